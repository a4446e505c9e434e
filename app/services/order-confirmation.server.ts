import { QueryTypes, type Transaction } from "sequelize";
import { Organisation, OrderConfirmation, sequelize, type Bid, type Job, type Spec, type User } from "~/models/index.server";
import { buildOrderDocument, orderNumber, type OrderDocument } from "~/content/order-document";
import { scopedJob } from "./job-reads.server";

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
  const buyer = await Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true });
  const shop = await Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true });
  const number = orderNumber(job.awardedAt.getUTCFullYear(), Number(serial));
  const document = buildOrderDocument({
    number,
    issuedAt: job.awardedAt,
    spec: { id: spec.id, title: spec.title, revision: bid.specRevision },
    buyer: { name: buyer.name, region: buyer.region },
    shop: { name: shop.name, region: shop.region },
    awardedBy: args.awardedBy.name,
    bid,
    terms: termsOf(bid),
    retainerPercent: job.retainerPercent,
    retainerCents: job.retainerCents,
    handoverBy: args.handoverBy,
  });
  return OrderConfirmation.create({ jobId: job.id, number, document }, { transaction });
}

/** The offer's free-text terms (bids before structured terms keep them in `terms`). */
function termsOf(bid: Bid): string[] {
  const text = bid.get("terms");
  return typeof text === "string" && text.trim() ? [text.trim()] : [];
}

/** The job's order confirmation for a reader of the job (404 otherwise); null for a job awarded before they were made. */
export async function orderConfirmationFor(user: User, jobId: string | undefined): Promise<{ jobId: string; order: OrderDocument | null }> {
  const job = await scopedJob(user, jobId);
  const row = await OrderConfirmation.findOne({ where: { jobId: job.id } });
  return { jobId: job.id, order: row?.document ?? null };
}
