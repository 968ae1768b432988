/**
 * Accounts of a team server: the three roles, e-mail sign-in names, passwords, and the bodies of the
 * account, sign-in and API-token requests. Personal mode has no accounts.
 */
import { z } from "zod";
import { nameSchema } from "./names";

/** Roles in rising order: each may do what the ones before it may. */
export const ROLES = ["viewer", "editor", "admin"] as const;
export type Role = (typeof ROLES)[number];
export const roleSchema = z.enum(ROLES, { error: `must be one of ${ROLES.join(", ")}` });

/** What each role may do, as the accounts page states it. */
export const ROLE_DUTIES: Readonly<Record<Role, string>> = {
  viewer: "reads and exports",
  editor: "also changes fuels, quotes, plants and studies, and restores from the trash",
  admin: "also manages accounts and API tokens and deletes from the trash for good",
};

/** True when `have` includes what `need` may do. */
export function roleAtLeast(have: Role, need: Role): boolean {
  return ROLES.indexOf(have) >= ROLES.indexOf(need);
}

export const MIN_PASSWORD_CHARS = 12;
export const MAX_PASSWORD_CHARS = 256;

export const emailSchema = z
  .string({ error: "must be text" })
  .transform((s) => s.normalize("NFC").trim().toLowerCase())
  .pipe(
    z
      .string()
      .max(254, "must be ≤ 254 characters")
      .regex(/^[^\s@]+@[^\s@]+$/, "must be an e-mail address (name@domain)"),
  );

export const passwordSchema = z
  .string({ error: "must be text" })
  .min(MIN_PASSWORD_CHARS, `must be at least ${MIN_PASSWORD_CHARS} characters`)
  .max(MAX_PASSWORD_CHARS, `must be ≤ ${MAX_PASSWORD_CHARS} characters`);

export const accountInputSchema = z.strictObject({
  email: emailSchema,
  displayName: z.union([nameSchema(120, "give a name or leave it out"), z.literal("")]).default(""),
  role: roleSchema,
  password: passwordSchema,
});
export type AccountInput = z.infer<typeof accountInputSchema>;

/** A change an admin makes to an account: role, display name, disabled or enabled, a new password. */
export const accountChangeSchema = z.strictObject({
  displayName: z.union([nameSchema(120, "give a name or leave it out"), z.literal("")]).optional(),
  role: roleSchema.optional(),
  disabled: z.boolean({ error: "must be true or false" }).optional(),
  password: passwordSchema.optional(),
});
export type AccountChange = z.infer<typeof accountChangeSchema>;

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z
    .string({ error: "must be text" })
    .min(1, "enter the password")
    .max(MAX_PASSWORD_CHARS, `must be ≤ ${MAX_PASSWORD_CHARS} characters`),
});

/** A signed-in person changing their own password. */
export const ownPasswordSchema = z.strictObject({
  currentPassword: z.string({ error: "must be text" }).min(1, "enter the current password").max(MAX_PASSWORD_CHARS),
  newPassword: passwordSchema,
});

/** How long an API token lasts when its issuer does not say (days). */
export const TOKEN_LIFETIME_DEFAULT_DAYS = 90;
/** The longest lifetime an API token may be given (days). */
export const TOKEN_LIFETIME_MAX_DAYS = 365;

export const tokenLifetimeSchema = z
  .number({ error: `must be a whole number of days from 1 to ${TOKEN_LIFETIME_MAX_DAYS}` })
  .int(`must be a whole number of days from 1 to ${TOKEN_LIFETIME_MAX_DAYS}`)
  .min(1, "must be at least 1 day")
  .max(TOKEN_LIFETIME_MAX_DAYS, `must be at most ${TOKEN_LIFETIME_MAX_DAYS} days`);

export const apiTokenInputSchema = z.strictObject({
  accountId: z
    .number({ error: "must be the id of an account" })
    .int()
    .positive()
    .max(2 ** 31 - 1),
  tokenName: nameSchema(80, "say what the token is for"),
  /** Days from issue until the token is refused; `TOKEN_LIFETIME_DEFAULT_DAYS` when left out. */
  lifetimeDays: tokenLifetimeSchema.default(TOKEN_LIFETIME_DEFAULT_DAYS),
});
export type ApiTokenInput = z.infer<typeof apiTokenInputSchema>;
