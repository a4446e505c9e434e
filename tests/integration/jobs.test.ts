// Awarded jobs: the retainer sum, default target dates, milestones recorded in order by the shop,
// undo and target changes with their history, e-mails, internal notes, the dashboard's filters
// and order, and who may see or change which job.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import * as jobsPage from "~/routes/jobs";
import * as jobPage from "~/routes/job";
import * as accountPage from "~/routes/account";
import * as specPage from "~/routes/spec";
import { Job, JobEvent, JobMilestone, Organisation, User, sequelize } from "~/models/index.server";
import { MILESTONE_KEYS } from "~/content/job-milestones";
import { addDays, isoDay } from "~/content/dates";
import { retainerCents } from "~/content/money";
import { changeTargetDate, reachMilestones, undoLastMilestone } from "~/services/job-progress.server";
import { jobFor } from "~/services/job-reads.server";
import { openJob } from "~/services/job-opening.server";
import { stageOf, targetDates } from "~/services/job-schedule";
import { deliverDueMail } from "~/services/mail.server";
import { FieldErrors } from "~/services/errors.server";
import { inDays, makeJob, makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import { makeBuyerAndShop } from "../support/parties";
import { mailsTo, waitForMail } from "../support/mailbox";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

/** A form of the job page (its `intent` and fields) as `visitor` posts it. */
const postToJob = (visitor: Visitor, jobId: string, fields: Record<string, string>) => visitor.post(jobPage.action, `/jobs/${jobId}`, fields, { jobId });

/** Moves a job's award (and its milestones' targets) `days` into the past, as if awarded then. */
async function ageJob(jobId: string, days: number) {
  const job = await Job.findByPk(jobId, { rejectOnEmpty: true });
  await job.update({ awardedAt: new Date(job.awardedAt.getTime() - days * 86_400_000) });
  for (const m of await JobMilestone.findAll({ where: { jobId } })) {
    if (m.targetDate) await m.update({ targetDate: addDays(m.targetDate, -days) });
  }
}

const expectFieldError = async (promise: Promise<unknown>, field: string, text: RegExp) => {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(FieldErrors);
  expect((error as FieldErrors).fieldErrors[field]?.join(" ")).toMatch(text);
};

describe("retainerCents", () => {
  it.each([
    // total cents, percent, retainer cents (worked by hand)
    [123_456, "12.50", 15_432], // 1234.56 × 12.5 % = 154.32
    [100_000, "20.00", 20_000],
    [12_345, "10", 1_235], // 123.45 × 10 % = 12.345 → half a cent rounds up
    [3, "50.00", 2], // 1.5 cents → 2
    [100, "14.50", 15], // 14.5 cents; 100 × 0.145 in floating point is 14.4999… and would give 14
    [99_999, "33.33", 33_330], // 999.99 × 33.33 % = 333.296667 → 333.30
    [1, "0.01", 0],
    [0, "25.00", 0],
    [12_345_678_901_234, "17.77", 2_193_827_140_749], // × 1777 = 21 938 271 407 492 818, beyond 2^53, / 10000 → …749.2818
    [9_000_000_000_000_00, "100.00", 9_000_000_000_000_00],
    [250_000_000_00, "7.5", 1_875_000_000], // 250 million × 7.5 % = 18.75 million
  ])("%i cents at %s %% is %i cents", (total, percent, expected) => {
    expect(retainerCents(total, percent)).toBe(expected);
  });

  it.each([
    [1000, "12.345"],
    [1000, "twelve"],
    [1000, "-5"],
    [1000, "100.01"],
    [-1, "10"],
    [10.5, "10"],
  ])("refuses %s cents at %s %%", (total, percent) => {
    expect(() => retainerCents(total, percent)).toThrow(RangeError);
  });
});

describe("default target dates", () => {
  it("spreads a 10-week lead time from the award day (worked by hand)", () => {
    // 70 days: retainer +7, drawings 20 % = 14, build 70 % = 49, test 85 % = 59.5 → 60, dispatch 70, hand-over 77.
    expect(targetDates("2026-01-30", 10)).toEqual({
      retainer_received: "2026-02-06",
      drawings_agreed: "2026-02-13",
      in_build: "2026-03-20",
      bench_tested: "2026-03-31",
      dispatched: "2026-04-10",
      handed_over: "2026-04-17",
    });
  });

  it("dates only the retainer when the bid has no lead time", () => {
    const dates = targetDates("2026-12-28", null);
    expect(dates.retainer_received).toBe("2027-01-04");
    expect(
      Object.entries(dates)
        .filter(([, d]) => d === null)
        .map(([k]) => k),
    ).toEqual(MILESTONE_KEYS.slice(1));
  });
});

describe("opening a job", () => {
  it("copies the parties and the money from spec and bid, with milestones and the award in its history", async () => {
    const buyer = await makeMember("buyer", { organisationName: "Harwell Press Works" });
    const shop = await makeMember("shop", { organisationName: "Dunmore Hydraulik" });
    const before = Date.now();
    const { spec, bid, job } = await makeJob(buyer, shop, { totalCents: 4_875_050 });
    expect(job.buyerOrganisationId).toBe(buyer.organisationId);
    expect(job.shopOrganisationId).toBe(shop.organisationId);
    expect(job.specId).toBe(spec.id);
    expect(job.bidId).toBe(bid.id);
    expect(job.currency).toBe("GBP");
    const stored = await Job.findByPk(job.id, { rejectOnEmpty: true });
    expect(stored.totalCents).toBe(4_875_050);
    expect(stored.retainerPercent).toBe("20.00");
    expect(stored.retainerCents).toBe(975_010); // 48 750.50 × 20 %
    expect(stored.retainerPaidAt).toBeNull();
    expect(stored.stage).toBeNull();

    const day = isoDay(stored.awardedAt);
    const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]] });
    // 12 weeks = 84 days: +7, 16.8 → 17, 58.8 → 59, 71.4 → 71, 84, 91.
    expect(milestones.map((m) => [m.key, m.targetDate])).toEqual([
      ["retainer_received", addDays(day, 7)],
      ["drawings_agreed", addDays(day, 17)],
      ["in_build", addDays(day, 59)],
      ["bench_tested", addDays(day, 71)],
      ["dispatched", addDays(day, 84)],
      ["handed_over", addDays(day, 91)],
    ]);
    expect(milestones.every((m) => m.reachedAt === null)).toBe(true);

    const events = await JobEvent.findAll({ where: { jobId: job.id } });
    expect(events).toHaveLength(1);
    expect(events[0].kind).toBe("awarded");
    expect(events[0].userId).toBe(buyer.id);
    expect(events[0].createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(events[0].detail).toMatchObject({ bidId: bid.id, totalCents: 4_875_050, retainerCents: 975_010, leadTimeWeeks: 12 });
  });

  it("rolls back with the transaction it was given", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop");
    const spec = await makePublishedSpec(buyer);
    const [jobsBefore, milestonesBefore, eventsBefore] = [await Job.count(), await JobMilestone.count(), await JobEvent.count()];
    const bid = await makeSubmittedBid(spec, shop, { totalCents: 50_000, leadTimeWeeks: 8 });
    await expect(
      sequelize.transaction(async (transaction) => {
        await openJob(transaction, { spec, bid, awardedBy: buyer });
        throw new Error("the award failed later");
      }),
    ).rejects.toThrow("the award failed later");
    expect(await Job.count({ where: { specId: spec.id } })).toBe(0);
    expect([await Job.count(), await JobMilestone.count(), await JobEvent.count()]).toEqual([jobsBefore, milestonesBefore, eventsBefore]);
  });
});

