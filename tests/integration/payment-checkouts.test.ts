// What the app does when the card service and the app disagree, on real PostgreSQL through the
// official SDK: an old tab's session near its end, a card service restarted under the app, and
// the reconciler asking about payments whose webhook never came. This file runs its own Stripe
// fake on a port the app is pointed at before it loads, so the fake can be restarted under it.
import Stripe from "stripe";
import { Op } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import * as pay from "~/routes/job-pay";
import * as webhook from "~/routes/webhooks.stripe";
import { Job, JobEvent, Organisation, OutboxMail, Payment, sequelize, type User } from "~/models/index.server";
import { reconcileOpenPayments } from "~/services/payment-sync.server";
import { startStripeFake, type StripeFake } from "../../fakes/stripe";
import { makeDealParties } from "../support/parties";
import { call } from "../support/routes";
import { signedIn } from "../support/sessions";
import { awardedJob as awardedJobOf } from "../support/awards";

const port = await vi.hoisted(async () => {
  const net = await import("node:net");
  const free = await new Promise<number>((resolve, reject) => {
    const probe = net.createServer();
    probe.once("error", reject);
    probe.listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as import("node:net").AddressInfo;
      probe.close(() => resolve(port));
    });
  });
  process.env.STRIPE_API_URL = `http://127.0.0.1:${free}`;
  return free;
});

const SECRET = process.env.STRIPE_WEBHOOK_SECRET!;
const stripe = new Stripe(process.env.STRIPE_SECRET_KEY!, { host: "127.0.0.1", port, protocol: "http" });
const MINUTE = 60_000;
const HOUR = 60 * MINUTE;

let fake: StripeFake;
let buyer: User;
let shop: User;

/** A restart of the card service: everything it knew is gone; the app keeps its rows. */
async function restartFake() {
  await fake?.close();
  fake = await startStripeFake({ port, webhookSecret: SECRET });
}

beforeAll(async () => {
  await restartFake();
  ({ buyer, shop } = await makeDealParties());
});

afterAll(async () => {
  vi.useRealTimers();
  await fake.close();
});

const awardedJob = () => awardedJobOf(buyer, shop);

/** The buyer clicks "pay" (signed in afresh, as clocks move in this file); where they are sent. */
async function clickPay(job: Job) {
  const visitor = await signedIn(buyer);
  const answer = await visitor.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });
  expect(answer.status).toBe(302);
  return answer.location!;
}

const openPayment = (job: Job) => Payment.findOne({ where: { jobId: job.id, status: ["pending", "failed"] }, rejectOnEmpty: true });

/** Posts the fake's event about `objectId` to the webhook, signed as Stripe signs it. */
function deliverEventAbout(type: string, objectId: string) {
  const event = fake.events.find((e) => e.type === type && (e.data.object as { id: string }).id === objectId);
  if (!event) throw new Error(`No ${type} event for ${objectId}`);
  const payload = JSON.stringify(event);
  const headers = new Headers({
    "Content-Type": "application/json",
    "Stripe-Signature": stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET }),
  });
  return call(webhook.action, new Request("http://127.0.0.1:3000/webhooks/stripe", { method: "POST", body: payload, headers }));
}

/** Makes payments look as if they were started `ms` ago. */
const backdate = (ids: string[], ms = 10 * MINUTE) =>
  sequelize.query(`UPDATE payments SET created_at = created_at - make_interval(secs => :secs) WHERE id IN (:ids)`, { replacements: { ids, secs: ms / 1000 } });

const sessionOf = (url: string) => url.split("/checkout/")[1];

describe("an old tab and a new click", () => {
  it("share the session while Stripe says it is open with time to pay; nearer its end it is expired before a new one is made", async () => {
    const job = await awardedJob();
    const oldTab = await clickPay(job);
    const first = await openPayment(job);
    vi.useFakeTimers({ toFake: ["Date"], shouldAdvanceTime: true });
    try {
      // 23½ hours on, half an hour left at Stripe: the new click gets the old tab's session.
      vi.setSystemTime(Date.now() + 23.5 * HOUR);
      expect(await clickPay(job)).toBe(oldTab);
      expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);

      // Five minutes left: too little to type a card. The old session is expired at Stripe first.
      vi.setSystemTime(Date.now() + 25 * MINUTE);
      const newTab = await clickPay(job);
      expect(newTab).not.toBe(oldTab);
      expect((await stripe.checkout.sessions.retrieve(sessionOf(oldTab))).status).toBe("expired");
      expect((await fake.pay(sessionOf(oldTab))).status).toBe(409);
      expect((await first.reload()).status).toBe("expired");
      const second = await openPayment(job);
      expect(second.checkoutSessionId).toBe(sessionOf(newTab));
      expect(await Payment.count({ where: { jobId: job.id, status: ["pending", "failed"] } })).toBe(1);

      expect((await fake.pay(sessionOf(newTab))).status).toBe(303);
      expect((await deliverEventAbout("checkout.session.completed", sessionOf(newTab))).data.outcome).toBe("paid");
      expect((await job.reload()).retainerPaidAt).not.toBeNull();
    } finally {
      vi.useRealTimers();
    }
  });
});

