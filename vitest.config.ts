import path from "node:path";
import { defineConfig } from "vitest/config";

// `npm test`: unit, database and API tests. They need no built app and no browser.
// Browser tests live in tests/browser/ and run with `npm run test:browser` (see .ci/run).
export default defineConfig({
  resolve: {
    alias: { "@": path.resolve(import.meta.dirname) },
  },
  test: {
    include: ["tests/**/*.test.ts"],
    exclude: ["tests/browser/**", "tests/bench/**", "node_modules/**", ".next/**"],
    environment: "node",
    testTimeout: 30_000,
  },
});
