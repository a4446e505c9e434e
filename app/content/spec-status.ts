import { statusWords } from "./status-words";

// Spec statuses in Tenderflow's own words, shown the same everywhere.
const SPEC = statusWords({
  draft: ["Draft", "neutral"],
  open: ["Open for bids", "good"],
  closed: ["Bidding closed", "warn"],
  awarded: ["Awarded", "good"],
  withdrawn: ["Withdrawn", "bad"],
});

export const SPEC_STATUSES = SPEC.statuses;
export type SpecStatus = (typeof SPEC_STATUSES)[number];
export const SPEC_STATUS_LABELS = SPEC.labels;
export const SPEC_STATUS_TONES = SPEC.tones;

/**
 * The one rule of "taking bids": published (open) and its deadline still ahead. Shops bid and
 * ask questions exactly while it holds. Searches write the same rule as a WHERE clause
 * (status open, bid_deadline > now) in open-specs.server.ts.
 */
export function takesBids(spec: { status: string; bidDeadline: Date | string | null }, now = new Date()): boolean {
  return spec.status === "open" && spec.bidDeadline !== null && new Date(spec.bidDeadline) > now;
}

/** The status people see: an open spec whose deadline has passed reads as bidding closed. */
export function shownSpecStatus(status: SpecStatus, bidDeadline: Date | string | null, now = new Date()): SpecStatus {
  return status === "open" && bidDeadline && !takesBids({ status, bidDeadline }, now) ? "closed" : status;
}
