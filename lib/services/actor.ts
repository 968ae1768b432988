/**
 * Who is acting: the signed-in account (team mode), the account of an API token, or "local user"
 * (personal mode and the seeder). The HTTP layer sets it for the duration of a request (`actingAs`);
 * the services read it when they record a change, so no service signature carries it.
 */
import { AsyncLocalStorage } from "node:async_hooks";
import type { Role } from "../schemas/accounts";

export interface Actor {
  /** What the change log shows: the account's e-mail, or "local user". */
  name: string;
  accountId: number | null;
  role: Role;
  /** How the request was authenticated. */
  via: "personal" | "session" | "token" | "command";
}

export const LOCAL_USER: Actor = Object.freeze({ name: "local user", accountId: null, role: "admin", via: "personal" });

const store = new AsyncLocalStorage<Actor>();

/** Runs `fn` with `actor` as the one acting. */
export function actingAs<T>(actor: Actor, fn: () => T): T {
  return store.run(actor, fn);
}

/** The one acting now; "local user" outside any request. */
export function currentActor(): Actor {
  return store.getStore() ?? LOCAL_USER;
}
