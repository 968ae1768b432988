/** `stoke properties` and `stoke flame`: the combustion engine as JSON. */
import { computeFuelProperties } from "../combustion/properties";
import { flameTemperature } from "../combustion/flame";
import { flameRequestSchema, propertiesRequestSchema } from "../schemas/combustion";
import { normaliseOxidizer } from "../combustion/stoichiometry";
import { parseFlags, readJsonInput, validate, ok, type CliResult } from "./io";

export function runProperties(argv: readonly string[], stdin: () => string): CliResult {
  const flags = parseFlags(argv, ["input"]);
  const req = validate(propertiesRequestSchema, readJsonInput(flags.input, stdin));
  return ok(computeFuelProperties(req.fuel, { combustionReferenceC: req.combustionReferenceC, meteringReferenceC: req.meteringReferenceC }));
}

export function runFlame(argv: readonly string[], stdin: () => string): CliResult {
  const flags = parseFlags(argv, ["input"]);
  const req = validate(flameRequestSchema, readJsonInput(flags.input, stdin));
  const r = flameTemperature({ ...req, oxidizer: req.oxidizer ? normaliseOxidizer(req.oxidizer) : undefined });
  return ok({
    temperatureK: r.temperatureK,
    temperatureC: r.temperatureK - 273.15,
    method: r.method,
    methodLabel: r.methodLabel,
    phi: r.phi,
    lambda: r.lambda,
    excessAirPercent: (r.lambda - 1) * 100,
    pressurePa: r.pressurePa,
    fuelTemperatureK: req.fuelTemperatureK,
    oxidizerTemperatureK: req.oxidizerTemperatureK,
    products: r.products,
    ...(r.equilibrium
      ? { iterations: r.equilibrium.iterations, elementBalanceRelError: r.equilibrium.elementBalanceRelError, enthalpyBalanceRelError: r.equilibrium.enthalpyBalanceRelError }
      : {}),
  });
}
