/**
 * Team mode in a real browser (a second production server with STOKE_MODE=team on its own SQLite file):
 * a page sends the visitor to sign-in, signing in lands on the page asked for with the user in the
 * header, a fuel deleted from its sheet waits in the trash, Restore brings it back, and its History
 * says who did both.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";
import { projectRoot, startNextServer, type NextServer } from "../support/next-server";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient } from "../../lib/db/client";
import { createAccount } from "../../lib/services/accounts";

let server: NextServer;
let dir: string;
let page: Page;
let close: () => Promise<void>;
const PASSWORD = "a long enough passphrase";

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-team-"));
  const url = `file:${path.join(dir, "team.db")}`;
  migrateSqlite({ databaseUrl: url });
  const client = createClient(url);
  const a = await createAccount(client, { email: "editor@example.org", displayName: "Eddie", role: "editor", password: PASSWORD });
  if (!a.ok) throw new Error(a.message);
  const admin = await createAccount(client, { email: "admin@example.org", role: "admin", password: PASSWORD });
  if (!admin.ok) throw new Error(admin.message);
  await client.$disconnect();
  server = await startNextServer(
    {
      DATABASE_URL: url,
      STOKE_SEED: "on",
      STOKE_MODE: "team",
      STOKE_SESSION_SECRET: "browser test secret, at least thirty-two characters",
    },
    "/sign-in",
  );
  ({ page, close } = await openBrowser());
});
afterAll(async () => {
  await close?.();
  await server?.stop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe("team mode in the browser", () => {
  it("sends a visitor to sign-in and, signed in, back to the page asked for with the user in the header", async () => {
    const base = server.baseURL;
    await page.goto(`${base}/plants`);
    await page.waitForURL(/\/sign-in\?next=%2Fplants/);
    await page.getByLabel("E-mail").fill("editor@example.org");
    await page.getByLabel("Password").fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("alert").filter({ hasText: "wrong" }).waitFor();
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${base}/plants`);
    expect(await page.getByTestId("signed-in").textContent()).toMatch(/editor@example\.org\s*\(editor\)/);
    // An editor does not get the accounts page.
    const res = await page.goto(`${base}/accounts`);
    expect(res?.status()).toBe(403);
  });

  it("a fuel deleted from its sheet waits in the trash; Restore brings it back and History names who did both", async () => {
    const base = server.baseURL;
    const created = await page.request.post(`${base}/api/fuels`, {
      data: { name: "Trial gas", definition: { composition: { CH4: 0.95, N2: 0.05 } } },
      headers: { origin: base },
    });
    expect(created.status()).toBe(201);
    const { id } = await created.json();
    await page.goto(`${base}/fuels/${id}`);
    page.once("dialog", (d) => void d.accept());
    await page.getByRole("button", { name: "Delete fuel" }).click();
    await page.waitForURL(`${base}/fuels`);
    expect(await page.locator("table.library").getByRole("link", { name: "Trial gas" }).count()).toBe(0);

    await page.goto(`${base}/trash`);
    const row = page.getByTestId(`trash-fuel-${id}`);
    await row.waitFor();
    expect(await row.textContent()).toMatch(/Trial gas.*editor@example\.org/);
    expect(await row.getByRole("button", { name: "Delete for good" }).count()).toBe(0); // an admin's
    await row.getByRole("button", { name: "Restore" }).click();
    await row.waitFor({ state: "detached" });
    await page.getByText("The trash is empty.").waitFor();

    await page.goto(`${base}/fuels/${id}`);
    await page.getByRole("heading", { level: 1, name: /Trial gas/ }).waitFor();
    const history = page.locator("section.history");
    await history.getByText("restored from the trash").waitFor();
    const text = (await history.textContent()) ?? "";
    expect(text).toMatch(/moved to the trash/);
    expect(text).toMatch(/fuel created/);
    expect(text.match(/editor@example\.org/g)?.length).toBe(3);
  });

  it("signing out ends the session; an admin creates an account on the Accounts page and its creation is listed", async () => {
    const base = server.baseURL;
    await page.goto(`${base}/plants`);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    expect((await page.request.get(`${base}/api/fuels`)).status()).toBe(401);
    await page.getByLabel("E-mail").fill("admin@example.org");
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${base}/`);
    await page.getByRole("link", { name: "Accounts" }).click();
    await page.getByRole("heading", { level: 1, name: "Accounts" }).waitFor();
    const form = page.locator("form", { has: page.getByRole("button", { name: "Create" }) });
    await form.getByLabel("E-mail").fill("new.viewer@example.org");
    await form.getByLabel(/^Password/).fill("another long passphrase");
    await form.getByRole("button", { name: "Create" }).click();
    await page.getByRole("status").filter({ hasText: "Created new.viewer@example.org" }).waitFor();
    await page.getByRole("cell", { name: "new.viewer@example.org" }).first().waitFor();
    const changes = page.locator("section.history");
    await changes.getByText("account new.viewer@example.org created").waitFor();
    expect(await changes.textContent()).toMatch(/admin@example\.org/);
  });

  it("a server in team mode without a session secret of 32 characters refuses to start and says why", () => {
    const run = spawnSync(path.join(projectRoot, "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", "0"], {
      cwd: projectRoot,
      env: {
        ...process.env,
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL: `file:${path.join(dir, "refused.db")}`,
        STOKE_MODE: "team",
        STOKE_SESSION_SECRET: "too short",
      },
      encoding: "utf8",
      timeout: 30_000,
    });
    expect(run.status).toBe(1);
    expect(run.stderr + run.stdout).toMatch(
      /cannot start in team mode\. Team mode needs STOKE_SESSION_SECRET of at least 32 characters \(it has 9\)/,
    );
  });
});
