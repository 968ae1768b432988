/**
 * Batch mode of the command line: NDJSON in, one record per input line out, in order; bad lines
 * reported and the run going on; CSV with units in the headers; a folder of study files; help.
 */
import { describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { NotConvergedError, InputError } from "../../lib/errors";
import { COMMANDS } from "../../lib/cli/commands";
import { commonOptions, defineCommand, type CommandSpec } from "../../lib/cli/command";
import { toCsv } from "../../lib/cli/csv";
import { runCli } from "../../lib/cli/main";
import { runCommand } from "../../lib/cli/run";
import { StringSink } from "../../lib/cli/io";

const run = (args: string[], stdin = "", errIsTTY = false) => runCli(args, () => stdin, { errIsTTY });
const records = (stdout: string) =>
  stdout
    .trim()
    .split("\n")
    .map((l) => JSON.parse(l));

// ISO 6976:2016, Table 3: methane, superior calorific value at 25 °C, 890.58 kJ/mol.
const METHANE_GCV_25C_kJ_per_mol = 890.58;
const within0_02Percent = (x: number, ref: number) => Math.abs(x - ref) <= 0.0002 * ref;

const LINES = [
  JSON.stringify({ fuel: { composition: { CH4: 1 } } }),
  JSON.stringify({ fuel: { composition: { CH4: 1.2 } } }),
  "",
  "{not json",
  JSON.stringify({ fuel: { composition: { CH4: 0.9, H2: 0.1 } }, meteringReferenceC: 0 }),
];
const NDJSON = `${LINES.join("\n")}\n`;

describe("NDJSON batch", () => {
  it("answers every non-blank line in order with its line number; bad lines name line and field; exit 2", async () => {
    const r = await run(["properties", "--ndjson"], NDJSON);
    const recs = records(r.stdout);
    expect(recs.map((x) => [x.line, x.ok])).toEqual([
      [1, true],
      [2, false],
      [4, false],
      [5, true],
    ]);
    expect(within0_02Percent(recs[0].result.hhv.kJ_per_mol, METHANE_GCV_25C_kJ_per_mol)).toBe(true);
    expect(recs[1].error).toEqual({ kind: "input", field: "fuel.composition.CH4", message: "fuel.composition.CH4: must be ≤ 1" });
    expect(recs[2].error.message).toMatch(/^not valid JSON/);
    expect(recs[3].result.reference.meteringReferenceC).toBe(0);
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toBe("stoke: 2 of 4 inputs failed (lines 2, 4)\n");
  });
  it("an .ndjson file gives the same records as standard input; CRLF and a byte-order mark are read; all good lines exit 0, nothing on stderr", async () => {
    const dir = mkdtempSync(join(tmpdir(), "stoke-batch-"));
    const file = join(dir, "gases.ndjson");
    writeFileSync(file, NDJSON);
    expect((await run(["properties", "--input", file])).stdout).toBe((await run(["properties", "--ndjson"], NDJSON)).stdout);
    const good = join(dir, "good.jsonl");
    writeFileSync(good, `\uFEFF${LINES[0]}\r\n${LINES[4]}\r\n`);
    const r = await run(["properties", "--input", good]);
    expect(r.exitCode).toBe(0);
    expect(r.stderr).toBe("");
    expect(records(r.stdout).map((x) => x.line)).toEqual([1, 2]);
  });
  it("flame takes batches too", async () => {
    const r = await run(
      ["flame", "--ndjson"],
      [
        { fuel: { compound: "CH4" }, method: "complete" },
        { fuel: { compound: "CH4" }, phi: 0 },
      ]
        .map((x) => JSON.stringify(x))
        .join("\n"),
    );
    const recs = records(r.stdout);
    expect(recs[0].ok).toBe(true);
    expect(recs[1].error.field).toBe("phi");
    expect(r.exitCode).toBe(2);
  });
  it("points a single-input run given several lines to --ndjson", async () => {
    const r = await run(["properties", "--input", "-"], NDJSON);
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/^stoke: input: not valid JSON .*; for one input per line use --ndjson\n$/);
  });
  it("refuses json output for a batch and ndjson output for a single input", async () => {
    expect((await run(["properties", "--ndjson", "--format", "json"], NDJSON)).stderr).toMatch(/batch output is --format ndjson/);
    expect((await run(["properties", "--input", "-", "--format", "ndjson"], LINES[0])).exitCode).toBe(2);
  });
});

