import type { Metadata } from "next";
import { db } from "@/lib/db/client";
import { ROLE_DUTIES, ROLES, TOKEN_LIFETIME_DEFAULT_DAYS, TOKEN_LIFETIME_MAX_DAYS } from "@/lib/schemas/accounts";
import { listAccounts, listTokens } from "@/lib/services/accounts";
import { stokeMode } from "@/lib/services/mode";
import { pageUser } from "../_auth/page-user";
import { History } from "../_ui/History";
import { AccountsAdmin } from "./AccountsAdmin";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Accounts" };

export default async function AccountsPage() {
  if (stokeMode() !== "team") {
    return (
      <>
        <h1>Accounts</h1>
        <p className="lede">Stoke runs in personal mode: there are no accounts. Team mode (STOKE_MODE=team, see the README) has them.</p>
      </>
    );
  }
  const [accounts, tokens, user] = await Promise.all([listAccounts(db()), listTokens(db()), pageUser()]);
  return (
    <>
      <h1>Accounts</h1>
      <ul className="lede">
        {ROLES.map((r) => (
          <li key={r}>
            <strong>{r}</strong>: {ROLE_DUTIES[r]}
          </li>
        ))}
      </ul>
      <p className="muted">A role change, disabling or a new password ends every session of the account at once.</p>
      <AccountsAdmin
        accounts={accounts}
        tokens={tokens}
        selfId={user?.accountId ?? null}
        lifetime={{ defaultDays: TOKEN_LIFETIME_DEFAULT_DAYS, maxDays: TOKEN_LIFETIME_MAX_DAYS }}
      />
      <History type="account" title="Changes to accounts and tokens" limit={30} />
    </>
  );
}
