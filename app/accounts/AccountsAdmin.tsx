"use client";

/**
 * The accounts page's forms (admin): create an account, change a role, disable or enable, reset a
 * password, issue and revoke API tokens. Each calls the API and shows the server's answer.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";
import type { AccountJson, TokenJson } from "@/lib/services/accounts";

type Account = AccountJson;
type Token = TokenJson;
/** API token lifetimes, days: the default and the longest allowed. */
type Lifetime = { defaultDays: number; maxDays: number };
const minute = (iso: string) => iso.slice(0, 16).replace("T", " ");

const ROLES = ["viewer", "editor", "admin"];

async function send(url: string, method: string, body?: unknown): Promise<{ ok: boolean; body: Record<string, unknown> }> {
  const res = await fetch(url, {
    method,
    headers: body === undefined ? undefined : { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { ok: res.ok, body: await res.json().catch(() => ({})) };
}

const messageOf = (b: Record<string, unknown>) => {
  const fields = Object.entries((b.fieldErrors as Record<string, string>) ?? {})
    .filter(([k]) => k !== "_")
    .map(([k, v]) => `${k}: ${v}`);
  return [String(b.error ?? "Refused."), ...fields].join(" — ");
};

export function AccountsAdmin({
  accounts,
  tokens,
  selfId,
  lifetime,
}: {
  accounts: Account[];
  tokens: Token[];
  selfId: number | null;
  lifetime: Lifetime;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [newToken, setNewToken] = useState<string | null>(null);

  async function run(p: Promise<{ ok: boolean; body: Record<string, unknown> }>, done: string) {
    const r = await p;
    setMessage({ ok: r.ok, text: r.ok ? done : messageOf(r.body) });
    if (r.ok) router.refresh();
    return r;
  }

  async function create(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const form = e.currentTarget;
    const r = await run(
      send("/api/accounts", "POST", {
        email: f.get("email"),
        displayName: f.get("displayName"),
        role: f.get("role"),
        password: f.get("password"),
      }),
      `Created ${f.get("email")}.`,
    );
    if (r.ok) form.reset();
  }

  async function issue(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const r = await run(
      send("/api/tokens", "POST", {
        accountId: Number(f.get("accountId")),
        tokenName: f.get("tokenName"),
        // Left empty: the server's default lifetime. Anything else goes as a number (NaN as null), for the server to judge.
        ...(String(f.get("lifetimeDays") ?? "").trim() === "" ? {} : { lifetimeDays: Number(f.get("lifetimeDays")) }),
      }),
      "Token issued.",
    );
    setNewToken(r.ok ? String(r.body.token) : null);
  }

  return (
    <>
      {message && (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "form-ok" : "form-errors"}>
          {message.text}
        </p>
      )}
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th scope="col">E-mail</th>
              <th scope="col">Name</th>
              <th scope="col">Role</th>
              <th scope="col">Status</th>
              <th scope="col">Last sign-in (UTC)</th>
              <th scope="col">New password</th>
            </tr>
          </thead>
          <tbody>
            {accounts.map((a) => (
              <tr key={a.id}>
                <td>
                  {a.email} {a.id === selfId && <span className="muted">(you)</span>}
                </td>
                <td>{a.displayName}</td>
                <td>
                  <select
                    aria-label={`role of ${a.email}`}
                    value={a.role}
                    onChange={(e) =>
                      run(
                        send(`/api/accounts/${a.id}`, "PATCH", { role: e.target.value }),
                        `${a.email} is now ${e.target.value}; their sessions ended.`,
                      )
                    }
                  >
                    {ROLES.map((r) => (
                      <option key={r} value={r}>
                        {r}
                      </option>
                    ))}
                  </select>
                </td>
                <td>
                  {a.disabled ? "disabled " : "enabled "}
                  <button
                    type="button"
                    onClick={() =>
                      run(
                        send(`/api/accounts/${a.id}`, "PATCH", { disabled: !a.disabled }),
                        `${a.email} ${a.disabled ? "enabled" : "disabled"}.`,
                      )
                    }
                  >
                    {a.disabled ? "Enable" : "Disable"}
                  </button>
                </td>
                <td>{a.lastSignInAt ? a.lastSignInAt.slice(0, 16).replace("T", " ") : "—"}</td>
                <td>
                  <form
                    onSubmit={async (e) => {
                      e.preventDefault();
                      const form = e.currentTarget;
                      const pw = new FormData(form).get("password");
                      const r = await run(
                        send(`/api/accounts/${a.id}`, "PATCH", { password: pw }),
                        `New password set for ${a.email}; their sessions ended.`,
                      );
                      if (r.ok) form.reset();
                    }}
                  >
                    <input
                      name="password"
                      type="password"
                      autoComplete="new-password"
                      aria-label={`new password for ${a.email}`}
                      minLength={12}
                      required
                    />{" "}
                    <button type="submit">Reset</button>
                  </form>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <h2>New account</h2>
      <form onSubmit={create} className="panel row">
        <label className="field">
          <span>E-mail</span>
          <input name="email" type="email" required />
        </label>
        <label className="field">
          <span>Display name</span>
          <input name="displayName" />
        </label>
        <label className="field">
          <span>Role</span>
          <select name="role" defaultValue="viewer">
            {ROLES.map((r) => (
              <option key={r}>{r}</option>
            ))}
          </select>
        </label>
        <label className="field">
          <span>Password (12 characters or more)</span>
          <input name="password" type="password" autoComplete="new-password" minLength={12} required />
        </label>
        <div style={{ alignSelf: "end" }}>
          <button type="submit">Create</button>
        </div>
      </form>

      <h2>API tokens</h2>
      <p className="lede">
        A token lets a script use the API as an account (with that account&apos;s role), sent as <code>Authorization: Bearer …</code>. It is
        shown once; Stoke keeps only its hash. It is refused after its expiry ({lifetime.defaultDays} days unless you choose fewer, at most{" "}
        {lifetime.maxDays}); issue a new one before then.
      </p>
      {newToken && (
        <p className="form-ok">
          The new token (copy it now, it is not shown again): <code data-testid="new-token">{newToken}</code>
        </p>
      )}
      {tokens.length > 0 && (
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th scope="col">Token</th>
                <th scope="col">For</th>
                <th scope="col">Account</th>
                <th scope="col">Issued (UTC)</th>
                <th scope="col">Expires (UTC)</th>
                <th scope="col">Last used</th>
                <th scope="col" />
              </tr>
            </thead>
            <tbody>
              {tokens.map((t) => (
                <tr key={t.id} data-testid={`token-${t.id}`}>
                  <td>
                    <code>{t.prefix}…</code>
                  </td>
                  <td>{t.name}</td>
                  <td>{t.email}</td>
                  <td>{minute(t.createdAt)}</td>
                  <td>
                    {minute(t.expiresAt)} {t.expired && <span className="badge">expired</span>}
                  </td>
                  <td>{t.lastUsedAt ? minute(t.lastUsedAt) : "never"}</td>
                  <td>
                    <button type="button" className="danger" onClick={() => run(send(`/api/tokens/${t.id}`, "DELETE"), "Token revoked.")}>
                      Revoke
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <form onSubmit={issue} className="panel row" style={{ marginTop: "0.75rem" }}>
        <label className="field">
          <span>Account</span>
          <select name="accountId">
            {accounts
              .filter((a) => !a.disabled)
              .map((a) => (
                <option key={a.id} value={a.id}>
                  {a.email} ({a.role})
                </option>
              ))}
          </select>
        </label>
        <label className="field">
          <span>What it is for</span>
          <input name="tokenName" required maxLength={80} />
        </label>
        <label className="field">
          <span>Valid for (days, 1–{lifetime.maxDays})</span>
          <input name="lifetimeDays" inputMode="numeric" defaultValue={String(lifetime.defaultDays)} style={{ width: "7rem" }} />
        </label>
        <div style={{ alignSelf: "end" }}>
          <button type="submit">Issue a token</button>
        </div>
      </form>
    </>
  );
}
