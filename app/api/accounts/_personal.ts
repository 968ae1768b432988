import { json } from "../_http";

/** What the account and token routes answer in personal mode. */
export const personalModeAnswer = () => json({ error: "Accounts exist in team mode only (STOKE_MODE=team).", fieldErrors: {} }, 404);
