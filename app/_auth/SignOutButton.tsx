"use client";

/** Signs out (the session ends on the server) and goes to the sign-in page. */
export function SignOutButton() {
  async function onClick() {
    await fetch("/api/session", { method: "DELETE" });
    window.location.assign("/sign-in");
  }
  return (
    <button type="button" onClick={onClick}>
      Sign out
    </button>
  );
}
