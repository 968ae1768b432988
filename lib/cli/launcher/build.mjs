/**
 * Compiles the command line ahead of time: lib/cli/entry.ts and what it imports, bundled by
 * esbuild into one plain-JavaScript file, dist/cli/stoke.cjs (git-ignored; `node dist/cli/stoke.cjs`
 * runs it; its last line is the build's id, a hash of the bundle), and dist/cli/stoke.build.json:
 * the id and the project files it was built from (the launcher rebuilds when one is newer).
 * Run by `npm install` (postinstall), `npm run build` and `npm run build:cli`.
 * The bundle must not contain the database layer, Prisma, Next or React: the build fails if it does.
 *
 * CommonJS, not ESM, because Node 20 can keep compiled code between runs only for scripts
 * (vm.Script cached data); the launcher does that, which halves the start-up work.
 */
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readdirSync, readFileSync, readlinkSync, renameSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { basename, dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = fileURLToPath(new URL("../../../", import.meta.url));
export const OUT_DIR = join(ROOT, "dist", "cli");
export const OUT_FILE = join(OUT_DIR, "stoke.cjs");
export const BUILD_FILE = join(OUT_DIR, "stoke.build.json");
/** The compiled-code cache of one build (written by the launcher on first use). */
export const cacheFileOf = (buildId) => join(OUT_DIR, `stoke-${buildId}.v8cache`);

/**
 * zod's namespace object carries every message locale (`z.locales`, ~290 KB); Stoke uses only the
 * English default, which zod imports itself. The bundle gets a locales module with English only:
 * a third less JavaScript to compile at every start.
 */
const zodEnglishOnly = {
  name: "zod-english-only",
  setup(b) {
    b.onResolve({ filter: /\/locales\/index\.js$/ }, (a) =>
      /[\\/]node_modules[\\/]zod[\\/]/.test(a.importer) ? { path: "zod-locales-en", namespace: "stoke" } : undefined,
    );
    b.onLoad({ filter: /^zod-locales-en$/, namespace: "stoke" }, () => ({
      contents: 'export { default as en } from "zod/v4/locales/en.js";',
      resolveDir: ROOT,
    }));
  },
};

const FORBIDDEN = [/^lib\/db\//, /^app\//, /node_modules\/(@prisma|prisma|next|react|react-dom|better-sqlite3)\//];

/** Writes `data` to `path` through a temporary file and a rename, so a concurrent reader sees old or new, never half. */
export function writeAtomic(path, data) {
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
  writeFileSync(tmp, data);
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
    format: "cjs",
    target: "node20",
    minifySyntax: true,
    minifyWhitespace: true,
    sourcemap: "linked",
    sourcesContent: false,
    legalComments: "none",
    metafile: true,
    write: false,
    logLevel: "warning",
    // help.ts reads package.json through import.meta.url only when run from source; here the
    // version is defined below and that branch is dead.
    logOverride: { "empty-import-meta": "silent" },
    define: { __STOKE_VERSION__: JSON.stringify(version) },
    plugins: [zodEnglishOnly],
  });
  // The launcher runs the bundle as a vm.Script, where Node 20 allows no import(): every module
  // must be bundled or statically required.
  const dynamic = Object.values(result.metafile.outputs).flatMap((o) =>
    o.imports.filter((i) => i.kind === "dynamic-import" && i.external).map((i) => i.path),
  );
  if (dynamic.length) throw new Error(`the command line must import these statically (it runs as a script): ${dynamic.join(", ")}`);
  const inputs = Object.keys(result.metafile.inputs);
  const bad = inputs.filter((f) => FORBIDDEN.some((re) => re.test(f)));
  if (bad.length) throw new Error(`the command line must not bundle the database layer or the web app: ${bad.join(", ")}`);
  mkdirSync(OUT_DIR, { recursive: true });
  const own = inputs.filter((f) => !f.includes("node_modules/") && !f.includes(":")).map((f) => relative(ROOT, join(ROOT, f)));
  const js = result.outputFiles.find((f) => f.path === OUT_FILE);
  const map = result.outputFiles.find((f) => f.path !== OUT_FILE);
  const id = createHash("sha256").update(js.contents).digest("hex").slice(0, 16);
  // The id closes the bundle: the launcher names the compiled-code cache by the source it runs.
  const text = `${js.text}// stoke-build ${id}\n`;
  for (const f of readdirSync(OUT_DIR))
    if (/^stoke-[0-9a-f]+\.v8cache$/.test(f) && f !== basename(cacheFileOf(id))) rmSync(join(OUT_DIR, f), { force: true });
  if (map) writeAtomic(map.path, map.contents);
  // The bundle before its description: a reader that sees the new id finds the new bundle.
  writeAtomic(OUT_FILE, text);
  writeAtomic(BUILD_FILE, `${JSON.stringify({ id, inputs: ["package.json", ...own] })}\n`);
  return { id, bytes: text.length, inputs: inputs.length };
}

/**
 * npm links the bins of dependencies into node_modules/.bin, but not the project's own; `npx stoke`
 * in the project folder finds the command there. Creates (or corrects) that link.
 */
export function linkBin() {
  const binDir = join(ROOT, "node_modules", ".bin");
  if (!existsSync(binDir)) return;
  const link = join(binDir, "stoke");
  const target = relative(binDir, join(ROOT, JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8")).bin.stoke));
  try {
    if (readlinkSync(link) === target) return;
    rmSync(link, { force: true });
  } catch {
    // no link yet
  }
  try {
    symlinkSync(target, link);
  } catch (e) {
    console.warn(`stoke: could not link node_modules/.bin/stoke (${e.code ?? e.message}); use npm run -s stoke -- …`);
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  linkBin();
  try {
    const r = await buildCli();
    if (!process.argv.includes("--quiet"))
      console.log(`stoke: built dist/cli/stoke.cjs (${(r.bytes / 1024).toFixed(0)} KiB from ${r.inputs} files)`);
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