describe("progress recorded by the shop", () => {
  let buyer: User;
  let shop: User;
  let shopVisitor: Visitor;

  beforeAll(async () => {
    ({ buyer, shop } = await makeBuyerAndShop({ buyer: "Calder Lift Systems", shop: "Brenner Fluidtechnik" }));
    shopVisitor = await signedIn(shop);
  });

  it("reaches milestones in order, without waiting for the retainer, and keeps the stage in step", async () => {
    const { job } = await makeJob(buyer, shop);
    const before = Date.now();
    expect(await reachMilestones(shop, job.id, { milestone: "drawings_agreed", note: "Drawing rev B signed." })).toEqual(["drawings_agreed"]);
    expect((await Job.findByPk(job.id, { rejectOnEmpty: true })).stage).toBe("drawings_agreed");

    // Already reached, and the retainer is the payment's to record.
    await expectFieldError(reachMilestones(shop, job.id, { milestone: "drawings_agreed", note: "" }), "milestone", /already recorded/);
    await expectFieldError(reachMilestones(shop, job.id, { milestone: "retainer_received", note: "" }), "milestone", /payment/);

    // Choosing a later milestone reaches the one between first.
    expect(await reachMilestones(shop, job.id, { milestone: "bench_tested", note: "Tested at 240 bar." })).toEqual(["in_build", "bench_tested"]);
    const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]] });
    expect(milestones.filter((m) => m.reachedAt).map((m) => m.key)).toEqual(["drawings_agreed", "in_build", "bench_tested"]);
    expect(milestones.filter((m) => m.reachedAt).every((m) => m.reachedById === shop.id && m.reachedAt!.getTime() >= before - 1000)).toBe(true);
    expect(stageOf(milestones)).toBe("bench_tested");
    expect((await Job.findByPk(job.id, { rejectOnEmpty: true })).stage).toBe("bench_tested");

    const events = await JobEvent.findAll({ where: { jobId: job.id, kind: "milestone_reached" }, order: [["createdAt", "ASC"]] });
    expect(events.map((e) => [e.milestone, e.userId, e.body])).toEqual([
      ["drawings_agreed", shop.id, "Drawing rev B signed."],
      ["in_build", shop.id, ""],
      ["bench_tested", shop.id, "Tested at 240 bar."],
    ]);
    expect(events[1].detail).toMatchObject({ reachedWith: "bench_tested" });
  });

  it("takes back only the last milestone, with a reason, and writes it into the history", async () => {
    const { job } = await makeJob(buyer, shop);
    await expectFieldError(undoLastMilestone(shop, job.id, { milestone: "drawings_agreed", reason: "Nothing yet" }), "", /nothing to take back/);
    await reachMilestones(shop, job.id, { milestone: "in_build", note: "" });
    // A stale page that still shows the drawings as last undoes nothing.
    await expectFieldError(undoLastMilestone(shop, job.id, { milestone: "drawings_agreed", reason: "Oops" }), "", /now In the workshop/);
    expect(await undoLastMilestone(shop, job.id, { milestone: "in_build", reason: "Manifold block scrapped; machining again." })).toBe("in_build");
    const stored = await Job.findByPk(job.id, { rejectOnEmpty: true });
    expect(stored.stage).toBe("drawings_agreed");
    const inBuild = await JobMilestone.findOne({ where: { jobId: job.id, key: "in_build" }, rejectOnEmpty: true });
    expect(inBuild.reachedAt).toBeNull();
    expect(inBuild.reachedById).toBeNull();
    const undone = await JobEvent.findOne({ where: { jobId: job.id, kind: "milestone_undone" }, rejectOnEmpty: true });
    expect(undone.userId).toBe(shop.id);
    expect(undone.milestone).toBe("in_build");
    expect(undone.body).toBe("Manifold block scrapped; machining again.");
    expect(typeof undone.detail.reachedAt).toBe("string");

    // Through the page: a reason is required, and a good request redirects back with a message.
    const noReason = await postToJob(shopVisitor, job.id, { intent: "undo", milestone: "drawings_agreed", reason: " " });
    expect(noReason.status).toBe(400);
    expect(noReason.data.result.error.reason).toEqual(["Say why the milestone is taken back."]);
    const ok = await postToJob(shopVisitor, job.id, { intent: "undo", milestone: "drawings_agreed", reason: "Customer reopened the drawings." });
    expect(ok.status).toBe(302);
    expect(ok.location).toBe(`/jobs/${job.id}`);
    expect((await Job.findByPk(job.id, { rejectOnEmpty: true })).stage).toBeNull();
  });

  it("moves a target date of an open milestone and records from and to", async () => {
    const { job } = await makeJob(buyer, shop);
    const dispatched = await JobMilestone.findOne({ where: { jobId: job.id, key: "dispatched" }, rejectOnEmpty: true });
    const newDate = addDays(dispatched.targetDate!, 14);
    const res = await postToJob(shopVisitor, job.id, {
      intent: "target",
      milestone: "dispatched",
      targetDate: newDate,
      reason: "Motor delivery slipped two weeks.",
    });
    expect(res.status).toBe(302);
    await dispatched.reload();
    expect(dispatched.targetDate).toBe(newDate);
    const event = await JobEvent.findOne({ where: { jobId: job.id, kind: "target_changed", milestone: "dispatched" }, rejectOnEmpty: true });
    expect(event.userId).toBe(shop.id);
    expect(event.milestone).toBe("dispatched");
    expect(event.detail).toEqual({ from: addDays(newDate, -14), to: newDate });
    expect(event.body).toBe("Motor delivery slipped two weeks.");
    // A slip carries the milestones after it along: hand-over was a week after dispatch and still is.
    const handedOver = await JobMilestone.findOne({ where: { jobId: job.id, key: "handed_over" }, rejectOnEmpty: true });
    expect(handedOver.targetDate).toBe(addDays(newDate, 7));
    const pushed = await JobEvent.findOne({ where: { jobId: job.id, kind: "target_changed", milestone: "handed_over" }, rejectOnEmpty: true });
    expect(pushed.detail).toEqual({ from: addDays(newDate, -7), to: addDays(newDate, 7), pushedBy: "dispatched" });

    // Impossible days, days before the award, reached milestones and the retainer are refused; nothing changes.
    const awardDay = isoDay((await Job.findByPk(job.id, { rejectOnEmpty: true })).awardedAt);
    const bad = [
      [{ milestone: "dispatched", targetDate: "2026-02-30" }, "targetDate", /like 2026-09-30/],
      [{ milestone: "dispatched", targetDate: "next week" }, "targetDate", /like 2026-09-30/],
      [{ milestone: "dispatched", targetDate: addDays(awardDay, -1) }, "targetDate", /on or after the award/],
      [{ milestone: "dispatched", targetDate: newDate }, "targetDate", /already the target/],
      [{ milestone: "retainer_received", targetDate: newDate }, "milestone", /workshop/],
      [{ milestone: "nozzle", targetDate: newDate }, "milestone", /Choose a milestone/],
    ] as const;
    for (const [fields, field, message] of bad) {
      const r = await postToJob(shopVisitor, job.id, { intent: "target", ...fields });
      expect(r.status, JSON.stringify(fields)).toBe(400);
      expect(r.data.result.error[field].join(" ")).toMatch(message);
    }
    // The plan stays in order: no target before the one ahead of it.
    const tested = await JobMilestone.findOne({ where: { jobId: job.id, key: "bench_tested" }, rejectOnEmpty: true });
    await expectFieldError(
      changeTargetDate(shop, job.id, { milestone: "dispatched", targetDate: addDays(tested.targetDate!, -1), reason: "" }),
      "targetDate",
      /can't be planned before Bench-tested .* Move that one first/,
    );
    await reachMilestones(shop, job.id, { milestone: "drawings_agreed", note: "" });
    await expectFieldError(changeTargetDate(shop, job.id, { milestone: "drawings_agreed", targetDate: newDate, reason: "" }), "milestone", /already reached/);
    await dispatched.reload();
    expect(dispatched.targetDate).toBe(newDate);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "target_changed" } })).toBe(2);
  });

  it("shows the history with who and when, newest first", async () => {
    const { job } = await makeJob(buyer, shop);
    await postToJob(shopVisitor, job.id, { intent: "progress-note", body: "Tank welded, waiting for paint." });
    await postToJob(shopVisitor, job.id, { intent: "reach", milestone: "drawings_agreed", note: "" });
    const buyerBrowser = await signedIn(buyer);
    const res = await buyerBrowser.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
    expect(res.status).toBe(200);
    const events = res.data.job.events as { kind: string; who: string; whoOrganisation: string; at: string; body: string }[];
    expect(events.map((e) => [e.kind, e.who, e.whoOrganisation])).toEqual([
      ["milestone_reached", shop.name, "Brenner Fluidtechnik"],
      ["progress_note", shop.name, "Brenner Fluidtechnik"],
      ["awarded", buyer.name, "Calder Lift Systems"],
    ]);
    expect(events[1].body).toBe("Tank welded, waiting for paint.");
    for (const e of events) expect(Date.now() - Date.parse(e.at)).toBeLessThan(60_000);
    expect(res.data.job.milestones[1]).toMatchObject({ key: "drawings_agreed", reachedBy: shop.name });
    expect(res.data.job.canRecordProgress).toBe(false);
    expect(res.data.job.canWriteManagerNote).toBe(false);

    const empty = await postToJob(shopVisitor, job.id, { intent: "progress-note", body: "   " });
    expect(empty.status).toBe(400);
    expect(empty.data.result.error.body).toEqual(["Write the note first."]);
    const nonsense = await postToJob(shopVisitor, job.id, { intent: "celebrate" });
    expect(nonsense.status).toBe(400);
    expect(nonsense.data.intent).toBeNull();
    expect(await JobEvent.count({ where: { jobId: job.id } })).toBe(3);
  });

  it("e-mails buyer and shop when a milestone is reached", async () => {
    const stranger = await makeMember("buyer");
    const { job, spec } = await makeJob(buyer, shop, { title: "Tilting deck, main cylinders" });
    const res = await postToJob(shopVisitor, job.id, { intent: "reach", milestone: "in_build", note: "Manifold machined." });
    expect(res.status).toBe(302);
    // The action hands mail to the sender; flush whatever is left (publish mails to every shop too).
    while ((await deliverDueMail(100)) > 0);
    for (const person of [buyer, shop]) {
      const mail = await waitForMail(person.email, `Job progress on "${spec.title}"`);
      expect(mail.subject).toContain("Drawings agreed, In the workshop");
      // The buyer reads who did it; the shop's own people read it as theirs.
      expect(mail.text).toContain(person === shop ? "Your shop has recorded progress" : "Brenner Fluidtechnik has recorded progress");
      expect(mail.text).toContain("Manifold machined.");
      expect(mail.text).toContain(`/jobs/${job.id}`);
    }
    // Another buyer organisation hears nothing.
    expect((await mailsTo(stranger.email)).filter((m) => m.subject.includes("Job progress"))).toEqual([]);

    // Taking a milestone back is news too.
    await undoLastMilestone(shop, job.id, { milestone: "in_build", reason: "Pump coupling arrived cracked." });
    while ((await deliverDueMail(100)) > 0);
    const taken = (await mailsTo(buyer.email)).filter((m) => m.subject === `Job progress on "${spec.title}": In the workshop taken back`);
    expect(taken).toHaveLength(1);
    expect(taken[0].text).toContain("Pump coupling arrived cracked.");
  });
});

