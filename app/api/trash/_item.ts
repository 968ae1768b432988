/** The trash item a route names: /api/trash/{fuel|plant|study}/{id}/…. */
import { isTrashKind, type TrashKind } from "@/lib/services/trash";
import { parseId } from "../_http";

export type TrashCtx = { params: Promise<{ kind: string; id: string }> };

export async function trashItem(ctx: TrashCtx): Promise<{ kind: TrashKind; id: number } | null> {
  const { kind, id } = await ctx.params;
  const n = parseId(id);
  return isTrashKind(kind) && n !== null ? { kind, id: n } : null;
}
