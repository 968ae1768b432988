import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { runCli } from "../../lib/cli/main";

const EXAMPLE = join(__dirname, "../../seed/example-study.json");

describe("stoke evaluate --uncertainty N", () => {
  it("adds the Monte Carlo ranking; the same seed gives the same figures, the chances of ranking first sum to 1", async () => {
    const a = await runCli(["evaluate", "--no-flame-speed", "--input", EXAMPLE, "--uncertainty", "400", "--seed", "7"], () => "");
    const b = await runCli(["evaluate", "--no-flame-speed", "--input", EXAMPLE, "--uncertainty", "400", "--seed", "7"], () => "");
    expect(a.exitCode).toBe(0);
    const ua = JSON.parse(a.stdout).uncertainty;
    expect(ua.draws).toBe(400);
    expect(JSON.stringify(ua.scenarios)).toBe(JSON.stringify(JSON.parse(b.stdout).uncertainty.scenarios));
    const total = ua.scenarios.reduce((s: number, x: { pFirst: number }) => s + x.pFirst, 0);
    expect(total).toBeCloseTo(1, 9);
  }, 60_000);

  it("writes its table as CSV and refuses a bad draw count naming the option", async () => {
    const csv = await runCli(["evaluate", "--no-flame-speed", "--input", EXAMPLE, "--uncertainty", "100", "--format", "csv"], () => "");
    expect(csv.stdout.split("\r\n")[0]).toMatch(/^scenario,baseline,status,ranked/);
    const bad = await runCli(["evaluate", "--no-flame-speed", "--input", EXAMPLE, "--uncertainty", "5"], () => "");
    expect(bad.exitCode).toBe(2);
    expect(bad.stderr).toMatch(/--uncertainty/);
  }, 60_000);
});
