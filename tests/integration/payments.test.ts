// The retainer's money path on real PostgreSQL, through the official Stripe SDK against the
// local fake: the session, the hosted page, the signed webhook (bad, replayed, unknown), a
// declined card, refunds, and who may see or do what.
import Stripe from "stripe";
import { Op, UniqueConstraintError } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import * as pay from "~/routes/job-pay";
import * as paymentPage from "~/routes/job-payment";
import * as jobPage from "~/routes/job";
import * as jobsPage from "~/routes/jobs";
import * as paymentsPage from "~/routes/payments";
import * as refund from "~/routes/payment-refund";
import { Job, JobEvent, JobMilestone, Organisation, OutboxMail, Payment, Refund, StripeEvent, type User } from "~/models/index.server";
import { deliverDueMail } from "~/services/mail.server";
import { newAttempt } from "~/services/payments.server";
import { AuditEvent } from "~/models/audit.server";
import { centsToInput } from "~/content/money";
import { spelledMoney } from "~/content/refund";
import { mailsTo, waitForMail } from "../support/mailbox";
import { PASSWORD, makeMember, makeOperatorUser } from "../support/factories";
import { makeDealParties } from "../support/parties";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { awardedJob as awardedJobOf } from "../support/awards";
import { deliverEvent, eventAbout, fakeStripe, madeUpEvent, payOnPage, signatureOf } from "../support/card-payments";

const stripe = fakeStripe();

let buyer: User;
let shop: User;
let manager: User;
let visitors: Record<"buyer" | "shop" | "manager", Visitor>;

/** An awarded job of `buyer`'s: one spec, one offer of 100.00 a line. */
const awardedJob = () => awardedJobOf(buyer, shop);

/** An awarded job whose retainer the buyer paid on the fake's page, recorded from the webhook. */
async function paidJob() {
  const job = await awardedJob();
  const url = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
  await payOnPage(url, "4242 4242 4242 4242");
  const payment = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
  await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!));
  await payment.reload();
  return { job, payment };
}

beforeAll(async () => {
  ({ buyer, shop, manager } = await makeDealParties());
  visitors = { buyer: await signedIn(buyer), shop: await signedIn(shop), manager: await signedIn(manager) };
});

