// The public quick-sizing page in a real browser: typing changes the circuit, units switch,
// a bad answer is marked beside its field.
import path from "node:path";
import { describe, expect, it } from "vitest";
import { SCREENSHOTS, browserAppForFile, openHydrated } from "../support/browser";

const app = browserAppForFile();

const diagram = (page: import("playwright-core").Page) => page.getByRole("img", { name: /circuit/i }).first();

/** A new page on the quick-sizing form, hydrated, with its example axis. */
async function quickSizing() {
  const page = await app.newPage();
  await openHydrated(page, "/quick-sizing");
  return page;
}

describe("quick sizing", () => {
  it("opens with an example circuit and redraws it as the person types", async () => {
    const page = await quickSizing();
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

  it("draws the folded bill and calculation trail when they open, for the design as typed", async () => {
    const page = await quickSizing();
    const trail = page.locator("details#calculation-trail");
    const bill = page.locator("details#bill");
    // Not in the page until opened: the trail alone was 84 kB of its HTML.
    expect(await trail.locator("[data-trail-row]").count()).toBe(0);
    expect(await bill.locator("[data-bom-key]").count()).toBe(0);
    await bill.locator("summary").click();
    await expect.poll(() => bill.locator("[data-bom-key]").count()).toBeGreaterThan(5);
    await page.getByRole("link", { name: "How every number was reached" }).click();
    await expect.poll(() => trail.locator("[data-trail-row]").count()).toBeGreaterThan(20);
    // An open trail follows the design as it changes.
    const rows = await trail.locator("[data-trail-row]").allTextContents();
    await page.getByLabel("Working force at the end of the stroke").fill("200000");
    await expect.poll(async () => (await trail.locator("[data-trail-row]").allTextContents()).join("|"), { timeout: 5_000 }).not.toBe(rows.join("|"));
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-trail-open.png") });
    await page.context().close();
  });

  it("switches to US customary units and keeps the same axis", async () => {
    const page = await quickSizing();
    await page.getByText("US customary (in, lb, psi)").click();
    await expect.poll(() => page.getByLabel("Stroke", { exact: true }).inputValue()).toBe("19.69");
    await expect.poll(() => page.getByLabel("Moving mass", { exact: true }).inputValue()).toBe("1764");
    await expect.poll(async () => (await diagram(page).innerHTML()).includes("psi"), { timeout: 5_000 }).toBe(true);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-us.png"), fullPage: true });
    // Back to metric: every answer reads exactly as typed (50 000 N is not 49 997 N after a trip through lbf).
    await page.getByText("Metric (mm, kg, bar)").click();
    await expect.poll(() => page.getByLabel("Stroke", { exact: true }).inputValue()).toBe("500");
    expect(await page.getByLabel("Moving mass", { exact: true }).inputValue()).toBe("800");
    const force = page.getByLabel("Working force at the end of the stroke");
    expect(await force.inputValue()).toBe("50000");
    // A force typed with its own unit is sized as such; a unit of the wrong kind is refused.
    await force.fill("60 bar");
    await expect.poll(() => force.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    await force.fill("60 kN");
    await expect.poll(() => force.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe(null);
    await page.context().close();
  });

  it("asks about a slow pressing stroke behind 'More about the motion', the pressing speed only with one", async () => {
    const page = await quickSizing();
    expect(await page.getByLabel("Pressing stroke").isVisible()).toBe(false);
    await page.getByText("More about the motion").click();
    expect(await page.getByRole("textbox", { name: "Pressing speed" }).count()).toBe(0);
    await page.getByLabel("Pressing stroke").fill("30");
    // by role: the circuit diagram's description names the pressing-speed control too
    const speed = page.getByRole("textbox", { name: "Pressing speed" });
    await expect.poll(() => speed.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    expect(await page.locator("#req-pressSpeedMmS-error").innerText()).toMatch(/needed when there is a pressing stroke/);
    await speed.fill("10");
    await expect.poll(() => speed.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe(null);
    expect(await diagram(page).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-press.png"), fullPage: true });
    await page.context().close();
  });

  it("shows the phases of one cycle after sizing, on a wide screen, a phone and in print", async () => {
    const page = await app.newPage();
    // A hydration mismatch in the chart would show up as a console or page error.
    const errors: string[] = [];
    page.on("console", (m) => {
      // The API's 400 for answers still being typed (a pressing stroke before its speed, on a slow machine) is its answer, not a fault.
      if (m.type() === "error" && !/status of 400/.test(m.text())) errors.push(m.text());
    });
    page.on("pageerror", (e) => errors.push(e.message));
    // The server's HTML already holds the drawn chart (plain SVG at a fixed size).
    const html = await (await page.request.get("/quick-sizing")).text();
    expect(html).toContain("data-cycle-chart");
    expect(html).toContain('<svg id="cycle-wide-pressure"');
    await openHydrated(page, "/quick-sizing");
    await page.getByText("More about the motion").click();
    await page.getByLabel("Pressing stroke").fill("30");
    await page.getByRole("textbox", { name: "Pressing speed" }).fill("10");
    const chart = page.locator("[data-cycle-chart]");
    await expect.poll(() => chart.locator('tr[data-cycle-phase="pressing"]').count(), { timeout: 15_000 }).toBe(1);
    expect(errors).toEqual([]);
    expect(await chart.locator('[data-cycle-size="wide"] svg[data-cycle-panel]').first().isVisible()).toBe(true);
    await chart.screenshot({ path: path.join(SCREENSHOTS, "cycle-chart-1280.png") });
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-cycle-1280.png"), fullPage: true });
    await page.setViewportSize({ width: 390, height: 844 });
    expect(await chart.locator('[data-cycle-size="narrow"] svg[data-cycle-panel]').first().isVisible()).toBe(true);
    await chart.screenshot({ path: path.join(SCREENSHOTS, "cycle-chart-390.png") });
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-390.png"), fullPage: true });
    await page.emulateMedia({ media: "print" });
    expect(await chart.locator('[data-cycle-size="wide"] svg[data-cycle-panel]').first().isVisible()).toBe(true);
    await chart.screenshot({ path: path.join(SCREENSHOTS, "cycle-chart-print.png") });
    await page.context().close();
  });

  it("opens the diagram larger on a phone, zooms it and closes again", async () => {
    const page = await app.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await openHydrated(page, "/quick-sizing");
    await page.getByRole("button", { name: "Open the diagram larger" }).click();
    const viewer = page.getByRole("dialog", { name: "Circuit diagram, larger" });
    await expect.poll(() => viewer.isVisible()).toBe(true);
    await viewer.getByRole("button", { name: "300 %" }).click();
    const scroller = viewer.locator("[data-diagram-zoom='3']");
    await expect.poll(() => scroller.evaluate((el) => el.scrollWidth > 3 * el.clientWidth)).toBe(true);
    // Labels are drawn at about 11.5 units; at 300 % of a 760-unit drawing that is about 34 px per line of text on screen.
    const width = (await scroller.locator("[data-circuit-diagram]").boundingBox())!.width;
    expect(width).toBeGreaterThan(2200);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-diagram-zoom-390.png") });
    await viewer.getByRole("button", { name: "Close" }).click();
    await expect.poll(() => viewer.isVisible()).toBe(false);
    expect(await diagram(page).count()).toBe(1);
    await page.context().close();
  });

  it("works as a plain GET form without JavaScript, the new questions included", async () => {
    const context = await app.browser.newContext({ baseURL: app.baseUrl, javaScriptEnabled: false, viewport: { width: 1280, height: 860 } });
    const page = await context.newPage();
    await page.goto("/quick-sizing");
    await page.getByText("More about the motion").click();
    await page.getByLabel("Pressing stroke").fill("30");
    await page.getByRole("button", { name: "Size the circuit" }).click();
    await page.waitForURL(/pressStrokeMm=30/);
    // The answer inside keeps the disclosure open, and the speed it now needs is asked, with the reason.
    expect(await page.locator("#req-pressSpeedMmS-error").innerText()).toMatch(/needed when there is a pressing stroke/);
    await page.getByLabel("Pressing speed").fill("10");
    await page.getByText("Pump choice").click();
    await page.getByRole("radio", { name: /^Double \(high-low\)/ }).check();
    await page.getByRole("button", { name: "Size the circuit" }).click();
    await page.waitForURL(/pressSpeedMmS=10/);
    expect(await page.locator("#req-pressSpeedMmS-error").count()).toBe(0);
    expect(await diagram(page).count()).toBe(1);
    expect(page.url()).toContain("pumpType=double");
    await context.close();
  });

  it("marks a bad answer beside its field and keeps the last circuit", async () => {
    const page = await quickSizing();
    await page.getByLabel("Stroke", { exact: true }).fill("-5");
    const stroke = page.getByLabel("Stroke", { exact: true });
    await expect.poll(() => stroke.getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    await expect.poll(() => page.getByText("Some answers need attention").count()).toBe(1);
    expect(await diagram(page).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-error.png"), fullPage: true });
    await page.context().close();
  });

  it("adds a second axis, names it, and shows both on one shared power unit with the machine's diagram; a bad answer is marked on its own axis", async () => {
    const page = await quickSizing();
    await page.getByRole("button", { name: /Add a second axis/ }).click();
    const first = page.locator('[data-quick-axis="1"]');
    const second = page.locator('[data-quick-axis="2"]');
    // The new axis appears above the button: its name takes the focus, in view, and the legend does not say "Axis 2: Axis 2".
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("id"))).toMatch(/^axis-\d+-name$/);
    expect(await second.getByLabel("Name of axis 2").evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await second.getByLabel("Name of axis 2").isVisible()).toBe(true);
    const nameBox = await second.getByLabel("Name of axis 2").boundingBox();
    expect(nameBox!.y).toBeGreaterThanOrEqual(0);
    expect(nameBox!.y).toBeLessThan(page.viewportSize()!.height);
    expect(await second.locator(":scope > legend").innerText()).toBe("Axis 2");
    await first.getByLabel("Name of axis 1").fill("Press");
    await second.getByLabel("Name of axis 2").fill("Clamp");
    // the clamp: a short, light horizontal stroke
    await second.getByLabel("Horizontal").check();
    // each axis's choices are a group of their own: the clamp's orientation leaves the press's alone
    expect(await second.getByLabel("Horizontal").isChecked()).toBe(true);
    expect(await first.getByLabel("Vertical").isChecked()).toBe(true);
    await second.getByLabel("Stroke", { exact: true }).fill("50");
    await second.getByLabel("Moving mass", { exact: true }).fill("100");
    const report = page.locator("[data-machine-report]");
    await expect.poll(async () => (await report.count()) === 1 && (await report.innerText()).includes("Clamp"), { timeout: 15_000 }).toBe(true);
    const text = await report.innerText();
    expect(text).toContain("Press");
    expect(text).toMatch(/Relief setting/);
    expect(text).toMatch(/Motor rating/);
    expect(text).toMatch(/Reservoir/);
    expect(await page.locator("[data-quick-cycle]").innerText()).toMatch(/one at a time, in the order above/);
    // the duty is asked once, for the whole machine
    expect(await page.getByRole("heading", { name: "Duty and site, for the whole machine" }).count()).toBe(1);
    expect(await page.getByLabel("Cycles per hour").count()).toBe(1);
    // one diagram of the machine: a column for each axis, one pump
    const drawing = page.locator('svg[data-machine-axes="2"]').first();
    await expect.poll(() => drawing.count(), { timeout: 15_000 }).toBe(1);
    expect(await drawing.locator('[data-axis-label="Press"]').count()).toBe(1);
    expect(await drawing.locator('[data-axis-label="Clamp"]').count()).toBe(1);
    expect(await drawing.locator('g[data-kind="pump"]').count()).toBeGreaterThanOrEqual(1);
    expect(await drawing.locator('g[data-kind="relief"]').count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-machine-1280.png"), fullPage: true });
    const circuitCard = report.locator("*:has(> [data-diagram-scroll])").first();
    await circuitCard.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-machine-diagram-1280.png") });
    // wider than the page: it scrolls sideways rather than shrinking its labels
    const scroller = report.locator("[data-diagram-scroll]");
    expect(await scroller.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);

    // A bad stroke on the clamp is marked on the clamp's field, not the press's.
    await second.getByLabel("Stroke", { exact: true }).fill("-5");
    await expect.poll(() => second.getByLabel("Stroke", { exact: true }).getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    expect(await first.getByLabel("Stroke", { exact: true }).getAttribute("aria-invalid")).toBe(null);
    await expect.poll(() => page.getByText("Some answers need attention").count()).toBe(1);
    expect(await report.count()).toBe(1); // the last machine stays on screen
    // Two axes of one name: the name is refused beside it.
    await second.getByLabel("Stroke", { exact: true }).fill("50");
    await second.getByLabel("Name of axis 2").fill("Press");
    await expect.poll(() => second.getByLabel("Name of axis 2").getAttribute("aria-invalid"), { timeout: 5_000 }).toBe("true");
    expect(await second.innerText()).toContain("Another axis already has this name");
    await second.getByLabel("Name of axis 2").fill("Clamp");
    await expect.poll(() => second.getByLabel("Name of axis 2").getAttribute("aria-invalid"), { timeout: 5_000 }).toBe(null);

    await page.setViewportSize({ width: 390, height: 844 });
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-machine-390.png"), fullPage: true });
    await circuitCard.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-machine-diagram-390.png") });
    // the larger view on a phone: every axis, zoomed and scrolled
    await report.getByRole("button", { name: "Open the diagram larger" }).click();
    const viewer = page.getByRole("dialog", { name: "Circuit diagram, larger" });
    await viewer.getByRole("button", { name: "150 %" }).click();
    const zoomed = viewer.locator("[data-diagram-zoom='1.5'] [data-circuit-diagram]");
    expect((await zoomed.boundingBox())!.width).toBeGreaterThan(1.5 * 1500);
    await page.screenshot({ path: path.join(SCREENSHOTS, "quick-sizing-machine-zoom-390.png") });
    await viewer.getByRole("button", { name: "Close" }).click();

    // Removing the clamp gives back the one-axis page.
    await page.getByRole("button", { name: "Remove Clamp" }).click();
    await expect.poll(() => page.locator("[data-machine-report]").count(), { timeout: 15_000 }).toBe(0);
    await expect.poll(() => diagram(page).count(), { timeout: 15_000 }).toBe(1);
    expect(await page.locator("svg[data-machine-axes]").count()).toBe(0);
    expect(await page.getByLabel("Name of axis 1").count()).toBe(0);
    await page.context().close();
  }, 60_000);
});
