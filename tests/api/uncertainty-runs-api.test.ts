/** The stored-run routes: start (202 with a job), follow, list, read back as JSON and CSV, cancel; a bad value answers 400 naming its field. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSeededApi, jsonRequest, openSeededApi, type SeededApi } from "./seeded-api";

let api: SeededApi;
let studyId = 0;
let routes: {
  runs: typeof import("../../app/api/studies/[id]/uncertainty/runs/route");
  run: typeof import("../../app/api/studies/[id]/uncertainty/runs/[run]/route");
  job: typeof import("../../app/api/studies/[id]/uncertainty/jobs/[job]/route");
};
beforeAll(async () => {
  api = await openSeededApi();
  studyId = await api.studyId("Hydrogen blending and biomethane");
  routes = {
    runs: await import("../../app/api/studies/[id]/uncertainty/runs/route"),
    run: await import("../../app/api/studies/[id]/uncertainty/runs/[run]/route"),
    job: await import("../../app/api/studies/[id]/uncertainty/jobs/[job]/route"),
  };
});
afterAll(() => closeSeededApi(api));

const ctx = <E extends Record<string, string> = Record<never, string>>(extra?: E) => ({
  params: Promise.resolve({ id: String(studyId), ...(extra ?? ({} as E)) }),
});

async function jobUntilDone(jobId: string) {
  for (;;) {
    const body = await (await routes.job.GET(jsonRequest(`/api/studies/${studyId}/uncertainty/jobs/${jobId}`), ctx({ job: jobId }))).json();
    if (body.job.state !== "running") return body.job;
    await new Promise((r) => setTimeout(r, 10));
  }
}

describe("uncertainty run routes", () => {
  it("starts a run (202), follows it to its stored run, lists and reads it as JSON and CSV", async () => {
    const res = await routes.runs.POST(jsonRequest(`/api/studies/${studyId}/uncertainty/runs?draws=1000&seed=4&fp=15`, "POST"), ctx());
    expect(res.status).toBe(202);
    const { job } = await res.json();
    const done = await jobUntilDone(job.id);
    expect(done.state).toBe("done");
    const list = await (await routes.runs.GET(jsonRequest(`/api/studies/${studyId}/uncertainty/runs`), ctx())).json();
    expect(list.runs[0]).toMatchObject({
      id: done.runId,
      stale: false,
      settings: { draws: 1000, seed: 4, ranges: { fuelPricePercent: 15 } },
    });
    const one = await routes.run.GET(
      jsonRequest(`/api/studies/${studyId}/uncertainty/runs/${done.runId}`),
      ctx({ run: String(done.runId) }),
    );
    expect((await one.json()).run.result.draws).toBe(1000);
    const csv = await routes.run.GET(
      jsonRequest(`/api/studies/${studyId}/uncertainty/runs/${done.runId}?format=csv`),
      ctx({ run: String(done.runId) }),
    );
    expect(csv.headers.get("content-type")).toMatch(/text\/csv/);
    expect((await csv.text()).split("\r\n")[0]).toMatch(/^scenario,baseline,status,ranked/);
  });

  it("answers 400 naming the field for draws out of range, 404 for an unknown job or run", async () => {
    const bad = await routes.runs.POST(jsonRequest(`/api/studies/${studyId}/uncertainty/runs?draws=5`, "POST"), ctx());
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).fieldErrors)).toEqual(["draws"]);
    expect((await routes.job.GET(jsonRequest("/x"), ctx({ job: "no-such-job" }))).status).toBe(404);
    expect((await routes.job.DELETE(jsonRequest("/x", "DELETE"), ctx({ job: "no-such-job" }))).status).toBe(404);
    expect((await routes.run.GET(jsonRequest("/x"), ctx({ run: "99999" }))).status).toBe(404);
  });

  it("a cancelled job ends cancelled and stores nothing", async () => {
    const before = await api.t.client.uncertaintyRun.count();
    const res = await routes.runs.POST(jsonRequest(`/api/studies/${studyId}/uncertainty/runs?draws=50000`, "POST"), ctx());
    const { job } = await res.json();
    const cancelled = await routes.job.DELETE(jsonRequest("/x", "DELETE"), ctx({ job: job.id }));
    expect(cancelled.status).toBe(200);
    expect((await jobUntilDone(job.id)).state).toBe("cancelled");
    expect(await api.t.client.uncertaintyRun.count()).toBe(before);
  });
});
