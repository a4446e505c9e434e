// The hosted payment page a session's `url` opens: an order summary and a plain card form that
// works without JavaScript, so browser tests and `fetch` can pay through it alike. The design
// and wording are the fake's own.
import { StripeFakeError } from "./errors";
import type { Payments } from "./payments";
import type { LineItem, Product, Session } from "./resources/checkout-sessions";
import type { PageAnswer, PageRoute } from "./server";
import type { Store } from "./store";
import { readCard, TEST_CARD_HINTS } from "./test-cards";

type FormState = { email: string; emailFixed: boolean; name?: string; problems?: Record<string, string>; declined?: string };

export function checkoutPageRoutes(store: Store, payments: Payments): PageRoute[] {
  const withSession = (id: string, answer: (session: Session) => PageAnswer): PageAnswer => {
    try {
      return answer(payments.currentSession(id));
    } catch (error) {
      if (error instanceof StripeFakeError && error.status === 404) {
        return { status: 404, html: page("Payment not found", `<p>There is no payment at this address.</p>`) };
      }
      throw error;
    }
  };

  return [
    {
      method: "GET",
      pattern: "/checkout/:id",
      handle: ({ path }) =>
        withSession(path.id, (session) =>
          session.status === "open" ? paymentForm(store, session, emailState(payments, session)) : closed(session, 200),
        ),
    },
    {
      method: "POST",
      pattern: "/checkout/:id",
      handle: ({ path, form }) =>
        withSession(path.id, (session) => {
          if (session.status !== "open") return closed(session, 409);
          const field = (name: string) => form.get(name)?.trim() ?? "";
          const known = emailState(payments, session);
          const email = known.emailFixed ? known.email : field("email");
          const name = field("name");
          const state = { email, emailFixed: known.emailFixed, name };
          const read = readCard({ number: field("card_number"), expiry: field("expiry"), cvc: field("cvc") });
          const problems = "problems" in read ? { ...read.problems } : {};
          if (!/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email)) problems.email = "Enter the e-mail address for the receipt.";
          if (Object.keys(problems).length > 0 || !("card" in read)) {
            return paymentForm(store, session, { ...state, problems }, 400);
          }
          const outcome = payments.pay(session, read.card, { email, name: name || null });
          if (!outcome.paid) return paymentForm(store, session, { ...state, declined: outcome.message }, 402);
          if (session.success_url) return { redirect: successUrl(session) };
          return closed(session, 200);
        }),
    },
  ];
}

/** A session made with an e-mail (its own or its customer's) pays with that one. */
function emailState(payments: Payments, session: Session) {
  const known = payments.knownEmail(session);
  return { email: known ?? "", emailFixed: known !== null };
}

const successUrl = (session: Session) => session.success_url!.replaceAll("{CHECKOUT_SESSION_ID}", session.id);

