// The Stripe fake, driven through the official SDK the way the app will drive it: customers,
// Checkout Sessions paid or declined on the hosted page, refunds, Stripe's errors and
// idempotency, and webhooks that `stripe.webhooks.constructEvent` accepts.
import { randomBytes } from "node:crypto";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { startStripeFake, type StripeFake } from "../../fakes/stripe";

const WEBHOOK_SECRET = `whsec_${randomBytes(16).toString("hex")}`;
const SECRET_KEY = "sk_test_tenderflowLocal0001";

/** A stand-in for the app's webhook route: keeps each raw delivery; can be told to fail. */
type Received = { body: string; signature: string };
async function startReceiver() {
  const received: Received[] = [];
  const state = { failNext: 0 };
  const server: Server = createServer((request, response) => {
    let body = "";
    request.on("data", (chunk) => (body += chunk));
    request.on("end", () => {
      if (state.failNext > 0) {
        state.failNext--;
        return response.writeHead(500).end("not now");
      }
      received.push({ body, signature: String(request.headers["stripe-signature"]) });
      response.writeHead(200).end("ok");
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/webhooks/stripe`;
  return { url, received, state, close: () => new Promise((resolve) => server.close(resolve)) };
}

let fake: StripeFake;
let stripe: Stripe;
let receiver: Awaited<ReturnType<typeof startReceiver>>;

beforeAll(async () => {
  receiver = await startReceiver();
  fake = await startStripeFake({ webhookUrl: receiver.url, webhookSecret: WEBHOOK_SECRET, retryDelaysMs: [20, 40] });
  stripe = new Stripe(SECRET_KEY, { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0 });
});

afterAll(async () => {
  await fake.close();
  await receiver.close();
});

beforeEach(async () => {
  await fake.settled();
  receiver.received.length = 0;
  receiver.state.failNext = 0;
});

/** Every event the receiver got, checked with the SDK exactly as the app's webhook route will. */
function verifiedEvents(type?: string) {
  return receiver.received
    .map(({ body, signature }) => stripe.webhooks.constructEvent(body, signature, WEBHOOK_SECRET))
    .filter((event) => !type || event.type === type);
}

async function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) {
  return stripe.checkout.sessions.create({
    mode: "payment",
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: "EUR",
          unit_amount: 150_000,
          product_data: { name: "Retainer for job 42", description: "Press circuit, 2 units" },
        },
      },
    ],
    success_url: "http://127.0.0.1:3000/jobs/42/paid?session={CHECKOUT_SESSION_ID}",
    cancel_url: "http://127.0.0.1:3000/jobs/42",
    metadata: { job_id: "42" },
    payment_intent_data: { metadata: { job_id: "42" } },
    client_reference_id: "job-42",
    customer_email: "buyer@example.test",
    ...extra,
  });
}

const futureExpiry = `12 / ${(new Date().getFullYear() + 2) % 100}`;

function submitCard(sessionUrl: string, card: string, more: Record<string, string> = {}) {
  return fetch(sessionUrl, {
    method: "POST",
    body: new URLSearchParams({ card_number: card, expiry: futureExpiry, cvc: "123", name: "Ada Buyer", ...more }),
    redirect: "manual",
  });
}

async function expectStripeError(promise: Promise<unknown>) {
  const error = await promise.then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(Stripe.errors.StripeError);
  return error as InstanceType<typeof Stripe.errors.StripeError>;
}

describe("customers", () => {
  it("creates, retrieves, updates and lists them by e-mail", async () => {
    const email = `shop-${randomBytes(4).toString("hex")}@example.test`;
    const created = await stripe.customers.create({ email, name: "Hydra Works", metadata: { org_id: "7", tier: "a" } });
    expect(created).toMatchObject({ object: "customer", email, name: "Hydra Works", livemode: false, metadata: { org_id: "7", tier: "a" } });
    expect(created.id).toMatch(/^cus_\w{24}$/);
    expect(created.created).toBeCloseTo(Date.now() / 1000, -1);

    expect((await stripe.customers.retrieve(created.id)) as Stripe.Customer).toMatchObject({ id: created.id, email });

    // Metadata merges; an empty value removes a key, as Stripe does.
    const updated = await stripe.customers.update(created.id, { name: "Hydra Works Ltd", metadata: { tier: "", city: "Ghent" } });
    expect(updated).toMatchObject({ name: "Hydra Works Ltd", email, metadata: { org_id: "7", city: "Ghent" } });
    expect(updated.metadata).not.toHaveProperty("tier");

    await stripe.customers.create({ email: "someone-else@example.test" });
    const listed = await stripe.customers.list({ email });
    expect(listed).toMatchObject({ object: "list", has_more: false, url: "/v1/customers" });
    expect(listed.data.map((c) => c.id)).toEqual([created.id]);
  });

  it("pages lists newest first with limit and starting_after", async () => {
    const email = `pages-${randomBytes(4).toString("hex")}@example.test`;
    const ids = [];
    for (let i = 0; i < 3; i++) ids.push((await stripe.customers.create({ email })).id);
    const first = await stripe.customers.list({ email, limit: 2 });
    expect(first.data.map((c) => c.id)).toEqual([ids[2], ids[1]]);
    expect(first.has_more).toBe(true);
    const second = await stripe.customers.list({ email, limit: 2, starting_after: ids[1] });
    expect(second.data.map((c) => c.id)).toEqual([ids[0]]);
    expect(second.has_more).toBe(false);
    const all = [];
    for await (const customer of stripe.customers.list({ email, limit: 1 })) all.push(customer.id);
    expect(all).toEqual([ids[2], ids[1], ids[0]]);
  });
});

describe("checkout sessions", () => {
  it("creates a payment session with its PaymentIntent, line items and metadata", async () => {
    const customer = await stripe.customers.create({ email: "buyer@example.test" });
    const session = await newSession({ customer: customer.id, customer_email: undefined });
    expect(session).toMatchObject({
      object: "checkout.session",
      mode: "payment",
      status: "open",
      payment_status: "unpaid",
      amount_total: 150_000,
      currency: "eur",
      customer: customer.id,
      client_reference_id: "job-42",
      metadata: { job_id: "42" },
      success_url: "http://127.0.0.1:3000/jobs/42/paid?session={CHECKOUT_SESSION_ID}",
      livemode: false,
    });
    expect(session.id).toMatch(/^cs_test_\w{24}$/);
    expect(session.url).toBe(`${fake.url}/checkout/${session.id}`);
    expect(session.expires_at - session.created).toBe(24 * 3600);

    const expanded = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent", "line_items"] });
    const intent = expanded.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({
      object: "payment_intent",
      status: "requires_payment_method",
      amount: 150_000,
      currency: "eur",
      customer: customer.id,
      metadata: { job_id: "42" },
      latest_charge: null,
    });
    expect(intent.id).toMatch(/^pi_/);
    expect(expanded.line_items?.data[0]).toMatchObject({ description: "Retainer for job 42", quantity: 1, amount_total: 150_000 });
    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data).toHaveLength(1);

    const listed = await stripe.checkout.sessions.list({ payment_intent: intent.id });
    expect(listed.data.map((s) => s.id)).toEqual([session.id]);
  });

  it("refuses the parameters Stripe refuses", async () => {
    const missing = await expectStripeError(stripe.checkout.sessions.create({ mode: "payment", success_url: "http://x.test/" }));
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 400, code: "parameter_missing", param: "line_items", type: "StripeInvalidRequestError" });

    const unknown = await expectStripeError(
      stripe.checkout.sessions.create({ ...({ mode: "payment", colour: "red" } as Stripe.Checkout.SessionCreateParams) }),
    );
    expect(unknown).toMatchObject({ code: "parameter_unknown", param: "colour" });

    const noCustomer = await expectStripeError(newSession({ customer: "cus_nobody", customer_email: undefined }));
    expect(noCustomer).toMatchObject({ statusCode: 404, code: "resource_missing", param: "customer" });

    const badAmount = await expectStripeError(
      newSession({ line_items: [{ quantity: 1, price_data: { currency: "eur", unit_amount: -5, product_data: { name: "x" } } }] }),
    );
    expect(badAmount).toMatchObject({ code: "parameter_invalid_integer", param: "line_items[0][price_data][unit_amount]" });

    const soon = Math.floor(Date.now() / 1000) + 60;
    expect(await expectStripeError(newSession({ expires_at: soon }))).toMatchObject({ param: "expires_at" });
  });

  it("expires an open session, which can then no longer be paid", async () => {
    const session = await newSession({ expires_at: Math.floor(Date.now() / 1000) + 3600 });
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: "expired", url: null, payment_status: "unpaid" });
    expect((await stripe.paymentIntents.retrieve(session.payment_intent as string)).status).toBe("canceled");

    const page = await fetch(session.url!);
    expect(await page.text()).toContain("can no longer be made");
    expect((await submitCard(session.url!, "4242 4242 4242 4242")).status).toBe(409);
    expect(await expectStripeError(stripe.checkout.sessions.expire(session.id))).toMatchObject({ statusCode: 400 });
    await fake.settled();
    expect(verifiedEvents("checkout.session.expired").map((e) => (e.data.object as Stripe.Checkout.Session).id)).toEqual([session.id]);
  });

  it("refuses to expire a completed session, which stays paid, and names an unknown one resource_missing", async () => {
    const session = await newSession();
    expect((await submitCard(session.url!, "4242 4242 4242 4242")).status).toBe(303);
    expect(await expectStripeError(stripe.checkout.sessions.expire(session.id))).toMatchObject({ statusCode: 400, type: "StripeInvalidRequestError" });
    expect(await stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: "complete", payment_status: "paid" });
    expect((await stripe.paymentIntents.retrieve(session.payment_intent as string)).status).toBe("succeeded");
    await fake.settled();
    expect(verifiedEvents("checkout.session.expired")).toEqual([]);
    expect(await expectStripeError(stripe.checkout.sessions.expire("cs_test_unknown"))).toMatchObject({ statusCode: 404, code: "resource_missing" });
  });

  it("forgets every session when restarted, as the app must expect", async () => {
    const session = await newSession();
    const again = await startStripeFake({ webhookSecret: WEBHOOK_SECRET });
    try {
      const other = new Stripe(SECRET_KEY, { host: "127.0.0.1", port: again.port, protocol: "http", maxNetworkRetries: 0 });
      expect(await expectStripeError(other.checkout.sessions.retrieve(session.id))).toMatchObject({ statusCode: 404, code: "resource_missing", param: "id" });
    } finally {
      await again.close();
    }
  });
});

describe("the hosted payment page", () => {
  it("shows the amount and description, and a cancel link back to the app", async () => {
    const session = await newSession();
    const response = await fetch(session.url!);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toContain("€1,500.00");
    expect(html).toContain("Retainer for job 42");
    expect(html).toContain("Press circuit, 2 units");
    expect(html).toContain('<form method="post"');
    expect(html).toContain('href="http://127.0.0.1:3000/jobs/42"');
    expect(html).toContain('value="buyer@example.test"');
  });

  it("takes 4242…: the session completes, the PaymentIntent succeeds with a charge, the app hears of it", async () => {
    const session = await newSession();
    const response = await submitCard(session.url!, "4242 4242 4242 4242");
    expect(response.status).toBe(303);
    expect(response.headers.get("location")).toBe(`http://127.0.0.1:3000/jobs/42/paid?session=${session.id}`);

    const paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent.latest_charge"] });
    expect(paid).toMatchObject({ status: "complete", payment_status: "paid", url: null });
    expect(paid.customer_details).toMatchObject({ email: "buyer@example.test", name: "Ada Buyer" });
    const intent = paid.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ status: "succeeded", amount_received: 150_000, last_payment_error: null });
    const charge = intent.latest_charge as Stripe.Charge;
    expect(charge.id).toMatch(/^ch_/);
    expect(charge).toMatchObject({ object: "charge", paid: true, status: "succeeded", amount: 150_000, amount_refunded: 0, refunded: false });
    expect(charge.payment_method_details?.card).toMatchObject({ brand: "visa", last4: "4242" });
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ id: charge.id, payment_intent: intent.id, metadata: { job_id: "42" } });

    await fake.settled();
    expect(receiver.received[0].signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const [completed] = verifiedEvents("checkout.session.completed");
    expect(completed).toMatchObject({ object: "event", livemode: false, api_version: expect.any(String) });
    expect(completed.id).toMatch(/^evt_/);
    const object = completed.data.object as Stripe.Checkout.Session;
    expect(object).toMatchObject({ id: session.id, payment_status: "paid", metadata: { job_id: "42" }, payment_intent: intent.id });
    expect(verifiedEvents("payment_intent.succeeded")).toHaveLength(1);
    expect(await stripe.events.retrieve(completed.id)).toMatchObject({ id: completed.id, type: "checkout.session.completed", pending_webhooks: 0 });
    const listed = await stripe.events.list({ type: "checkout.session.*", limit: 1 });
    expect(listed.data[0].id).toBe(completed.id);

    // Paying again changes nothing.
    expect((await submitCard(session.url!, "4242 4242 4242 4242")).status).toBe(409);
  });

  it("declines 4000…0002: the failure is shown, the app hears payment_failed, and a retry can pay", async () => {
    const session = await newSession();
    const declined = await submitCard(session.url!, "4000 0000 0000 0002");
    expect(declined.status).toBe(402);
    const html = await declined.text();
    expect(html).toContain("Payment declined");
    expect(html).toContain("Your card was declined.");
    expect(html).toContain('<form method="post"');

    const intent = await stripe.paymentIntents.retrieve(session.payment_intent as string);
    expect(intent.status).toBe("requires_payment_method");
    expect(intent.last_payment_error).toMatchObject({ type: "card_error", code: "card_declined", decline_code: "generic_decline" });
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
    await fake.settled();
    const [failed] = verifiedEvents("payment_intent.payment_failed");
    expect((failed.data.object as Stripe.PaymentIntent).id).toBe(intent.id);
    expect(verifiedEvents("checkout.session.completed")).toHaveLength(0);

    expect((await submitCard(session.url!, "4242424242424242")).status).toBe(303);
    expect((await stripe.paymentIntents.retrieve(intent.id)).status).toBe("succeeded");
  });

  it("names what is wrong with a card that is not a test card, and takes no payment", async () => {
    const session = await newSession();
    const before = fake.events.length;
    const wrong = await submitCard(session.url!, "4111 1111 1111 1112", { expiry: "13 / 30", cvc: "1" });
    expect(wrong.status).toBe(400);
    const html = await wrong.text();
    expect(html).toContain("That card number is not valid.");
    expect(html).toContain("MM / YY");
    expect(html).toContain("3 digits");
    const notTest = await submitCard(session.url!, "4111 1111 1111 1111");
    expect(await notTest.text()).toContain("test cards only");
    expect(fake.events.length).toBe(before);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
  });
});

