import { statusWords } from "./status-words";

// Where a shop organisation stands with the operator, in Tenderflow's own words.
const APPROVAL = statusWords({ pending: ["Waiting for approval", "warn"], approved: ["Approved", "good"], refused: ["Refused", "bad"] });

export const APPROVALS = APPROVAL.statuses;
export type Approval = (typeof APPROVALS)[number];
export const APPROVAL_LABELS = APPROVAL.labels;
export const APPROVAL_TONES = APPROVAL.tones;

/** The longest reason an admin can give for a refusal (the shop reads it in a mail and on its home). */
export const REFUSAL_REASON_MAX = 1000;
