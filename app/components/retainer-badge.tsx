import { Badge } from "./ui";
import { formatDay } from "~/content/dates";

// A job's retainer in one word, the same on every page: not paid, paid, partly or wholly paid back.
export function RetainerBadge({
  paidAt,
  refundedCents,
  retainerCents,
  withDate = false,
}: {
  paidAt: string | null;
  refundedCents: number;
  retainerCents: number;
  withDate?: boolean;
}) {
  if (!paidAt) return <Badge tone="warn">Not paid</Badge>;
  if (refundedCents >= retainerCents && retainerCents > 0) return <Badge tone="warn">Paid back</Badge>;
  if (refundedCents > 0) return <Badge tone="warn">Partly paid back</Badge>;
  return <Badge tone="good">{withDate ? `Paid ${formatDay(paidAt)}` : "Paid"}</Badge>;
}
