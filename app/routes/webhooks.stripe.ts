import type { Route } from "./+types/webhooks.stripe";
import { handleStripeEvent } from "~/services/stripe-events.server";
import { verifiedEvent } from "~/services/stripe.server";

// Stripe's webhook endpoint. The signature is checked over the raw body before anything is
// read from it; a bad or missing one is a 400 and changes nothing. A signed event that does not
// match our payment (amount, currency, refund) is recorded, flagged and answered 200: resending
// it would not make it match, so Stripe is told to stop.
export async function action({ request }: Route.ActionArgs) {
  const payload = await request.text();
  let event;
  try {
    event = verifiedEvent(payload, request.headers.get("Stripe-Signature"));
  } catch (error) {
    return Response.json({ error: `Signature check failed: ${error instanceof Error ? error.message : String(error)}` }, { status: 400 });
  }
  const outcome = await handleStripeEvent(event);
  return Response.json({ received: true, outcome });
}

export function loader() {
  return new Response("Stripe posts events here.", { status: 405, headers: { Allow: "POST" } });
}
