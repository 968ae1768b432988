/**
 * Team mode in a real browser, by role (a second `next start` with STOKE_MODE=team on its own
 * seeded SQLite file): a viewer sees no button, link or form that changes anything on the fuel
 * list, a fuel sheet, a plant page and a study page — and the form pages still answer 403 — while
 * an editor sees each of them; an admin issues API tokens with a lifetime on the Accounts page.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser, pageSettled } from "./browser";
import { startNextServer, type NextServer } from "../support/next-server";
import { seedFlameFixture } from "../support/flame-fixture";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient } from "../../lib/db/client";
import { createAccount } from "../../lib/services/accounts";

let server: NextServer;
let dir: string;
let dbUrl: string;
let page: Page;
let close: () => Promise<void>;
const PASSWORD = "a long enough passphrase";
const ids = { fuel: 0, plant: 0, study: 0 };

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-roles-"));
  const url = `file:${path.join(dir, "roles.db")}`;
  dbUrl = url;
  migrateSqlite({ databaseUrl: url });
  const client = createClient(url);
  for (const role of ["viewer", "editor", "admin"] as const) {
    const a = await createAccount(client, { email: `${role}@example.org`, role, password: PASSWORD });
    if (!a.ok) throw new Error(a.message);
  }
  server = await startNextServer(
    {
      DATABASE_URL: url,
      STOKE_SEED: "on",
      STOKE_MODE: "team",
      STOKE_SESSION_SECRET: "browser test secret, at least thirty-two characters",
    },
    "/sign-in",
  );
  // The server seeded the demo on start; the demo study's flames are read from the fixture.
  await seedFlameFixture(client);
  const study = await client.study.findFirstOrThrow({ where: { deletedAt: null }, orderBy: { id: "asc" } });
  const plant = await client.plant.findUniqueOrThrow({ where: { id: study.plantId } });
  const fuel = await client.fuel.findUniqueOrThrow({ where: { id: plant.baselineFuelId as number } });
  Object.assign(ids, { fuel: fuel.id, plant: plant.id, study: study.id });
  await client.$disconnect();
  ({ page, close } = await openBrowser());
});
afterAll(async () => {
  await close?.();
  await server?.stop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

async function signInAs(email: string): Promise<void> {
  const base = server.baseURL;
  await page.context().clearCookies();
  const res = await page.request.post(`${base}/api/session`, { data: { email, password: PASSWORD }, headers: { origin: base } });
  expect(res.status(), await res.text()).toBe(200);
}

/** What each page offers, by accessible name: [page, role, name]. */
const ACTIONS: [(i: typeof ids) => string, "link" | "button", string | RegExp][] = [
  [() => "/fuels", "link", "New fuel or blend"],
  [(i) => `/fuels/${i.fuel}`, "link", "Edit fuel"],
  [(i) => `/fuels/${i.fuel}`, "button", "Delete fuel"],
  [(i) => `/fuels/${i.fuel}`, "button", "Correct"],
  [(i) => `/fuels/${i.fuel}`, "button", "Withdraw"],
  [(i) => `/fuels/${i.fuel}`, "button", "Add a price quote"],
  [(i) => `/plants/${i.plant}`, "link", "New study for this plant"],
  [(i) => `/plants/${i.plant}`, "link", "Edit plant"],
  [(i) => `/plants/${i.plant}`, "button", "Delete plant"],
  [(i) => `/studies/${i.study}`, "link", /^Edit$/],
  [(i) => `/studies/${i.study}`, "button", "Duplicate"],
  [(i) => `/studies/${i.study}`, "button", /^Delete$/],
  [(i) => `/studies/${i.study}`, "button", "Issue revision"],
];

/** How many of each action the pages show, in the order of ACTIONS. */
async function countActions(): Promise<number[]> {
  const counts: number[] = [];
  let at = "";
  for (const [where, role, name] of ACTIONS) {
    const url = server.baseURL + where(ids);
    if (url !== at) {
      const res = await page.goto(url);
      expect(res?.status(), url).toBe(200);
      await page.getByRole("heading", { level: 1 }).first().waitFor();
      await pageSettled(page);
      at = url;
    }
    counts.push(await page.getByRole(role, { name, exact: typeof name === "string" }).count());
  }
  return counts;
}