/** A command that fails on request, to check the batch machinery shared by every command. */
const probe: CommandSpec = {
  name: "probe",
  summary: "test command",
  input: "{}",
  output: "{}",
  csv: true,
  folder: false,
  options: [],
  examples: [],
  load: async () =>
    defineCommand({
      compute(input: unknown) {
        const x = input as { fail?: string; wait_ms?: number; v?: number };
        if (x.wait_ms) for (const t0 = performance.now(); performance.now() - t0 < x.wait_ms; );
        if (x.fail === "input") throw new InputError("v", "must be given");
        if (x.fail === "converge") throw new NotConvergedError("probe-solver", "no verified answer", { iterations: 7 });
        if (x.fail === "bug") throw new TypeError("oops");
        return { v: x.v };
      },
      csv: (r: { v?: number }) => ({ header: ["v kg"], rows: [[r.v]] }),
    }),
};
async function runProbe(lines: object[], argv: string[] = ["--ndjson"], errIsTTY = false) {
  const out = new StringSink();
  const err = new StringSink();
  const text = lines.map((l) => JSON.stringify(l)).join("\n");
  const exitCode = await runCommand(probe, argv, {
    stdinText: () => text,
    async *stdinLines() {
      yield* text.split("\n");
    },
    out,
    err,
    errIsTTY,
    debug: false,
  });
  return { exitCode, stdout: out.text, stderr: err.text };
}

describe("batch exit status and records, for any command", () => {
  it("not converged alone exits 1; with bad input 2; with a bug 70; the run always goes on", async () => {
    expect((await runProbe([{ v: 1 }, { fail: "converge" }])).exitCode).toBe(1);
    expect((await runProbe([{ fail: "converge" }, { fail: "input" }])).exitCode).toBe(2);
    const r = await runProbe([{ fail: "bug" }, { fail: "input" }, { v: 3 }]);
    expect(r.exitCode).toBe(70);
    expect(records(r.stdout).map((x) => [x.line, x.ok, x.error?.kind])).toEqual([
      [1, false, "internal"],
      [2, false, "input"],
      [3, true, undefined],
    ]);
  });
  it("a non-converged record carries the solver and its diagnostics", async () => {
    const [rec] = records((await runProbe([{ fail: "converge" }])).stdout);
    expect(rec.error).toMatchObject({ kind: "not-converged", solver: "probe-solver", diagnostics: { iterations: 7 } });
  });
  it("shows progress on standard error only when it is a terminal", async () => {
    const lines = [{ v: 1, wait_ms: 250 }, { v: 2 }];
    expect((await runProbe(lines, ["--ndjson"], true)).stderr).toMatch(/\rstoke: 1 inputs, 0 failed, [\d.]+\/s/);
    expect((await runProbe(lines, ["--ndjson"], false)).stderr).toBe("");
    expect((await runProbe(lines, ["--ndjson", "--no-progress"], true)).stderr).toBe("");
  });
});

