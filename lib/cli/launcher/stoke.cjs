#!/usr/bin/env node
/**
 * The `stoke` command (package.json "bin"). Runs the compiled command line, dist/cli/stoke.cjs, in
 * plain Node, keeping V8's compiled code of it between runs (dist/cli/stoke-<build id>.v8cache,
 * written on first use). When the bundle is missing or older than one of the files it was built
 * from, it is rebuilt first; if it cannot be built (no esbuild, read-only folder), the TypeScript
 * source runs through tsx instead (slower start, same results).
 * CommonJS so that Node starts it without its ES-module loader.
 */
"use strict";
const { readFileSync, renameSync, statSync, writeFileSync } = require("node:fs");
const { createRequire } = require("node:module");
const { join } = require("node:path");
const { pathToFileURL } = require("node:url");
const { Script } = require("node:vm");

const root = join(__dirname, "..", "..", "..");
const outDir = join(root, "dist", "cli");
const bundle = join(outDir, "stoke.cjs");

/** A build exists and none of the files it was built from is newer. */
function isCurrent() {
  try {
    const builtMs = statSync(bundle).mtimeMs;
    const { inputs } = JSON.parse(readFileSync(join(outDir, "stoke.build.json"), "utf8"));
    for (const f of inputs) if (statSync(join(root, f)).mtimeMs > builtMs) return false;
    return true;
  } catch {
    return false;
  }
}

function runCompiled() {
  if (process.env.STOKE_DEBUG === "1") {
    // Node's own loader, with source maps on before it compiles: stacks point into the TypeScript.
    process.setSourceMapsEnabled(true);
    require(bundle);
    return;
  }
  const source = readFileSync(bundle, "utf8");
  // The cache is named by the id on the bundle's last line: the code cached is that of this source.
  const id = /\/\/ stoke-build ([0-9a-f]+)\s*$/.exec(source.slice(-64))?.[1];
  const cacheFile = id ? join(outDir, `stoke-${id}.v8cache`) : undefined;
  let cachedData;
  try {
    if (cacheFile) cachedData = readFileSync(cacheFile);
  } catch {
    // first run of this build
  }
  // Node's own CommonJS wrapper, on the first line so that line numbers stay those of the bundle.
  const script = new Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, { filename: bundle, cachedData });
  if (cacheFile && (!cachedData || script.cachedDataRejected)) {
    process.once("exit", () => {
      try {
        const tmp = `${cacheFile}.${process.pid}.tmp`;
        writeFileSync(tmp, script.createCachedData());
        renameSync(tmp, cacheFile);
      } catch {
        // a read-only installation runs without the cache
      }
    });
  }
  const mod = { exports: {} };
  script.runInThisContext()(mod.exports, createRequire(bundle), mod, bundle, outDir);
}

async function rebuildOrFallBack() {
  try {
    const { buildCli } = await import(pathToFileURL(join(__dirname, "build.mjs")).href);
    await buildCli();
  } catch (e) {
    if (process.env.STOKE_DEBUG === "1")
      console.error(`stoke: cannot build dist/cli/stoke.cjs (${e?.message ?? e}); running the source through tsx`);
    const { register } = await import("tsx/esm/api");
    register();
    await import(pathToFileURL(join(root, "lib", "cli", "entry.ts")).href);
    return;
  }
  runCompiled();
}

if (isCurrent()) runCompiled();
else rebuildOrFallBack();
