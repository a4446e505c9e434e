// Jobs in a real browser: the stage chart arrives drawn in the server's HTML and hydrates without
// a mismatch; the shop records a milestone on the job page; the account manager's internal note
// stays out of the shop's view.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { User } from "~/models/index.server";
import { PASSWORD, makeJob } from "../support/factories";
import { makeDealParties } from "../support/parties";
import { SCREENSHOTS, browserAppForFile, hydrated, signInAs, signedInPage } from "../support/browser";

let buyer: User;
let shop: User;
let manager: User;
let jobId: string;

beforeAll(async () => {
  ({ buyer, shop, manager } = await makeDealParties({ buyer: "Marlow Clamp Systems", shop: "Tamar Hydraulic Works" }));
  for (const title of ["Fixture clamp, twin cylinders", "Edge press, main ram"]) {
    const { job } = await makeJob(buyer, shop, { title, totalCents: 2_480_000, leadTimeWeeks: 10 });
    jobId ??= job.id;
  }
});
const app = browserAppForFile();

/** Console errors and uncaught page errors (a hydration mismatch shows up as one of them). */
function collectErrors(page: import("playwright-core").Page) {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  return errors;
}

/**
 * Waits until React has claimed the server's markup (it sets its props on the DOM nodes it
 * hydrates), so nothing the test does to the page races the hydration it checks.
 */
async function fullyHydrated(page: import("playwright-core").Page) {
  await hydrated(page);
  await page.waitForFunction(() => {
    const form = document.querySelector("main form");
    return !!form && Object.keys(form).some((k) => k.startsWith("__reactProps"));
  });
}

// Playwright's default screenshot hides the caret with inline styles on inputs, which React
// would report as a hydration mismatch.
const shot = (page: import("playwright-core").Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, name), fullPage: true, caret: "initial" });

describe("jobs in the browser", () => {
  it("the account manager's dashboard: the chart is in the server's HTML and hydrates cleanly", async () => {
    const page = await app.newPage();
    const errors = collectErrors(page);
    await signInAs(page, manager.email, PASSWORD);
    await page.waitForURL("**/jobs");
    const html = await (await page.request.get("/jobs")).text();
    expect(html).toContain("data-jobs-chart");
    expect(html.match(/data-stage-bar="/g)?.length).toBe(7); // one per stage, zeros included

    await page.goto("/jobs");
    await fullyHydrated(page);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Job dashboard");
    const table = page.getByRole("table", { name: /Jobs by stage/ });
    expect(await table.getByRole("row", { name: /Awaiting retainer 2/ }).count()).toBe(1);
    expect(await page.locator("[data-jobs-chart] [data-stage-bar]").count()).toBe(7);
    expect(await page.locator('[data-jobs-chart] [data-stage-bar="2"]').count()).toBeGreaterThan(0);
    expect(await page.getByRole("link", { name: "Fixture clamp, twin cylinders" }).count()).toBe(1);
    await shot(page, "jobs-dashboard.png");

    // Filters are URL parameters read by the server.
    await page.getByLabel("Search jobs by spec title").fill("edge");
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/q=edge/);
    await expect.poll(() => page.getByRole("link", { name: "Fixture clamp, twin cylinders" }).count()).toBe(0);
    expect(await page.getByRole("link", { name: "Edge press, main ram" }).count()).toBe(1);

    // An internal note on the job page.
    await page.goto(`/jobs/${jobId}`);
    await fullyHydrated(page);
    await page.getByLabel("Note", { exact: true }).fill("Buyer asked for a call before the drawings are signed.");
    await page.getByRole("button", { name: "Save the note" }).click();
    await expect.poll(() => page.getByRole("status").first().textContent()).toContain("Internal note saved");
    expect(await page.getByText("Tenderflow staff only").count()).toBe(1);
    expect(errors).toEqual([]);
    await page.context().close();
  }, 60_000);

  it("the shop records a milestone on the job page and the buyer sees it, without the internal note", async () => {
    const page = await app.newPage();
    const errors = collectErrors(page);
    await signInAs(page, shop.email, PASSWORD);
    await page.waitForURL("**/open-specs");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Jobs" }).click();
    await page.waitForURL("**/jobs");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Jobs");
    await page.getByRole("link", { name: "Fixture clamp, twin cylinders" }).click();
    await page.waitForURL(`**/jobs/${jobId}`);
    await fullyHydrated(page);
    expect(await page.getByText("call before the drawings").count()).toBe(0);

    await page.getByLabel("Reached up to and including").selectOption("drawings_agreed");
    await page.getByLabel("Note (optional)").fill("Drawing rev C signed by both sides.");
    await page.getByRole("button", { name: "Record as reached" }).click();
    await expect.poll(() => page.getByRole("status").first().textContent()).toContain("Recorded as reached: Drawings agreed");
    // The forms start afresh for the next change.
    expect(await page.getByLabel("Note (optional)").inputValue()).toBe("");
    expect(await page.getByLabel("Reached up to and including").inputValue()).toBe("in_build");
    // Taking it back needs a reason, said beside the field.
    await page.getByRole("button", { name: "Take it back" }).click();
    await expect.poll(() => page.getByText("Say why the milestone is taken back.").count()).toBe(1);
    await shot(page, "job-shop.png");
    expect(errors).toEqual([]);
    await page.context().close();

    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    await buyerPage.goto(`/jobs/${jobId}`);
    await expect.poll(() => buyerPage.getByText("Drawing rev C signed by both sides.").count()).toBe(1);
    expect(await buyerPage.getByText("call before the drawings").count()).toBe(0);
    expect(await buyerPage.getByRole("button", { name: "Record as reached" }).count()).toBe(0);
    await shot(buyerPage, "job-buyer.png");
    await buyerPage.context().close();
  }, 60_000);
});