describe("paying the retainer", () => {
  it("creates one session with the right amount and metadata, pays through the hosted page, and applies the webhook once", async () => {
    const job = await awardedJob();
    const started = await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });
    expect(started.status).toBe(302);
    const url = started.location!;
    expect(url.startsWith(process.env.STRIPE_API_URL!)).toBe(true);
    const payment = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    const session = await stripe.checkout.sessions.retrieve(payment.checkoutSessionId!, { expand: ["line_items"] });
    expect(session).toMatchObject({ mode: "payment", amount_total: job.retainerCents, currency: "gbp", status: "open", client_reference_id: job.id });
    expect(session.metadata).toEqual({ payment_id: payment.id, job_id: job.id });
    expect(session.customer).toBe((await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).stripeCustomerId);
    expect(session.success_url).toBe(`http://127.0.0.1:3000/jobs/${job.id}/payment?session_id={CHECKOUT_SESSION_ID}`);

    // A second click reuses the attempt: one payment row, the same page.
    const again = await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });
    expect(again.location).toBe(url);
    expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);

    // Paying on the hosted page sends the buyer back, where the page waits for the webhook.
    const paid = await payOnPage(url, "4242 4242 4242 4242");
    expect(paid.status).toBe(303);
    const back = new URL(paid.headers.get("Location")!);
    expect(back.pathname).toBe(`/jobs/${job.id}/payment`);
    const waiting = await visitors.buyer.get(paymentPage.loader, back.pathname + back.search, { jobId: job.id });
    expect(waiting.data.status).toBe("pending");
    expect((await job.reload()).retainerPaidAt).toBeNull();

    // A bad or missing signature: 400 and nothing changes.
    const completed = await eventAbout("checkout.session.completed", session.id);
    expect((await deliverEvent(completed, "t=1,v1=deadbeef")).status).toBe(400);
    expect((await deliverEvent(completed, null)).status).toBe(400);
    expect((await deliverEvent({ ...completed, id: "evt_forged" }, signatureOf(JSON.stringify(completed)))).status).toBe(400);
    expect(await StripeEvent.count()).toBe(0);
    expect((await payment.reload()).status).toBe("pending");

    const applied = await deliverEvent(completed);
    expect(applied.status).toBe(200);
    expect(applied.data.outcome).toBe("paid");
    await payment.reload();
    expect(payment.status).toBe("paid");
    expect(payment.paymentIntentId).toMatch(/^pi_/);
    await job.reload();
    expect(job.retainerPaidAt).not.toBeNull();
    expect(job.stage).toBe("retainer_received");
    const milestone = await JobMilestone.findOne({ where: { jobId: job.id, key: "retainer_received" }, rejectOnEmpty: true });
    expect(milestone.reachedById).toBe(buyer.id);
    expect((await visitors.buyer.get(paymentPage.loader, back.pathname + back.search, { jobId: job.id })).data.status).toBe("paid");

    // Receipts to the payer and to the shop.
    await deliverDueMail(500);
    expect((await waitForMail(buyer.email, "Receipt: retainer")).text).toContain(payment.paymentIntentId!);
    await waitForMail(shop.email, "Retainer received");

    // The same event again changes nothing: one payment, one history row, no more mail.
    const mailsBefore = (await mailsTo(buyer.email)).length;
    const replayed = await deliverEvent(completed);
    expect(replayed.status).toBe(200);
    expect(replayed.data.outcome).toBe("replay");
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "retainer_paid" } })).toBe(1);
    expect(await Payment.count({ where: { jobId: job.id, status: "paid" } })).toBe(1);
    await deliverDueMail(500);
    expect((await mailsTo(buyer.email)).length).toBe(mailsBefore);

    // Paid is paid: the button is gone and a forged click is refused.
    const page = await visitors.buyer.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
    expect(page.data.job.retainerPaidAt).not.toBeNull();
    const refused = await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });
    expect(refused.location).toBe(`/jobs/${job.id}`);
    expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);
  });

  it("logs an event for a session it doesn't know and carries on", async () => {
    const event = madeUpEvent(`evt_unknown_${Date.now()}`, "checkout.session.completed", {
      id: "cs_test_nobody",
      object: "checkout.session",
      payment_status: "paid",
      amount_total: 100,
      metadata: {},
    });
    const res = await deliverEvent(event);
    expect(res.status).toBe(200);
    expect(res.data.outcome).toMatch(/no payment for session cs_test_nobody/);
    expect((await StripeEvent.findByPk(event.id, { rejectOnEmpty: true })).outcome).toMatch(/no payment/);
  });

  it("leaves the job unpaid after a declined card, says so, and lets the buyer try again", async () => {
    const job = await awardedJob();
    const url = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
    const declined = await payOnPage(url, "4000 0000 0000 0002");
    expect(declined.status).toBe(402);
    expect(await declined.text()).toMatch(/declined/i);
    const payment = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    const failed = await eventAbout("payment_intent.payment_failed", "", (o) => (o.metadata as Record<string, string>)?.payment_id === payment.id);
    expect((await deliverEvent(failed)).data.outcome).toBe("declined");
    await payment.reload();
    expect(payment.status).toBe("failed");
    expect(payment.failureMessage).toMatch(/declined/i);
    expect((await job.reload()).retainerPaidAt).toBeNull();
    const page = await visitors.buyer.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
    expect(page.data.retainer.payments[0]).toMatchObject({ status: "failed" });
    // Trying again goes back to the same open page, where another card can pay.
    expect((await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location).toBe(url);
    expect((await payOnPage(url, "4242 4242 4242 4242")).status).toBe(303);
    expect((await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!))).data.outcome).toBe("paid");
    expect((await payment.reload()).status).toBe("paid");
  });
});