describe("team mode in the browser: what each role sees", () => {
  it("a viewer sees no edit, delete, import or revision actions on the fuel list, a fuel, a plant and a study; the form pages answer 403", async () => {
    await signInAs("viewer@example.org");
    const counts = await countActions();
    expect(Object.fromEntries(ACTIONS.map(([w, , n], k) => [`${w(ids)} ${n}`, counts[k]]))).toEqual(
      Object.fromEntries(ACTIONS.map(([w, , n]) => [`${w(ids)} ${n}`, 0])),
    );
    // Reading and exporting stay: the library's export link, the study's downloads, the tabs.
    await page.goto(`${server.baseURL}/fuels`);
    await page.locator("main").getByRole("link", { name: "Export", exact: true }).waitFor();
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Export", exact: true }).waitFor();
    await page.goto(`${server.baseURL}/studies/${ids.study}`);
    await page.getByRole("link", { name: "CSV", exact: true }).waitFor();
    await page.getByRole("link", { name: "Report", exact: true }).first().waitFor();
    // The import page shows the exports and no import form.
    await page.goto(`${server.baseURL}/fuels/transfer`);
    await page.getByRole("link", { name: "Download JSON" }).waitFor();
    expect(await page.getByRole("form", { name: "Import a library file" }).count()).toBe(0);
    expect(await page.getByRole("form", { name: "Add an exchange rate" }).count()).toBe(0);
    for (const p of ["/fuels/new", `/fuels/${ids.fuel}/edit`, `/plants/${ids.plant}/edit`, `/studies/${ids.study}/edit`]) {
      expect((await page.goto(server.baseURL + p))?.status(), p).toBe(403);
    }
  });

  it("an editor sees each of them", async () => {
    await signInAs("editor@example.org");
    const counts = await countActions();
    for (const [k, [w, , n]] of ACTIONS.entries()) expect(counts[k], `${w(ids)} ${n}`).toBeGreaterThan(0);
    await page.goto(`${server.baseURL}/fuels/transfer`);
    await page.getByRole("form", { name: "Import a library file" }).waitFor();
    expect((await page.goto(`${server.baseURL}/fuels/new`))?.status()).toBe(200);
  });

  it("an admin issues a token with a lifetime: a bad one is refused naming the field, the list shows the expiry and marks an expired token", async () => {
    await signInAs("admin@example.org");
    await page.goto(`${server.baseURL}/accounts`);
    const form = page.locator("form", { has: page.getByRole("button", { name: "Issue a token" }) });
    await form.getByLabel("What it is for").fill("reporting script");
    await form.getByLabel(/Valid for/).fill("400");
    await form.getByRole("button", { name: "Issue a token" }).click();
    await page.getByRole("alert").filter({ hasText: "lifetimeDays: must be at most 365 days" }).waitFor();
    await form.getByLabel(/Valid for/).fill("30");
    await form.getByRole("button", { name: "Issue a token" }).click();
    await page.getByTestId("new-token").waitFor();
    const client = createClient(dbUrl);
    const tokens = await client.apiToken.findMany();
    expect(tokens.length).toBe(1);
    const t = tokens[0];
    const days = (t.expiresAt.getTime() - t.createdAt.getTime()) / (24 * 3600 * 1000);
    expect(days).toBeCloseTo(30, 6);
    const row = page.getByTestId(`token-${t.id}`);
    await row.getByText(t.expiresAt.toISOString().slice(0, 16).replace("T", " ")).waitFor();
    expect(await row.getByText("expired").count()).toBe(0);
    await client.apiToken.update({ where: { id: t.id }, data: { expiresAt: new Date("2026-01-05T08:30:00Z") } });
    await client.$disconnect();
    await page.reload();
    await row.getByText("2026-01-05 08:30").waitFor();
    await row.getByText("expired", { exact: true }).waitFor();
  });
});
