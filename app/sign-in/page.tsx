import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { stokeMode } from "@/lib/services/mode";
import { pageUser } from "../_auth/page-user";
import { SignInForm } from "./SignInForm";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Sign in" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/** Only a path on this server (never "//other.example" or a full URL): no open redirect. */
function safeNext(v: unknown): string {
  return typeof v === "string" && /^\/(?![/\\])/.test(v) ? v : "/";
}

export default async function SignInPage({ searchParams }: Props) {
  const next = safeNext((await searchParams).next);
  if (stokeMode() !== "team") {
    return (
      <>
        <h1>Sign in</h1>
        <p className="lede">
          Stoke runs in personal mode: it answers this machine only and needs no sign-in. <Link href="/">Go on</Link>.
        </p>
      </>
    );
  }
  if (await pageUser()) redirect(next);
  return (
    <>
      <h1>Sign in</h1>
      <p className="lede">This Stoke server is shared by a team. Sign in with the account an administrator gave you.</p>
      <SignInForm next={next} />
    </>
  );
}
