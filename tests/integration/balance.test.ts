// The balance (issue 17 point 7): due once the shop hands over, paid by card through the Stripe
// fake exactly as the retainer (hosted page, signed webhook applied once, receipts), or recorded
// as a bank transfer by the account's manager; never twice, never by the wrong person.
import { beforeAll, describe, expect, it } from "vitest";
import * as pay from "~/routes/job-pay";
import * as balanceRoute from "~/routes/job-balance";
import { Job, JobEvent, Payment, type User } from "~/models/index.server";
import { AuditEvent } from "~/models/audit.server";
import { addDays, todayUtc } from "~/content/dates";
import { balancePanelOf, recordBankTransfer } from "~/services/balance.server";
import { reachMilestones } from "~/services/job-progress.server";
import { retainerPanelOf, startBalancePayment } from "~/services/payments.server";
import { deliverDueMail } from "~/services/mail.server";
import { makeMember, makeOperatorUser } from "../support/factories";
import { makeDealParties } from "../support/parties";
import { mailsTo } from "../support/mailbox";
import type { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { awardedJob } from "../support/awards";
import { deliverEvent, eventAbout, fakeStripe, payOnPage } from "../support/card-payments";

let buyer: User;
let shop: User;
let manager: User;
let buyerBrowser: Visitor;

beforeAll(async () => {
  ({ buyer, shop, manager } = await makeDealParties());
  buyerBrowser = await signedIn(buyer);
});

/** Pays a job's retainer (or balance) by card on the fake's page and delivers its webhook; returns the payment. */
async function payByCard(job: Job, purpose: "retainer" | "balance") {
  const path = `/jobs/${job.id}/pay${purpose === "balance" ? "?for=balance" : ""}`;
  const started = await buyerBrowser.post(pay.action, path, {}, { jobId: job.id });
  expect(started.location?.startsWith(process.env.STRIPE_API_URL!)).toBe(true);
  await payOnPage(started.location!);
  const payment = await Payment.findOne({ where: { jobId: job.id, purpose }, order: [["createdAt", "DESC"]], rejectOnEmpty: true });
  await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!));
  return payment.reload();
}

/** A job whose retainer is paid and whose shop has handed over. */
async function handedOver() {
  const job = await awardedJob(buyer, shop);
  await payByCard(job, "retainer");
  await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
  return job.reload();
}

describe("paying the balance by card", () => {
  it("is not due before the handover", async () => {
    const job = await awardedJob(buyer, shop);
    await payByCard(job, "retainer");
    await expect(startBalancePayment(buyer, job.id)).rejects.toThrow(/falls due when the shop has handed over/);
    expect(await balancePanelOf(buyer, job.id)).toMatchObject({ canPay: false, waiting: expect.stringMatching(/handed over/) });
  });

  it("takes total − retainer through the hosted page, records it once from the webhook, and sends receipts", async () => {
    const job = await handedOver();
    expect((await balancePanelOf(buyer, job.id)).canPay).toBe(true);
    const payment = await payByCard(job, "balance");
    const session = await fakeStripe().checkout.sessions.retrieve(payment.checkoutSessionId!);
    expect(session.amount_total).toBe(job.totalCents - job.retainerCents);
    expect(payment).toMatchObject({ status: "paid", purpose: "balance", amountCents: job.totalCents - job.retainerCents });

    await job.reload();
    expect(job.balanceMethod).toBe("card");
    expect(job.balancePaidAt).not.toBeNull();
    expect(job.retainerRefundedCents).toBe(0);
    // A replayed webhook changes nothing.
    expect((await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!))).status).toBe(200);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "balance_paid" } })).toBe(1);

    // Paying twice: the button is gone and a forged click is refused.
    expect((await balancePanelOf(buyer, job.id)).canPay).toBe(false);
    await expect(startBalancePayment(buyer, job.id)).rejects.toThrow(/balance is already paid|was paid on/);
    // The retainer's panel lists the retainer's payments only.
    expect((await retainerPanelOf(buyer, job.id)).payments.map((p) => p.amountCents)).toEqual([job.retainerCents]);

    await deliverDueMail();
    expect((await mailsTo(buyer.email)).some((m) => m.subject.startsWith("Receipt: balance of"))).toBe(true);
    expect((await mailsTo(shop.email)).some((m) => m.subject.startsWith("Balance received"))).toBe(true);
  });

  it("is refused to the shop and the account's staff (they don't pay), and is a 404 to other buyers", async () => {
    const job = await handedOver();
    await expect(startBalancePayment(shop, job.id)).rejects.toMatchObject({ init: { status: 403 } });
    await expect(startBalancePayment(manager, job.id)).rejects.toMatchObject({ init: { status: 403 } });
    await expect(startBalancePayment(await makeMember("buyer"), job.id)).rejects.toMatchObject({ init: { status: 404 } });
  });
});

