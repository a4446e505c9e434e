// Checkout Sessions in payment mode: created with their line items and PaymentIntent, read,
// listed and expired. Paying one happens on the hosted page (checkout-page.ts).
import type Stripe from "stripe";
import { invalid, invalidParam, missingParam } from "../errors";
import type { EventHub } from "../events";
import { mergeMetadata, type ParamReader } from "../params";
import type { Payments } from "../payments";
import type { ApiRoute } from "../server";
import { newId, unixNow, type Store } from "../store";
import type { Customer } from "./customers";
import { newPaymentIntent } from "./payment-intents";

const CREATE = [
  "mode",
  "line_items",
  "customer",
  "customer_email",
  "success_url",
  "cancel_url",
  "metadata",
  "payment_intent_data",
  "client_reference_id",
  "expires_at",
  "payment_method_types",
];
const MINUTE = 60;

export type Product = ReturnType<typeof newProduct>;
function newProduct(data: ParamReader) {
  data.allowOnly(["name", "description", "metadata"]);
  return {
    id: newId("prod"),
    object: "product" as const,
    active: true,
    created: unixNow(),
    description: data.text("description") ?? null,
    images: [] as string[],
    livemode: false,
    metadata: mergeMetadata({}, data.metadata()),
    name: data.requiredText("name"),
    updated: unixNow(),
    url: null,
  } satisfies Partial<Stripe.Product>;
}

function newLineItem(item: ParamReader) {
  item.allowOnly(["price_data", "quantity", "price"]);
  if (item.has("price")) throw invalid("The Stripe fake takes line items with price_data only.", { param: "line_items" });
  const priceData = item.child("price_data");
  if (!priceData) throw missingParam(`${item.prefix}[price_data]`);
  priceData.allowOnly(["currency", "unit_amount", "product_data"]);
  const currency = priceData.requiredText("currency").toLowerCase();
  const unitAmount = priceData.integer("unit_amount", { min: 0 });
  if (unitAmount === undefined) throw missingParam(`${priceData.prefix}[unit_amount]`);
  const productData = priceData.child("product_data");
  if (!productData) throw missingParam(`${priceData.prefix}[product_data]`);
  const product = newProduct(productData);
  const quantity = item.integer("quantity", { min: 1 });
  if (quantity === undefined) throw missingParam(`${item.prefix}[quantity]`);
  const lineItem = {
    id: newId("li"),
    object: "item" as const,
    amount_discount: 0,
    amount_subtotal: unitAmount * quantity,
    amount_tax: 0,
    amount_total: unitAmount * quantity,
    currency,
    description: product.name,
    quantity,
    price: {
      id: newId("price"),
      object: "price" as const,
      active: false,
      billing_scheme: "per_unit" as const,
      created: unixNow(),
      currency,
      livemode: false,
      lookup_key: null,
      metadata: {},
      nickname: null,
      product: product.id,
      recurring: null,
      type: "one_time" as const,
      unit_amount: unitAmount,
      unit_amount_decimal: String(unitAmount),
    },
  };
  return { lineItem, product };
}
export type LineItem = ReturnType<typeof newLineItem>["lineItem"];

