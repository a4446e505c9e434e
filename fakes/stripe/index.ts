// A Stripe stand-in for local runs and tests: the API the app calls through the official SDK,
// a hosted payment page, and signed webhooks. Start one with startStripeFake().
import type { AddressInfo } from "node:net";
import { EventHub } from "./events";
import { checkoutPageRoutes } from "./checkout-page";
import { Payments } from "./payments";
import { checkoutSessionRoutes } from "./resources/checkout-sessions";
import { customerRoutes } from "./resources/customers";
import { eventRoutes } from "./resources/events";
import { paymentIntentRoutes } from "./resources/payment-intents";
import { refundRoutes } from "./resources/refunds";
import { createFakeServer } from "./server";
import { Store } from "./store";

export type { Delivery, FakeEvent } from "./events";
export { signatureHeader } from "./signing";

/** The API version events carry: the one stripe 23.1.0 asks for. */
export const FAKE_API_VERSION = "2026-10-28.endive";

export type StripeFakeOptions = {
  /** 0 (the default) picks a free port. */
  port?: number;
  /** Where events are POSTed; without one they are only kept. Can be set later. */
  webhookUrl?: string;
  webhookSecret: string;
  /** The address browsers reach the fake at, for session URLs; http://127.0.0.1:<port> by default. */
  publicUrl?: string;
  /** Accept only this secret key (any well-formed sk_test_… key otherwise). */
  secretKey?: string;
  apiVersion?: string;
  /** Pauses before each retry of a failed delivery; one attempt more than there are pauses. */
  retryDelaysMs?: number[];
  log?: (line: string) => void;
};

export type CardForm = { card_number?: string; expiry?: string; cvc?: string; email?: string; name?: string };

export async function startStripeFake(options: StripeFakeOptions) {
  const store = new Store();
  const apiVersion = options.apiVersion ?? FAKE_API_VERSION;
  const hub = new EventHub(store, {
    webhookUrl: options.webhookUrl,
    webhookSecret: options.webhookSecret,
    apiVersion,
    retryDelaysMs: options.retryDelaysMs ?? [250, 1000, 4000],
  });
  const payments = new Payments(store, hub);
  let publicUrl = "";
  const server = createFakeServer({
    store,
    apiVersion,
    secretKey: options.secretKey,
    log: options.log,
    apiRoutes: [
      ...customerRoutes(store),
      ...checkoutSessionRoutes(store, hub, payments, () => publicUrl),
      ...paymentIntentRoutes(store),
      ...refundRoutes(store, hub),
      ...eventRoutes(store),
    ],
    pageRoutes: checkoutPageRoutes(store, payments),
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, "127.0.0.1", () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://127.0.0.1:${port}`;
  publicUrl = (options.publicUrl ?? url).replace(/\/$/, "");
  // Sessions past their expires_at expire (with their events) even if nobody looks at them.
  const sweeper = setInterval(() => payments.expireOverdue(), 1000).unref();

  return {
    url,
    port,
    publicUrl,
    /** Every event made so far, oldest first (delivered or not). */
    events: hub.events,
    /** Every delivery attempt, retries and replays included. */
    deliveries: hub.deliveries,
    setWebhookUrl(webhookUrl: string | undefined) {
      hub.config.webhookUrl = webhookUrl;
    },
    /** Resolves when no webhook delivery or retry is under way. */
    settled: () => hub.settled(),
    /** Delivers again every event the webhook accepted: same id and payload, a fresh signature. */
    replayAll: () => hub.replayAll(),
    /** Puts back a payment made before this fake started, so it can still be refunded. */
    restorePaid: (paid: Parameters<Payments["restorePaid"]>[0]) => payments.restorePaid(paid),
    /** Submits the hosted payment form, as a payer's browser would; answers with the page's response. */
    pay(sessionId: string, form: CardForm = {}) {
      const fields = { card_number: "4242 4242 4242 4242", expiry: `12 / ${(new Date().getFullYear() + 3) % 100}`, cvc: "123", ...form };
      return fetch(`${url}/checkout/${sessionId}`, { method: "POST", body: new URLSearchParams(fields), redirect: "manual" });
    },
    async close() {
      clearInterval(sweeper);
      hub.close();
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
    },
  };
}

export type StripeFake = Awaited<ReturnType<typeof startStripeFake>>;
