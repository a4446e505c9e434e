// The card numbers the payment page accepts, and the checks on what a payer types. Only these
// numbers do anything: an unknown but well-formed number is refused, so a test never "pays"
// with a card whose outcome nobody chose.
export type TestCard = {
  number: string;
  brand: "visa" | "mastercard";
  funding: "credit" | "debit";
  expMonth: number;
  expYear: number;
  decline?: "generic_decline" | "insufficient_funds";
  declineMessage?: string;
};

const CARDS: Record<string, Omit<TestCard, "number" | "expMonth" | "expYear">> = {
  "4242424242424242": { brand: "visa", funding: "credit" },
  "5555555555554444": { brand: "mastercard", funding: "credit" },
  "4000000000000002": { brand: "visa", funding: "credit", decline: "generic_decline", declineMessage: "Your card was declined." },
  "4000000000009995": { brand: "visa", funding: "debit", decline: "insufficient_funds", declineMessage: "Your card has insufficient funds." },
};

export const TEST_CARD_HINTS = [
  ["4242 4242 4242 4242", "paid"],
  ["4000 0000 0000 0002", "declined"],
  ["4000 0000 0000 9995", "declined: insufficient funds"],
] as const;

export type CardEntry = { number: string; expiry: string; cvc: string };

/** The card a payer typed, or the problems to show beside the fields. */
export function readCard(entry: CardEntry, today = new Date()): { card: TestCard } | { problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const number = entry.number.replace(/[\s-]/g, "");
  const known = CARDS[number];
  if (!/^\d{12,19}$/.test(number) || !passesLuhn(number)) problems.card_number = "That card number is not valid.";
  else if (!known) problems.card_number = "This page takes test cards only: use one of the numbers listed below.";

  const expiry = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(entry.expiry);
  const month = expiry ? Number(expiry[1]) : 0;
  const year = expiry ? (expiry[2].length === 2 ? 2000 + Number(expiry[2]) : Number(expiry[2])) : 0;
  if (!expiry || month < 1 || month > 12) problems.expiry = "Write the expiry date as MM / YY.";
  else if (year * 12 + month < today.getFullYear() * 12 + today.getMonth() + 1) problems.expiry = "This card has expired.";

  if (!/^\d{3}$/.test(entry.cvc.trim())) problems.cvc = "The security code is the 3 digits on the back of the card.";

  if (Object.keys(problems).length > 0 || !known) return { problems };
  return { card: { ...known, number, expMonth: month, expYear: year } };
}

function passesLuhn(digits: string) {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let digit = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) digit = digit * 2 > 9 ? digit * 2 - 9 : digit * 2;
    sum += digit;
  }
  return sum % 10 === 0;
}