describe("refunds", () => {
  it("pays back part, then the rest, recorded from the webhook; never more than was paid", async () => {
    const { job, payment } = await paidJob();

    const post = (fields: Record<string, string>, visitor = visitors.manager) =>
      visitor.post(refund.action, `/payments/${payment.id}/refund`, { currentPassword: PASSWORD, confirm: "yes", ...fields }, { paymentId: payment.id });
    // The manager types their own password again; without it, or with a wrong one, nothing moves.
    const noPassword = await post({ amount: "100.00", reason: "Paint left off the order", currentPassword: "" });
    expect(noPassword.status).toBe(400);
    expect(noPassword.data.result.error.currentPassword).toEqual(["Enter your password to confirm."]);
    const wrongPassword = await post({ amount: "100.00", reason: "Paint left off the order", currentPassword: "not-my-password" });
    expect(wrongPassword.status).toBe(400);
    expect(wrongPassword.data.result.error.currentPassword).toEqual(["That is not your password."]);
    expect(wrongPassword.data.result.initialValue.currentPassword).toBeUndefined();
    expect(await Refund.count({ where: { paymentId: payment.id } })).toBe(0);
    expect((await post({ amount: "100", reason: "" })).status).toBe(400);
    const zero = await post({ amount: "0", reason: "Nothing really" });
    expect(zero.data.result.error.amount[0]).toMatch(/above zero/);
    expect((await post({ amount: "12,5", reason: "Overcharged" })).status).toBe(400);
    const tooMuch = await post({ amount: String(payment.amountCents), reason: "Too much" });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.data.result.error.amount[0]).toMatch(/At most/);

    const partial = await post({ amount: "100.00", reason: "Paint left off the order" });
    expect(partial.status).toBe(302);
    const first = await Refund.findOne({ where: { paymentId: payment.id }, rejectOnEmpty: true });
    expect(first).toMatchObject({ status: "requested", amountCents: 10_000 });
    expect(first.stripeRefundId).toMatch(/^re_/);
    // Recorded only once the webhook says so.
    expect((await payment.reload()).refundedCents).toBe(0);
    const charge = await eventAbout("charge.refunded", "", (o) => o.payment_intent === payment.paymentIntentId && o.amount_refunded === 10_000);
    expect((await deliverEvent(charge)).data.outcome).toBe("refunded 10000");
    await payment.reload();
    expect(payment).toMatchObject({ status: "partially_refunded", refundedCents: 10_000 });
    expect((await first.reload()).status).toBe("recorded");
    expect((await deliverEvent(charge)).data.outcome).toBe("replay");

    // An empty amount is a mistake to point out, not "everything left".
    const empty = await post({ amount: "", reason: "Job cancelled by the buyer" });
    expect(empty.status).toBe(400);
    expect(empty.data.result.error.amount).toEqual(["Enter the amount to pay back, e.g. 250 or 250.50."]);
    const rest = await post({ amount: centsToInput(payment.amountCents - 10_000), reason: "Job cancelled by the buyer" });
    expect(rest.status).toBe(302);
    const all = await eventAbout("charge.refunded", "", (o) => o.payment_intent === payment.paymentIntentId && o.amount_refunded === payment.amountCents);
    await deliverEvent(all);
    await payment.reload();
    expect(payment).toMatchObject({ status: "refunded", refundedCents: payment.amountCents });
    expect(await Refund.count({ where: { paymentId: payment.id, status: "recorded" } })).toBe(2);
    expect((await post({ amount: "1", reason: "More" })).status).toBe(400);
    await deliverDueMail(500);
    await waitForMail(buyer.email, "Refund of");
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "retainer_refunded" } })).toBe(2);
    // The job itself says it: paid back, found by the dashboard's filter, and the shop is told.
    expect((await job.reload()).retainerRefundedCents).toBe(payment.amountCents);
    const refundedJobs = await visitors.manager.get(jobsPage.loader, "/jobs?retainer=refunded");
    expect(refundedJobs.data.jobs.map((j: { id: string }) => j.id)).toContain(job.id);
    const stillPaid = await visitors.manager.get(jobsPage.loader, "/jobs?retainer=paid");
    expect(stillPaid.data.jobs.map((j: { id: string }) => j.id)).not.toContain(job.id);
    await waitForMail(shop.email, "Retainer paid back in full");
  });
});

