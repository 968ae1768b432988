"use client";

/** Tabs between the pages of one study; they keep the chosen metric and upstream setting. */
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";

const TABS = [
  { path: "", label: "Comparison" },
  { path: "/sweep", label: "Hydrogen sweep" },
  { path: "/phi", label: "φ sweep" },
  { path: "/sensitivity", label: "Sensitivity" },
  { path: "/uncertainty", label: "Uncertainty" },
  { path: "/report", label: "Report" },
  { path: "/edit", label: "Edit" },
];

/** `canEdit`: whether the Edit tab shows (the account may edit the study). */
export function StudyTabs({ id, canEdit }: { id: number; canEdit: boolean }) {
  const pathname = usePathname();
  const sp = useSearchParams();
  const keep = new URLSearchParams();
  for (const k of ["metric", "upstream"]) {
    const v = sp.get(k);
    if (v) keep.set(k, v);
  }
  const q = keep.toString() ? `?${keep.toString()}` : "";
  const base = `/studies/${id}`;
  return (
    <nav className="study-tabs no-print" aria-label="Study pages">
      {TABS.filter((t) => canEdit || t.path !== "/edit").map((t) => {
        const href = base + t.path;
        return (
          <Link
            key={t.label}
            href={t.path === "/edit" ? href : href + q}
            aria-current={pathname === href ? "page" : undefined}
            prefetch={false}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
