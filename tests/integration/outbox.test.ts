// The outbox never loses mail: a send that fails stays queued and is retried later with backoff;
// after the last attempt it is kept as failed, with its error, for someone to look at.
import { describe, expect, it, vi } from "vitest";

// A port nobody listens on, set before the app reads its environment: every send is refused.
vi.hoisted(() => {
  process.env.SMTP_PORT = "1";
});

import { OutboxMail } from "~/models/index.server";
import { MAX_ATTEMPTS, deliverDueMail, enqueueMail, retryDelayMs } from "~/services/mail.server";

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

  it("marks a mail failed after the last attempt and keeps it", async () => {
    const mail = await enqueueMail({ to: "other@example.test", subject: "Hello", text: "Body" });
    await mail.update({ attempts: MAX_ATTEMPTS - 1, nextAttemptAt: new Date(Date.now() - 1000) });
    await deliverDueMail();
    await mail.reload();
    expect(mail.status).toBe("failed");
    expect(mail.attempts).toBe(MAX_ATTEMPTS);
    expect(await OutboxMail.findByPk(mail.id)).not.toBeNull();
  });

  it("backs off: each delay at least doubles, capped at an hour", () => {
    expect(retryDelayMs(1)).toBe(30_000);
    expect(retryDelayMs(2)).toBe(60_000);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