describe("internal notes", () => {
  it("are written by the account manager and admins, and never shown to buyer or shop", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop");
    const manager = await makeOperatorUser("account_manager");
    const admin = await makeOperatorUser("admin");
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
    const { job } = await makeJob(buyer, shop);
    const [managerV, adminV, buyerV, shopV] = await Promise.all([manager, admin, buyer, shop].map((user) => signedIn(user)));

    const note = "Buyer hinted the retainer waits for their quarter-end.";
    const res = await postToJob(managerV, job.id, { intent: "manager-note", body: note });
    expect(res.status).toBe(302);
    expect((await postToJob(adminV, job.id, { intent: "manager-note", body: "Checked by admin." })).status).toBe(302);
    const stored = await JobEvent.findAll({ where: { jobId: job.id, kind: "manager_note" }, order: [["createdAt", "ASC"]] });
    expect(stored.map((e) => [e.userId, e.visibility, e.body])).toEqual([
      [manager.id, "operator", note],
      [admin.id, "operator", "Checked by admin."],
    ]);

    for (const operator of [managerV, adminV]) {
      const page = await operator.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
      expect(page.data.job.events.filter((e: { kind: string }) => e.kind === "manager_note")).toHaveLength(2);
      expect(page.data.job.canWriteManagerNote).toBe(true);
    }
    for (const party of [buyerV, shopV]) {
      const page = await party.get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
      expect(page.status).toBe(200);
      expect(JSON.stringify(page.data)).not.toContain("quarter-end");
      expect(page.data.job.events.map((e: { kind: string }) => e.kind)).toEqual(["awarded"]);
      const write = await postToJob(party, job.id, { intent: "manager-note", body: "Let me in" });
      expect(write.status).toBe(403);
    }
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "manager_note" } })).toBe(2);
  });
});

