/** POST /api/trash/{fuel|plant|study}/{id}/purge: deletes an item in the trash for good (admin). 409 while something uses it. */
import { db } from "@/lib/db/client";
import { purgeFromTrash } from "@/lib/services/trash";
import { failure, json, notFound, withErrors } from "../../../../_http";
import { trashItem, type TrashCtx } from "../../../_item";

export const dynamic = "force-dynamic";

export const POST = withErrors(async (_req: Request, ctx: TrashCtx): Promise<Response> => {
  const item = await trashItem(ctx);
  if (!item) return notFound("Item in the trash");
  const r = await purgeFromTrash(db(), item.kind, item.id);
  if (!r.ok) return failure(r);
  return json({ purged: r.value });
});
