// A new buyer in a real browser writes a spec of two axes (a clamp and a hemming ram on one power
// unit), chooses the cycle while the shared power unit is sized beside it, and publishes it.
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Spec, SpecRevision } from "~/models/index.server";
import { makeMember } from "../support/factories";
import { PHONE, SCREENSHOTS, browserAppForFile, hydrated, signedInPage } from "../support/browser";
import { fillQuotationStep } from "../support/spec-page";

const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `machine-spec-${name}.png`), fullPage: true });

/** On a phone the step stacks without a sideways scroll of the page (screenshot `name`); then back to the desktop. */
async function fitsAPhone(page: Page, name: string) {
  await page.setViewportSize(PHONE);
  await shot(page, name);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
  await page.setViewportSize({ width: 1280, height: 720 });
}

async function next(page: Page, expectedStep: string) {
  await page.getByRole("button", { name: "Save and continue →" }).click();
  await page.waitForURL(`**/edit/${expectedStep}`);
  await hydrated(page);
}

async function answerAxis(page: Page, axis: string, a: { mass: string; force: string; stroke: string; out: string; back: string }, nextStep: string) {
  await page.getByLabel("Vertical").check();
  await page.getByRole("radio", { name: /^Down/ }).check();
  await next(page, `${axis}-motion`);
  await page.getByLabel("Moving mass", { exact: true }).fill(a.mass);
  await page.getByLabel("Working force at the end of the stroke").fill(a.force);
  await page.getByLabel("Stroke", { exact: true }).fill(a.stroke);
  await page.getByLabel("Extending speed").fill(a.out);
  await page.getByLabel("Retracting speed").fill(a.back);
  const preview = page.getByRole("complementary", { name: "Live preview" });
  await expect.poll(() => preview.getByRole("img").count(), { timeout: 8_000 }).toBeGreaterThan(0);
  return () => next(page, nextStep);
}

describe("a machine of two axes", () => {
  it("a new buyer names two axes, answers each, chooses the cycle and publishes the machine", { timeout: 180_000 }, async () => {
    const buyer = await makeMember("buyer", { organisationName: "Wrenfield Door Systems" });
    const page = await signedInPage(app, buyer.email, "**/specs");
    await page.getByRole("button", { name: "Start a new spec" }).first().click();
    await page.waitForURL("**/edit/machine");
    await hydrated(page);

    await page.getByLabel("Title").fill("Hemming cell");
    await page.getByLabel("What the machine does").fill("Clamps a door skin on the anvil, then folds its edge with the hemming ram.");
    await page.getByLabel("Axis 1 name").fill("Clamp");
    // Adding an axis keeps what was typed and shows the new one in the list, to be named there.
    await page.getByRole("button", { name: "+ Add an axis" }).click();
    await page.waitForURL("**/edit/machine#axes");
    await hydrated(page);
    expect(await page.getByLabel("Title").inputValue()).toBe("Hemming cell");
    expect(await page.getByLabel("Axis 2 name").inputValue()).toBe("Axis 2");
    // Two axes of one name are refused beside the second.
    await page.getByLabel("Axis 2 name").fill("clamp");
    await page.getByRole("button", { name: "Save and continue →" }).click();
    await expect.poll(() => page.getByText("Another axis is already called “clamp”.").count()).toBe(1);
    await page.getByLabel("Axis 2 name").fill("Hemming ram");
    await shot(page, "1-machine");
    await fitsAPhone(page, "1b-machine-phone");
    await next(page, "axis01-mounting");

    // The progress lists each axis with its steps.
    const progress = page.getByRole("navigation", { name: "Spec steps" });
    await expect.poll(() => progress.getByRole("list", { name: "Axes" }).innerText()).toMatch(/Clamp[\s\S]*Mounting[\s\S]*Hemming ram/);
    const spec = await Spec.findOne({ where: { title: "Hemming cell" }, rejectOnEmpty: true });
    const ram = spec.answers.machine.axes.split(" ")[1];

    await shot(page, "2-clamp-mounting");
    const clampDone = await answerAxis(page, "axis01", { mass: "40", force: "15000", stroke: "60", out: "50", back: "80" }, `${ram}-mounting`);
    await shot(page, "3-clamp-motion");
    await clampDone();
    const ramDone = await answerAxis(page, ram, { mass: "300", force: "45000", stroke: "250", out: "90", back: "140" }, "cycle");
    await ramDone();

    // One after another by default, in words; the shared power unit is sized beside it.
    const words = page.getByText(/^Clamp extends, then/);
    expect(await words.innerText()).toBe("Clamp extends, then Clamp retracts, then Hemming ram extends, then Hemming ram retracts.");
    const figures = page.locator("[data-machine-figures]");
    await expect.poll(() => figures.count(), { timeout: 8_000 }).toBe(1);
    // Clamp, hem, ram back, unclamp: the words follow the choice at once.
    const clamp = page.getByRole("group", { name: "Clamp" });
    const hemming = page.getByRole("group", { name: "Hemming ram" });
    await clamp.getByLabel("Retracts in").selectOption("4");
    await hemming.getByLabel("Extends in").selectOption("2");
    await hemming.getByLabel("Retracts in").selectOption("3");
    await expect
      .poll(() => page.getByText(/^Clamp extends, then/).innerText())
      .toBe("Clamp extends, then Hemming ram extends, then Hemming ram retracts, then Clamp retracts.");
    // Moving both together is sized at once: the cycle's table gains a phase where both move.
    const table = page.locator("[data-cycle-table]");
    await expect.poll(() => table.count(), { timeout: 8_000 }).toBe(1);
    expect(await table.innerText()).not.toMatch(/Clamp extends, Hemming ram/);
    await hemming.getByLabel("Extends in").selectOption("1");
    await expect.poll(() => table.innerText()).toMatch(/Clamp extends, Hemming ram/);
    await shot(page, "4a-cycle-together");
    await hemming.getByLabel("Extends in").selectOption("2");
    await expect.poll(() => table.innerText()).not.toMatch(/Clamp extends, Hemming ram/);
    await shot(page, "4-cycle");
    // On a phone the steps, the choices and the power unit stack too.
    await fitsAPhone(page, "4b-cycle-phone");
    await next(page, "duty");

    await page.getByLabel("Cycles per hour").fill("120");
    await page.getByLabel("Hours of work per day").fill("16");
    await shot(page, "5-duty");
    await next(page, "quotation");
    await fillQuotationStep(page, "UK — West Midlands");
    await next(page, "review");

    // The review shows the machine: both axes, the one power unit, the cycle, each axis's answers.
    await expect.poll(() => page.locator("[data-machine-report]").count()).toBe(1);
    expect(await page.getByRole("heading", { name: "The axes (2)" }).count()).toBe(1);
    expect(await page.getByText("Clamp extends, then Hemming ram extends, then Hemming ram retracts, then Clamp retracts.").count()).toBeGreaterThan(0);
    await shot(page, "6-review");
    await page.getByLabel(/I have read the cautions/).check();
    await page.getByRole("button", { name: "Publish for bids" }).click();
    await page.waitForURL("**/specs/*?published=1");
    await shot(page, "7-published");

    const revision = await SpecRevision.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(revision.machine).not.toBeNull();
    expect(revision.axes.map((a) => a.name)).toEqual(["Clamp", "Hemming ram"]);
    expect(revision.machine!.sequence.map((s) => s.map((m) => `${m.axis} ${m.motion}`).join(" + "))).toEqual([
      "Clamp extend",
      "Hemming ram extend",
      "Hemming ram retract",
      "Clamp retract",
    ]);
    await page.context().close();
  });
});
