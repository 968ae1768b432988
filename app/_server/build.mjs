/**
 * Bundles the production server (app/_server/serve.ts and the parts of lib/ and app/_auth it uses)
 * with esbuild into dist/server/serve.mjs. Packages stay in node_modules (imported at run time).
 * Run by `npm run build` and by the test support before it starts a server.
 */
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
export const SERVER_FILE = join(ROOT, "dist", "server", "serve.mjs");

export async function buildServer() {
  const { build } = await import("esbuild");
  mkdirSync(join(ROOT, "dist", "server"), { recursive: true });
  await build({
    absWorkingDir: ROOT,
    entryPoints: ["app/_server/serve.ts"],
    outfile: SERVER_FILE,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: "external",
    sourcemap: "linked",
    sourcesContent: false,
    logLevel: "warning",
    tsconfig: join(ROOT, "tsconfig.json"),
  });
  return SERVER_FILE;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  try {
    await buildServer();
  } catch (e) {
    console.error(e?.message ?? e);
    process.exitCode = 1;
  }
}