describe("refunds", () => {
  async function paidIntent() {
    const session = await newSession();
    expect((await fake.pay(session.id)).status).toBe(303);
    return stripe.paymentIntents.retrieve(session.payment_intent as string);
  }

  it("refunds part, then the rest, and refuses a refund beyond what is left", async () => {
    const intent = await paidIntent();
    const part = await stripe.refunds.create({ payment_intent: intent.id, amount: 50_000, reason: "requested_by_customer", metadata: { why: "scope" } });
    expect(part.id).toMatch(/^re_/);
    expect(part).toMatchObject({
      object: "refund",
      amount: 50_000,
      currency: "eur",
      status: "succeeded",
      charge: intent.latest_charge,
      reason: "requested_by_customer",
    });
    expect(await stripe.charges.retrieve(intent.latest_charge as string)).toMatchObject({ amount_refunded: 50_000, refunded: false });

    const tooMuch = await expectStripeError(stripe.refunds.create({ charge: intent.latest_charge as string, amount: 100_001 }));
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(tooMuch).toMatchObject({ statusCode: 400, code: "amount_too_large", param: "amount" });

    const rest = await stripe.refunds.create({ charge: intent.latest_charge as string });
    expect(rest.amount).toBe(100_000);
    expect(await stripe.charges.retrieve(intent.latest_charge as string)).toMatchObject({ amount_refunded: 150_000, refunded: true });
    const again = await expectStripeError(stripe.refunds.create({ payment_intent: intent.id }));
    expect(again).toMatchObject({ code: "charge_already_refunded" });

    expect((await stripe.refunds.retrieve(part.id)).amount).toBe(50_000);
    const listed = await stripe.refunds.list({ payment_intent: intent.id });
    expect(listed.data.map((r) => r.id)).toEqual([rest.id, part.id]);

    await fake.settled();
    const refunded = verifiedEvents("charge.refunded");
    expect(refunded.map((e) => (e.data.object as Stripe.Charge).amount_refunded)).toEqual([50_000, 150_000]);
    expect(refunded[1].data.previous_attributes).toEqual({ amount_refunded: 50_000, refunded: false });
    expect(refunded[0].request?.idempotency_key).toMatch(/^stripe-node-retry-/);
    expect(verifiedEvents("refund.created")).toHaveLength(2);
  });

  it("refuses to refund a PaymentIntent that was never paid", async () => {
    const session = await newSession();
    const error = await expectStripeError(stripe.refunds.create({ payment_intent: session.payment_intent as string }));
    expect(error).toMatchObject({ statusCode: 400, code: "charge_not_refundable" });
    expect(await expectStripeError(stripe.refunds.create({}))).toMatchObject({ code: "parameter_missing" });
  });
});

