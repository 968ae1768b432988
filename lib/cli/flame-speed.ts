/**
 * `stoke flame-speed`: the laminar burning velocity of a fuel/oxidiser mixture by a 1D premixed flame
 * with GRI-Mech 3.0 (lib/flame), and the post-flame NO screening indicator. The solution profile is
 * left out of the output (it is the engine's warm-start data, not a result).
 */
import { defineCommand, type CsvTable } from "./command";
import { validate } from "./io";
import { flameSpeedRequestSchema } from "../schemas/flame-speed";
import { computeFlameSpeed } from "../flame/flame-speed";

type FlameSpeedOutput = ReturnType<typeof output>;

function output(r: ReturnType<typeof computeFlameSpeed>) {
  const { solution: _solution, ...rest } = r;
  return rest;
}

export const flameSpeedCommand = defineCommand({
  compute(input) {
    return output(computeFlameSpeed(validate(flameSpeedRequestSchema, input)));
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
