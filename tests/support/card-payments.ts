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

/** The fake's event of `type` about the object `objectId`. */
export async function eventAbout(type: string, objectId: string) {
  const stripe = fakeStripe();
  for (let i = 0; i < 50; i++) {
    const { data } = await stripe.events.list({ type, limit: 100 });
    const found = data.find((e) => (e.data.object as { id?: string }).id === objectId);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`No ${type} event for ${objectId}`);
}

/** Posts an event to the app's webhook, signed with the endpoint's secret. */
export function deliverEvent(event: unknown) {
  const payload = JSON.stringify(event);
  const header = fakeStripe().webhooks.generateTestHeaderString({ payload, secret: process.env.STRIPE_WEBHOOK_SECRET! });
  const headers = new Headers({ "Content-Type": "application/json", "Stripe-Signature": header });
  return call(webhook.action, new Request("http://127.0.0.1:3000/webhooks/stripe", { method: "POST", body: payload, headers }));
}
