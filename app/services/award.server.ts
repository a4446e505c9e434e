import { Op } from "sequelize";
import { Bid, Job, Organisation, Spec, User, sequelize } from "~/models/index.server";
import { can, jobsWhere, viewerOf } from "~/auth/access-policy.server";
import { formatDay, todayUtc } from "~/content/dates";
import { formatMoney } from "~/content/money";
import { recordAudit } from "./audit.server";
import { FieldErrors } from "./errors.server";
import { specFor } from "./spec-access.server";
import { enqueueMail } from "./mail.server";
import { bidChosenMail, bidNotChosenMail, newJobMail } from "./mail-templates.server";
import { openJob } from "./job-opening.server";

// Awarding: the buyer chooses exactly one offered bid. The spec row is locked for update, so
// of two racing awards the second waits, then finds the spec awarded and changes nothing.

export async function awardBid(user: User, specId: string | undefined, { bidId }: { bidId: string }): Promise<Job> {
  return sequelize.transaction(async (transaction) => {
    const spec = await specFor(user, specId, "spec.award", { transaction, lock: true });
    if (spec.status === "awarded") throw new FieldErrors({ "": ["This spec has already been awarded."] });
    if (spec.status !== "open") throw new FieldErrors({ "": ["Only a spec open for bids can be awarded."] });
    const bid = await Bid.findOne({ where: { id: bidId, specId: spec.id }, lock: transaction.LOCK.UPDATE, transaction });
    if (!bid || bid.status !== "submitted") throw new FieldErrors({ bidId: ["That bid is not on offer any more; reload the comparison."] });
    if (bid.validUntil && bid.validUntil < todayUtc()) {
      throw new FieldErrors({ bidId: [`This offer was valid until ${formatDay(bid.validUntil)}. Ask the shop to renew it first.`] });
    }

    await spec.update({ status: "awarded", revising: false }, { transaction });
    await bid.update({ status: "won" }, { transaction });
    const others = await Bid.findAll({ where: { specId: spec.id, id: { [Op.ne]: bid.id }, status: "submitted" }, transaction });
    await Bid.update({ status: "not_selected" }, { where: { id: others.map((o) => o.id) }, transaction });
    const job = await openJob(transaction, { spec, bid, awardedBy: user });
    const shop = await Organisation.findByPk(bid.organisationId, { attributes: ["name"], transaction, rejectOnEmpty: true });
    await recordAudit(
      {
        actor: user,
        action: "bid-awarded",
        subject: { type: "spec", id: spec.id, label: spec.title },
        details: { shop: shop.name, total: formatMoney(bid.totalCents, bid.currency), jobId: job.id },
      },
      transaction,
    );

    // Everyone who offered hears the outcome; the account manager hears of the new job.
    for (const offer of [bid, ...others]) {
      const won = offer.id === bid.id;
      const people = await User.findAll({ where: { organisationId: offer.organisationId, active: true }, transaction });
      for (const person of people) {
        const mail = won
          ? bidChosenMail({
              name: person.name,
              specTitle: spec.title,
              jobId: job.id,
              totalCents: bid.totalCents,
              retainerCents: job.retainerCents,
              currency: job.currency,
            })
          : bidNotChosenMail({ name: person.name, specId: spec.id, specTitle: spec.title });
        await enqueueMail({ to: person.email, ...mail }, transaction);
      }
    }
    const buyer = await Organisation.findByPk(spec.organisationId, { transaction, rejectOnEmpty: true });
    const manager = buyer.accountManagerId ? await User.findByPk(buyer.accountManagerId, { transaction }) : null;
    if (manager?.active) {
      const mail = newJobMail({
        name: manager.name,
        buyerName: buyer.name,
        specTitle: spec.title,
        jobId: job.id,
        totalCents: bid.totalCents,
        currency: bid.currency,
      });
      await enqueueMail({ to: manager.email, ...mail }, transaction);
    }
    return job;
  });
}

/** Whether the viewer may award this spec now: its buyer, while it is open (awardBid checks both again). */
export async function canAwardNow(user: User, spec: Pick<Spec, "organisationId" | "status">): Promise<boolean> {
  return can(await viewerOf(user), "spec.award", spec) && spec.status === "open";
}

/** The job an award of this spec opened, if the viewer may read it (for the comparison page's link). */
export async function awardedJobOf(user: User, spec: Pick<Spec, "id">): Promise<{ id: string } | null> {
  return Job.findOne({ where: { [Op.and]: [jobsWhere(await viewerOf(user)), { specId: spec.id }] }, attributes: ["id"] });
}
