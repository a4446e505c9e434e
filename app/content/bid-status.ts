// Bid statuses in Tenderflow's own words, shown the same everywhere.
export const BID_STATUSES = ["draft", "submitted", "withdrawn", "won", "not_selected"] as const;
export type BidStatus = (typeof BID_STATUSES)[number];

export const BID_STATUS_LABELS: Record<BidStatus, string> = {
  draft: "Being prepared",
  submitted: "Offered",
  withdrawn: "Taken back",
  won: "Chosen",
  not_selected: "Not chosen",
};

export const BID_STATUS_TONES: Record<BidStatus, "neutral" | "good" | "warn" | "bad"> = {
  draft: "neutral",
  submitted: "good",
  withdrawn: "bad",
  won: "good",
  not_selected: "warn",
};
