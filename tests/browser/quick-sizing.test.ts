// The public quick-sizing page in a real browser: typing changes the circuit, units switch,
// a bad answer is marked beside its field.
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SCREENSHOTS, hydrated, startBrowserApp, type BrowserApp } from "../support/browser";

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
}, 120_000);
afterAll(async () => {
  await app?.close();
});

const diagram = (page: import("playwright-core").Page) => page.getByRole("img", { name: /circuit/i }).first();

describe("quick sizing", () => {
  it("opens with an example circuit and redraws it as the person types", async () => {
    const page = await app.newPage();
    await page.goto("/quick-sizing");
    await hydrated(page);
    const before = await diagram(page).innerHTML();
    expect(before).toContain(`data-kind="cbv"`); // the example press overruns on extension
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-example.png"), fullPage: true });

    // Turn the press into a horizontal feed: the counterbalance valve disappears.
    await page.getByLabel("Horizontal").check();
    await expect.poll(async () => (await diagram(page).innerHTML()).includes(`data-kind="cbv"`), { timeout: 5_000 }).toBe(false);

    // A much heavier working force needs a bigger bore.
    const boreBefore = await diagram(page).innerHTML();
    await page.getByLabel("Working force at the end of the stroke").fill("200000");
    await expect.poll(async () => await diagram(page).innerHTML(), { timeout: 5_000 }).not.toBe(boreBefore);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-feed.png"), fullPage: true });
    await page.context().close();
  });

  it("switches to US customary units and keeps the same axis", async () => {
    const page = await app.newPage();
    await page.goto("/quick-sizing");
    await hydrated(page);
    await page.getByText("US customary (in, lb, psi)").click();
    await expect.poll(() => page.getByLabel("Stroke", { exact: true }).inputValue()).toBe("19.69");
    await expect.poll(() => page.getByLabel("Moving mass", { exact: true }).inputValue()).toBe("1764");
    await expect.poll(async () => (await diagram(page).innerHTML()).includes("psi"), { timeout: 5_000 }).toBe(true);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-us.png"), fullPage: true });
    await page.context().close();
  });

  it("marks a bad answer beside its field and keeps the last circuit", async () => {
    const page = await app.newPage();
    await page.goto("/quick-sizing");
    await hydrated(page);
    await page.getByLabel("Stroke", { exact: true }).fill("-5");
    const stroke = page.getByLabel("Stroke", { exact: true });
    await expect.poll(() => stroke.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    await expect.poll(() => page.getByText("Some answers need attention").count()).toBe(1);
    expect(await diagram(page).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-error.png"), fullPage: true });
    await page.context().close();
  });
});