describe("CSV output", () => {
  it("properties: one row per input line, units in the headers, errors in their row", async () => {
    const r = await run(["properties", "--ndjson", "--format", "csv"], NDJSON);
    const [header, ...rows] = parse(r.stdout) as string[][];
    expect(header.slice(0, 2)).toEqual(["line", "error"]);
    for (const h of [
      "HHV MJ/kg",
      "HHV kJ/mol",
      "Wobbe gross MJ/m3 (metering reference)",
      "CO2 kg/GJ LHV",
      "water dew point °C",
      "metering reference °C",
    ])
      expect(header).toContain(h);
    expect(rows.map((x) => x[0])).toEqual(["1", "2", "4", "5"]);
    const at = (row: string[], h: string) => row[header.indexOf(h)];
    expect(within0_02Percent(Number(at(rows[0], "HHV kJ/mol")), METHANE_GCV_25C_kJ_per_mol)).toBe(true);
    expect(at(rows[1], "error")).toBe("fuel.composition.CH4: must be ≤ 1");
    expect(at(rows[1], "HHV MJ/kg")).toBe("");
    expect(at(rows[2], "error")).toMatch(/^not valid JSON/);
    expect(rows.every((x) => x.length === header.length)).toBe(true);
  });
  it("flame: one row per charge, a column per product species of any row", async () => {
    const lines = [
      { fuel: { compound: "CH4" }, method: "complete" },
      { fuel: { compound: "CH4" }, method: "equilibrium", phi: 0.9 },
    ];
    const r = await run(["flame", "--ndjson", "--format", "csv"], lines.map((x) => JSON.stringify(x)).join("\n"));
    const [header, ...rows] = parse(r.stdout) as string[][];
    expect(header.slice(0, 4)).toEqual(["line", "error", "method", "flame temperature K"]);
    expect(rows.map((x) => x[header.indexOf("method")])).toEqual(["complete", "equilibrium"]);
    expect(Number(rows[1][header.indexOf("NO mole fraction (wet products)")])).toBeGreaterThan(0);
    expect(rows[0][header.indexOf("NO mole fraction (wet products)")]).toBe("");
  });
  it("a single input writes one row without line and error columns", async () => {
    const r = await run(["properties", "--input", "-", "--format", "csv"], LINES[0]);
    const rows = parse(r.stdout) as string[][];
    expect(rows).toHaveLength(2);
    expect(rows[0][0]).toBe("fuel");
  });
  it("quotes commas, quotes and line breaks; defuses spreadsheet formulas; keeps negative numbers", async () => {
    const name = '=HYPERLINK("x"), "quoted"\nnext';
    const r = await run(["properties", "--input", "-", "--format", "csv"], JSON.stringify({ fuel: { composition: { CH4: 1 }, name } }));
    const [header, row] = parse(r.stdout) as string[][];
    expect(row[header.indexOf("fuel")]).toBe(`'${name}`);
    const [, cells] = parse(
      toCsv({ header: ["a", "b", "c", "d", "e"], rows: [[-3.25, "-3.25", "@SUM(A1)", Number.NaN, null]] }),
    ) as string[][];
    expect(cells).toEqual(["-3.25", "-3.25", "'@SUM(A1)", "", ""]);
  });
});

describe("evaluate over a folder of study files", () => {
  it("one record per *.json file in name order, bad files reported, CSV rows named by file", async () => {
    const dir = mkdtempSync(join(tmpdir(), "stoke-studies-"));
    const example = readFileSync(join(__dirname, "../../seed/example-study.json"), "utf8");
    writeFileSync(join(dir, "b-good.json"), example);
    const bad = JSON.parse(example);
    bad.plant.flueO2DryPercent = "x";
    writeFileSync(join(dir, "a-bad.json"), JSON.stringify(bad));
    writeFileSync(join(dir, "notes.txt"), "not a study");
    const r = await run(["evaluate", "--input", dir, "--format", "csv", "--no-flame-speed"]);
    expect(r.exitCode).toBe(2);
    const [header, ...rows] = parse(r.stdout) as string[][];
    expect(header.slice(0, 4)).toEqual(["file", "error", "rank", "scenario"]);
    expect(rows[0]).toEqual(expect.arrayContaining(["a-bad.json", "plant.flueO2DryPercent: must be a number"]));
    const good = rows.filter((x) => x[0] === "b-good.json");
    expect(good).toHaveLength(1 + JSON.parse(example).scenarios.length);
    expect(header.some((h) => /EUR\/MWh useful/.test(h))).toBe(true);
    expect(r.stderr).toBe("stoke: 1 of 2 inputs failed (file a-bad.json)\n");
  });
  it("a folder is refused by commands that read one file", async () => {
    const r = await run(["properties", "--input", tmpdir()]);
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/is a folder/);
  });
});

describe("help and version", () => {
  it("`stoke help COMMAND` lists every option of the command and an example", async () => {
    for (const spec of COMMANDS) {
      const r = await run(["help", spec.name]);
      expect(r.exitCode).toBe(0);
      for (const o of [...commonOptions(spec), ...spec.options]) expect(r.stdout).toContain(`--${o.name}`);
      expect(r.stdout).toMatch(new RegExp(`examples:\\n  .*stoke ${spec.name} `));
      expect((await run([spec.name, "--help"])).stdout).toBe(r.stdout);
    }
  });
  it("`stoke --version` prints the package version; an unknown command exits 2", async () => {
    const pkg = JSON.parse(readFileSync(join(__dirname, "../../package.json"), "utf8"));
    expect((await run(["--version"])).stdout).toBe(`stoke ${pkg.version}\n`);
    const r = await run(["help", "burn"]);
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/unknown command "burn"/);
  });
});
