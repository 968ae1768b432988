import type { Metadata } from "next";
import { ROLE_DUTIES } from "@/lib/schemas/accounts";
import { pageUser } from "../_auth/page-user";
import { PasswordForm } from "./PasswordForm";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await pageUser();
  if (!user || user.accountId === null) {
    return (
      <>
        <h1>Your account</h1>
        <p className="lede">Stoke runs in personal mode: there are no accounts.</p>
      </>
    );
  }
  return (
    <>
      <h1>Your account</h1>
      <p className="lede">
        Signed in as <strong>{user.name}</strong>, {user.role}: {ROLE_DUTIES[user.role]}.
      </p>
      <h2>Change your password</h2>
      <p className="muted">Every session of your account ends, this one too; then sign in with the new password.</p>
      <PasswordForm />
    </>
  );
}
