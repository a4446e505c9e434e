// The outbox never loses mail: each row has a pg-boss job queued in the same transaction; a send
// that fails is retried by the queue with backoff; after the last attempt the row is kept as
// failed, with its error, for an admin to send again. Account mail goes before activity and
// announcements; requests only queue, never send.
import { beforeEach, describe, expect, it, vi } from "vitest";

// A port nobody listens on, set before the app reads its environment: every send is refused.
vi.hoisted(() => {
  process.env.SMTP_PORT = "1";
});

import { randomUUID } from "node:crypto";
import { Op, QueryTypes } from "sequelize";
import * as team from "~/routes/team";
import * as jobPage from "~/routes/job";
import * as adminMail from "~/routes/admin.mail";
import { OutboxMail, sequelize } from "~/models/index.server";
import { requestPasswordReset } from "~/services/accounts.server";
import { MAIL_PRIORITIES, MAX_ATTEMPTS, deliverDueMail, enqueueMail, retryDelayMs } from "~/services/mail.server";
import { QUEUES, workQueue } from "~/services/work-queue.server";
import { makeJob, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

// Each test reads the whole queue, so each starts with an empty one.
beforeEach(async () => {
  await OutboxMail.destroy({ where: {} });
  await sequelize.query("DELETE FROM pgboss.job");
});

const jobState = async (id: string) => {
  const [row] = await sequelize.query<{ state: string }>("SELECT state FROM pgboss.job WHERE id = :id", { replacements: { id }, type: QueryTypes.SELECT });
  return row?.state;
};
const mailJobCount = async () => (await sequelize.query("SELECT id FROM pgboss.job WHERE name = 'mail'", { type: QueryTypes.SELECT })).length;

describe("mail outbox", () => {
  it("keeps a mail that could not be sent and schedules a retry", async () => {
    const mail = await enqueueMail({ to: "someone@example.test", subject: "Hello", text: "Body" });
    const before = Date.now();
    expect(await deliverDueMail()).toBe(0);
    await mail.reload();
    expect(mail.status).toBe("pending");
    expect(mail.attempts).toBe(1);
    expect(mail.lastError).toBeTruthy();
    expect(mail.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(before + retryDelayMs(1) - 1000);
    // Not due yet: a second run does not try it again.
    expect(await deliverDueMail()).toBe(0);
    expect((await mail.reload()).attempts).toBe(1);
  });

  it("retries through the queue with a growing wait, then marks the mail failed after the last attempt and keeps it", async () => {
    const mail = await enqueueMail({ to: "other@example.test", subject: "Hello", text: "Body" });
    let lastWait = 0;
    for (let attempt = 1; attempt <= MAX_ATTEMPTS; attempt++) {
      // Time passes: the retry the queue scheduled is due now.
      await sequelize.query(`UPDATE pgboss.job SET start_after = now() WHERE id = :id AND state = 'retry'`, { replacements: { id: mail.jobId } });
      const before = Date.now();
      expect(await deliverDueMail()).toBe(0);
      await mail.reload();
      expect(mail.attempts).toBe(attempt);
      if (attempt === MAX_ATTEMPTS) break;
      expect(mail.status).toBe("pending");
      const wait = mail.nextAttemptAt.getTime() - before;
      expect(wait).toBeGreaterThanOrEqual(retryDelayMs(attempt) - 1000);
      expect(wait).toBeGreaterThan(lastWait / 2);
      lastWait = wait;
    }
    expect(mail.status).toBe("failed");
    expect(mail.lastError).toBeTruthy();
    expect(await jobState(mail.jobId!)).toBe("failed");
    // Nothing is left to try.
    expect(await deliverDueMail()).toBe(0);
    expect((await mail.reload()).attempts).toBe(MAX_ATTEMPTS);
  });

  it("backs off: each delay doubles, the last wait about half an hour to an hour", () => {
    expect(retryDelayMs(1)).toBe(30_000);
    expect(retryDelayMs(2)).toBe(60_000);
    expect(retryDelayMs(MAX_ATTEMPTS - 1)).toBe(1_920_000);
  });

  it("queues the mail and its job in the change's transaction: a change rolled back leaves neither", async () => {
    const jobsBefore = await mailJobCount();
    await expect(
      sequelize.transaction(async (transaction) => {
        await enqueueMail({ to: "never@example.test", subject: "Rolled back", text: "Body" }, transaction);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await OutboxMail.count({ where: { to: "never@example.test" } })).toBe(0);
    expect(await mailJobCount()).toBe(jobsBefore);

    const kept = await sequelize.transaction((transaction) => enqueueMail({ to: "kept@example.test", subject: "Committed", text: "Body" }, transaction));
    expect(await jobState(kept.jobId!)).toBe("created");
  });
});

describe("mail priority", () => {
  it("claims a password reset queued after hundreds of announcements first", async () => {
    const shop = await makeMember("shop");
    const queuedBefore = Date.now() - 60_000;
    for (let i = 0; i < 300; i++) {
      const mail = await enqueueMail({ to: `shop${i}@example.test`, subject: "New spec open for bids: Press", text: "Body", priority: "announcement" });
      // Queued a minute ago: older than the reset by far.
      await mail.update({ nextAttemptAt: new Date(queuedBefore + i) });
    }
    await enqueueMail({ to: "activity@example.test", subject: "New bid on Press", text: "Body" });
    await requestPasswordReset(shop.email);
    const reset = await OutboxMail.findOne({ where: { to: shop.email }, rejectOnEmpty: true });
    expect(reset.priority).toBe(MAIL_PRIORITIES.account);

    // One claim (the SMTP port refuses, so the claimed mail records one failed attempt).
    await deliverDueMail(1);
    expect((await reset.reload()).attempts).toBe(1);
    expect(await OutboxMail.count({ where: { attempts: { [Op.gt]: 0 }, id: { [Op.ne]: reset.id } } })).toBe(0);
    // Then activity before the announcements.
    await deliverDueMail(1);
    expect((await OutboxMail.findOne({ where: { to: "activity@example.test" }, rejectOnEmpty: true })).attempts).toBe(1);
    expect(await OutboxMail.count({ where: { priority: MAIL_PRIORITIES.announcement, attempts: { [Op.gt]: 0 } } })).toBe(0);
  });
});

describe("requests only queue mail", () => {
  // The SMTP port of this file refuses every connection: had a request tried to send, its row
  // would show an attempt and the error.
  const untried = async (to: string) => {
    const rows = await OutboxMail.findAll({ where: { to } });
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) expect([row.status, row.attempts, row.lastError]).toEqual(["pending", 0, null]);
    return rows;
  };

  it("an invitation is queued, first in line, and nothing is sent in the request", async () => {
    const buyer = await makeMember("buyer");
    const email = uniqueEmail("invitee");
    const res = await (await signedIn(buyer)).post(team.action, "/team", { email });
    expect(res.status).toBe(302);
    const [row] = await untried(email);
    expect(row.priority).toBe(MAIL_PRIORITIES.account);
  });

  it("a milestone is queued for buyer and shop, and nothing is sent in the request", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop");
    const { job } = await makeJob(buyer, shop, { totalCents: 500_000, leadTimeWeeks: 10 });
    const res = await (await signedIn(shop)).post(jobPage.action, `/jobs/${job.id}`, { intent: "reach", milestone: "in_build", note: "" }, { jobId: job.id });
    expect(res.status).toBe(302);
    for (const person of [buyer, shop]) {
      const rows = await untried(person.email);
      expect(rows.some((r) => r.subject.startsWith("Job progress on"))).toBe(true);
    }
  });
});

describe("the admin's mail page", () => {
  it("lists failed mail with its error and sends it again; waiting mail has its own list", async () => {
    const admin = await makeOperatorUser("admin");
    const failed = await enqueueMail({ to: "lost@example.test", subject: "Your offer was chosen", text: "Body with a secret link" });
    await failed.update({ status: "failed", attempts: MAX_ATTEMPTS, lastError: "connect ECONNREFUSED 127.0.0.1:1" });
    const waiting = await enqueueMail({ to: "slow@example.test", subject: "Spec revised", text: "Body" });
    await OutboxMail.update(
      { createdAt: new Date(Date.now() - 3_600_000), attempts: 3, lastError: "Greeting never received" },
      { where: { id: waiting.id }, silent: true },
    );
    await enqueueMail({ to: "fresh@example.test", subject: "Just queued", text: "Body" });

    const visitor = await signedIn(admin);
    const page = await visitor.get(adminMail.loader, "/admin/mail");
    expect(page.status).toBe(200);
    expect(page.data.counts).toEqual({ failed: 1, waiting: 1, queued: 2 });
    expect(page.data.mails).toEqual([
      expect.objectContaining({
        id: failed.id,
        to: "lost@example.test",
        subject: "Your offer was chosen",
        attempts: MAX_ATTEMPTS,
        lastError: "connect ECONNREFUSED 127.0.0.1:1",
        status: "failed",
      }),
    ]);
    // The body (which may hold a sign-in link) is never shown.
    expect(JSON.stringify(page.data)).not.toContain("secret link");
    const slow = await visitor.get(adminMail.loader, "/admin/mail?show=waiting");
    expect(slow.data.mails.map((m: { to: string }) => m.to)).toEqual(["slow@example.test"]);
    const queued = await visitor.get(adminMail.loader, "/admin/mail?show=queued&sort=longest-waiting");
    expect(queued.data.mails.map((m: { to: string }) => m.to)).toEqual(["slow@example.test", "fresh@example.test"]);

    const again = await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: failed.id });
    expect(again.status).toBe(302);
    await failed.reload();
    expect([failed.status, failed.attempts]).toEqual(["pending", 0]);
    expect(failed.nextAttemptAt.getTime()).toBeLessThanOrEqual(Date.now());
    expect((await visitor.get(adminMail.loader, "/admin/mail")).data.counts.failed).toBe(0);

    // A mail sent meanwhile is not sent twice; a forged id is a 404.
    await failed.update({ status: "sent", sentAt: new Date() });
    const sent = await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: failed.id });
    expect(sent.status).toBe(409);
    expect((await failed.reload()).status).toBe("sent");
    expect((await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: "not-an-id" })).status).toBe(400);
    expect((await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: randomUUID() })).status).toBe(404);
  });

  it("sending again a mail still being retried leaves one job to deliver it", async () => {
    const mail = await enqueueMail({ to: "retried@example.test", subject: "Hello", text: "Body" });
    await deliverDueMail();
    const firstJob = (await mail.reload()).jobId!;
    expect([mail.attempts, await jobState(firstJob)]).toEqual([1, "retry"]);

    const visitor = await signedIn(await makeOperatorUser("admin"));
    expect((await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: mail.id })).status).toBe(302);
    await mail.reload();
    expect(mail.jobId).not.toBe(firstJob);
    expect(mail.attempts).toBe(0);

    // Both jobs due: the old one is no longer the mail's and sends nothing; the new one tries.
    await sequelize.query(`UPDATE pgboss.job SET start_after = now() WHERE name = 'mail' AND state = 'retry'`);
    await deliverDueMail();
    expect((await mail.reload()).attempts).toBe(1);
    expect(await jobState(firstJob)).toBe("completed");
    expect(await jobState(mail.jobId!)).toBe("retry");
  });

  it("shows the mail queued now and each schedule's last finished and failed run", async () => {
    await enqueueMail({ to: "queued@example.test", subject: "Queued", text: "Body" });
    const boss = workQueue();
    // One scheduled run of each outcome, as the workers settle them.
    await boss.send(QUEUES.bidDeadlines, {});
    await boss.send(QUEUES.paymentReconciliation, {}, { retryLimit: 0 });
    const [done] = await boss.fetch(QUEUES.bidDeadlines);
    await boss.complete(QUEUES.bidDeadlines, done.id);
    const [failed] = await boss.fetch(QUEUES.paymentReconciliation);
    await boss.fail(QUEUES.paymentReconciliation, failed.id, { message: "The card service did not answer" });

    const page = await (await signedIn(await makeOperatorUser("admin"))).get(adminMail.loader, "/admin/mail");
    expect(page.data.background.queued).toBe(1);
    const byLabel = Object.fromEntries(page.data.background.schedules.map((s: { label: string }) => [s.label, s]));
    expect(byLabel["Bid deadlines passing"]).toEqual(expect.objectContaining({ every: "every minute", lastFailedAt: null, lastError: null }));
    expect(byLabel["Bid deadlines passing"].lastDoneAt).toEqual(expect.any(String));
    expect(byLabel["Payments without their webhook"]).toEqual(expect.objectContaining({ lastDoneAt: null, lastError: "The card service did not answer" }));
    expect(byLabel["Overdue milestones"]).toEqual(expect.objectContaining({ every: "every 15 minutes", lastDoneAt: null, lastFailedAt: null }));
  });

  it("is the admin's only: others get 403 and change nothing", async () => {
    const failed = await enqueueMail({ to: "kept@example.test", subject: "Hello", text: "Body" });
    await failed.update({ status: "failed", attempts: MAX_ATTEMPTS, lastError: "refused" });
    for (const user of [await makeMember("buyer"), await makeMember("shop"), await makeOperatorUser("account_manager")]) {
      const visitor = await signedIn(user);
      expect((await visitor.get(adminMail.loader, "/admin/mail")).status).toBe(403);
      expect((await visitor.post(adminMail.action, "/admin/mail", { intent: "send-again", mailId: failed.id })).status).toBe(403);
    }
    expect((await failed.reload()).status).toBe("failed");
    const anonymous = await new Visitor().get(adminMail.loader, "/admin/mail");
    expect(anonymous.status).toBe(302);
  });
});
