// The card service misbehaving under the buyer's "pay" click. msw stands between the app's own
// Stripe client and STRIPE_API_URL, so each test picks its failure (an error answer, a dropped
// connection) without stopping or reconfiguring the shared Stripe fake; requests no test
// intercepts pass through to the fake, which is how each test shows the next click recovering.
// A connection that stalls past the SDK's timeout cannot be played here: msw's stand-in socket
// never runs Node's idle timer. The SDK turns both into a StripeConnectionError, the case the
// dropped connection covers.
import { http, HttpResponse } from "msw";
import { setupServer } from "msw/node";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import * as pay from "~/routes/job-pay";
import { popToast } from "~/auth/session.server";
import { Payment, type Job, type User } from "~/models/index.server";
import { expectConsoleError } from "../support/console-errors";
import { makeBuyerAndShop } from "../support/parties";
import type { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { awardedJob as awardedJobOf } from "../support/awards";

const STRIPE = process.env.STRIPE_API_URL!.replace(/\/$/, "");
const DOWN = "The card service did not answer, so nothing was charged. Try again in a minute.";

const cardService = setupServer();
beforeAll(() => cardService.listen({ onUnhandledRequest: "bypass" }));
afterEach(() => cardService.resetHandlers());
afterAll(() => cardService.close());

let buyer: User;
let shop: User;
let visitor: Visitor;

beforeAll(async () => {
  ({ buyer, shop } = await makeBuyerAndShop());
  visitor = await signedIn(buyer);
});

const awardedJob = () => awardedJobOf(buyer, shop);

const clickPay = (job: Job) => visitor.post(pay.action, `/jobs/${job.id}/pay`, {}, { jobId: job.id });

/** The message the job page shows after the redirect. */
const toastOnJobPage = async (job: Job) => (await popToast(visitor.request(`/jobs/${job.id}`))).toast;

/** Every request the SDK makes to `path`, answered by `answer`; the requests, for inspection. */
function intercept(path: string, answer: () => Promise<Response> | Response) {
  const seen: Request[] = [];
  cardService.use(
    http.post(`${STRIPE}${path}`, ({ request }) => {
      seen.push(request);
      return answer();
    }),
  );
  return seen;
}

describe("the card service fails while the buyer clicks pay", () => {
  it("answers 500: the buyer is sent back to the job with a clear message, and the next click pays", async () => {
    const job = await awardedJob();
    const seen = intercept("/v1/customers", () =>
      HttpResponse.json({ error: { type: "api_error", message: "Something went wrong on the card service." } }, { status: 500 }),
    );
    expectConsoleError(/Stripe refused a retainer session: Something went wrong/);

    const failed = await clickPay(job);
    expect(failed.status).toBe(302);
    expect(failed.location).toBe(`/jobs/${job.id}`);
    expect(await toastOnJobPage(job)).toBe(DOWN);
    // The SDK retried as configured, always under one idempotency key, so no retry can double up.
    expect(seen.length).toBe(3);
    expect(new Set(seen.map((r) => r.headers.get("Idempotency-Key"))).size).toBe(1);
    // One attempt is kept open, without a session, and nothing is paid.
    const open = await Payment.findAll({ where: { jobId: job.id } });
    expect(open.map((p) => [p.status, p.checkoutSessionId])).toEqual([["pending", null]]);
    expect((await job.reload()).retainerPaidAt).toBeNull();

    cardService.resetHandlers();
    const retried = await clickPay(job);
    expect(retried.status).toBe(302);
    expect(retried.location!.startsWith(process.env.STRIPE_API_URL!)).toBe(true);
    expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);
  });

  it("drops the connection: the same clear message, no session, and the next click pays", async () => {
    const job = await awardedJob();
    // The customer is made (by the fake); the checkout session's requests die on the wire.
    const seen = intercept("/v1/checkout/sessions", () => HttpResponse.error());
    expectConsoleError(/Stripe refused a retainer session: An error occurred with our connection to Stripe/);

    const failed = await clickPay(job);
    expect(failed.status).toBe(302);
    expect(failed.location).toBe(`/jobs/${job.id}`);
    expect(await toastOnJobPage(job)).toBe(DOWN);
    const [attempt, ...others] = await Payment.findAll({ where: { jobId: job.id } });
    expect(others).toEqual([]);
    expect(attempt.status).toBe("pending");
    expect(attempt.checkoutSessionId).toBeNull();
    // Every retry asked for this attempt's one session, so the card service could not make two.
    expect(seen.map((r) => r.headers.get("Idempotency-Key"))).toEqual(Array(3).fill(`retainer-${attempt.id}`));

    cardService.resetHandlers();
    const retried = await clickPay(job);
    expect(retried.location!.startsWith(process.env.STRIPE_API_URL!)).toBe(true);
    expect((await attempt.reload()).checkoutSessionId).not.toBeNull();
    expect(await Payment.count({ where: { jobId: job.id } })).toBe(1);
  });

  it("answers 500 when asked about the open session: the buyer keeps that session once it is back", async () => {
    const job = await awardedJob();
    const first = await clickPay(job);
    expect(first.location!.startsWith(process.env.STRIPE_API_URL!)).toBe(true);
    const sessionId = (await Payment.findOne({ where: { jobId: job.id }, rejectOnEmpty: true })).checkoutSessionId!;

    cardService.use(
      http.get(`${STRIPE}/v1/checkout/sessions/${sessionId}`, () =>
        HttpResponse.json({ error: { type: "api_error", message: "Lookup failed." } }, { status: 500 }),
      ),
    );
    expectConsoleError(/Stripe refused a retainer session: Lookup failed/);
    const failed = await clickPay(job);
    expect(failed.location).toBe(`/jobs/${job.id}`);
    expect(await toastOnJobPage(job)).toBe(DOWN);
    // The open attempt is neither closed nor replaced while the card service cannot be asked.
    const payments = await Payment.findAll({ where: { jobId: job.id } });
    expect(payments.map((p) => [p.status, p.checkoutSessionId])).toEqual([["pending", sessionId]]);

    cardService.resetHandlers();
    expect((await clickPay(job)).location).toBe(first.location);
  });
});
