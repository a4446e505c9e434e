import type { Transaction } from "sequelize";
import { Bid, Job, JobEvent, JobMilestone, Spec, User } from "~/models/index.server";
import { MILESTONES } from "~/content/job-milestones";
import { isoDay } from "~/content/dates";
import { retainerCents } from "~/content/money";
import { FieldErrors } from "./errors.server";
import { targetDates } from "./job-schedule";
import { makeOrderConfirmation } from "./order-confirmation.server";

// Opening a job, inside the award's transaction: the job copies both parties and the bid's money,
// works out the retainer, gives each milestone its default target day and makes the order
// confirmation.

export async function openJob(transaction: Transaction, args: { spec: Spec; bid: Bid; awardedBy: User }): Promise<Job> {
  const { spec, bid, awardedBy } = args;
  if (bid.specId !== spec.id) throw new Error("openJob: the bid belongs to another spec.");
  if (spec.retainerPercent === null) throw new FieldErrors({ "": ["This spec has no retainer share; it must be published before it is awarded."] });
  const awardedAt = new Date();
  const retainer = retainerCents(bid.totalCents, spec.retainerPercent);
  const job = await Job.create(
    {
      specId: spec.id,
      bidId: bid.id,
      buyerOrganisationId: spec.organisationId,
      shopOrganisationId: bid.organisationId,
      awardedById: awardedBy.id,
      awardedAt,
      currency: bid.currency,
      totalCents: bid.totalCents,
      retainerPercent: spec.retainerPercent,
      retainerCents: retainer,
      retainerPaidAt: null,
      stage: null,
    },
    { transaction },
  );
  const targets = targetDates(isoDay(awardedAt), bid.leadTimeWeeks);
  await JobMilestone.bulkCreate(
    MILESTONES.map((m, position) => ({ jobId: job.id, key: m.key, position, targetDate: targets[m.key], reachedAt: null, reachedById: null })),
    { transaction },
  );
  await makeOrderConfirmation(transaction, { job, spec, bid, awardedBy, handoverBy: targets.handed_over });
  await JobEvent.create(
    {
      jobId: job.id,
      userId: awardedBy.id,
      kind: "awarded",
      milestone: null,
      detail: {
        bidId: bid.id,
        totalCents: bid.totalCents,
        currency: bid.currency,
        retainerPercent: spec.retainerPercent,
        retainerCents: retainer,
        leadTimeWeeks: bid.leadTimeWeeks,
      },
    },
    { transaction },
  );
  return job;
}