describe("the job dashboard", () => {
  let manager: User;
  let managerV: Visitor;
  let adminV: Visitor;
  let account: User;
  let otherAccount: User;
  let shop: User;
  const jobs = {} as Record<"late" | "fresh" | "paid" | "older" | "elsewhere", string>;

  beforeAll(async () => {
    manager = await makeOperatorUser("account_manager");
    const otherManager = await makeOperatorUser("account_manager");
    account = await makeMember("buyer", { organisationName: "Ostrava Stamping" });
    otherAccount = await makeMember("buyer", { organisationName: "Lindqvist Balers" });
    shop = await makeMember("shop", { organisationName: "Peak Valley Power Units" });
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: account.organisationId } });
    await Organisation.update({ accountManagerId: otherManager.id }, { where: { id: otherAccount.organisationId } });

    jobs.late = (await makeJob(account, shop, { title: "Coil press, late" })).job.id;
    jobs.older = (await makeJob(account, shop, { title: "Baler ram, older" })).job.id;
    jobs.paid = (await makeJob(account, shop, { title: "Press brake, paid" })).job.id;
    jobs.fresh = (await makeJob(account, shop, { title: "Lift table, fresh" })).job.id;
    jobs.elsewhere = (await makeJob(otherAccount, shop, { title: "Coil press, other account" })).job.id;
    // The late job was awarded 40 days ago: its drawings (day 17) are overdue. The older one was
    // awarded 10 days ago and drawings were agreed on time: the retainer (day 7) is now late too,
    // so it is moved to day 20. The paid job's retainer arrived and its drawings were agreed.
    await ageJob(jobs.late, 40);
    await ageJob(jobs.older, 10);
    await JobMilestone.update({ targetDate: addDays(isoDay(new Date()), 10) }, { where: { jobId: jobs.older, key: "retainer_received" } });
    await reachMilestones(shop, jobs.older, { milestone: "drawings_agreed", note: "" });
    await ageJob(jobs.paid, 2);
    await Job.update({ retainerPaidAt: new Date() }, { where: { id: jobs.paid } });
    await JobMilestone.update({ reachedAt: new Date() }, { where: { jobId: jobs.paid, key: "retainer_received" } });
    await reachMilestones(shop, jobs.paid, { milestone: "drawings_agreed", note: "" });
    managerV = await signedIn(manager);
    adminV = await signedIn(await makeOperatorUser("admin"));
  });

  const ids = (res: { data: { jobs: { id: string }[] } }) => res.data.jobs.map((j) => j.id);

  it("lists the manager's accounts only, overdue first, then the newest award", async () => {
    const res = await managerV.get(jobsPage.loader, "/jobs");
    expect(res.status).toBe(200);
    expect(ids(res)).toEqual([jobs.late, jobs.fresh, jobs.paid, jobs.older]);
    const late = res.data.jobs[0];
    expect(late).toMatchObject({
      overdue: true,
      daysSinceAward: 40,
      stage: "awaiting_retainer",
      buyerName: "Ostrava Stamping",
      shopName: "Peak Valley Power Units",
    });
    expect(late.next).toMatchObject({ key: "retainer_received", label: "Retainer received" });
    expect(late.totalCents).toBe(1_234_567);
    expect(late.retainerCents).toBe(246_913); // 12 345.67 × 20 % = 2 469.134
    expect(res.data.jobs.find((j: { id: string }) => j.id === jobs.paid)).toMatchObject({ overdue: false, stage: "drawings_agreed" });
    expect(res.data.byStage.find((s: { stage: string }) => s.stage === "awaiting_retainer").count).toBe(2);
    expect(res.data.byStage.find((s: { stage: string }) => s.stage === "drawings_agreed").count).toBe(2);
    expect(res.data.accounts).toEqual([{ id: account.organisationId, name: "Ostrava Stamping" }]);
  });

  it("filters on the server by stage, retainer, overdue, account and title", async () => {
    const cases: [string, string[]][] = [
      ["/jobs?overdue=1", [jobs.late]],
      ["/jobs?retainer=paid", [jobs.paid]],
      ["/jobs?retainer=unpaid", [jobs.late, jobs.fresh, jobs.older]],
      ["/jobs?stage=drawings_agreed", [jobs.paid, jobs.older]],
      ["/jobs?stage=awaiting_retainer", [jobs.late, jobs.fresh]],
      ["/jobs?stage=handed_over", []],
      ["/jobs?q=coil", [jobs.late]],
      ["/jobs?q=%25", []], // a typed wildcard is matched literally
      ["/jobs?q=press&retainer=unpaid", [jobs.late]],
      [`/jobs?account=${account.organisationId}`, [jobs.late, jobs.fresh, jobs.paid, jobs.older]],
      [`/jobs?account=${otherAccount.organisationId}`, []], // not theirs: nothing, not the other manager's jobs
      ["/jobs?stage=melted&retainer=maybe&account=nope&overdue=perhaps", [jobs.late, jobs.fresh, jobs.paid, jobs.older]], // bad values are ignored
    ];
    for (const [path, expected] of cases) {
      const res = await managerV.get(jobsPage.loader, path);
      expect(ids(res), path).toEqual(expected);
      expect(res.data.total, path).toBe(expected.length);
    }
    // The chart counts every stage under the other filters.
    const paid = await managerV.get(jobsPage.loader, "/jobs?stage=awaiting_retainer&retainer=paid");
    expect(paid.data.byStage.find((s: { stage: string }) => s.stage === "drawings_agreed").count).toBe(1);
    expect(paid.data.byStage.reduce((n: number, s: { count: number }) => n + s.count, 0)).toBe(1);
  });

  it("gives admins every job, filterable by account", async () => {
    const all = await adminV.get(jobsPage.loader, "/jobs");
    expect(ids(all)).toEqual(expect.arrayContaining(Object.values(jobs)));
    const other = await adminV.get(jobsPage.loader, `/jobs?account=${otherAccount.organisationId}`);
    expect(ids(other)).toEqual([jobs.elsewhere]);
  });

  it("offers the account filter to those whose jobs span accounts, not to a buyer", async () => {
    const buyerList = await (await signedIn(account)).get(jobsPage.loader, "/jobs");
    expect(ids(buyerList)).toHaveLength(4);
    expect(buyerList.data.accounts).toEqual([]);
    const shopList = await (await signedIn(shop)).get(jobsPage.loader, "/jobs");
    expect(shopList.data.accounts.map((a: { name: string }) => a.name)).toEqual(["Lindqvist Balers", "Ostrava Stamping"]);
  });

  it("shows an account's jobs on its account page", async () => {
    const res = await managerV.get(accountPage.loader, `/accounts/${account.organisationId}`, { organisationId: account.organisationId });
    expect(res.status).toBe(200);
    expect(res.data.organisation.jobs.total).toBe(4);
    expect(res.data.organisation.jobs.recent.map((j: { id: string }) => j.id)).toEqual([jobs.late, jobs.fresh, jobs.paid, jobs.older]);
  });

  it("the job page marks overdue milestones", async () => {
    const res = await managerV.get(jobPage.loader, `/jobs/${jobs.late}`, { jobId: jobs.late });
    const overdue = res.data.job.milestones.filter((m: { overdue: boolean }) => m.overdue).map((m: { key: string }) => m.key);
    expect(overdue).toEqual(["retainer_received", "drawings_agreed"]);
    expect(res.data.job.overdue).toBe(true);
  });
});

