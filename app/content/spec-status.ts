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

/** The status people see: an open spec whose deadline has passed reads as bidding closed. */
export function shownSpecStatus(status: SpecStatus, bidDeadline: Date | string | null, now = new Date()): SpecStatus {
  return status === "open" && bidDeadline && new Date(bidDeadline) <= now ? "closed" : status;
}