describe("a refund's confirmation", () => {
  it("asks with the amount spelled out before any money moves, and the audit log follows the money", async () => {
    const { payment } = await paidJob();
    const buyerName = (await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).name;
    const ask = (fields: Record<string, string>) => visitors.manager.post(refund.action, `/payments/${payment.id}/refund`, fields, { paymentId: payment.id });
    const asked = await ask({ amount: "12.50", reason: "Paint left off the order" });
    expect(asked.status).toBe(200);
    const paid = spelledMoney(payment.amountCents, payment.currency);
    expect(asked.data.confirm).toEqual({
      question: `Refund ${payment.currency} 12.50 of the ${paid} retainer to ${buyerName}?`,
      amount: "12.50",
      reason: "Paint left off the order",
    });
    expect(await Refund.count({ where: { paymentId: payment.id } })).toBe(0);
    // A refund that would be refused is refused at the question already.
    expect((await ask({ amount: centsToInput(payment.amountCents + 1), reason: "Too much" })).data.result.error.amount[0]).toMatch(/At most/);
    expect((await ask({ amount: "", reason: "All of it" })).data.result.error.amount).toEqual(["Enter the amount to pay back, e.g. 250 or 250.50."]);
    // Confirming needs the password.
    expect((await ask({ amount: "12.50", reason: "Paint left off the order", confirm: "yes" })).data.result.error.currentPassword).toBeTruthy();
    expect(await Refund.count({ where: { paymentId: payment.id } })).toBe(0);
    const done = await ask({ amount: "12.50", reason: "Paint left off the order", confirm: "yes", currentPassword: PASSWORD });
    expect(done.status).toBe(302);
    const charge = await eventAbout("charge.refunded", "", (o) => o.payment_intent === payment.paymentIntentId && o.amount_refunded === 1250);
    await deliverEvent(charge);
    const made = await Refund.findOne({ where: { paymentId: payment.id }, rejectOnEmpty: true });
    expect((await AuditEvent.findAll({ where: { subjectId: payment.id } })).map((e) => e.action)).toEqual(["payment-paid"]);
    const refundEntries = await AuditEvent.findAll({ where: { subjectId: made.id }, order: [["at", "ASC"]] });
    expect(refundEntries.map((e) => [e.action, e.actorId])).toEqual([
      ["refund-requested", manager.id],
      ["refund-settled", null],
    ]);
  });
});

