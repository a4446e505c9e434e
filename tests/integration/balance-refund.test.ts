// A refund of the balance that the card service's webhook reports is the balance's: it goes in the
// job's history as a balance refund and never counts as the retainer paid back
// (jobs.retainer_refunded_cents, which the retainer's badge and the jobs list's "refunded" filter
// read), while the same event about the retainer still does.
import { randomUUID } from "node:crypto";
import type Stripe from "stripe";
import { beforeAll, describe, expect, it } from "vitest";
import { JobEvent, Payment, type User } from "~/models/index.server";
import { newAttempt } from "~/services/payments.server";
import { handleStripeEvent } from "~/services/stripe-events.server";
import { makeJob, makeMember } from "../support/factories";

let buyer: User;
let shop: User;

beforeAll(async () => {
  buyer = await makeMember("buyer");
  shop = await makeMember("shop");
});

/** Stripe's charge.refunded about a paid payment, `refundedCents` paid back so far (as the event carries it). */
const chargeRefunded = (payment: Payment, refundedCents: number) =>
  handleStripeEvent({
    id: `evt_${randomUUID()}`,
    type: "charge.refunded",
    data: {
      object: {
        id: `ch_${randomUUID()}`,
        payment_intent: payment.paymentIntentId,
        amount: payment.amountCents,
        amount_refunded: refundedCents,
        currency: payment.currency.toLowerCase(),
      },
    },
  } as unknown as Stripe.Event);

const events = (jobId: string, kind: string) => JobEvent.count({ where: { jobId, kind } });

describe("a refund told by the webhook", () => {
  it("of the balance is recorded as the balance's and leaves the retainer's figures alone; of the retainer, counts there", async () => {
    const { job } = await makeJob(buyer, shop);
    const paid = { status: "paid" as const, paidAt: new Date() };
    const retainer = await Payment.create({ ...newAttempt(job, buyer.id), ...paid, paymentIntentId: `pi_${randomUUID()}` });
    const balance = await Payment.create({ ...newAttempt(job, buyer.id, "balance"), ...paid, paymentIntentId: `pi_${randomUUID()}` });

    expect(await chargeRefunded(balance, 10_000)).toBe("refunded 10000 of a balance");
    expect(await balance.reload()).toMatchObject({ status: "partially_refunded", refundedCents: 10_000 });
    expect(await chargeRefunded(balance, balance.amountCents)).toBe(`refunded ${balance.amountCents - 10_000} of a balance`);
    expect(await balance.reload()).toMatchObject({ status: "refunded", refundedCents: balance.amountCents });
    expect((await job.reload()).retainerRefundedCents).toBe(0);
    expect(await events(job.id, "balance_refunded")).toBe(2);
    expect(await events(job.id, "retainer_refunded")).toBe(0);

    expect(await chargeRefunded(retainer, retainer.amountCents)).toBe(`refunded ${retainer.amountCents}`);
    expect((await job.reload()).retainerRefundedCents).toBe(retainer.amountCents);
    expect(await events(job.id, "retainer_refunded")).toBe(1);
  });
});
