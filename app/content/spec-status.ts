export const SPEC_STATUSES = ["draft", "open", "closed", "awarded", "withdrawn"] as const;
export type SpecStatus = (typeof SPEC_STATUSES)[number];

// Spec statuses in Tenderflow's own words, shown the same everywhere.
export const SPEC_STATUS_LABELS: Record<SpecStatus, string> = {
  draft: "Draft",
  open: "Open for bids",
  closed: "Bidding closed",
  awarded: "Awarded",
  withdrawn: "Withdrawn",
};

export const SPEC_STATUS_TONES: Record<SpecStatus, "neutral" | "good" | "warn" | "bad"> = {
  draft: "neutral",
  open: "good",
  closed: "warn",
  awarded: "good",
  withdrawn: "bad",
};

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