describe("a card service that lost its sessions", () => {
  it("starts afresh when the buyer clicks pay, and the reconciler closes attempts nobody can pay", async () => {
    const job = await awardedJob();
    const other = await awardedJob();
    const before = await clickPay(job);
    await clickPay(other);
    const stale = await openPayment(job);
    const otherStale = await openPayment(other);
    const oldCustomer = (await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).stripeCustomerId;

    await restartFake();
    const after = await clickPay(job);
    expect(after.startsWith(`${fake.url}/checkout/cs_test_`)).toBe(true);
    expect(after).not.toBe(before);
    expect((await stale.reload()).status).toBe("expired");
    const fresh = await openPayment(job);
    expect(fresh.id).not.toBe(stale.id);
    // The organisation's customer was unknown to the new card service too: it has a new one.
    const customer = (await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).stripeCustomerId!;
    expect(customer).not.toBe(oldCustomer);
    expect((await stripe.customers.retrieve(customer)).id).toBe(customer);
    expect((await fake.pay(sessionOf(after))).status).toBe(303);
    expect((await deliverEventAbout("checkout.session.completed", sessionOf(after))).data.outcome).toBe("paid");

    await backdate([otherStale.id]);
    expect((await reconcileOpenPayments())[otherStale.id]).toBe("expired");
    expect((await otherStale.reload()).status).toBe("expired");
    expect(await clickPay(other)).toMatch(/\/checkout\/cs_test_/);
  });
});

describe("reconciling open payments", () => {
  it("records a payment whose webhook never came, ends an expired one, and leaves recent and open ones alone", async () => {
    const [paidJob, expiredJob, openJob] = [await awardedJob(), await awardedJob(), await awardedJob()];
    const paidUrl = await clickPay(paidJob);
    const expiredUrl = await clickPay(expiredJob);
    await clickPay(openJob);
    const [paid, expired, open] = await Promise.all([openPayment(paidJob), openPayment(expiredJob), openPayment(openJob)]);
    expect((await fake.pay(sessionOf(paidUrl))).status).toBe(303);
    await stripe.checkout.sessions.expire(sessionOf(expiredUrl));

    // Minutes old at most: a webhook may still be on its way.
    const early = await reconcileOpenPayments();
    for (const p of [paid, expired, open]) expect(early[p.id]).toBeUndefined();

    await backdate([paid.id, expired.id, open.id]);
    const outcomes = await reconcileOpenPayments();
    expect(outcomes[paid.id]).toBe("paid");
    expect(outcomes[expired.id]).toBe("expired");
    expect(outcomes[open.id]).toBe("still open");
    expect(await paid.reload()).toMatchObject({ status: "paid", paymentIntentId: expect.stringMatching(/^pi_/) });
    expect(paid.paidAt).not.toBeNull();
    expect((await paidJob.reload()).retainerPaidAt).not.toBeNull();
    expect((await expired.reload()).status).toBe("expired");
    expect((await open.reload()).status).toBe("pending");
    // Asked about once per period.
    expect((await reconcileOpenPayments())[open.id]).toBeUndefined();

    // The late webhook changes nothing: one history row, one receipt.
    expect((await deliverEventAbout("checkout.session.completed", paid.checkoutSessionId!)).data.outcome).toBe("payment already recorded");
    expect(await JobEvent.count({ where: { jobId: paidJob.id, kind: "retainer_paid" } })).toBe(1);
    const receipts = await OutboxMail.count({ where: { to: buyer.email, text: { [Op.like]: `%${paid.paymentIntentId}%` } } });
    expect(receipts).toBe(1);
    // The expired attempt's job can be paid afresh.
    expect(sessionOf(await clickPay(expiredJob))).not.toBe(sessionOf(expiredUrl));
  });

  it("expires a session still open on a job paid through another attempt", async () => {
    const job = await awardedJob();
    const firstUrl = await clickPay(job);
    const first = await openPayment(job);
    await first.update({ status: "expired" }); // forced: the app gave it up while Stripe still takes it
    const secondUrl = await clickPay(job);
    const second = await openPayment(job);
    expect((await fake.pay(sessionOf(firstUrl))).status).toBe(303);
    expect((await deliverEventAbout("checkout.session.completed", sessionOf(firstUrl))).data.outcome).toBe("paid");

    await backdate([second.id]);
    expect((await reconcileOpenPayments())[second.id]).toBe("expired");
    expect((await stripe.checkout.sessions.retrieve(sessionOf(secondUrl))).status).toBe("expired");
    expect((await fake.pay(sessionOf(secondUrl))).status).toBe(409);
    expect((await second.reload()).status).toBe("expired");
  });

  it("lets several app servers reconcile at once, each payment by one of them", async () => {
    const jobs = [await awardedJob(), await awardedJob(), await awardedJob(), await awardedJob()];
    for (const job of jobs) await clickPay(job);
    const ids = (await Promise.all(jobs.map(openPayment))).map((p) => p.id);
    await backdate(ids);
    const [a, b] = await Promise.all([reconcileOpenPayments({ limit: 2 }), reconcileOpenPayments({ limit: 2 })]);
    const mine = (outcomes: Record<string, string>) => Object.keys(outcomes).filter((id) => ids.includes(id));
    expect(mine(a).filter((id) => mine(b).includes(id))).toEqual([]);
    const rest = await reconcileOpenPayments();
    expect(new Set([...mine(a), ...mine(b), ...mine(rest)])).toEqual(new Set(ids));
  });
});