function paymentForm(store: Store, session: Session, state: FormState, status = 200): PageAnswer {
  const expanded = store.expand(session, ["line_items.data.price.product"]) as { line_items: { data: LineItem[] } };
  const total = money(session.amount_total, session.currency);
  const problem = (name: string) =>
    state.problems?.[name] ? `<p class="problem" id="${name}-problem">${escape(state.problems[name])}</p>` : "";
  const input = (name: string, label: string, attributes: string, value = "") => `
    <label for="${name}">${label}</label>
    <input id="${name}" name="${name}" ${attributes} value="${escape(value)}"${state.problems?.[name] ? ` aria-invalid="true" aria-describedby="${name}-problem"` : ""}>
    ${problem(name)}`;
  const items = expanded.line_items.data.map((item) => {
    const product = item.price.product as unknown as Product;
    return `<tr><td><strong>${escape(item.description)}</strong>${product.description ? `<br><small>${escape(product.description)}</small>` : ""}
      ${item.quantity > 1 ? `<br><small>${item.quantity} × ${money(item.price.unit_amount, item.currency)}</small>` : ""}</td>
      <td class="amount">${money(item.amount_total, item.currency)}</td></tr>`;
  });
  const body = `
    ${state.declined ? `<div class="alert" role="alert"><strong>Payment declined.</strong> ${escape(state.declined)} No money was taken; you can try again with another card.</div>` : ""}
    <table class="summary">${items.join("")}
      <tr class="total"><td>Total due (${session.currency.toUpperCase()})</td><td class="amount" data-testid="total">${total}</td></tr>
    </table>
    <form method="post" action="/checkout/${session.id}" novalidate>
      ${input("email", "E-mail for the receipt", `type="email" autocomplete="email"${state.emailFixed ? " readonly" : ""}`, state.email)}
      ${input("name", "Name on the card", `autocomplete="cc-name"`, state.name ?? "")}
      ${input("card_number", "Card number", `inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242"`)}
      <div class="pair">
        <div>${input("expiry", "Expiry (MM / YY)", `autocomplete="cc-exp" placeholder="12 / 34"`)}</div>
        <div>${input("cvc", "Security code", `inputmode="numeric" autocomplete="cc-csc" placeholder="123"`)}</div>
      </div>
      <button type="submit">Pay ${total}</button>
    </form>
    ${session.cancel_url ? `<p class="cancel"><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : ""}
    <aside><strong>Test cards</strong> (any future expiry, any 3-digit code):
      <ul>${TEST_CARD_HINTS.map(([number, outcome]) => `<li><code>${number}</code> ${outcome}</li>`).join("")}</ul>
    </aside>`;
  return { status, html: page(`Pay ${total}`, body) };
}

function closed(session: Session, status: number): PageAnswer {
  if (session.status === "complete") {
    const onward = session.success_url ? `<p><a href="${escape(successUrl(session))}">Continue</a></p>` : "";
    return { status, html: page("Payment received", `<p>This payment of ${money(session.amount_total, session.currency)} is complete. Thank you.</p>${onward}`) };
  }
  const back = session.cancel_url ? `<p><a href="${escape(session.cancel_url)}">Go back</a></p>` : "";
  return { status, html: page("Payment link expired", `<p>This payment can no longer be made. Ask for a new payment link.</p>${back}`) };
}

/** An amount in minor units, shown with the currency's own number of decimals. */
function money(minor: number, currency: string) {
  const format = new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() });
  return format.format(minor / 10 ** (format.resolvedOptions().maximumFractionDigits ?? 2));
}

function escape(text: string) {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function page(title: string, body: string) {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)} · test payment</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; background: #eef2f0; color: #1d2b27; margin: 0; }
  main { max-width: 30rem; margin: 2rem auto; background: #fff; border-top: 6px solid #2f7d6d; padding: 1.5rem 2rem; }
  .mode { display: inline-block; background: #fff1c2; color: #6b4e00; font-size: .8rem; padding: .1rem .5rem; }
  h1 { font-size: 1.4rem; margin: .5rem 0 1rem; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1.5rem; }
  td { padding: .4rem 0; border-bottom: 1px solid #dfe7e4; vertical-align: top; }
  .amount { text-align: right; white-space: nowrap; } .total td { font-weight: 700; border-bottom: 0; }
  label { display: block; font-weight: 600; margin-top: .8rem; }
  input { width: 100%; box-sizing: border-box; padding: .5rem; font: inherit; border: 1px solid #9fb3ad; }
  input[aria-invalid] { border-color: #b3261e; } .problem { color: #b3261e; margin: .2rem 0 0; }
  .pair { display: flex; gap: 1rem; } .pair > div { flex: 1; }
  button { margin-top: 1.4rem; width: 100%; padding: .7rem; font: inherit; font-weight: 700; color: #fff; background: #2f7d6d; border: 0; cursor: pointer; }
  .alert { background: #fbe4e2; border-left: 4px solid #b3261e; padding: .6rem .8rem; margin-bottom: 1rem; }
  .cancel { text-align: center; } aside { margin-top: 1.5rem; font-size: .85rem; color: #4b5d58; }
</style></head>
<body><main><span class="mode">Test mode: no real money moves</span><h1>${escape(title)}</h1>${body}</main></body></html>`;
}