describe("who may see and do what", () => {
  it("lists payments for their own organisation, their accounts, or everyone", async () => {
    const job = await awardedJob();
    await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });
    const ownIds = (await Payment.findAll({ where: { buyerOrganisationId: buyer.organisationId } })).map((p) => p.id).sort();
    const ids = async (visitor: Visitor) => ((await visitor.get(paymentsPage.loader, "/payments")).data.payments as { id: string }[]).map((p) => p.id).sort();
    expect(await ids(visitors.buyer)).toEqual(ownIds);
    expect(await ids(visitors.manager)).toEqual(ownIds);
    expect(await ids(await signedIn(await makeMember("buyer")))).toEqual([]);
    expect(await ids(await signedIn(await makeOperatorUser("account_manager")))).toEqual([]);
    expect((await ids(await signedIn(await makeOperatorUser("admin")))).length).toBeGreaterThanOrEqual(ownIds.length);
    expect((await visitors.shop.get(paymentsPage.loader, "/payments")).status).toBe(403);
    const out = await new Visitor().get(paymentsPage.loader, "/payments");
    expect(out.location).toBe("/sign-in?redirectTo=%2Fpayments");
  });

  it("lets only the buyer pay, only the account's manager or an admin refund, and hides other organisations' jobs", async () => {
    const job = await awardedJob();
    expect((await visitors.shop.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).status).toBe(403);
    expect((await visitors.manager.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).status).toBe(403);
    const stranger = await signedIn(await makeMember("buyer"));
    expect((await stranger.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).status).toBe(404);
    for (const id of ["00000000-0000-4000-8000-000000000000", "forged"])
      expect((await visitors.buyer.post(pay.action, `/jobs/${id}/pay`, {}, { jobId: id })).status).toBe(404);
    expect((await new Visitor().post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).status).toBe(302);

    const url = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
    await payOnPage(url, "4242 4242 4242 4242");
    const payment = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    await deliverEvent(await eventAbout("checkout.session.completed", payment.checkoutSessionId!));
    const sessionPath = `/jobs/${job.id}/payment?session_id=${payment.checkoutSessionId}`;
    expect((await stranger.get(paymentPage.loader, sessionPath, { jobId: job.id })).status).toBe(404);
    expect((await visitors.buyer.get(paymentPage.loader, `/jobs/${job.id}/payment?session_id=cs_test_other`, { jobId: job.id })).status).toBe(404);

    const fields = { amount: "1", reason: "Test", currentPassword: PASSWORD, confirm: "yes" };
    expect((await visitors.buyer.post(refund.action, `/payments/${payment.id}/refund`, fields, { paymentId: payment.id })).status).toBe(403);
    expect((await visitors.shop.post(refund.action, `/payments/${payment.id}/refund`, fields, { paymentId: payment.id })).status).toBe(403);
    const otherManager = await signedIn(await makeOperatorUser("account_manager"));
    expect((await otherManager.post(refund.action, `/payments/${payment.id}/refund`, fields, { paymentId: payment.id })).status).toBe(404);
    expect(await Refund.count({ where: { paymentId: payment.id } })).toBe(0);
    // The shop sees the job but not the payment attempts.
    expect((await visitors.shop.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id })).data.retainer.payments).toEqual([]);
    expect((await Job.findByPk(job.id, { rejectOnEmpty: true })).retainerPaidAt).not.toBeNull();
  });
});

