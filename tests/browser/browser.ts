/** Debian's chromium through playwright-core, with a fresh profile per test file. */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

export async function openBrowser(): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
    viewport: { width: 1360, height: 900 },
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(20_000);
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Waits until a streamed page shows everything it sent: no loading state left, and no part that
 * the server already rendered still held in the renderer's hidden container (streamed parts are
 * revealed in batches, which may come after the load event). Counting what a page offers before
 * that can miss what is still hidden.
 */
export async function pageSettled(page: Page): Promise<void> {
  await page.waitForFunction(() => !document.querySelector(".loading-state") && !document.querySelector('[hidden][id^="S:"]'));
}
