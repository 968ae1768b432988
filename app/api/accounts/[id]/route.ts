/**
 * PATCH /api/accounts/{id} {role?, displayName?, disabled?, password?} (admin): a role change,
 * disabling or a new password ends the account's sessions. 409 for the last enabled admin.
 */
import { db } from "@/lib/db/client";
import { changeAccount } from "@/lib/services/accounts";
import { stokeMode } from "@/lib/services/mode";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../_http";
import { personalModeAnswer } from "../_personal";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

export const PATCH = withErrors(async (req: Request, { params }: Ctx): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  const id = parseId((await params).id);
  if (id === null) return notFound("Account");
  const body = await readJson(req, 16 * 1024);
  if (!body.ok) return body.response;
  const r = await changeAccount(db(), id, body.value);
  if (!r.ok) return failure(r);
  return json(r.value);
});
