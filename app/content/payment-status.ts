// Payment statuses in Tenderflow's own words, shown the same everywhere.
export const PAYMENT_STATUSES = ["pending", "paid", "failed", "expired", "refunded", "partially_refunded"] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

export const PAYMENT_STATUS_LABELS: Record<PaymentStatus, string> = {
  pending: "Awaiting card",
  paid: "Paid",
  failed: "Card declined",
  expired: "Lapsed",
  refunded: "Paid back",
  partially_refunded: "Partly paid back",
};

export const PAYMENT_STATUS_TONES: Record<PaymentStatus, "neutral" | "good" | "warn" | "bad"> = {
  pending: "neutral",
  paid: "good",
  failed: "bad",
  expired: "warn",
  refunded: "warn",
  partially_refunded: "warn",
};
