// Job pages as a first-time account manager, buyer and admin read them, on a laptop and a phone:
// a handed-over job says what it waits for and an overdue one how late it is (dashboard and
// account page alike); on a phone the stage counts read as a short table and the job page's
// actions stay whole; the card service's return page names the job; the audit log links an
// award's job and says its details in words.
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Job, JobMilestone, Organisation, Payment, type User } from "~/models/index.server";
import { addDays, todayUtc } from "~/content/dates";
import { newAttempt } from "~/services/payments.server";
import { reachMilestones } from "~/services/job-progress.server";
import { PASSWORD, makeJob, makeMember, makeOperatorUser } from "../support/factories";
import { awardedJob } from "../support/awards";
import { SCREENSHOTS, hydrated, signInAs, startBrowserApp, type BrowserApp } from "../support/browser";

const LAPTOP = { width: 1366, height: 768 };
const PHONE = { width: 390, height: 844 };
const HANDED_OVER = "Baling press, main ram";
const LATE = "Edge press, main ram";

let app: BrowserApp;
// The people: a buyer account followed by its manager, and an admin; the jobs: one handed over, one late.
let buyer: User, manager: User, admin: User;
let handedOver: Job, late: Job;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Hollin Press Works" });
  const shop = await makeMember("shop", { organisationName: "Garrow Fluid Power" });
  manager = await makeOperatorUser("account_manager");
  admin = await makeOperatorUser("admin");
  await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
  // Awarded through the award service (so the audit log has it), paid, then handed over by the shop.
  handedOver = await awardedJob(buyer, shop, { title: HANDED_OVER });
  await handedOver.update({ retainerPaidAt: new Date() });
  await JobMilestone.update({ reachedAt: new Date() }, { where: { jobId: handedOver.id, key: "retainer_received" } });
  await reachMilestones(shop, handedOver.id, { milestone: "handed_over", note: "" });
  await Payment.create({ ...newAttempt(handedOver, buyer.id), status: "paid", paidAt: new Date(), checkoutSessionId: "cs_test_at_a_glance" });
  await Payment.create({ ...newAttempt(handedOver, buyer.id, "balance"), checkoutSessionId: "cs_test_at_a_glance_balance" });
  // A job whose retainer was due five days ago.
  ({ job: late } = await makeJob(buyer, shop, { title: LATE }));
  await JobMilestone.update({ targetDate: addDays(todayUtc(), -5) }, { where: { jobId: late.id, key: "retainer_received" } });
  app = await startBrowserApp();
}, 180_000);
afterAll(async () => {
  await app?.close();
});

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `at-a-glance-${name}.png`), fullPage: true });

async function signedIn(email: string, home: string, viewport: { width: number; height: number }) {
  const page = await app.newPage();
  await page.setViewportSize(viewport);
  await signInAs(page, email, PASSWORD);
  await page.waitForURL(home);
  return page;
}

async function open(page: Page, url: string) {
  await page.goto(url);
  await hydrated(page);
}

describe("job pages at a glance", () => {
  it(
    "the account manager sees what a handed-over job waits for and how late a job is, on the dashboard and the account's page",
    { timeout: 120_000 },
    async () => {
      const page = await signedIn(manager.email, "**/jobs", LAPTOP);
      const row = (title: string) => page.getByRole("row").filter({ has: page.getByRole("link", { name: title }) });
      await expect.poll(() => row(HANDED_OVER).textContent()).toContain("Awaiting the buyer's acceptance, balance due");
      expect(await row(LATE).textContent()).toContain("5 days late");
      await shot(page, "1-dashboard");

      await open(page, `/accounts/${buyer.organisationId}`);
      const jobsCard = page.locator("section", { has: page.getByRole("heading", { name: "Jobs", exact: true }) });
      const item = (title: string) => jobsCard.getByRole("listitem").filter({ has: page.getByRole("link", { name: title }) });
      await expect.poll(() => item(HANDED_OVER).textContent()).toContain("Awaiting the buyer's acceptance, balance due");
      expect(await item(LATE).textContent()).toContain("5 days late");
      await shot(page, "2-account");

      await open(page, `/jobs/${handedOver.id}`);
      expect(await page.getByText("Awaiting the buyer's acceptance, balance due").count()).toBe(1);

      // The payments list says what each card payment was for.
      await open(page, "/payments");
      const payments = page.getByRole("row").filter({ has: page.getByRole("link", { name: HANDED_OVER }) });
      await expect.poll(() => payments.count()).toBe(2);
      expect(await payments.getByRole("cell", { name: "Balance", exact: true }).count()).toBe(1);
      expect(await payments.getByRole("cell", { name: "Retainer", exact: true }).count()).toBe(1);
      await shot(page, "2b-payments");
      await page.context().close();
    },
  );

  it(
    "on a phone: the stage counts are a short table, not a chart cut at the edge, and the job's actions each stay on one line",
    { timeout: 120_000 },
    async () => {
      const page = await signedIn(manager.email, "**/jobs", PHONE);
      await hydrated(page);
      const counts = page.getByRole("table", { name: /Jobs by stage/ });
      await expect.poll(() => counts.isVisible()).toBe(true);
      expect(await counts.getByRole("row", { name: "Handed over 1" }).isVisible()).toBe(true);
      expect(await page.locator("[data-jobs-chart]").isVisible()).toBe(false);
      await shot(page, "3-phone-dashboard");

      await open(page, `/jobs/${handedOver.id}`);
      for (const name of ["Order confirmation", "Open the spec", "Download the priced bill (XLSX)"]) {
        const box = (await page.getByRole("link", { name }).boundingBox())!;
        // One line of text in a button is about 36 px high; a squeezed one was two or three lines.
        expect(box.height, name).toBeLessThan(44);
        expect(box.x + box.width, name).toBeLessThanOrEqual(PHONE.width);
      }
      await shot(page, "4-phone-job");
      await page.context().close();
    },
  );

  it("back from the card service, the buyer reads which job the payment was for", { timeout: 60_000 }, async () => {
    const page = await signedIn(buyer.email, "**/specs", PHONE);
    await open(page, `/jobs/${handedOver.id}/payment?session_id=cs_test_at_a_glance`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Retainer payment");
    expect(await page.getByText(new RegExp(`^${HANDED_OVER} · `)).count()).toBe(1);
    await shot(page, "5-payment-return");
    await page.context().close();
  });

  it("the audit log links an award's job and says its details in words", { timeout: 60_000 }, async () => {
    const page = await signedIn(admin.email, "**/admin/**", LAPTOP);
    await open(page, "/admin/audit?action=bid-awarded");
    const award = page.getByRole("row").filter({ hasText: HANDED_OVER });
    await expect.poll(() => award.count()).toBe(1);
    expect(await award.getByRole("link", { name: HANDED_OVER }).getAttribute("href")).toBe(`/jobs/${handedOver.id}`);
    expect(await award.textContent()).toContain("Shop: Garrow Fluid Power");
    expect(await award.textContent()).not.toContain("jobId");
    await shot(page, "6-audit");
    await page.context().close();
  });
});
