/**
 * The installed command: dist/cli/stoke.cjs built fresh, run by plain Node (no TypeScript loader),
 * and the `stoke` launcher of package.json "bin".
 */
import { beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { BUILD_FILE, buildCli, OUT_FILE, ROOT } from "../../lib/cli/launcher/build.mjs";

const node = (file: string, args: string[], input = "") =>
  spawnSync(process.execPath, [file, ...args], { input, encoding: "utf8", cwd: ROOT, env: { ...process.env, NODE_OPTIONS: "" } });

beforeAll(async () => {
  await buildCli();
}, 60_000);

describe("the compiled command line", () => {
  it("is one plain-JavaScript file without the database layer, Prisma, Next or React", () => {
    const { inputs } = JSON.parse(readFileSync(BUILD_FILE, "utf8")) as { inputs: string[] };
    expect(inputs).toContain("lib/cli/entry.ts");
    expect(inputs.filter((f) => /^lib\/db\/|^app\//.test(f))).toEqual([]);
    const js = readFileSync(OUT_FILE, "utf8");
    expect(js).not.toMatch(/@prisma\/client|better-sqlite3|from"react"|from "react"/);
  });
  it("answers --version and an NDJSON batch in plain Node, exit 2 for a bad line", () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8"));
    expect(node(OUT_FILE, ["--version"]).stdout).toBe(`stoke ${pkg.version}\n`);
    const r = node(OUT_FILE, ["properties", "--ndjson"], '{"fuel":{"composition":{"CH4":1}}}\n{"fuel":{"composition":{"CH4":2}}}\n');
    const recs = r.stdout
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l));
    // ISO 6976:2016, Table 3: methane, superior calorific value at 25 °C, 890.58 kJ/mol (±0.02 %).
    expect(Math.abs(recs[0].result.hhv.kJ_per_mol - 890.58)).toBeLessThanOrEqual(0.18);
    expect(recs[1]).toMatchObject({ line: 2, ok: false, error: { field: "fuel.composition.CH4" } });
    expect(r.status).toBe(2);
  });
  it("the bin launcher runs the compiled file, single input and batch", () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8"));
    const bin = join(ROOT, pkg.bin.stoke);
    const r = node(bin, ["properties", "--input", "-"], '{"fuel":{"compound":"C99"}}');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^stoke: fuel\.compound: unknown species "C99".*\n$/);
    const b = node(bin, ["flame", "--ndjson"], '{"fuel":{"compound":"CH4"},"method":"complete"}\n{"fuel":{"compound":"CH4"},"phi":-1}\n');
    expect(
      b.stdout
        .trim()
        .split("\n")
        .map((l) => JSON.parse(l).ok),
    ).toEqual([true, false]);
    expect(b.status).toBe(2);
  });
});