describe("a bank transfer recorded by the account manager", () => {
  const post = (visitor: Visitor, jobId: string, fields: Record<string, string>) =>
    visitor.post(balanceRoute.action, `/jobs/${jobId}/balance`, fields, { jobId });

  it("records the balance once, with its reference, receipts and an audit entry; bad input is named", async () => {
    const job = await handedOver();
    const staff = await signedIn(manager);
    expect((await post(staff, job.id, { reference: "", paidOn: todayUtc() })).data.result.error.reference).toBeTruthy();
    expect((await post(staff, job.id, { reference: "BACS 4471", paidOn: "2026-02-30" })).data.result.error.paidOn[0]).toMatch(/like 2026-09-30/);
    const future = await post(staff, job.id, { reference: "BACS 4471", paidOn: addDays(todayUtc(), 2) });
    expect(future.data.result.error.paidOn[0]).toMatch(/future/);

    expect((await post(staff, job.id, { reference: "BACS 4471", paidOn: todayUtc() })).status).toBe(302);
    const again = await post(staff, job.id, { reference: "BACS 4471", paidOn: todayUtc() });
    expect(again.status).toBe(400);
    expect(again.data.result.error[""][0]).toMatch(/balance was paid on/);

    await job.reload();
    expect(job).toMatchObject({ balanceMethod: "bank_transfer", balanceReference: "BACS 4471" });
    expect(await Payment.count({ where: { jobId: job.id, purpose: "balance" } })).toBe(0);
    expect(await AuditEvent.count({ where: { action: "payment-recorded", subjectId: job.id } })).toBe(1);
    expect(await balancePanelOf(shop, job.id)).toMatchObject({ method: "bank_transfer", reference: null });
    await deliverDueMail();
    expect((await mailsTo(buyer.email)).some((m) => m.subject.startsWith("Receipt: balance of") && m.text.includes("BACS 4471"))).toBe(true);
  });

  it("is the account's staff's alone: the buyer gets a 403, another account's manager a 404", async () => {
    const job = await handedOver();
    await expect(recordBankTransfer(buyer, job.id, { reference: "Mine", paidOn: todayUtc() })).rejects.toMatchObject({ init: { status: 403 } });
    await expect(recordBankTransfer(await makeOperatorUser("account_manager"), job.id, { reference: "X", paidOn: todayUtc() })).rejects.toMatchObject({
      init: { status: 404 },
    });
    expect((await job.reload()).balancePaidAt).toBeNull();
  });

  it("a card payment completing after the transfer was recorded is paid back by itself", async () => {
    const job = await handedOver();
    const started = await buyerBrowser.post(pay.action, `/jobs/${job.id}/pay?for=balance`, {}, { jobId: job.id });
    await recordBankTransfer(manager, job.id, { reference: "BACS 9", paidOn: todayUtc() });
    await payOnPage(started.location!);
    const payment = await Payment.findOne({ where: { jobId: job.id, purpose: "balance" }, rejectOnEmpty: true });
    await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!));
    await payment.reload();
    expect(payment.duplicate).toBe(true);
    expect((await job.reload()).balanceMethod).toBe("bank_transfer");
    expect(payment.flag).toMatch(/after the balance was paid; refunded automatically/);
    await deliverDueMail();
    expect((await mailsTo(buyer.email)).some((m) => m.subject.startsWith("Charged twice for the balance of") && m.text.includes(`/jobs/${job.id}`))).toBe(true);
  });
});
