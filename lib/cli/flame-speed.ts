/**
 * `stoke flame-speed`: the laminar burning velocity of a fuel/oxidiser mixture by a 1D premixed flame
 * with GRI-Mech 3.0 (lib/flame), and the post-flame NO screening indicator. The solution profile is
 * left out of the output (it is the engine's warm-start data, not a result).
 */
import { defineCommand, type CsvTable } from "./command";
import { validate } from "./io";
import { flameSpeedRequestSchema } from "../schemas/flame-speed";
import { computeFlameSpeed, type FlameSpeedState } from "../flame/flame-speed";
import { NotConvergedError } from "../errors";

type FlameSpeedOutput = ReturnType<typeof output>;

function output(r: ReturnType<typeof computeFlameSpeed>) {
  const { solution: _solution, ...rest } = r;
  return rest;
}

/** With --warm-chain: the last converged solution of this run, the next input's starting point. */
let chain: FlameSpeedState | undefined;

export const flameSpeedCommand = defineCommand({
  recordByRecord: true,
  compute(input, o) {
    const req = validate(flameSpeedRequestSchema, input);
    if (o["warm-chain"] !== true) return output(computeFlameSpeed(req));
    try {
      const r = computeFlameSpeed(req, chain ? { warmStart: chain } : {});
      chain = r.solution;
      return output(r);
    } catch (e) {
      if (e instanceof NotConvergedError) chain = undefined;
      throw e;
    }
  },
  csv(r: FlameSpeedOutput): CsvTable {
    return {
      header: [
        "burning velocity cm/s",
        "burnt temperature K",
        "flame thickness mm",
        "grid points",
        "NO ppm (dry)",
        "NOx as NO2 mg/m3 (0 °C, 101.325 kPa, dry, at reference O2)",
        "reference O2 %",
        "post-flame residence ms",
        "mechanism",
        "transport",
      ],
      rows: [
        [
          r.burningVelocity_cm_per_s,
          r.burntTemperatureK,
          r.flameThickness_mm,
          r.gridPoints,
          r.NO.ppm_dry,
          r.NO.mg_per_m3_dry_at_ref_O2,
          r.NO.referenceO2Percent,
          r.NO.residenceMs,
          r.mechanism,
          r.transport,
        ],
      ],
    };
  },
});
