// Where a shop organisation stands with the operator, in Tenderflow's own words.
export const APPROVALS = ["pending", "approved", "refused"] as const;
export type Approval = (typeof APPROVALS)[number];

export const APPROVAL_LABELS: Record<Approval, string> = {
  pending: "Waiting for approval",
  approved: "Approved",
  refused: "Refused",
};

export const APPROVAL_TONES: Record<Approval, "neutral" | "good" | "warn" | "bad"> = {
  pending: "warn",
  approved: "good",
  refused: "bad",
};

/** The longest reason an admin can give for a refusal (the shop reads it in a mail and on its home). */
export const REFUSAL_REASON_MAX = 1000;