export function newSession(params: ParamReader, store: Store, publicUrl: string) {
  params.allowOnly(CREATE);
  const mode = params.requiredText("mode");
  if (mode !== "payment") throw invalidParam("mode", "The Stripe fake supports mode=payment only.");
  const lineItems = params.list("line_items");
  if (!lineItems?.length) throw missingParam("line_items");
  const built = lineItems.map(newLineItem);
  const items = built.map(({ lineItem }) => lineItem);
  const currency = items[0].currency;
  if (items.some((item) => item.currency !== currency)) {
    throw invalidParam("line_items", "All line items of a Checkout Session must have the same currency.");
  }

  const customerId = params.text("customer");
  const customerEmail = params.text("customer_email");
  if (customerId && customerEmail) {
    throw invalid("You may only specify one of these parameters: customer, customer_email.", { param: "customer_email" });
  }
  const customer = customerId ? store.get<Customer>("customer", customerId, "customer") : undefined;
  if (customerEmail !== undefined && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(customerEmail)) {
    throw invalidParam("customer_email", `Invalid email address: ${customerEmail}`, "email_invalid");
  }
  const successUrl = readUrl(params, "success_url");
  const cancelUrl = readUrl(params, "cancel_url");
  const now = unixNow();
  const expiresAt = params.integer("expires_at") ?? now + 24 * 60 * MINUTE;
  // A few seconds of grace, for the time a request takes to arrive.
  if (expiresAt < now + 30 * MINUTE - 10 || expiresAt > now + 24 * 60 * MINUTE) {
    throw invalidParam("expires_at", "expires_at must be between 30 minutes and 24 hours from now.", "parameter_invalid_integer");
  }
  const methods = params.values.payment_method_types;
  if (methods !== undefined && JSON.stringify(methods) !== '["card"]') {
    throw invalidParam("payment_method_types", "The Stripe fake takes card payments only.");
  }

  const intentData = params.child("payment_intent_data")?.allowOnly(["metadata", "description", "receipt_email"]);
  const intentFields = {
    amount: items.reduce((sum, item) => sum + item.amount_total, 0),
    currency,
    customer: customer?.id ?? null,
    description: intentData?.text("description") ?? null,
    metadata: mergeMetadata({}, intentData?.metadata()),
    receiptEmail: intentData?.text("receipt_email") ?? null,
  };
  const metadata = mergeMetadata({}, params.metadata());
  const clientReferenceId = params.text("client_reference_id") ?? null;

  // Everything is valid: only now is anything stored.
  for (const { product } of built) store.add(product);
  const intent = store.add(newPaymentIntent(intentFields));
  const amount = intent.amount;
  const id = newId("cs_test");
  const session = {
    id,
    object: "checkout.session" as const,
    after_expiration: null,
    allow_promotion_codes: null,
    amount_subtotal: amount,
    amount_total: amount,
    billing_address_collection: null,
    cancel_url: cancelUrl ?? null,
    client_reference_id: clientReferenceId,
    client_secret: null,
    created: now,
    currency,
    customer: customer?.id ?? null,
    customer_creation: customer ? null : ("if_required" as const),
    customer_details: null as null | Stripe.Checkout.Session.CustomerDetails,
    customer_email: customerEmail ?? null,
    expires_at: expiresAt,
    invoice: null,
    livemode: false,
    locale: null,
    metadata,
    mode: "payment" as const,
    payment_intent: intent.id,
    payment_link: null,
    payment_method_types: ["card"],
    payment_status: "unpaid" as "unpaid" | "paid",
    recovered_from: null,
    setup_intent: null,
    status: "open" as "open" | "complete" | "expired",
    submit_type: null,
    subscription: null,
    success_url: successUrl ?? null,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: "hosted" as const,
    url: `${publicUrl}/checkout/${id}` as string | null,
  } satisfies Partial<Stripe.Checkout.Session>;
  return { session: store.add(session), intent, items };
}
export type Session = ReturnType<typeof newSession>["session"];

function readUrl(params: ParamReader, name: string) {
  const value = params.text(name);
  if (value === undefined) return undefined;
  // Stripe substitutes the {CHECKOUT_SESSION_ID} placeholder, which is not valid in a URL as is.
  if (!URL.canParse(value.replace("{CHECKOUT_SESSION_ID}", "cs"))) throw invalidParam(name, "Not a valid URL", "url_invalid");
  return value;
}

export function checkoutSessionRoutes(store: Store, events: EventHub, payments: Payments, publicUrl: () => string): ApiRoute[] {
  const lineItems = new Map<string, LineItem[]>();
  const lineItemList = (sessionId: string, query?: ParamReader) => {
    const items = lineItems.get(sessionId) ?? [];
    const limit = query?.integer("limit", { min: 1, max: 100 }) ?? 10;
    return { object: "list" as const, data: items.slice(0, limit), has_more: items.length > limit, url: `/v1/checkout/sessions/${sessionId}/line_items` };
  };
  store.defineVirtualField("checkout.session", "line_items", (session) => lineItemList(session.id));

  return [
    {
      method: "POST",
      pattern: "/v1/checkout/sessions",
      handle: ({ params, cause }) => {
        const { session, intent, items } = newSession(params, store, publicUrl());
        lineItems.set(session.id, items);
        events.emit("payment_intent.created", intent, cause);
        return session;
      },
    },
    {
      method: "GET",
      pattern: "/v1/checkout/sessions/:id",
      handle: ({ path }) => payments.currentSession(path.id),
    },
    {
      method: "GET",
      pattern: "/v1/checkout/sessions",
      handle: ({ params }) => {
        params.allowOnly(["limit", "starting_after", "ending_before", "created", "customer", "payment_intent", "status"]);
        payments.expireOverdue();
        const wanted = ["customer", "payment_intent", "status"].map((field) => [field, params.text(field)] as const);
        return store.list<Session>("checkout.session", "/v1/checkout/sessions", params, (session) =>
          wanted.every(([field, value]) => value === undefined || session[field as keyof Session] === value),
        );
      },
    },
    {
      method: "GET",
      pattern: "/v1/checkout/sessions/:id/line_items",
      handle: ({ path, params }) => {
        store.get("checkout.session", path.id);
        return lineItemList(path.id, params.allowOnly(["limit"]));
      },
    },
    {
      method: "POST",
      pattern: "/v1/checkout/sessions/:id/expire",
      handle: ({ path, params, cause }) => {
        params.allowOnly([]);
        const session = payments.currentSession(path.id);
        if (session.status !== "open") {
          throw invalid(`This Checkout Session is ${session.status}; only an open session can be expired.`);
        }
        return payments.expire(session, cause);
      },
    },
    { method: "GET", pattern: "/v1/products/:id", handle: ({ path }) => store.get("product", path.id) },
  ];
}
