/**
 * Compiles the command line ahead of time: lib/cli/entry.ts and what it imports, bundled by
 * esbuild into one plain-JavaScript file, dist/cli/stoke.mjs (git-ignored), plus
 * stoke.inputs.json, the project files it was built from (the launcher rebuilds when one is newer).
 * Run by `npm install` (postinstall), `npm run build` and `npm run build:cli`.
 * The bundle must not contain the database layer, Prisma, Next or React: the build fails if it does.
 */
import { mkdirSync, readFileSync, renameSync, writeFileSync, chmodSync } from "node:fs";
import { basename, dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = fileURLToPath(new URL("../../../", import.meta.url));
export const OUT_DIR = join(ROOT, "dist", "cli");
export const OUT_FILE = join(OUT_DIR, "stoke.mjs");
export const INPUTS_FILE = join(OUT_DIR, "stoke.inputs.json");

/**
 * zod's namespace object carries every message locale (`z.locales`, ~290 KB); Stoke uses only the
 * English default, which zod imports itself. The bundle gets a locales module with English only:
 * a third less JavaScript to compile at every start.
 */
const zodEnglishOnly = {
  name: "zod-english-only",
  setup(b) {
    b.onResolve({ filter: /\/locales\/index\.js$/ }, (a) => (/[\\/]node_modules[\\/]zod[\\/]/.test(a.importer) ? { path: "zod-locales-en", namespace: "stoke" } : undefined));
    b.onLoad({ filter: /^zod-locales-en$/, namespace: "stoke" }, () => ({ contents: 'export { default as en } from "zod/v4/locales/en.js";', resolveDir: ROOT }));
  },
};

const FORBIDDEN = [/^lib\/db\//, /node_modules\/(@prisma|prisma|next|react|react-dom|better-sqlite3)\//];

/** Writes `text` to `path` through a temporary file and a rename, so a concurrent reader sees old or new, never half. */
function writeAtomic(path, text, mode) {
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
  writeFileSync(tmp, text);
  if (mode) chmodSync(tmp, mode);
  renameSync(tmp, path);
}

export async function buildCli() {
  const { build } = await import("esbuild");
  const version = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8")).version;
  const result = await build({
    absWorkingDir: ROOT,
    entryPoints: ["lib/cli/entry.ts"],
    outfile: OUT_FILE,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    minifySyntax: true,
    minifyWhitespace: true,
    sourcemap: "linked",
    sourcesContent: false,
    legalComments: "none",
    metafile: true,
    write: false,
    logLevel: "warning",
    banner: { js: "#!/usr/bin/env node" },
    define: { __STOKE_VERSION__: JSON.stringify(version) },
    plugins: [zodEnglishOnly],
  });
  const inputs = Object.keys(result.metafile.inputs);
  const bad = inputs.filter((f) => FORBIDDEN.some((re) => re.test(f)));
  if (bad.length) throw new Error(`the command line must not bundle the database layer or the web app: ${bad.join(", ")}`);
  mkdirSync(OUT_DIR, { recursive: true });
  const own = inputs.filter((f) => !f.includes("node_modules/") && !f.includes(":")).map((f) => relative(ROOT, join(ROOT, f)));
  writeAtomic(INPUTS_FILE, JSON.stringify(["package.json", ...own]) + "\n");
  // The map first, the bundle last: the bundle's time stamp marks a complete build.
  const files = [...result.outputFiles].sort((a, b) => Number(a.path === OUT_FILE) - Number(b.path === OUT_FILE));
  for (const f of files) writeAtomic(f.path, f.contents, f.path === OUT_FILE ? 0o755 : undefined);
  return { bytes: files.find((f) => f.path === OUT_FILE).contents.length, inputs: inputs.length };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  try {
    const r = await buildCli();
    if (!process.argv.includes("--quiet")) console.log(`stoke: built dist/cli/stoke.mjs (${(r.bytes / 1024).toFixed(0)} KiB from ${r.inputs} files)`);
  } catch (e) {
    if (e?.code === "ERR_MODULE_NOT_FOUND" && String(e.message).includes("esbuild")) {
      // An install without dev dependencies: the launcher runs the TypeScript through tsx instead.
      console.warn("stoke: esbuild is not installed; the command line will compile on the fly (slower start)");
    } else {
      console.error(e?.message ?? e);
      process.exitCode = 1;
    }
  }
}
