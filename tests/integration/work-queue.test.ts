// Background work on pg-boss, with its workers really running: two work queues on one database
// (two servers) deliver each mail once; the background work an app server starts runs the
// schedules' jobs, and the mail they queue goes out through the sender; it stops cleanly.
import { randomBytes } from "node:crypto";
import { describe, expect, it, vi } from "vitest";
import { Op, QueryTypes } from "sequelize";
import { OutboxMail, Spec, sequelize } from "~/models/index.server";
import { enqueueMail, startMailSender } from "~/services/mail.server";
import { SCHEDULES, keepStartingBackgroundWork, startBackgroundWork } from "~/services/background-work.server";
import { QUEUES, createWorkQueue, workQueue } from "~/services/work-queue.server";
import { inDays, makeMember, makePublishedSpec } from "../support/factories";
import { mailsTo } from "../support/mailbox";
import { expectConsoleError } from "../support/console-errors";

describe("two work queues on one database", () => {
  it("deliver each mail exactly once", async () => {
    const run = randomBytes(3).toString("hex");
    const addresses = Array.from({ length: 30 }, (_, i) => `pair-${run}-${i}@example.test`);
    const queued = await Promise.all(
      addresses.map((to, i) => enqueueMail({ to, subject: `Pair ${run} #${i}`, text: "Body", priority: i % 3 ? "activity" : "account" })),
    );

    // Two servers' queues, each with its own sender, without schedules or maintenance.
    const servers = [createWorkQueue({ schedule: false, supervise: false }), createWorkQueue({ schedule: false, supervise: false })];
    try {
      for (const boss of servers) {
        await boss.start();
        await startMailSender(boss);
      }
      await expect
        .poll(async () => OutboxMail.count({ where: { id: queued.map((m) => m.id), status: "sent" } }), { timeout: 20_000, interval: 250 })
        .toBe(addresses.length);
    } finally {
      await Promise.all(servers.map((boss) => boss.stop({ graceful: true, timeout: 2_000 })));
    }
    for (const mail of queued) expect((await mail.reload()).attempts).toBe(1);
    const received = await Promise.all(addresses.map((to) => mailsTo(to)));
    expect(received.map((mails) => mails.length)).toEqual(addresses.map(() => 1));
  });
});

describe("two servers running the schedules", () => {
  it("run a scheduled job that came twice (two cron ticks, one on each) and tell its event once", async () => {
    const buyer = await makeMember("buyer");
    const spec = await makePublishedSpec(buyer, { machine: { title: "Roll former" }, quotation: { bidDeadline: inDays(22) } });
    await Spec.update({ bidDeadline: new Date(Date.now() - 60_000) }, { where: { id: spec.id } });
    const deadlines = SCHEDULES.find((s) => s.queue === QUEUES.bidDeadlines)!;

    const servers = [createWorkQueue({ schedule: false, supervise: false }), createWorkQueue({ schedule: false, supervise: false })];
    try {
      for (const boss of servers) {
        await boss.start();
        await boss.work(deadlines.queue, () => deadlines.run(new Date()));
      }
      const ids = await Promise.all(servers.map((boss) => boss.send(deadlines.queue, {})));
      const finished = () =>
        sequelize.query("SELECT id FROM pgboss.job WHERE id IN (:ids) AND state = 'completed'", { replacements: { ids }, type: QueryTypes.SELECT });
      await expect.poll(async () => (await finished()).length, { timeout: 15_000, interval: 250 }).toBe(2);
    } finally {
      await Promise.all(servers.map((boss) => boss.stop({ graceful: true, timeout: 2_000 })));
    }
    expect(await OutboxMail.count({ where: { to: buyer.email, subject: "No bids on Roll former" } })).toBe(1);
  });
});

describe("an app server's background work", () => {
  it("schedules each job by cron, runs a scheduled job's handler and sends the mail it queues, then stops", async () => {
    const buyer = await makeMember("buyer");
    const spec = await makePublishedSpec(buyer, { machine: { title: "Panel bender" }, quotation: { bidDeadline: inDays(20) } });
    // Its deadline passed an hour ago, without a bid.
    await Spec.update({ bidDeadline: new Date(Date.now() - 3_600_000) }, { where: { id: spec.id } });

    const stop = await startBackgroundWork();
    try {
      const schedules = await workQueue().getSchedules();
      expect(schedules.map((s) => [s.name, s.cron]).sort()).toEqual(SCHEDULES.map((s) => [s.queue, s.cron]).sort());

      // The job a schedule makes each minute, made now.
      await workQueue().send(QUEUES.bidDeadlines, {});
      await expect
        .poll(async () => (await mailsTo(buyer.email)).map((m) => m.subject), { timeout: 15_000, interval: 250 })
        .toContain("No bids on Panel bender");
      expect(await OutboxMail.count({ where: { to: buyer.email, subject: "No bids on Panel bender", status: { [Op.ne]: "sent" } } })).toBe(0);
    } finally {
      await stop();
    }
    // Stopped cleanly: no job is left claimed by it.
    const held = await sequelize.query("SELECT id FROM pgboss.job WHERE state = 'active'", { type: QueryTypes.SELECT });
    expect(held).toEqual([]);
  });
});

describe("a server that boots while the database cannot be reached", () => {
  it("says so and starts its background work when it can", async () => {
    expectConsoleError(/Background work did not start; trying again/);
    const start = vi.spyOn(workQueue(), "start").mockRejectedValueOnce(new Error("connect ECONNREFUSED 127.0.0.1:5432"));
    const stop = await keepStartingBackgroundWork(20);
    try {
      expect(start).toHaveBeenCalledTimes(2);
      expect((await workQueue().getSchedules()).length).toBe(SCHEDULES.length);
    } finally {
      await stop();
      start.mockRestore();
    }
  });
});
