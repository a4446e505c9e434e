// Webhook signatures exactly as Stripe makes them, so the app's `stripe.webhooks.constructEvent`
// verifies the fake's deliveries with the same code that verifies Stripe's.
import { createHmac } from "node:crypto";
import { unixNow } from "./store";

export function signatureHeader(payload: string, secret: string, timestamp = unixNow()) {
  const signature = createHmac("sha256", secret).update(`${timestamp}.${payload}`, "utf8").digest("hex");
  return `t=${timestamp},v1=${signature}`;
}
