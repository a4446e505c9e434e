import { statusWords } from "./status-words";

// Bid statuses in Tenderflow's own words, shown the same everywhere.
const BID = statusWords({
  draft: ["Being prepared", "neutral"],
  submitted: ["Offered", "good"],
  withdrawn: ["Taken back", "bad"],
  won: ["Chosen", "good"],
  not_selected: ["Not chosen", "warn"],
});

export const BID_STATUSES = BID.statuses;
export type BidStatus = (typeof BID_STATUSES)[number];
export const BID_STATUS_LABELS = BID.labels;
export const BID_STATUS_TONES = BID.tones;
