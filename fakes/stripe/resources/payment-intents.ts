// PaymentIntents, the charges made for them and the card payment methods used: built here,
// changed by payments.ts, read (never written) through the API.
import type Stripe from "stripe";
import type { Metadata, ParamReader } from "../params";
import type { ApiRoute } from "../server";
import { newId, unixNow, type Store } from "../store";
import type { TestCard } from "../test-cards";

export function newPaymentIntent(fields: {
  amount: number;
  currency: string;
  customer: string | null;
  description: string | null;
  metadata: Metadata;
  receiptEmail: string | null;
}) {
  const id = newId("pi");
  return {
    id,
    object: "payment_intent" as const,
    amount: fields.amount,
    amount_capturable: 0,
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: null,
    canceled_at: null as number | null,
    cancellation_reason: null as "abandoned" | null,
    capture_method: "automatic_async" as const,
    client_secret: `${id}_secret_${newId("s").slice(2)}`,
    confirmation_method: "automatic" as const,
    created: unixNow(),
    currency: fields.currency,
    customer: fields.customer,
    description: fields.description,
    last_payment_error: null as null | Stripe.PaymentIntent.LastPaymentError,
    latest_charge: null as string | null,
    livemode: false,
    metadata: fields.metadata,
    next_action: null,
    on_behalf_of: null,
    payment_method: null as string | null,
    payment_method_types: ["card"],
    processing: null,
    receipt_email: fields.receiptEmail,
    review: null,
    setup_future_usage: null,
    shipping: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: "requires_payment_method" as "requires_payment_method" | "succeeded" | "canceled",
    transfer_data: null,
    transfer_group: null,
  } satisfies Partial<Stripe.PaymentIntent>;
}
export type PaymentIntent = ReturnType<typeof newPaymentIntent>;

export type CardHolder = { email: string | null; name: string | null };

export function newPaymentMethod(card: TestCard, holder: CardHolder, customer: string | null) {
  return {
    id: newId("pm"),
    object: "payment_method" as const,
    billing_details: { address: null, email: holder.email, name: holder.name, phone: null, tax_id: null },
    card: {
      ...cardDetails(card),
      checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: "pass" },
      display_brand: card.brand,
      generated_from: null,
      networks: { available: [card.brand], preferred: null },
      regulated_status: "unregulated" as const,
      three_d_secure_usage: { supported: true },
      wallet: null,
    },
    created: unixNow(),
    customer,
    customer_account: null,
    livemode: false,
    metadata: {},
    type: "card" as const,
  } satisfies Partial<Stripe.PaymentMethod>;
}
export type PaymentMethod = ReturnType<typeof newPaymentMethod>;

export function newCharge(intent: PaymentIntent, method: PaymentMethod, card: TestCard) {
  const paid = !card.decline;
  return {
    id: newId("ch"),
    object: "charge" as const,
    amount: intent.amount,
    amount_captured: paid ? intent.amount : 0,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    balance_transaction: null,
    billing_details: method.billing_details,
    calculated_statement_descriptor: "TENDERFLOW TEST",
    captured: paid,
    created: unixNow(),
    currency: intent.currency,
    customer: intent.customer,
    description: intent.description,
    disputed: false,
    failure_code: paid ? null : "card_declined",
    failure_message: paid ? null : card.declineMessage!,
    fraud_details: {},
    livemode: false,
    metadata: { ...intent.metadata },
    outcome: paid
      ? { network_status: "approved_by_network", reason: null, risk_level: "normal", seller_message: "Payment complete.", type: "authorized" }
      : {
          network_status: "declined_by_network",
          reason: card.decline!,
          risk_level: "normal",
          seller_message: "The issuing bank declined the payment.",
          type: "issuer_declined",
        },
    paid,
    payment_intent: intent.id,
    payment_method: method.id,
    payment_method_details: { type: "card", card: cardDetails(card) },
    receipt_email: intent.receipt_email,
    receipt_url: null,
    refunded: false,
    status: paid ? ("succeeded" as const) : ("failed" as const),
  };
}
export type Charge = ReturnType<typeof newCharge>;

function cardDetails(card: TestCard) {
  return { brand: card.brand, country: "US", exp_month: card.expMonth, exp_year: card.expYear, funding: card.funding, last4: card.number.slice(-4) };
}

const LIST = ["limit", "starting_after", "ending_before", "created"];

export function paymentIntentRoutes(store: Store): ApiRoute[] {
  const byField = (params: ParamReader, field: string) => {
    const wanted = params.text(field);
    return (item: Record<string, unknown>) => wanted === undefined || item[field] === wanted;
  };
  return [
    { method: "GET", pattern: "/v1/payment_intents/:id", handle: ({ path }) => store.get("payment_intent", path.id) },
    {
      method: "GET",
      pattern: "/v1/payment_intents",
      handle: ({ params }) =>
        store.list<PaymentIntent>("payment_intent", "/v1/payment_intents", params.allowOnly([...LIST, "customer"]), byField(params, "customer")),
    },
    { method: "GET", pattern: "/v1/charges/:id", handle: ({ path }) => store.get("charge", path.id) },
    {
      method: "GET",
      pattern: "/v1/charges",
      handle: ({ params }) => {
        params.allowOnly([...LIST, "customer", "payment_intent"]);
        const [customer, intent] = [byField(params, "customer"), byField(params, "payment_intent")];
        return store.list<Charge>("charge", "/v1/charges", params, (c) => customer(c) && intent(c));
      },
    },
    { method: "GET", pattern: "/v1/payment_methods/:id", handle: ({ path }) => store.get("payment_method", path.id) },
  ];
}
