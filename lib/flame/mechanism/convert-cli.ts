/**
 * `npx tsx lib/flame/mechanism/convert-cli.ts [name]`: converts `<name>.yaml` (default gri30) beside
 * this file into `<name>.json`, the data file the app reads. Run once when a mechanism is added or
 * its YAML changes; commit the JSON. tests/unit/flame/mechanism.test.ts checks that the committed
 * JSON equals a fresh conversion.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { convertMechanismYaml, mechanismJsonText } from "./convert";
import { MECHANISM_CITATIONS } from "./citations";

const name = process.argv[2] ?? "gri30";
const citation = MECHANISM_CITATIONS[name];
if (!citation) {
  console.error(`No citation known for mechanism "${name}": add it to lib/flame/mechanism/citations.ts first.`);
  process.exit(2);
}
const dir = fileURLToPath(new URL(".", import.meta.url));
const raw = convertMechanismYaml(readFileSync(`${dir}${name}.yaml`, "utf8"), name, citation);
writeFileSync(`${dir}${name}.json`, mechanismJsonText(raw));
console.log(`${name}.json: ${raw.species.length} species, ${raw.reactions.length} reactions`);
