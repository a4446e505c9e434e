// The scheduled reminders, run at a fixed clock: a bid deadline passing (with bids: the buyer;
// with none: the buyer and the account's manager, or the admins), a milestone falling overdue
// (the shop, or the buyer for the retainer, and the account's manager). Each event is told once,
// even when two runs (two servers) go at the same moment; a new deadline or target is a new event.
import { describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { JobMilestone, Organisation, OutboxMail, Spec, type User } from "~/models/index.server";
import { addDays } from "~/content/dates";
import { remindOfOverdueMilestones, remindOfPassedDeadlines } from "~/services/reminders.server";
import { inDays, makeJob, makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import { makeManagerOf } from "../support/parties";

const subjectsTo = async (user: User, since: Date) =>
  (await OutboxMail.findAll({ where: { to: user.email, createdAt: { [Op.gte]: since } }, order: [["createdAt", "ASC"]] })).map((m) => m.subject);

const minuteAfter = (moment: Date) => new Date(moment.getTime() + 60_000);

async function managedBuyer() {
  const buyer = await makeMember("buyer");
  const manager = await makeManagerOf(buyer);
  return { buyer, manager };
}

describe("a bid deadline passing", () => {
  it("tells the buyer how many bids came, once, and nothing before the deadline", async () => {
    const { buyer, manager } = await managedBuyer();
    const spec = await makePublishedSpec(buyer, { machine: { title: "Coil press" }, quotation: { bidDeadline: inDays(30) } });
    await makeSubmittedBid(spec, await makeMember("shop"));
    await makeSubmittedBid(spec, await makeMember("shop"));
    const start = new Date();

    await remindOfPassedDeadlines(new Date(spec.bidDeadline!.getTime() - 60_000));
    expect(await subjectsTo(buyer, start)).toEqual([]);

    await remindOfPassedDeadlines(minuteAfter(spec.bidDeadline!));
    expect(await subjectsTo(buyer, start)).toEqual(["Bidding closed on Coil press: 2 bids"]);
    expect(await subjectsTo(manager, start)).toEqual([]);

    // The next minute's run, and one a day later, find it told.
    expect(await remindOfPassedDeadlines(minuteAfter(minuteAfter(spec.bidDeadline!)))).toBe(0);
    await remindOfPassedDeadlines(new Date(spec.bidDeadline!.getTime() + 86_400_000));
    expect(await subjectsTo(buyer, start)).toHaveLength(1);
  });

  it("with no bid tells the buyer and the account manager, once even when two servers run together", async () => {
    const { buyer, manager } = await managedBuyer();
    const spec = await makePublishedSpec(buyer, { machine: { title: "Bale press" }, quotation: { bidDeadline: inDays(31) } });
    const start = new Date();
    const at = minuteAfter(spec.bidDeadline!);

    const [a, b] = await Promise.all([remindOfPassedDeadlines(at), remindOfPassedDeadlines(at)]);
    expect(a + b).toBe(1);
    expect(await subjectsTo(buyer, start)).toEqual(["No bids on Bale press"]);
    expect(await subjectsTo(manager, start)).toEqual([`No bids for ${(await Organisation.findByPk(buyer.organisationId))!.name}: Bale press`]);
  });

  it("tells the admins when the account has no manager, and again after a revision sets a new deadline", async () => {
    const buyer = await makeMember("buyer");
    const admin = await makeOperatorUser("admin");
    const spec = await makePublishedSpec(buyer, { machine: { title: "Tube bender" }, quotation: { bidDeadline: inDays(32) } });
    const start = new Date();
    await remindOfPassedDeadlines(minuteAfter(spec.bidDeadline!));
    expect(await subjectsTo(admin, start)).toContain(`No bids for ${(await Organisation.findByPk(buyer.organisationId))!.name}: Tube bender`);

    // A revision moved the deadline on, and it passed again: a new event.
    const later = new Date(spec.bidDeadline!.getTime() + 3 * 86_400_000);
    await Spec.update({ bidDeadline: later }, { where: { id: spec.id } });
    await remindOfPassedDeadlines(minuteAfter(later));
    expect(await subjectsTo(buyer, start)).toEqual(["No bids on Tube bender", "No bids on Tube bender"]);
  });
});

describe("a milestone falling overdue", () => {
  async function jobWithManager(title: string) {
    const { buyer, manager } = await managedBuyer();
    const shop = await makeMember("shop");
    const { job } = await makeJob(buyer, shop, { title, leadTimeWeeks: 10 });
    const milestones = await JobMilestone.findAll({ where: { jobId: job.id } });
    const target = (key: string) => milestones.find((m) => m.key === key)!;
    return { buyer, shop, manager, job, target };
  }
  const dayAfter = (day: string) => new Date(`${addDays(day, 1)}T00:20:00Z`);

  it("tells the shop and the account manager once, with how late it is; a moved target that passes again is told again", async () => {
    const { buyer, shop, manager, target } = await jobWithManager("Lift table A");
    await target("retainer_received").update({ reachedAt: new Date() });
    const drawings = target("drawings_agreed");
    const start = new Date();

    await remindOfOverdueMilestones(new Date(`${drawings.targetDate}T12:00:00Z`));
    expect(await subjectsTo(shop, start)).toEqual([]);

    const late = new Date(`${addDays(drawings.targetDate!, 2)}T00:20:00Z`);
    await Promise.all([remindOfOverdueMilestones(late), remindOfOverdueMilestones(late)]);
    expect(await subjectsTo(shop, start)).toEqual(["Overdue: Drawings agreed on Lift table A"]);
    expect(await subjectsTo(manager, start)).toEqual(["Overdue: Drawings agreed on Lift table A"]);
    expect(await subjectsTo(buyer, start)).toEqual([]);
    const mail = await OutboxMail.findOne({ where: { to: shop.email, createdAt: { [Op.gte]: start } }, rejectOnEmpty: true });
    expect(mail.text).toContain("2 days late");
    expect(await remindOfOverdueMilestones(late)).toBe(0);

    // The shop moves the target; it passes too: told again.
    const moved = addDays(drawings.targetDate!, 5);
    await drawings.update({ targetDate: moved });
    await remindOfOverdueMilestones(dayAfter(moved));
    expect(await subjectsTo(shop, start)).toHaveLength(2);
  });

  it("tells the buyer (not the shop) of an unpaid retainer; a reached milestone or an accepted job is not told", async () => {
    const { buyer, shop, manager, job, target } = await jobWithManager("Lift table B");
    const retainer = target("retainer_received");
    const start = new Date();
    await remindOfOverdueMilestones(dayAfter(retainer.targetDate!));
    expect(await subjectsTo(buyer, start)).toEqual(["Overdue: Retainer received on Lift table B"]);
    expect(await subjectsTo(manager, start)).toEqual(["Overdue: Retainer received on Lift table B"]);
    expect(await subjectsTo(shop, start)).toEqual([]);

    const drawings = target("drawings_agreed");
    await drawings.update({ reachedAt: new Date() });
    await remindOfOverdueMilestones(dayAfter(drawings.targetDate!));
    const building = target("in_build");
    await job.update({ acceptedAt: new Date() });
    await remindOfOverdueMilestones(dayAfter(building.targetDate!));
    expect(await subjectsTo(shop, start)).toEqual([]);
  });
});