describe("idempotency keys", () => {
  it("answers a repeated key with the first response, marked as replayed", async () => {
    const key = `key-${randomBytes(6).toString("hex")}`;
    const first = await stripe.customers.create({ email: "once@example.test" }, { idempotencyKey: key });
    const second = await stripe.customers.create({ email: "once@example.test" }, { idempotencyKey: key });
    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers["idempotent-replayed"]).toBe("true");
    expect(first.lastResponse.headers["idempotent-replayed"]).toBeUndefined();
    expect((await stripe.customers.list({ email: "once@example.test" })).data).toHaveLength(1);
  });

  it("refuses the same key with other parameters", async () => {
    const key = `key-${randomBytes(6).toString("hex")}`;
    await stripe.customers.create({ email: "a@example.test" }, { idempotencyKey: key });
    const error = await expectStripeError(stripe.customers.create({ email: "b@example.test" }, { idempotencyKey: key }));
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(error).toMatchObject({ statusCode: 400, rawType: "idempotency_error" });
  });
});

describe("errors", () => {
  it("answers an unknown id with 404 resource_missing", async () => {
    const error = await expectStripeError(stripe.customers.retrieve("cus_doesnotexist"));
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error).toMatchObject({ statusCode: 404, code: "resource_missing", param: "id", message: "No such customer: 'cus_doesnotexist'" });
    expect(error.requestId).toMatch(/^req_/);
    expect(await expectStripeError(stripe.paymentIntents.retrieve("pi_nothing"))).toMatchObject({ statusCode: 404, code: "resource_missing" });
  });

  it("refuses a missing or malformed API key with 401", async () => {
    const options = { host: "127.0.0.1", port: fake.port, protocol: "http" as const, maxNetworkRetries: 0 };
    for (const key of ["not-a-key", "sk_live_realKeyNotWelcome1", "pk_test_publishableKey01"]) {
      const error = await expectStripeError(new Stripe(key, options).customers.list());
      expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
      expect(error.statusCode).toBe(401);
    }
    const noKey = await fetch(`${fake.url}/v1/customers`);
    expect(noKey.status).toBe(401);
    expect((await noKey.json()).error).toMatchObject({ type: "invalid_request_error", message: expect.stringContaining("API key") });
  });

  it("accepts only the configured key when one is set", async () => {
    const strict = await startStripeFake({ webhookSecret: WEBHOOK_SECRET, secretKey: SECRET_KEY });
    try {
      const options = { host: "127.0.0.1", port: strict.port, protocol: "http" as const, maxNetworkRetries: 0 };
      expect((await new Stripe(SECRET_KEY, options).customers.list()).object).toBe("list");
      const error = await expectStripeError(new Stripe("sk_test_someOtherKey0001", options).customers.list());
      expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    } finally {
      await strict.close();
    }
  });
});