describe("one live checkout per job", () => {
  it("lets two clicks at once share one attempt, and the database refuses a second open one", async () => {
    const job = await awardedJob();
    const [a, b] = await Promise.all([0, 1].map(() => visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })));
    expect(a.location).toMatch(/\/checkout\/cs_test_/);
    expect(b.location).toBe(a.location);
    const open = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);
    const copy = newAttempt(job, buyer.id);
    expect([copy.buyerOrganisationId, copy.amountCents, copy.currency]).toEqual([open.buyerOrganisationId, open.amountCents, open.currency]);
    await expect(Payment.create(copy)).rejects.toBeInstanceOf(UniqueConstraintError);
    await expect(Payment.create({ ...copy, status: "failed" })).rejects.toBeInstanceOf(UniqueConstraintError);
    // A closed attempt leaves room for the next one.
    await open.update({ status: "expired" });
    expect((await Payment.create(copy)).status).toBe("pending");
  });

  it("refunds a second charge by itself, flags it, and tells the buyer and the account manager", async () => {
    const job = await awardedJob();
    const since = new Date();
    const oldTab = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
    const first = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    // Forced: the app gave the first attempt up (as when its session completed just as it was
    // being expired) while the card service still takes it.
    await first.update({ status: "expired" });
    const newTab = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
    expect(newTab).not.toBe(oldTab);
    const second = await Payment.findOne({ where: { jobId: job.id, status: "pending" }, rejectOnEmpty: true });
    expect((await payOnPage(oldTab, "4242 4242 4242 4242")).status).toBe(303);
    expect((await payOnPage(newTab, "4242 4242 4242 4242")).status).toBe(303);

    expect((await deliverEvent(await eventAbout("checkout.session.completed", first.checkoutSessionId!))).data.outcome).toBe("paid");
    const completed = await eventAbout("checkout.session.completed", second.checkoutSessionId!);
    const twice = await deliverEvent(completed);
    expect(twice.status).toBe(200);
    expect(twice.data.outcome).toBe("charged twice; refund requested");
    await second.reload();
    expect(second).toMatchObject({ status: "paid", duplicate: true });
    expect(second.flag).toMatch(/second time.*refunded automatically/);
    // The refund is asked of Stripe at once, in full, and asked only once.
    const asked = await stripe.refunds.list({ payment_intent: second.paymentIntentId! });
    expect(asked.data).toHaveLength(1);
    expect(asked.data[0]).toMatchObject({ amount: second.amountCents, reason: "duplicate", status: "succeeded" });
    const row = await Refund.findOne({ where: { paymentId: second.id }, rejectOnEmpty: true });
    expect(row).toMatchObject({ status: "requested", requestedById: null, stripeRefundId: asked.data[0].id, amountCents: second.amountCents });
    expect((await deliverEvent(completed)).data.outcome).toBe("replay");
    expect((await stripe.refunds.list({ payment_intent: second.paymentIntentId! })).data).toHaveLength(1);

    // Its refund's webhook settles the second charge and leaves the job's retainer alone.
    const refunded = await eventAbout("charge.refunded", "", (o) => o.payment_intent === second.paymentIntentId);
    expect((await deliverEvent(refunded)).data.outcome).toBe(`refunded ${second.amountCents} of a second charge`);
    expect(await second.reload()).toMatchObject({ status: "refunded", refundedCents: second.amountCents });
    expect((await row.reload()).status).toBe("recorded");
    await job.reload();
    expect(job.retainerPaidAt).not.toBeNull();
    expect(job.retainerRefundedCents).toBe(0);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "retainer_paid" } })).toBe(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "retainer_refunded" } })).toBe(0);
    expect((await first.reload()).status).toBe("paid");

    // Mail: one receipt, the buyer and the account manager told of the second charge, the shop not bothered.
    const queued = await OutboxMail.findAll({ where: { createdAt: { [Op.gte]: since } } });
    const subjects = (to: string) => queued.filter((m) => m.to === to).map((m) => m.subject);
    expect(subjects(buyer.email).filter((s) => s.startsWith("Receipt"))).toHaveLength(1);
    expect(subjects(buyer.email).filter((s) => s.startsWith("Charged twice"))).toHaveLength(1);
    expect(subjects(manager.email)).toEqual([expect.stringMatching(/^Check: retainer charged twice/)]);
    expect(subjects(shop.email).filter((s) => /paid back/i.test(s))).toEqual([]);
    await deliverDueMail(500);
    expect((await waitForMail(buyer.email, "Charged twice")).text).toContain(second.paymentIntentId!);
    expect((await waitForMail(manager.email, "Check: retainer charged twice")).text).toContain("refunded automatically");

    // The payments table shows it for a person to check.
    const flagged = await visitors.manager.get(paymentsPage.loader, "/payments?flagged=1");
    const listed = flagged.data.payments as { id: string; flag: string | null; duplicate: boolean }[];
    expect(listed.find((p) => p.id === second.id)).toMatchObject({ duplicate: true, flag: expect.stringMatching(/refunded automatically/) });
    expect(listed.map((p) => p.id)).not.toContain(first.id);
    const page = await visitors.buyer.get(paymentPage.loader, `/jobs/${job.id}/payment?session_id=${second.checkoutSessionId}`, { jobId: job.id });
    expect(page.data.duplicate).toBe(true);
  });
});