describe("who may see and change a job", () => {
  let job: Job;
  const people = {} as Record<"buyer" | "colleague" | "shop" | "shopMate" | "otherShop" | "otherBuyer" | "manager" | "otherManager" | "admin", User>;
  const visitors = {} as Record<keyof typeof people, Visitor>;

  beforeAll(async () => {
    people.buyer = await makeMember("buyer", { organisationName: "Aldgate Forming" });
    people.shop = await makeMember("shop", { organisationName: "Rhein-Ruhr Hydraulics" });
    people.otherShop = await makeMember("shop", { organisationName: "Solent Fluid Power" });
    people.otherBuyer = await makeMember("buyer", { organisationName: "Bergen Deck Machinery" });
    people.manager = await makeOperatorUser("account_manager");
    people.otherManager = await makeOperatorUser("account_manager");
    people.admin = await makeOperatorUser("admin");
    people.colleague = await User.create({ ...colleagueOf(people.buyer), email: `colleague-${randomUUID().slice(0, 8)}@example.test` });
    people.shopMate = await User.create({ ...colleagueOf(people.shop), email: `shopmate-${randomUUID().slice(0, 8)}@example.test` });
    await Organisation.update({ accountManagerId: people.manager.id }, { where: { id: people.buyer.organisationId } });
    await Organisation.update({ accountManagerId: people.otherManager.id }, { where: { id: people.otherBuyer.organisationId } });
    job = (await makeJob(people.buyer, people.shop)).job;
    // The other shop has a job of its own, with the other buyer.
    await makeJob(people.otherBuyer, people.otherShop);
    for (const key of Object.keys(people) as (keyof typeof people)[]) visitors[key] = await signedIn(people[key]);
  });

  const colleagueOf = (user: User) => ({
    organisationId: user.organisationId,
    name: `Colleague of ${user.name}`,
    passwordHash: user.passwordHash,
    role: user.role,
    lastSignInAt: null,
  });

  it.each([
    ["buyer", 200],
    ["colleague", 200],
    ["shop", 200],
    ["shopMate", 200],
    ["manager", 200],
    ["admin", 200],
    ["otherShop", 404],
    ["otherBuyer", 404],
    ["otherManager", 404],
  ] as const)("the job page as %s: %i", async (who, status) => {
    const res = await visitors[who].get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
    expect(res.status).toBe(status);
    const list = await visitors[who].get(jobsPage.loader, "/jobs");
    expect(list.status).toBe(200);
    expect(list.data.jobs.some((j: { id: string }) => j.id === job.id)).toBe(status === 200);
  });

  it.each(["not-a-uuid", "1; drop table jobs", "00000000-0000-0000-0000-000000000000", randomUUID()])("a forged id (%s) is not found", async (id) => {
    for (const who of ["buyer", "shop", "manager", "admin"] as const) {
      expect((await visitors[who].get(jobPage.loader, `/jobs/${id}`, { jobId: id })).status).toBe(404);
      expect((await postToJob(visitors[who], id, { intent: "progress-note", body: "x" })).status).toBe(404);
    }
  });

  it("signed out: the pages redirect to sign-in and back, and nothing is written", async () => {
    const page = await new Visitor().get(jobPage.loader, `/jobs/${job.id}`, { jobId: job.id });
    expect(page.status).toBe(302);
    expect(page.location).toBe(`/sign-in?redirectTo=${encodeURIComponent(`/jobs/${job.id}`)}`);
    const list = await new Visitor().get(jobsPage.loader, "/jobs?overdue=1");
    expect(list.location).toBe(`/sign-in?redirectTo=${encodeURIComponent("/jobs?overdue=1")}`);
    const post = await postToJob(new Visitor(), job.id, { intent: "progress-note", body: "Anonymous" });
    expect(post.status).toBe(302);
    expect(post.location).toMatch(/^\/sign-in/);
    expect(await JobEvent.count({ where: { jobId: job.id, body: "Anonymous" } })).toBe(0);
  });

  it.each([
    ["shop", "reach", 302],
    ["shopMate", "progress-note", 302],
    ["buyer", "reach", 403],
    ["colleague", "progress-note", 403],
    ["manager", "reach", 403],
    ["admin", "target", 403],
    ["shop", "manager-note", 403],
    ["manager", "manager-note", 302],
    ["otherShop", "reach", 404],
    ["otherShop", "progress-note", 404],
    ["otherBuyer", "progress-note", 404],
    ["otherManager", "manager-note", 404],
  ] as const)("as %s, %s answers %i", async (who, intent, status) => {
    const fields: Record<string, Record<string, string>> = {
      reach: { intent, milestone: "drawings_agreed", note: "" },
      "progress-note": { intent, body: `Note from ${who}` },
      target: { intent, milestone: "dispatched", targetDate: inDays(200), reason: "" },
      "manager-note": { intent, body: `Internal from ${who}` },
    };
    const before = await JobEvent.count({ where: { jobId: job.id } });
    const res = await postToJob(visitors[who], job.id, fields[intent]);
    expect(res.status).toBe(status);
    expect(await JobEvent.count({ where: { jobId: job.id } })).toBe(before + (status === 302 ? 1 : 0));
    if (status === 302 && intent === "reach") await undoLastMilestone(people.shop, job.id, { milestone: "drawings_agreed", reason: "reset for the next case" });
  });

  it("everyone who sees the job can open its spec", async () => {
    for (const who of ["buyer", "colleague", "shop", "manager", "admin"] as const) {
      const res = await visitors[who].get(specPage.loader, `/specs/${job.specId}`, { specId: job.specId });
      expect(res.status, who).toBe(200);
    }
  });

  it("the service refuses other organisations too, not only the route", async () => {
    await expect(jobFor(people.otherShop, job.id)).rejects.toMatchObject({ init: { status: 404 } });
    await expect(reachMilestones(people.otherShop, job.id, { milestone: "drawings_agreed", note: "" })).rejects.toMatchObject({ init: { status: 404 } });
    await expect(reachMilestones(people.buyer, job.id, { milestone: "drawings_agreed", note: "" })).rejects.toMatchObject({ init: { status: 403 } });
  });
});
