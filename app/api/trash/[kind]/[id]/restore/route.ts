/** POST /api/trash/{fuel|plant|study}/{id}/restore: takes an item out of the trash (editor). */
import { db } from "@/lib/db/client";
import { restoreFromTrash } from "@/lib/services/trash";
import { failure, json, notFound, withErrors } from "../../../../_http";
import { trashItem, type TrashCtx } from "../../../_item";

export const dynamic = "force-dynamic";

export const POST = withErrors(async (_req: Request, ctx: TrashCtx): Promise<Response> => {
  const item = await trashItem(ctx);
  if (!item) return notFound("Item in the trash");
  const r = await restoreFromTrash(db(), item.kind, item.id);
  if (!r.ok) return failure(r);
  return json({ restored: r.value, url: `/${item.kind === "study" ? "studies" : `${item.kind}s`}/${item.id}` });
});
