import { statusWords } from "./status-words";

// Payment statuses in Tenderflow's own words, shown the same everywhere.
const PAYMENT = statusWords({
  pending: ["Awaiting card", "neutral"],
  paid: ["Paid", "good"],
  failed: ["Card declined", "bad"],
  expired: ["Lapsed", "warn"],
  refunded: ["Paid back", "warn"],
  partially_refunded: ["Partly paid back", "warn"],
});

export const PAYMENT_STATUSES = PAYMENT.statuses;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];
export const PAYMENT_STATUS_LABELS = PAYMENT.labels;
export const PAYMENT_STATUS_TONES = PAYMENT.tones;
