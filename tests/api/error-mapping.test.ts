/**
 * What went wrong becomes an HTTP status in one place (app/api/_http.ts), as issue 8 of the
 * project specifies: bad input 400 with the field named; an infeasible charge 422; a solver that
 * did not converge 422. The evaluation is made to throw each of lib/'s errors in turn (the study
 * evaluation itself is tested elsewhere); everything else runs as in production.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeSeededApi, openSeededApi, type SeededApi } from "./seeded-api";
import { InfeasibleChargeError, InputError, NotConvergedError } from "../../lib/errors";

const control = vi.hoisted(() => ({ error: null as Error | null }));

vi.mock("../../lib/study/evaluate", async (importOriginal) => {
  const actual = await importOriginal<typeof import("../../lib/study/evaluate")>();
  return {
    ...actual,
    evaluateStudy: (...args: Parameters<typeof actual.evaluateStudy>) => {
      if (control.error) throw control.error;
      return actual.evaluateStudy(...args);
    },
  };
});

let api: SeededApi;
let routes: {
  studies: typeof import("../../app/api/studies/route");
  results: typeof import("../../app/api/studies/[id]/results/route");
  http: typeof import("../../app/api/_http");
};
const fuel: Record<string, number> = {};
let plantId = 0;
let studyId = 0;

beforeAll(async () => {
  api = await openSeededApi();
  Object.assign(fuel, api.fuel);
  plantId = api.plantId;
  studyId = await api.studyId("Hydrogen blending and biomethane");
  routes = {
    studies: await import("../../app/api/studies/route"),
    results: await import("../../app/api/studies/[id]/results/route"),
    http: await import("../../app/api/_http"),
  };
});
afterAll(async () => {
  control.error = null;
  await closeSeededApi(api);
});

const post = (body: unknown) =>
  new Request("http://localhost/api/studies", {
    method: "POST",
    body: JSON.stringify(body),
    headers: { "content-type": "application/json" },
  });
const ctx = (id: number) => ({ params: Promise.resolve({ id: String(id) }) });
const study = (name: string) => ({
  plantId,
  name,
  currency: "EUR",
  discountRatePercent: 7,
  horizonYears: 12,
  baseline: { name: "Gas today", fuelId: fuel["Pipeline natural gas"] },
  scenarios: [{ name: "LPG", fuelId: fuel["LPG (propane)"] }],
});

async function postWith(
  error: Error | null,
  name: string,
): Promise<{ status: number; body: { error: string; fieldErrors: Record<string, string> } }> {
  control.error = error;
  try {
    const res = await routes.studies.POST(post(study(name)));
    return { status: res.status, body: await res.json() };
  } finally {
    control.error = null;
  }
}

describe("POST /api/studies when the evaluation refuses", () => {
  it("a solver that did not converge: 422, says so, names the solver, stores nothing", async () => {
    const before = await api.t.client.study.count();
    const r = await postWith(
      new NotConvergedError("equilibrium", "residual 3e-2 after 60 iterations", { iterations: 60 }),
      "Not converged",
    );
    expect(r.status).toBe(422);
    expect(r.body.error).toMatch(/equilibrium solver did not converge: residual 3e-2 after 60 iterations/);
    expect(await api.t.client.study.count()).toBe(before);
  });

  it("an infeasible charge: 422 with the scenario's fuel field named", async () => {
    const r = await postWith(
      new InfeasibleChargeError("scenarios.0.fuel", "too little oxygen to burn the fuel", "too-little-oxygen"),
      "Infeasible",
    );
    expect(r.status).toBe(422);
    expect(r.body.fieldErrors["scenarios.0.fuelId"]).toBe("too little oxygen to burn the fuel");
  });

  it("bad input: 400 with the field named", async () => {
    const r = await postWith(new InputError("scenarios.0.overrides.stackTemperatureC", "must be above the dew point"), "Input");
    expect(r.status).toBe(400);
    expect(r.body.fieldErrors["scenarios.0.overrides.stackTemperatureC"]).toBe("must be above the dew point");
  });

  it("bad input found by the evaluation itself (no error injected): 400 with the field named", async () => {
    const body = {
      ...study("Condensing without return water"),
      scenarios: [{ name: "LPG", fuelId: fuel["LPG (propane)"], overrides: { condensing: true } }],
    };
    const res = await routes.studies.POST(post(body));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors["scenarios.0.overrides.returnWaterC"]).toMatch(/return-water/);
  });

  it("a bug is not an answer: a RangeError propagates (Next answers 500)", async () => {
    control.error = new RangeError("index out of range");
    try {
      await expect(routes.studies.POST(post(study("Bug")))).rejects.toThrow(RangeError);
    } finally {
      control.error = null;
    }
  });
});

describe("GET /api/studies/{id}/results when the stored study cannot be evaluated", () => {
  it("not converged and infeasible: 422 each, with the study's field named", async () => {
    control.error = new NotConvergedError("flame-temperature", "energy balance open after 50 iterations");
    const a = await routes.results.GET(new Request(`http://localhost/api/studies/${studyId}/results`), ctx(studyId));
    control.error = new InfeasibleChargeError("scenarios.1.fuel", "soot would form", "soot");
    const b = await routes.results.GET(new Request(`http://localhost/api/studies/${studyId}/results`), ctx(studyId));
    control.error = null;
    expect(a.status).toBe(422);
    expect((await a.json()).error).toMatch(/flame-temperature solver did not converge/);
    expect(b.status).toBe(422);
    expect((await b.json()).fieldErrors["scenarios.1.fuel"]).toBe("soot would form");
  });
});

describe("errors thrown through a route handler", () => {
  it("input 400, infeasible 422, not converged 422, each as { error, fieldErrors: { field: detail } }", async () => {
    const { withErrors } = routes.http;
    const answer = (e: Error) => withErrors(async () => Promise.reject(e))();
    const input = await answer(new InputError("phi", "must be > 0"));
    expect(input.status).toBe(400);
    expect(await input.json()).toEqual({ error: "phi: must be > 0", fieldErrors: { phi: "must be > 0" } });
    const infeasible = await answer(new InfeasibleChargeError("phi", "too rich: soot would form", "soot"));
    expect(infeasible.status).toBe(422);
    expect((await infeasible.json()).fieldErrors).toEqual({ phi: "too rich: soot would form" });
    const stuck = await answer(new NotConvergedError("equilibrium", "no verified solution", { iterations: 80 }));
    expect(stuck.status).toBe(422);
    expect((await stuck.json()).fieldErrors).toEqual({ _: "the equilibrium solver did not converge: no verified solution" });
    await expect(answer(new RangeError("bug"))).rejects.toThrow(RangeError);
  });
});
