// What happens to a Checkout Session after it is created: a payer's card is tried (paid or
// declined, with the charge, PaymentIntent and events Stripe would produce), or the session
// expires, by request or when its expires_at passes.
import { NO_REQUEST, type EventCause, type EventHub } from "./events";
import type { Customer } from "./resources/customers";
import type { Session } from "./resources/checkout-sessions";
import { newCharge, newPaymentIntent, newPaymentMethod, type CardHolder, type PaymentIntent } from "./resources/payment-intents";
import { unixNow, update, type Store } from "./store";
import type { TestCard } from "./test-cards";

export type PaymentOutcome = { paid: true; session: Session } | { paid: false; session: Session; message: string };

export class Payments {
  constructor(
    private readonly store: Store,
    private readonly events: EventHub,
  ) {}

  /** A session as it stands now: one past its expires_at is expired first. */
  currentSession(id: string) {
    const session = this.store.get<Session>("checkout.session", id);
    if (session.status === "open" && unixNow() >= session.expires_at) this.expire(session, NO_REQUEST);
    return session;
  }

  expireOverdue() {
    for (const session of this.store.all<Session>("checkout.session")) this.currentSession(session.id);
  }

  /** The e-mail the page starts with: the one the session was made with, or its customer's. */
  knownEmail(session: Session) {
    if (session.customer_email) return session.customer_email;
    return session.customer ? this.store.get<Customer>("customer", session.customer).email : null;
  }

  expire(session: Session, cause: EventCause) {
    const intent = this.store.get<PaymentIntent>("payment_intent", session.payment_intent);
    update(session, { status: "expired", url: null });
    update(intent, { status: "canceled", canceled_at: unixNow(), cancellation_reason: "abandoned" });
    this.events.emit("payment_intent.canceled", intent, cause);
    this.events.emit("checkout.session.expired", session, cause);
    return session;
  }

  /**
   * Puts back a payment made before this fake started (it keeps everything in memory): a
   * succeeded PaymentIntent with its charge, under the ids the app stored, so refunds of it work.
   */
  restorePaid(paid: {
    paymentIntentId: string;
    amount: number;
    amountRefunded: number;
    currency: string;
    customer: string | null;
    metadata: Record<string, string>;
  }) {
    if (this.store.find(paid.paymentIntentId)) return;
    const intent = {
      ...newPaymentIntent({
        amount: paid.amount,
        currency: paid.currency.toLowerCase(),
        customer: paid.customer,
        description: null,
        metadata: paid.metadata,
        receiptEmail: null,
      }),
      id: paid.paymentIntentId,
    };
    const card = { number: "4242424242424242", brand: "visa" as const, funding: "credit" as const, expMonth: 12, expYear: new Date().getFullYear() + 3 };
    const method = this.store.add(newPaymentMethod(card, { email: null, name: null }, paid.customer));
    const charge = this.store.add({ ...newCharge(intent, method, card), amount_refunded: paid.amountRefunded, refunded: paid.amountRefunded >= paid.amount });
    this.store.add(intent);
    update(intent, { status: "succeeded", amount_received: paid.amount, payment_method: method.id, latest_charge: charge.id });
  }

  /** Tries a test card on an open session, as the payment page does when the payer submits. */
  pay(session: Session, card: TestCard, holder: CardHolder): PaymentOutcome {
    const intent = this.store.get<PaymentIntent>("payment_intent", session.payment_intent);
    const method = this.store.add(newPaymentMethod(card, holder, session.customer));
    const charge = this.store.add(newCharge(intent, method, card));
    intent.latest_charge = charge.id;

    if (card.decline) {
      update(intent, {
        status: "requires_payment_method",
        payment_method: null,
        last_payment_error: {
          type: "card_error",
          code: "card_declined",
          decline_code: card.decline,
          message: card.declineMessage,
          charge: charge.id,
          doc_url: "https://stripe.com/docs/error-codes/card-declined",
          payment_method: structuredClone(method),
        },
      });
      this.events.emit("charge.failed", charge, NO_REQUEST);
      this.events.emit("payment_intent.payment_failed", intent, NO_REQUEST);
      return { paid: false, session, message: card.declineMessage! };
    }

    update(intent, {
      status: "succeeded",
      amount_received: intent.amount,
      payment_method: method.id,
      last_payment_error: null,
    });
    update(session, {
      status: "complete",
      payment_status: "paid",
      url: null,
      customer_details: {
        address: null,
        business_name: null,
        email: holder.email,
        individual_name: null,
        name: holder.name,
        phone: null,
        tax_exempt: "none",
        tax_ids: [],
      },
    });
    this.events.emit("charge.succeeded", charge, NO_REQUEST);
    this.events.emit("payment_intent.succeeded", intent, NO_REQUEST);
    this.events.emit("checkout.session.completed", session, NO_REQUEST);
    return { paid: true, session };
  }
}
