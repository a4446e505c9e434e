// Paying through the local Stripe fake as a buyer's browser and Stripe itself would: the hosted
// page submitted with a card, the fake's events looked up, and a webhook delivered signed.
import Stripe from "stripe";
import * as webhook from "~/routes/webhooks.stripe";
import { call } from "./routes";

export const fakeStripe = () => {
  const url = new URL(process.env.STRIPE_API_URL!);
  return new Stripe(process.env.STRIPE_SECRET_KEY!, { host: url.hostname, port: Number(url.port), protocol: "http" as const });
};

/** Submits the fake's hosted page with a card, as the buyer's browser would. */
export const payOnPage = (url: string, card = "4242 4242 4242 4242") =>
  fetch(url, {
    method: "POST",
    body: new URLSearchParams({ card_number: card, expiry: `12 / ${(new Date().getFullYear() + 3) % 100}`, cvc: "123" }),
    redirect: "manual",
  });

/** The fake's event of `type` about the object `objectId` (or the first whose object `match`es), as its API lists it. */
export async function eventAbout(type: string, objectId: string, match: (o: Record<string, unknown>) => boolean = (o) => o.id === objectId) {
  const stripe = fakeStripe();
  for (let i = 0; i < 50; i++) {
    const { data } = await stripe.events.list({ type, limit: 100 });
    const found = data.find((e) => match(e.data.object as unknown as Record<string, unknown>));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`No ${type} event for ${objectId}`);
}

/** An event as Stripe sends it (test mode, one pending delivery) of `type` about `object`, made up by the test. */
export const madeUpEvent = (id: string, type: string, object: unknown) => ({
  id,
  object: "event",
  type,
  created: Math.floor(Date.now() / 1000),
  api_version: "2026-10-28.endive",
  livemode: false,
  pending_webhooks: 1,
  request: { id: null, idempotency_key: null },
  data: { object },
});

/** The `Stripe-Signature` header Stripe would send with `payload`, signed with the endpoint's secret. */
export const signatureOf = (payload: string) => fakeStripe().webhooks.generateTestHeaderString({ payload, secret: process.env.STRIPE_WEBHOOK_SECRET! });

/** Posts an event to the app's webhook as Stripe would, signed; or with the `signature` given (null: none). */
export function deliverEvent(event: unknown, signature?: string | null) {
  const payload = JSON.stringify(event);
  const header = signature === undefined ? signatureOf(payload) : signature;
  const headers = new Headers({ "Content-Type": "application/json" });
  if (header) headers.set("Stripe-Signature", header);
  return call(webhook.action, new Request("http://127.0.0.1:3000/webhooks/stripe", { method: "POST", body: payload, headers }));
}
