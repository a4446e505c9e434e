// A first-time buyer in a real browser: signs up, switches to US units, describes a lift axis
// step by step while the live preview redraws, and publishes it. A screenshot of every step.
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Spec, SpecAttachment, SpecRevision } from "~/models/index.server";
import { fillQuotationStep } from "../support/spec-page";
import { SCREENSHOTS, browserAppForFile, hydrated, openHydrated } from "../support/browser";
import { linkIn, waitForMail } from "../support/mailbox";

const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `intake-${name}.png`), fullPage: true });

async function next(page: Page, expectedStep: string) {
  await saveInView(page);
  await page.getByRole("button", { name: "Save and continue →" }).click();
  await page.waitForURL(`**/edit/${expectedStep}`);
  await hydrated(page);
}

/** On a 1366 × 768 laptop screen a step's main action is in view without scrolling, however long the step. */
async function saveInView(page: Page) {
  const box = (await page.getByRole("button", { name: "Save and continue →" }).boundingBox())!;
  const height = page.viewportSize()!.height;
  expect(box.y).toBeGreaterThanOrEqual(0);
  expect(box.y + box.height).toBeLessThanOrEqual(height);
}

describe("spec intake", () => {
  it("a new buyer describes an axis in US units and publishes it", { timeout: 120_000 }, async () => {
    const page = await app.newPage();
    await openHydrated(page, "/sign-up");
    await page.getByText("We build machines").click();
    await page.getByLabel("Company name").fill("Tamsin Lift Works");
    await page.getByLabel("Your name").fill("Tamsin Hale");
    await page.getByLabel("Work e-mail address").fill("tamsin@tamsin-lift.test");
    await page.getByLabel("Password").fill("first-time-buyer");
    await page.getByRole("button", { name: "Create account" }).click();
    // The address is confirmed by the link mailed to it, which makes the account.
    await expect.poll(() => page.getByRole("heading", { name: "Check your inbox" }).count()).toBe(1);
    const link = new URL(linkIn(await waitForMail("tamsin@tamsin-lift.test", "Finish creating", 15_000), "/sign-up/"));
    await openHydrated(page, link.pathname);
    await page.getByRole("button", { name: "Create my account" }).click();
    await page.waitForURL("**/specs");
    await shot(page, "0-empty");

    await openHydrated(page, "/settings");
    await page.getByText("US customary (in, lb, psi)").click();
    await page.getByRole("button", { name: "Save settings" }).click();
    await page.waitForURL("**/settings");

    await page.goto("/specs");
    await page.getByRole("button", { name: "Start a new spec" }).first().click();
    await page.waitForURL("**/edit/machine");
    await hydrated(page);
    await page.setViewportSize({ width: 1366, height: 768 });

    // A bad answer shows beside its field.
    await page.getByRole("button", { name: "Save and continue →" }).click();
    await expect.poll(() => page.getByText("Give the spec a short title").count()).toBe(1);
    await page.getByLabel("Title").fill("Scissor lift, main cylinder");
    // Leaving a half-filled step asks first; staying keeps what was typed.
    await page.getByRole("link", { name: "← My specs" }).click();
    await expect.poll(() => page.getByRole("alertdialog").count()).toBe(1);
    expect(await page.getByRole("alertdialog").innerText()).toContain("Leave this step without saving?");
    await page.getByRole("button", { name: "Stay on this step" }).click();
    expect(page.url()).toContain("/edit/machine");
    expect(await page.getByLabel("Title").inputValue()).toBe("Scissor lift, main cylinder");
    // One axis to start with, named by the buyer; its own questions come next.
    await page.getByLabel("Axis 1 name").fill("Lift cylinder");
    await shot(page, "1-machine");
    await next(page, "axis01-mounting");
    await page.getByLabel("Vertical").check();
    // Which way the rod moves is answered already ("Up"), as quick sizing does; it can be changed.
    expect(await page.getByRole("radio", { name: /^Up/ }).isChecked()).toBe(true);
    await page.getByRole("radio", { name: /^Down/ }).check();
    await page.getByRole("radio", { name: /^Up/ }).check();
    // The body's mounting is a refinement behind a disclosure; a trunnion-mounted lift.
    await page.getByText("More about the mounting").click();
    await page.getByLabel("How the cylinder body is fixed").selectOption("trunnion");
    await shot(page, "1b-mounting");
    await next(page, "axis01-motion");

    await page.getByLabel("Moving mass", { exact: true }).fill("2200");
    await page.getByLabel("Stroke", { exact: true }).fill("30");
    await page.getByLabel("Extending speed").fill("2");
    await page.getByLabel("Retracting speed").fill("3");
    const preview = page.getByRole("complementary", { name: "Live preview" });
    await expect.poll(() => preview.getByRole("img").count(), { timeout: 8_000 }).toBe(1);
    const first = await preview.getByRole("img").innerHTML();
    await page.getByLabel("Moving mass", { exact: true }).fill("9000");
    await expect.poll(() => preview.getByRole("img").innerHTML(), { timeout: 8_000 }).not.toBe(first);
    expect(await preview.getByRole("img").innerHTML()).toContain("psi");
    // The lift stops more gently than it starts.
    await page.getByText("More about the motion").click();
    await page.getByLabel("Time to stop").fill("0.5");
    // How long the load is held is the axis's own.
    await page.getByLabel("Time the load is held at rest").fill("20");
    // The live preview's key sizes each fit their own cell on a laptop screen (none runs into the next).
    const keySizes = page.locator("[data-key-size] > dd:first-of-type");
    await expect.poll(() => keySizes.count()).toBeGreaterThan(0);
    const overflowing = await keySizes.evaluateAll((dds) => dds.filter((dd) => dd.scrollWidth > dd.clientWidth + 1).map((dd) => dd.textContent));
    expect(overflowing).toEqual([]);
    await shot(page, "2-motion");
    await next(page, "duty");

    await page.getByLabel("Cycles per hour").fill("12");
    await page.getByLabel("Hours of work per day").fill("8");
    await page
      .getByLabel("60 Hz")
      .check()
      .catch(async () => page.getByLabel("Mains frequency").selectOption("60"));
    await page.getByLabel("Mains voltage").selectOption("480 V three-phase");
    await shot(page, "3-duty");
    await next(page, "quotation");

    await fillQuotationStep(page, "US — Ohio");
    // A drawing goes up on its own request, outside the step's form, with a progress bar.
    await page.locator("[data-enhanced]").waitFor(); // the uploader is a chunk of its own: hydrated once it is there
    await page.getByLabel("Drawings and photos").setInputFiles({
      name: "lift-layout.pdf",
      mimeType: "application/pdf",
      buffer: Buffer.from("%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n"),
    });
    await expect.poll(() => page.getByRole("link", { name: "lift-layout.pdf" }).count(), { timeout: 8_000 }).toBeGreaterThan(0);
    await shot(page, "4-quotation");
    await next(page, "review");

    await expect.poll(() => page.getByText("Before anyone builds this").count()).toBe(1);
    expect(await page.getByRole("link", { name: "lift-layout.pdf" }).count()).toBe(1);
    // Every answer reads in words with its unit: choices by their labels, blanks by their meaning.
    const answer = (label: string) => page.locator("dt", { hasText: new RegExp(`^${label}$`) }).locator("xpath=following-sibling::dd[1]");
    expect(await answer("How the cylinder body is fixed").innerText()).toBe("Trunnion");
    expect(await answer("Mains frequency").innerText()).toBe("60 Hz");
    expect(await answer("Time to stop").innerText()).toBe("0.5 s");
    expect(await answer("Time the load is held at rest").innerText()).toBe("20 min");
    expect(await answer("Pump").innerText()).toBe("Let the sizing choose");
    expect(await answer("Stroke").innerText()).toBe("30 in");
    await shot(page, "5-review");
    // On a 1366 × 768 screen the publish bar is in view without scrolling; long detail is folded, one click away.
    await page.setViewportSize({ width: 1366, height: 768 });
    const publishBox = (await page.getByRole("button", { name: "Publish for bids" }).boundingBox())!;
    expect(publishBox.y).toBeGreaterThanOrEqual(0);
    expect(publishBox.y + publishBox.height).toBeLessThanOrEqual(768);
    const trail = page.locator("details#calculation-trail");
    expect(await trail.evaluate((d) => (d as HTMLDetailsElement).open)).toBe(false);
    await page.getByRole("link", { name: "How every number was reached" }).click();
    await expect.poll(() => trail.evaluate((d) => (d as HTMLDetailsElement).open)).toBe(true);
    // Drawn when it opens, not sent with the page.
    await expect.poll(() => trail.locator("[data-trail-row]").count()).toBeGreaterThan(20);
    await page.screenshot({ path: path.join(SCREENSHOTS, "intake-5b-review-1366.png") });
    await page.getByLabel(/I have read the cautions/).check();
    await page.getByRole("button", { name: "Publish for bids" }).click();
    await page.waitForURL("**/specs/*?published=1");
    await expect.poll(() => page.getByText("Open for bids").count()).toBeGreaterThan(0);
    await shot(page, "6-published");

    const spec = await Spec.findOne({ where: { title: "Scissor lift, main cylinder" }, rejectOnEmpty: true });
    expect(spec.status).toBe("open");
    const revision = await SpecRevision.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const requirements = revision.axes[0].requirements as {
      strokeMm: number;
      massKg: number;
      supplyHz: number;
      holdMinutes: number;
      decelTimeS: number;
      mountingStyle: string;
    };
    expect(requirements).toMatchObject({ holdMinutes: 20, decelTimeS: 0.5, mountingStyle: "trunnion" });
    expect(requirements.strokeMm).toBeCloseTo(762, 0); // 30 in × 25.4 mm/in
    expect(requirements.massKg).toBeCloseTo(4082, 0); // 9000 lb × 0.45359237 kg/lb
    expect(requirements.supplyHz).toBe(60);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(1);
    await page.context().close();
  });
});
