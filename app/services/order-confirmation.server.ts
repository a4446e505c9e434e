import { QueryTypes, type Transaction } from "sequelize";
import { OrderConfirmation, sequelize, type Bid, type Job, type Spec, type User } from "~/models/index.server";
import { buildOrderDocument, orderNumber, type OrderDocument } from "~/content/order-document";
import { scopedJob } from "./job-reads.server";
import { offerSummary } from "./offer-summary";
import { profileById } from "./organisation-profile.server";

// The order confirmation: made inside the award's transaction (so an award always has one and a
// rolled-back award leaves none), read by whoever may read the job.

export async function makeOrderConfirmation(
  transaction: Transaction,
  args: { job: Job; spec: Spec; bid: Bid; awardedBy: User; handoverBy: string | null },
): Promise<OrderConfirmation> {
  const { job, spec, bid } = args;
  const [{ serial }] = await sequelize.query<{ serial: string }>("SELECT nextval('order_number_seq') AS serial", {
    type: QueryTypes.SELECT,
    transaction,
  });
  const buyer = await profileById(job.buyerOrganisationId, transaction);
  const shop = await profileById(job.shopOrganisationId, transaction);
  if (!buyer || !shop) throw new Error(`makeOrderConfirmation: a party of job ${job.id} is missing.`);
  const number = orderNumber(job.awardedAt.getUTCFullYear(), Number(serial));
  const document = buildOrderDocument({
    number,
    issuedAt: job.awardedAt,
    spec: { id: spec.id, title: spec.title, revision: bid.specRevision },
    buyer,
    shop,
    awardedBy: args.awardedBy.name,
    offer: offerSummary(bid, job.retainerPercent),
    totalCents: job.totalCents,
    retainerPercent: job.retainerPercent,
    retainerCents: job.retainerCents,
    handoverBy: args.handoverBy,
  });
  return OrderConfirmation.create({ jobId: job.id, number, document }, { transaction });
}

/** The job's order confirmation for a reader of the job (404 otherwise); null for a job awarded before they were made. */
export async function orderConfirmationFor(user: User, jobId: string | undefined): Promise<{ jobId: string; order: OrderDocument | null }> {
  const job = await scopedJob(user, jobId);
  const row = await OrderConfirmation.findOne({ where: { jobId: job.id } });
  return { jobId: job.id, order: row?.document ?? null };
}
