import type { Metadata } from "next";
import { db } from "@/lib/db/client";
import { trashEnabled } from "@/lib/services/mode";
import { listTrash } from "@/lib/services/trash";
import { pageActions } from "../_auth/page-user";
import { TrashActions } from "./TrashActions";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Trash" };

const KIND_WORDS = { fuel: "Fuel", plant: "Plant", study: "Study" } as const;

export default async function TrashPage() {
  const [items, can] = await Promise.all([listTrash(db()), pageActions()]);
  return (
    <>
      <h1>Trash</h1>
      <p className="lede">
        Deleted fuels, plants and studies wait here. An editor can restore them; an admin can delete them for good. While an item is in the
        trash its name stays taken, and nothing else sees it: lists, exports and studies leave it out.
        {!trashEnabled() &&
          " This server deletes at once (personal mode): only items deleted in team mode or with STOKE_TRASH=on are here."}
      </p>
      {items.length === 0 ? (
        <p className="muted">The trash is empty.</p>
      ) : (
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th scope="col">What</th>
                <th scope="col">Name</th>
                <th scope="col">Deleted (UTC)</th>
                <th scope="col">By</th>
                <th scope="col" />
              </tr>
            </thead>
            <tbody>
              {items.map((i) => (
                <tr key={`${i.kind}-${i.id}`} data-testid={`trash-${i.kind}-${i.id}`}>
                  <td>{KIND_WORDS[i.kind]}</td>
                  <td>
                    {i.name} {i.detail && <span className="muted">({i.detail})</span>}
                  </td>
                  <td style={{ whiteSpace: "nowrap" }}>{i.deletedAt.slice(0, 16).replace("T", " ")}</td>
                  <td>{i.deletedBy}</td>
                  <td>
                    <TrashActions kind={i.kind} id={i.id} name={i.name} canRestore={can.restoreFromTrash} canPurge={can.purgeFromTrash} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
