import path from "node:path";
import { defineConfig } from "vitest/config";

// Real-browser tests: Debian's chromium through playwright-core against the production server on a
// fresh temp database. Needs a production build (`next build`; the setup builds when none exists).
export default defineConfig({
  resolve: { alias: { "@": path.resolve(import.meta.dirname, "../..") } },
  test: {
    root: path.resolve(import.meta.dirname, "../.."),
    include: ["tests/browser/**/*.test.ts"],
    globalSetup: ["tests/browser/server.ts"],
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
});
