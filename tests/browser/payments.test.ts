// The money path in a real browser: the buyer of an awarded job is sent to the fake card
// service's page, a declined card is explained and retried, a good card pays, the job shows the
// retainer as received once the signed webhook arrives — and replaying every webhook the fake
// sent changes nothing.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Job, JobEvent, OutboxMail, Payment, StripeEvent, type User } from "~/models/index.server";
import { makeMember } from "../support/factories";
import { SCREENSHOTS, browserAppForFile, openHydrated, signedInPage } from "../support/browser";
import { awardedJob } from "../support/awards";
import { fillCard, startBrowserAppWithCards } from "../support/card-page";

let buyer: User;
let job: Job;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Saltmarsh Baling Machines" });
  const shop = await makeMember("shop", { organisationName: "Tollgate Hydraulics" });
  job = await awardedJob(buyer, shop, { unitPrice: "250", leadTimeWeeks: 9, title: "Baler, compaction ram" });
});
const app = browserAppForFile(startBrowserAppWithCards);

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `payments-${name}.png`), fullPage: true });

describe("paying the retainer", () => {
  it("a declined card is explained and retried, a good one pays, and replayed webhooks change nothing", { timeout: 180_000 }, async () => {
    const page = await signedInPage(app, buyer.email, "**/specs");
    await openHydrated(page, `/jobs/${job.id}`);
    await shot(page, "1-job-unpaid");
    // On a phone the payment is the first thing under the job's title, not under its milestones.
    await page.setViewportSize({ width: 390, height: 844 });
    const pay = await page.getByRole("button", { name: /^Pay the retainer of/ }).boundingBox();
    expect(pay && pay.y + pay.height).toBeLessThanOrEqual(844);
    await shot(page, "1b-job-unpaid-phone");
    await page.setViewportSize({ width: 1280, height: 860 });
    await page.getByRole("button", { name: /^Pay the retainer of/ }).click();
    await page.waitForURL(`${app.cards.url}/checkout/**`);
    expect(await page.getByTestId("total").textContent()).toBe(
      new Intl.NumberFormat("en-GB", { style: "currency", currency: "GBP" }).format(job.retainerCents / 100),
    );

    // Declined: the card service says so and nothing is charged.
    await fillCard(page, "4000 0000 0000 0002");
    await expect.poll(() => page.getByRole("alert").textContent()).toContain("Payment declined.");
    await shot(page, "2-declined");
    await app.cards.settled();
    await page.getByRole("link", { name: "Cancel and go back" }).click();
    await page.waitForURL(`**/jobs/${job.id}?payment=cancelled`);
    await expect.poll(() => page.getByText(/Your last payment did not go through/).count()).toBe(1);
    expect((await job.reload()).retainerPaidAt).toBeNull();
    await shot(page, "3-job-declined");

    // Trying again, with a card that pays: back in the app, "processing" until the webhook lands.
    await page.getByRole("button", { name: /^Try again: pay/ }).click();
    await page.waitForURL(`${app.cards.url}/checkout/**`);
    await fillCard(page, "4242 4242 4242 4242");
    await page.waitForURL(`**/jobs/${job.id}/payment?session_id=*`);
    await expect.poll(() => page.getByText(/the retainer of .* has been received/).count(), { timeout: 20_000 }).toBe(1);
    await shot(page, "4-paid");
    await page.getByRole("link", { name: "Back to the job" }).click();
    await page.waitForURL(`**/jobs/${job.id}`);
    await expect.poll(() => page.getByText(/^Paid \d/).count()).toBeGreaterThan(0);
    await shot(page, "5-job-paid");
    expect((await job.reload()).stage).toBe("retainer_received");

    // Every webhook again, same ids, fresh signatures: nothing changes.
    await app.cards.settled();
    const snapshot = async () => ({
      events: await StripeEvent.count(),
      payments: (await Payment.findAll({ where: { jobId: job.id }, order: [["createdAt", "ASC"]] })).map((p) => [
        p.status,
        p.amountCents,
        p.refundedCents,
        p.paidAt?.toISOString(),
      ]),
      history: await JobEvent.count({ where: { jobId: job.id } }),
      mail: await OutboxMail.count(),
      paidAt: (await job.reload()).retainerPaidAt?.toISOString(),
    });
    const before = await snapshot();
    expect(before.events).toBeGreaterThanOrEqual(2);
    expect(before.payments).toEqual([["paid", job.retainerCents, 0, before.paidAt]]);
    const replayed = await app.cards.replayAll();
    await app.cards.settled();
    // The app accepted every replay (200) and applied none of them.
    expect(replayed.length).toBe(app.cards.events.filter((e) => app.cards.deliveries.some((d) => d.eventId === e.id && !d.replay && d.status === 200)).length);
    expect(replayed.every((d) => d.replay && d.status === 200)).toBe(true);
    const types = replayed.map((d) => d.type);
    expect(types).toContain("checkout.session.completed");
    expect(types).toContain("payment_intent.payment_failed");
    expect(await snapshot()).toEqual(before);
  });
});
