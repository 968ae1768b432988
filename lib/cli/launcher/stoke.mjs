#!/usr/bin/env node
/**
 * The `stoke` command (package.json "bin"). Runs the compiled command line, dist/cli/stoke.mjs,
 * in plain Node. When that file is missing or older than one of the files it was built from, it
 * is rebuilt first; if it cannot be built (no esbuild, read-only folder), the TypeScript source
 * runs through tsx instead (slower start, same results).
 */
import { readFileSync, statSync } from "node:fs";

const root = new URL("../../../", import.meta.url);
const out = new URL("dist/cli/stoke.mjs", root);

function isStale() {
  let builtMs;
  let inputs;
  try {
    builtMs = statSync(out).mtimeMs;
    inputs = JSON.parse(readFileSync(new URL("dist/cli/stoke.inputs.json", root), "utf8"));
  } catch {
    return true;
  }
  for (const f of inputs) {
    try {
      if (statSync(new URL(f, root)).mtimeMs > builtMs) return true;
    } catch {
      return true;
    }
  }
  return false;
}

let compiled = true;
if (isStale()) {
  try {
    await (await import("./build.mjs")).buildCli();
  } catch (e) {
    compiled = false;
    if (process.env.STOKE_DEBUG === "1") console.error(`stoke: cannot build dist/cli/stoke.mjs (${e?.message ?? e}); running the source through tsx`);
  }
}
if (compiled) {
  await import(out.href);
} else {
  const { register } = await import("tsx/esm/api");
  register();
  await import(new URL("lib/cli/entry.ts", root).href);
}
