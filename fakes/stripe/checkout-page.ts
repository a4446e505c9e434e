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
        withSession(path.id, (session) => (session.status === "open" ? paymentForm(store, session, emailState(payments, session)) : closed(session, 200))),
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
  const problem = (name: string) => (state.problems?.[name] ? `<p class="problem" id="${name}-problem">${escape(state.problems[name])}</p>` : "");
  const input = (name: string, label: string, attributes: string, value = "") => `
    <label for="${name}">${label}</label>
    <input id="${name}" name="${name}" ${attributes} value="${escape(value)}"${state.problems?.[name] ? ` aria-invalid="true" aria-describedby="${name}-problem"` : ""}>
    ${problem(name)}`;
  const items = expanded.line_items.data.map((item) => {
    const product = item.price.product as unknown as Product;
    return `<li><span class="what">${escape(item.description)}${product.description ? `<small>${escape(product.description)}</small>` : ""}
      ${item.quantity > 1 ? `<small>${item.quantity} × ${money(item.price.unit_amount, item.currency)}</small>` : ""}</span>
      <span class="amount">${money(item.amount_total, item.currency)}</span></li>`;
  });
  const body = `
    ${state.declined ? `<div class="alert" role="alert"><strong>Payment declined.</strong> ${escape(state.declined)} No money was taken; you can try again with another card.</div>` : ""}
    <div class="desk">
    <section class="slip" aria-label="What this payment is for">
      <p class="slip-head">Payment slip · ${session.currency.toUpperCase()}</p>
      <ul>${items.join("")}</ul>
      <p class="slip-total"><span>To pay</span><span class="amount" data-testid="total">${total}</span></p>
    </section>
    <form method="post" action="/checkout/${session.id}" novalidate>
      ${input("email", "E-mail for the receipt", `type="email" autocomplete="email"${state.emailFixed ? " readonly" : ""}`, state.email)}
      ${input("name", "Name on the card", `autocomplete="cc-name"`, state.name ?? "")}
      ${input("card_number", "Card number", `inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242"`)}
      <div class="pair">
        <div>${input("expiry", "Expiry (MM / YY)", `autocomplete="cc-exp" placeholder="12 / 34"`)}</div>
        <div>${input("cvc", "Security code", `inputmode="numeric" autocomplete="cc-csc" placeholder="123"`)}</div>
      </div>
      <button type="submit">Pay ${total}</button>
      ${session.cancel_url ? `<p class="cancel"><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : ""}
    </form>
    </div>
    <aside aria-label="Test cards"><strong>Test cards</strong>: any future expiry, any 3-digit code.
      <dl>${TEST_CARD_HINTS.map(([number, outcome]) => `<div><dt><code>${number}</code></dt><dd class="${outcome === "paid" ? "ok" : "no"}">${outcome}</dd></div>`).join("")}</dl>
    </aside>`;
  return { status, html: page(`Pay ${total}`, body) };
}

function closed(session: Session, status: number): PageAnswer {
  if (session.status === "complete") {
    const onward = session.success_url ? `<p><a href="${escape(successUrl(session))}">Continue</a></p>` : "";
    return {
      status,
      html: page("Payment received", `<p>This payment of ${money(session.amount_total, session.currency)} is complete. Thank you.</p>${onward}`),
    };
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
  body { font: 16px/1.5 system-ui, sans-serif; background: #f4f1ea; color: #22262b; margin: 0; }
  .till { background: repeating-linear-gradient(135deg, #f2c230 0 14px, #22262b 14px 28px); padding: .35rem; }
  .till p { margin: 0 auto; max-width: 52rem; background: #22262b; color: #f2c230; font: 600 .8rem/1.6 ui-monospace, monospace; letter-spacing: .08em; text-transform: uppercase; padding: .2rem .8rem; }
  main { max-width: 52rem; margin: 1.5rem auto; padding: 0 1rem; }
  h1 { font-size: 1.35rem; margin: 0 0 1rem; }
  .desk { display: grid; gap: 1.5rem; grid-template-columns: 1fr; }
  @media (min-width: 44rem) { .desk { grid-template-columns: 18rem 1fr; align-items: start; } }
  .slip { background: #fffdf7; border: 2px dashed #b9ad92; padding: 1rem 1.1rem; font-family: ui-monospace, monospace; font-size: .9rem; }
  .slip-head { margin: 0 0 .6rem; color: #6d6350; font-size: .75rem; text-transform: uppercase; letter-spacing: .06em; }
  .slip ul { list-style: none; margin: 0; padding: 0; }
  .slip li { display: flex; justify-content: space-between; gap: .8rem; padding: .45rem 0; border-bottom: 1px dotted #cfc5ae; }
  .slip small { display: block; color: #6d6350; }
  .slip-total { display: flex; justify-content: space-between; margin: .7rem 0 0; font-weight: 700; font-size: 1.05rem; }
  .amount { white-space: nowrap; text-align: right; }
  form { background: #fff; border-radius: .5rem; box-shadow: 0 1px 3px rgba(0,0,0,.12); padding: 1.1rem 1.3rem 1.3rem; }
  label { display: block; font-weight: 600; font-size: .9rem; margin-top: .8rem; }
  label:first-child { margin-top: 0; }
  input { width: 100%; box-sizing: border-box; padding: .5rem .6rem; font: inherit; border: 1px solid #a9a395; border-radius: .35rem; background: #fdfcf9; }
  input[aria-invalid] { border-color: #a4262c; } .problem { color: #a4262c; font-size: .9rem; margin: .2rem 0 0; }
  .pair { display: flex; gap: 1rem; } .pair > div { flex: 1; }
  button { margin-top: 1.2rem; width: 100%; padding: .65rem; font: inherit; font-weight: 700; color: #22262b; background: #f2c230; border: 2px solid #22262b; border-radius: .35rem; cursor: pointer; }
  .alert { background: #fbe6e4; border: 2px solid #a4262c; border-radius: .35rem; padding: .6rem .8rem; margin-bottom: 1rem; }
  .cancel { text-align: center; margin: .8rem 0 0; font-size: .9rem; }
  aside { margin-top: 1.5rem; font-size: .85rem; color: #4a4f55; }
  aside dl { display: grid; gap: .3rem; margin: .5rem 0 0; }
  aside dl div { display: flex; gap: .8rem; align-items: baseline; } aside dd { margin: 0; font-weight: 600; }
  aside dd.ok { color: #2d6a3e; } aside dd.no { color: #a4262c; }
</style></head>
<body><div class="till"><p>Test till · Tenderflow's local stand-in for the card service · no real money moves</p></div>
<main><h1>${escape(title)}</h1>${body}</main></body></html>`;
}