describe("webhook events that do not match the payment", () => {
  /** The event with another id and some fields of its object changed (or removed, as undefined). */
  const altered = (event: Stripe.Event, name: string, change: Record<string, unknown>) => ({
    ...event,
    id: `evt_${name}_${Date.now()}_${Math.random().toString(36).slice(2)}`,
    data: { object: JSON.parse(JSON.stringify({ ...(event.data.object as object), ...change })) },
  });

  it("records a completed session with no amount, another amount or another currency, flags the payment, and applies none", async () => {
    const job = await awardedJob();
    const url = (await visitors.buyer.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id })).location!;
    const payment = await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    await payOnPage(url, "4242 4242 4242 4242");
    const real = await eventAbout("checkout.session.completed", payment.checkoutSessionId!);
    const wrong: [string, Record<string, unknown>, RegExp][] = [
      ["no_amount", { amount_total: undefined }, /no amount/],
      ["null_amount", { amount_total: null }, /no amount/],
      ["less", { amount_total: 1 }, /amount 1 instead of/],
      ["other_currency", { currency: "usd" }, /currency usd instead of gbp/],
      ["no_currency", { currency: undefined }, /currency missing/],
    ];
    for (const [name, change, reason] of wrong) {
      const event = altered(real, name, change);
      const answer = await deliverEvent(event);
      expect(answer.status).toBe(200);
      expect(answer.data.outcome).toMatch(reason);
      expect(answer.data.outcome).toMatch(/not applied/);
      expect((await StripeEvent.findByPk(event.id, { rejectOnEmpty: true })).outcome).toMatch(reason);
    }
    await payment.reload();
    expect(payment.status).toBe("pending");
    expect(payment.flag).toMatch(/no amount/);
    expect(payment.flag).toMatch(/currency usd/);
    expect((await job.reload()).retainerPaidAt).toBeNull();
    // Signed but shapeless: recorded, answered, nothing breaks.
    const shapeless = { ...real, id: `evt_shapeless_${Date.now()}`, data: { object: null } };
    const answer = await deliverEvent(shapeless);
    expect(answer.status).toBe(200);
    expect(answer.data.outcome).toMatch(/^malformed checkout.session.completed/);
    expect((await deliverEvent({ ...real, id: 42 })).status).toBe(200);
    // The true event still pays it.
    expect((await deliverEvent(real)).data.outcome).toBe("paid");
    expect((await job.reload()).retainerPaidAt).not.toBeNull();
  });

  it("does not record a refund larger than the payment, in another currency, or without an amount", async () => {
    const { job, payment } = await paidJob();
    const [charge] = (await stripe.charges.list({ payment_intent: payment.paymentIntentId! })).data;
    const refundEvent = madeUpEvent("", "charge.refunded", charge) as unknown as Stripe.Event;
    const wrong: [string, Record<string, unknown>, RegExp][] = [
      ["oversized", { amount_refunded: payment.amountCents + 1, refunded: true }, /more than the \d+ paid/],
      ["other_currency", { amount_refunded: 100, currency: "eur" }, /currency eur/],
      ["no_refund_amount", { amount_refunded: undefined }, /no refunded amount/],
      ["no_amount", { amount: undefined, amount_refunded: 100 }, /no amount/],
      ["negative", { amount_refunded: -5 }, /no refunded amount/],
    ];
    for (const [name, change, reason] of wrong) {
      const answer = await deliverEvent(altered(refundEvent, name, change));
      expect(answer.status).toBe(200);
      expect(answer.data.outcome).toMatch(reason);
      expect(answer.data.outcome).toMatch(/not applied/);
    }
    await payment.reload();
    expect(payment).toMatchObject({ status: "paid", refundedCents: 0 });
    expect(payment.flag).toMatch(/more than the \d+ paid/);
    expect((await job.reload()).retainerRefundedCents).toBe(0);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "retainer_refunded" } })).toBe(0);
    // A refund within the payment is still recorded.
    expect((await deliverEvent(altered(refundEvent, "fine", { amount_refunded: 500 }))).data.outcome).toBe("refunded 500");
  });
});
