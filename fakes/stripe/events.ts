// Events: each change the app may need to hear about becomes a Stripe event object, kept for
// GET /v1/events and POSTed, signed, to the webhook URL. Deliveries run in the background,
// are retried with a growing pause, and never throw into the fake.
import { setTimeout as sleep } from "node:timers/promises";
import { signatureHeader } from "./signing";
import { newId, unixNow, type StripeObject, type Store } from "./store";

export type FakeEvent = StripeObject & {
  object: "event";
  type: string;
  api_version: string;
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
};

/** What caused an event: an API request (its id and idempotency key) or none (the payment page). */
export type EventCause = { id: string | null; idempotency_key: string | null };
export const NO_REQUEST: EventCause = { id: null, idempotency_key: null };

export type Delivery = {
  eventId: string;
  type: string;
  attempt: number;
  replay: boolean;
  status?: number;
  error?: string;
};

export type WebhookConfig = {
  webhookUrl?: string;
  webhookSecret: string;
  apiVersion: string;
  retryDelaysMs: number[];
};

export class EventHub {
  readonly events: FakeEvent[] = [];
  readonly deliveries: Delivery[] = [];
  private readonly payloads = new Map<string, string>();
  private readonly delivered = new Set<string>();
  private readonly inFlight = new Set<Promise<void>>();
  private readonly closing = new AbortController();

  constructor(
    private readonly store: Store,
    readonly config: WebhookConfig,
  ) {}

  emit(type: string, object: unknown, cause: EventCause, previousAttributes?: Record<string, unknown>) {
    const event: FakeEvent = this.store.add({
      id: newId("evt"),
      object: "event",
      api_version: this.config.apiVersion,
      created: unixNow(),
      data: { object: structuredClone(object), ...(previousAttributes && { previous_attributes: previousAttributes }) },
      livemode: false,
      pending_webhooks: this.config.webhookUrl ? 1 : 0,
      request: cause,
      type,
    });
    this.events.push(event);
    // The payload is fixed once, so a replay sends the very bytes of the first delivery.
    this.payloads.set(event.id, JSON.stringify(event, null, 2));
    this.send(event, false);
    return event;
  }

  /** Sends every event that reached the app once more, freshly signed, as Stripe may do. */
  async replayAll() {
    await this.settled();
    const from = this.deliveries.length;
    for (const event of this.events) if (this.delivered.has(event.id)) this.send(event, true);
    await this.settled();
    return this.deliveries.slice(from);
  }

  /** Resolves once no delivery (or retry) is under way. */
  async settled() {
    while (this.inFlight.size > 0) await Promise.all(this.inFlight);
  }

  close() {
    this.closing.abort();
  }

  private send(event: FakeEvent, replay: boolean) {
    if (!this.config.webhookUrl || this.closing.signal.aborted) return;
    const delivery = this.deliver(event, replay)
      .catch(() => {})
      .finally(() => this.inFlight.delete(delivery));
    this.inFlight.add(delivery);
  }

  private async deliver(event: FakeEvent, replay: boolean) {
    const payload = this.payloads.get(event.id)!;
    const delays = this.config.retryDelaysMs;
    for (let attempt = 1; attempt <= delays.length + 1; attempt++) {
      if (attempt > 1) await sleep(delays[attempt - 2], undefined, { signal: this.closing.signal });
      const record: Delivery = { eventId: event.id, type: event.type, attempt, replay };
      this.deliveries.push(record);
      try {
        const response = await fetch(this.config.webhookUrl!, {
          method: "POST",
          headers: {
            "Content-Type": "application/json; charset=utf-8",
            "Stripe-Signature": signatureHeader(payload, this.config.webhookSecret),
            "User-Agent": "TenderflowStripeFake/1.0 (webhooks)",
          },
          body: payload,
          signal: AbortSignal.any([AbortSignal.timeout(10_000), this.closing.signal]),
        });
        record.status = response.status;
        await response.arrayBuffer();
        if (response.ok) {
          this.delivered.add(event.id);
          event.pending_webhooks = 0;
          return;
        }
      } catch (error) {
        record.error = error instanceof Error ? ((error.cause as Error | undefined)?.message ?? error.message) : String(error);
      }
    }
  }
}