describe("webhook delivery", () => {
  it("retries a delivery the app refused, with the same event", async () => {
    receiver.state.failNext = 2;
    const session = await newSession();
    await fake.settled();
    const event = fake.events.at(-1)!;
    expect(event.type).toBe("payment_intent.created");
    const attempts = fake.deliveries.filter((d) => d.eventId === event.id);
    expect(attempts.map((d) => [d.attempt, d.status])).toEqual([
      [1, 500],
      [2, 500],
      [3, 200],
    ]);
    const [created] = verifiedEvents("payment_intent.created");
    expect((created.data.object as Stripe.PaymentIntent).id).toBe(session.payment_intent);
  });

  it("keeps working when the webhook URL does not answer", async () => {
    const closed = await startReceiver();
    await closed.close();
    fake.setWebhookUrl(closed.url);
    try {
      const session = await newSession();
      await fake.settled();
      const attempts = fake.deliveries.filter((d) => d.eventId === fake.events.at(-1)!.id);
      expect(attempts).toHaveLength(3);
      expect(attempts.every((d) => d.error && d.status === undefined)).toBe(true);
      expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
      expect((await stripe.events.retrieve(fake.events.at(-1)!.id)).pending_webhooks).toBe(1);
    } finally {
      fake.setWebhookUrl(receiver.url);
    }
  });

  it("replays every delivered event with the same id and payload, freshly signed", async () => {
    const session = await newSession();
    await fake.pay(session.id);
    await fake.settled();
    const firstRound = receiver.received.map((r) => r.body);
    receiver.received.length = 0;

    const replays = await fake.replayAll();
    expect(replays.every((d) => d.replay && d.status === 200)).toBe(true);
    const replayed = new Map(receiver.received.map((r) => [JSON.parse(r.body).id as string, r.body]));
    for (const body of firstRound) expect(replayed.get(JSON.parse(body).id)).toBe(body);
    // Every replay still verifies: the signature is made anew over the unchanged payload.
    expect(verifiedEvents().length).toBe(receiver.received.length);
  });
});

