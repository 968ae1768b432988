/** GET /api/trash: fuels, plants and studies in the trash, latest first. */
import { db } from "@/lib/db/client";
import { listTrash } from "@/lib/services/trash";
import { json, withErrors } from "../_http";

export const dynamic = "force-dynamic";

export const GET = withErrors(async (): Promise<Response> => json({ items: await listTrash(db()) }));
