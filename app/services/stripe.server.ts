import Stripe from "stripe";
import { env } from "~/env.server";

// The one Stripe client. STRIPE_API_URL points the official SDK at the local fake; without it
// the SDK talks to Stripe itself, so test mode needs nothing but other keys in the environment.
let client: Stripe | undefined;

export function stripe(): Stripe {
  if (client) return client;
  const { STRIPE_SECRET_KEY, STRIPE_API_URL } = env();
  const local = STRIPE_API_URL ? new URL(STRIPE_API_URL) : null;
  client = new Stripe(STRIPE_SECRET_KEY, {
    ...(local ? { host: local.hostname, port: Number(local.port || 80), protocol: local.protocol.replace(":", "") as "http" | "https" } : {}),
    maxNetworkRetries: 2,
    timeout: 20_000,
    appInfo: { name: "Tenderflow" },
  });
  return client;
}

/** Checks a webhook's signature and parses it; throws when the signature does not hold. */
export function verifiedEvent(payload: string, signature: string | null): Stripe.Event {
  if (!signature) throw new Error("No Stripe-Signature header.");
  return stripe().webhooks.constructEvent(payload, signature, env().STRIPE_WEBHOOK_SECRET);
}

/** Stripe does not know the object asked for (deleted, or made by a card service since reset). */
export function isMissingAtStripe(error: unknown): boolean {
  return error instanceof Stripe.errors.StripeInvalidRequestError && error.code === "resource_missing";
}
