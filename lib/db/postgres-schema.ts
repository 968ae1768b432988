/**
 * The PostgreSQL Prisma schema is derived from the SQLite one (prisma/schema.prisma, the one
 * source): the same models with the provider swapped and the generated client written to its own
 * folder (lib/db/generated-pg/). `npm run generate` writes prisma/postgres/schema.prisma with this
 * before generating both clients; tests/db/postgres-schema.test.ts checks the committed file is in sync.
 *
 * Run as a script (`tsx lib/db/postgres-schema.ts`) it writes the file; with `--check` it only
 * says whether the file is current (exit 1 when not).
 */
import fs from "node:fs";
import path from "node:path";

export const SQLITE_SCHEMA_PATH = "prisma/schema.prisma";
export const POSTGRES_SCHEMA_PATH = "prisma/postgres/schema.prisma";

const HEADER = `// GENERATED from prisma/schema.prisma by lib/db/postgres-schema.ts (npm run generate). Do not edit:
// change prisma/schema.prisma and run \`npm run generate\`. Migrations: prisma/postgres/migrations/.
`;

/** The PostgreSQL twin of the SQLite schema text. Throws when the text lacks what it swaps. */
export function derivePostgresSchema(sqliteSchema: string): string {
  let out = sqliteSchema;
  const provider = /(datasource\s+db\s*\{[^}]*?provider\s*=\s*)"sqlite"/;
  if (!provider.test(out)) throw new Error(`${SQLITE_SCHEMA_PATH}: no datasource with provider = "sqlite"`);
  out = out.replace(provider, '$1"postgresql"');
  const output = /(generator\s+client\s*\{[^}]*?output\s*=\s*)"\.\.\/lib\/db\/generated"/;
  if (!output.test(out)) throw new Error(`${SQLITE_SCHEMA_PATH}: the client generator's output is not "../lib/db/generated"`);
  // The derived file sits one folder deeper (prisma/postgres/).
  out = out.replace(output, '$1"../../lib/db/generated-pg"');
  return HEADER + out;
}

function main(): void {
  const root = process.cwd();
  const source = fs.readFileSync(path.join(root, SQLITE_SCHEMA_PATH), "utf8");
  const derived = derivePostgresSchema(source);
  const target = path.join(root, POSTGRES_SCHEMA_PATH);
  const current = fs.existsSync(target) ? fs.readFileSync(target, "utf8") : null;
  if (process.argv.includes("--check")) {
    if (current !== derived) {
      console.error(`${POSTGRES_SCHEMA_PATH} is out of date: run npm run generate`);
      process.exit(1);
    }
    return;
  }
  if (current !== derived) {
    fs.mkdirSync(path.dirname(target), { recursive: true });
    fs.writeFileSync(target, derived);
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.dirname ?? "", "postgres-schema.ts")) main();
