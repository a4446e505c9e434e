// Customers: create, retrieve, update and list (with Stripe's exact `email` filter).
import type Stripe from "stripe";
import { mergeMetadata, type ParamReader } from "../params";
import type { ApiRoute } from "../server";
import { newId, unixNow, type Store } from "../store";

const EDITABLE = ["email", "name", "description", "phone", "metadata"];

export function newCustomer(params: ParamReader) {
  return {
    id: newId("cus"),
    object: "customer" as const,
    address: null,
    balance: 0,
    created: unixNow(),
    currency: null,
    default_source: null,
    delinquent: false,
    description: params.text("description") ?? null,
    discount: null,
    email: params.text("email") ?? null,
    invoice_prefix: newId("x").slice(2, 10).toUpperCase(),
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: mergeMetadata({}, params.metadata()),
    name: params.text("name") ?? null,
    phone: params.text("phone") ?? null,
    preferred_locales: [] as string[],
    shipping: null,
    tax_exempt: "none" as const,
    test_clock: null,
  } satisfies Stripe.Customer;
}
export type Customer = ReturnType<typeof newCustomer>;

export function customerRoutes(store: Store): ApiRoute[] {
  return [
    {
      method: "POST",
      pattern: "/v1/customers",
      handle: ({ params }) => store.add(newCustomer(params.allowOnly(EDITABLE))),
    },
    {
      method: "GET",
      pattern: "/v1/customers/:id",
      handle: ({ path }) => store.get<Customer>("customer", path.id),
    },
    {
      method: "POST",
      pattern: "/v1/customers/:id",
      handle: ({ path, params }) => {
        const customer = store.get<Customer>("customer", path.id);
        params.allowOnly(EDITABLE);
        for (const field of ["email", "name", "description", "phone"] as const) {
          // An empty string clears a field in Stripe's form encoding.
          if (params.has(field)) customer[field] = params.text(field) || null;
        }
        customer.metadata = mergeMetadata(customer.metadata, params.metadata());
        return customer;
      },
    },
    {
      method: "GET",
      pattern: "/v1/customers",
      handle: ({ params }) => {
        const email = params.allowOnly(["email", "limit", "starting_after", "ending_before", "created"]).text("email");
        return store.list<Customer>("customer", "/v1/customers", params, (c) => email === undefined || c.email === email);
      },
    },
  ];
}
