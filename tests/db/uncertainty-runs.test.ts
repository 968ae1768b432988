/** Stored uncertainty runs: run in slices off the request path, stored with the hash of their inputs, stale once the study changes, shown with the revision on the same inputs. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { issueRevision } from "../../lib/services/revisions";
import { studyRecord, updateStudy } from "../../lib/services/studies";
import { uncertaintyOfStoredStudy } from "../../lib/services/uncertainty";
import {
  cancelUncertaintyJob,
  getUncertaintyRun,
  listUncertaintyRuns,
  runForReport,
  startUncertaintyRun,
  uncertaintyJob,
  type UncertaintyJob,
} from "../../lib/services/uncertainty-runs";

const t = await tempDb();
let studyId = 0;
beforeAll(async () => {
  await seedIfEmpty(t.client);
  studyId = (await t.client.study.findFirstOrThrow({ where: { name: "Hydrogen blending and biomethane" } })).id;
});
afterAll(() => t.cleanup());

async function settled(id: string): Promise<UncertaintyJob> {
  for (;;) {
    const j = uncertaintyJob(studyId, id)!;
    if (j.state !== "running") return j;
    await new Promise((r) => setTimeout(r, 10));
  }
}

const request = { draws: 1500, seed: 7, ranges: { fuelPricePercent: 25 } };

describe("stored uncertainty runs", () => {
  let runId = 0;
  it("a run goes off the request path with progress, ends stored, and gives the figures of the direct computation", async () => {
    const started = await startUncertaintyRun(t.client, studyId, request);
    if (!started.ok) throw new Error(started.message);
    expect(started.value.state).toBe("running");
    const done = await settled(started.value.id);
    expect(done.state).toBe("done");
    expect(done.runId).not.toBeNull();
    runId = done.runId!;
    const stored = await getUncertaintyRun(t.client, studyId, runId);
    if (!stored.ok) throw new Error(stored.message);
    expect(stored.value.stale).toBe(false);
    expect(stored.value.settings).toMatchObject({ draws: 1500, seed: 7, shape: "triangular", ranges: { fuelPricePercent: 25 } });
    const direct = await uncertaintyOfStoredStudy(t.client, studyId, request);
    if (!direct.ok) throw new Error(direct.message);
    // The same seed gives the same figures, whether run in slices and stored or at once.
    const strip = (r: typeof direct.result) => ({ ...r, elapsedMs: 0, timingsMs: null });
    expect(strip(stored.value.result)).toEqual(strip(JSON.parse(JSON.stringify(direct.result))));
  });

  it("the issued revision on the same inputs shows the stored run; after a change the run is stale and the revision keeps it", async () => {
    const rev = await issueRevision(t.client, studyId);
    if (!rev.ok) throw new Error(rev.message);
    const forRevision = await runForReport(t.client, studyId, rev.value.hash);
    expect(forRevision?.id).toBe(runId);
    expect(forRevision?.revisions).toEqual([rev.value.revision]);
    const rec = (await studyRecord(t.client, studyId))!;
    const { id: _i, isDemo: _d, storedProblems: _p, ...body } = rec;
    const changed = await updateStudy(t.client, studyId, { ...body, discountRatePercent: 6 });
    expect(changed.ok).toBe(true);
    const [summary] = await listUncertaintyRuns(t.client, studyId);
    expect(summary.id).toBe(runId);
    expect(summary.stale).toBe(true);
    // The revision's inputs did not change: its run is still found by its hash.
    expect((await runForReport(t.client, studyId, rev.value.hash))?.id).toBe(runId);
  });

  it("a cancelled run stores nothing; a bad request names the field and starts nothing", async () => {
    const before = await t.client.uncertaintyRun.count();
    const started = await startUncertaintyRun(t.client, studyId, { ...request, draws: 50_000 });
    if (!started.ok) throw new Error(started.message);
    cancelUncertaintyJob(studyId, started.value.id);
    expect((await settled(started.value.id)).state).toBe("cancelled");
    expect(await t.client.uncertaintyRun.count()).toBe(before);
    const bad = await startUncertaintyRun(t.client, studyId, { ...request, draws: 5 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(Object.keys(bad.fieldErrors)).toEqual(["draws"]);
  });
});
