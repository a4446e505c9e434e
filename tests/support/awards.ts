// A job reached the way people reach it: a published spec, a shop's offer priced line by line
// through the bid service, and the buyer's award. For tests of what follows the award (payments).
import type { Job, User } from "~/models/index.server";
import { awardBid } from "~/services/award.server";
import { bomOf, saveBid } from "~/services/bids.server";
import { inDays, makePublishedSpec } from "./factories";

export async function awardedJob(
  buyer: User,
  shop: User,
  { unitPrice = "100", leadTimeWeeks = 10, title }: { unitPrice?: string; leadTimeWeeks?: number; title?: string } = {},
): Promise<Job> {
  const spec = await makePublishedSpec(buyer, title ? { machine: { title } } : {});
  const bom = await bomOf(spec);
  const bid = await saveBid(shop, spec.id, {
    intent: "submit",
    lines: bom.map((l) => ({ key: l.key, unitPrice })),
    leadTimeWeeks,
    validUntil: inDays(40),
  });
  return awardBid(buyer, spec.id, { bidId: bid.id });
}