describe("a payment made before the fake started", () => {
  it("is put back under its ids, so it can still be refunded, and only once", async () => {
    fake.restorePaid({
      paymentIntentId: "pi_restoredDemo0001",
      amount: 50_000,
      amountRefunded: 10_000,
      currency: "GBP",
      customer: null,
      metadata: { payment_id: "demo" },
    });
    fake.restorePaid({ paymentIntentId: "pi_restoredDemo0001", amount: 1, amountRefunded: 0, currency: "GBP", customer: null, metadata: {} });
    const intent = await stripe.paymentIntents.retrieve("pi_restoredDemo0001", { expand: ["latest_charge"] });
    expect(intent).toMatchObject({ status: "succeeded", amount: 50_000, amount_received: 50_000, currency: "gbp", metadata: { payment_id: "demo" } });
    expect(intent.latest_charge).toMatchObject({ amount_refunded: 10_000, refunded: false });
    const refund = await stripe.refunds.create({ payment_intent: "pi_restoredDemo0001", amount: 40_000 });
    expect(refund).toMatchObject({ amount: 40_000, status: "succeeded" });
    await expect(stripe.refunds.create({ payment_intent: "pi_restoredDemo0001", amount: 1 })).rejects.toMatchObject({ code: "charge_already_refunded" });
  });
});
