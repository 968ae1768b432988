"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** A top-bar link that marks itself as the current section. */
export function NavLink({
  href,
  children,
  exact = false,
  not = [],
}: {
  href: string;
  children: React.ReactNode;
  exact?: boolean;
  not?: string[];
}) {
  const path = usePathname() ?? "";
  const current = !not.includes(path) && (exact ? path === href : path === href || path.startsWith(`${href}/`));
  return (
    <Link href={href} aria-current={current ? "page" : undefined}>
      {children}
    </Link>
  );
}
