import { Badge, ButtonLink } from "./ui";
import { BID_STATUS_LABELS, BID_STATUS_TONES, type BidStatus } from "~/content/bid-status";
import { formatMoney } from "~/content/money";
import type { SpecStatus } from "~/content/spec-status";

// The spec page's bidding strip: a shop's own bid, or the buyer's count of offers.
export function BidPanel({
  specId,
  canBid,
  accepting,
  specStatus,
  currency,
  ownBid,
  offers,
  latestRevision,
}: {
  specId: string;
  /** The reader is a shop that may bid on this spec (the access policy's answer). */
  canBid: boolean;
  accepting: boolean;
  specStatus: SpecStatus;
  currency: string;
  ownBid: { status: BidStatus; totalCents: number; version: number; specRevision: number } | null;
  offers: number | null;
  latestRevision: number;
}) {
  if (canBid) {
    return (
      <section aria-label="Your bid" className="mb-6 flex flex-wrap items-center gap-3 rounded-lg bg-white p-4 ring-1 ring-ink-200">
        <h2 className="font-semibold">Your bid</h2>
        {ownBid ? (
          <>
            <Badge tone={BID_STATUS_TONES[ownBid.status]}>{BID_STATUS_LABELS[ownBid.status]}</Badge>
            {ownBid.version > 0 ? (
              <span className="tabular-nums">
                {formatMoney(ownBid.totalCents, currency)} (offer {ownBid.version})
              </span>
            ) : null}
            {ownBid.specRevision < latestRevision ? <Badge tone="warn">Made on revision {ownBid.specRevision}</Badge> : null}
          </>
        ) : (
          <span className="text-sm text-ink-600">{accepting ? "Price the bill line by line; save a draft any time." : "No bid from your shop."}</span>
        )}
        <span className="grow" />
        {accepting || ownBid ? (
          <ButtonLink to={`/specs/${specId}/bid`} tone={ownBid ? "secondary" : "primary"}>
            {ownBid ? (accepting ? "Open your bid" : "See your bid") : "Start a bid"}
          </ButtonLink>
        ) : null}
      </section>
    );
  }
  if (offers === null) return null;
  return (
    <section aria-label="Offers" className="mb-6 flex flex-wrap items-center gap-3 rounded-lg bg-white p-4 ring-1 ring-ink-200">
      <h2 className="font-semibold">Offers</h2>
      <span className="text-sm text-ink-600">
        {offers === 0 ? "None yet; shops have been told." : `${offers} offer${offers === 1 ? "" : "s"} from fluid-power shops.`}
        {specStatus === "open" && !accepting ? " Bidding has closed; choose one." : ""}
      </span>
      <span className="grow" />
      {offers > 0 ? <ButtonLink to={`/specs/${specId}/bids`}>{specStatus === "awarded" ? "See the bids" : "Compare and award"}</ButtonLink> : null}
    </section>
  );
}
