/** The command line: JSON out, exit 2 with one line naming the field on bad input. */
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { runCli } from "../../lib/cli/main";

const run = (args: string[], stdin = "") => runCli(args, () => stdin);

describe("stoke properties", () => {
  it("prints the property sheet of the issue's example (90 % CH4, 10 % H2)", async () => {
    const r = await run(
      ["properties", "--input", "-"],
      JSON.stringify({ fuel: { composition: { CH4: 0.9, H2: 0.1 } }, combustionReferenceC: 25, meteringReferenceC: 15 }),
    );
    expect(r.exitCode).toBe(0);
    const p = JSON.parse(r.stdout);
    for (const k of ["kJ_per_mol", "MJ_per_kg", "MJ_per_m3", "kJ_per_mol_O2", "MJ_per_kg_O2"]) {
      expect(typeof p.hhv[k]).toBe("number");
      expect(typeof p.lhv[k]).toBe("number");
    }
    expect(p.molarMass_g_per_mol).toBeCloseTo(0.9 * 16.04246 + 0.1 * 2.01588, 4); // ISO 6976:2016 molar masses
    expect(p.wobbe.gross_MJ_per_m3).toBeGreaterThan(p.wobbe.net_MJ_per_m3);
    expect(p.reference).toMatchObject({ combustionReferenceC: 25, meteringReferenceC: 15 });
    expect(typeof p.relativeDensity).toBe("number");
    expect(typeof p.stoichiometricAir.kg_per_kg).toBe("number");
    expect(typeof p.stoichiometricAir.mol_per_mol).toBe("number");
    expect(typeof p.co2.kg_per_GJ_hhv).toBe("number");
    expect(typeof p.flueGas.wet_m3_per_MJ_lhv).toBe("number");
    expect(typeof p.flueGas.co2max_dry_percent).toBe("number");
    expect(typeof p.flueGas.dewPoint_C).toBe("number");
  });
  it("accepts the other fuel forms in the same slot", async () => {
    for (const fuel of [
      { compound: "C2H5OH", phase: "liquid" },
      { ultimate: { C: 0.47, H: 0.058, O: 0.38, N: 0.002, S: 0.0002, moisture: 0.08, ash: 0.0098 }, correlation: "channiwala-parikh-2002" },
      {
        blend: [
          { fuel: { compound: "CH4" }, share: 0.8 },
          { fuel: { compound: "H2" }, share: 0.2 },
        ],
        basis: "volume",
      },
    ]) {
      const r = await run(["properties", "--input", "-"], JSON.stringify({ fuel }));
      expect(r.stderr).toBe("");
      expect(r.exitCode).toBe(0);
    }
  });
  const bad: [unknown, RegExp][] = [
    [{ fuel: { composition: { CH4: 0.9, H2: 0.3 } } }, /^stoke: fuel\.composition: .*sum to 1.*1\.2000/],
    [{ fuel: { composition: { CH4: 0.5, XY: 0.5 } } }, /fuel\.composition\.XY: unknown species "XY"/],
    [{ fuel: { composition: { CH4: -0.1, H2: 1.1 } } }, /fuel\.composition\.CH4: must be ≥ 0/],
    [{ fuel: { compound: "C99" } }, /fuel\.compound: unknown species "C99"/],
    [{ fuel: {} }, /fuel: a fuel needs one of/],
    [{ fuel: { compound: "CH4" }, meteringReferenceC: 17 }, /meteringReferenceC: must be one of/],
    [
      {
        fuel: {
          blend: [
            { fuel: { compound: "CH4" }, share: 0.7 },
            { fuel: { compound: "H2" }, share: 0.2 },
          ],
          basis: "volume",
        },
      },
      /fuel\.blend: blend shares must sum to 1/,
    ],
  ];
  for (const [input, message] of bad) {
    it(`rejects ${JSON.stringify(input)} with exit 2 and one line naming the field`, async () => {
      const r = await run(["properties", "--input", "-"], JSON.stringify(input));
      expect(r.exitCode).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(message);
    });
  }
  it("rejects malformed JSON, a missing file and unknown options", async () => {
    expect((await run(["properties", "--input", "-"], "{oops")).stderr).toMatch(/input: not valid JSON/);
    expect((await run(["properties", "--input", "/nonexistent/x.json"])).stderr).toMatch(/cannot read/);
    expect((await run(["properties", "--inptu", "x"])).stderr).toMatch(/unknown option --inptu/);
    expect((await run(["burn"])).exitCode).toBe(2);
  });
});

describe("stoke flame", () => {
  it("returns temperature, method, products and φ; flue O2 may replace φ", async () => {
    const r = await run(["flame", "--input", "-"], JSON.stringify({ fuel: { compound: "CH4" }, phi: 1, method: "equilibrium" }));
    const o = JSON.parse(r.stdout);
    expect(o.method).toBe("equilibrium");
    expect(o.phi).toBe(1);
    expect(o.temperatureK).toBeGreaterThan(2200);
    expect(o.products.NO).toBeGreaterThan(0);
    const r2 = await run(["flame", "--input", "-"], JSON.stringify({ fuel: { compound: "CH4" }, flueO2DryPercent: 3, method: "complete" }));
    expect(JSON.parse(r2.stdout).phi).toBeLessThan(0.9);
  });
  it("rejects two ways of stating the air, and an oxidiser without O2", async () => {
    const a = await run(["flame", "--input", "-"], JSON.stringify({ fuel: { compound: "CH4" }, phi: 1, excessAirPercent: 10 }));
    expect(a.stderr).toMatch(/phi: give only one of/);
    const b = await run(["flame", "--input", "-"], JSON.stringify({ fuel: { compound: "CH4" }, oxidizer: { N2: 1 } }));
    expect(b.stderr).toMatch(/oxidizer: the oxidiser needs O2/);
  });
});

describe("the npm script end to end", () => {
  it("`npm run -s stoke -- properties --input FILE` prints JSON; bad input exits 2", () => {
    const dir = mkdtempSync(join(tmpdir(), "stoke-cli-"));
    const good = join(dir, "good.json");
    writeFileSync(good, JSON.stringify({ fuel: { composition: { CH4: 1 } } }));
    const r = spawnSync("npm", ["run", "-s", "stoke", "--", "properties", "--input", good], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).hhv.kJ_per_mol).toBeCloseTo(890.58, 0); // ISO 6976:2016, methane GCV 25 °C
    const bad = spawnSync("npm", ["run", "-s", "stoke", "--", "properties", "--input", "-"], {
      encoding: "utf8",
      input: '{"fuel":{"composition":{"CH4":1.2}}}',
    });
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim()).toMatch(/^stoke: fuel\.composition\.CH4: must be ≤ 1$/);
  }, 30000);
});
