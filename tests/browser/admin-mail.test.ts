// The admin's mail page on a real server, whose background work runs on pg-boss: the schedules
// show their runs as the server's cron makes them, and "Send again" puts a failed mail back on the
// queue, which the server's sender delivers.
import path from "node:path";
import { randomUUID } from "node:crypto";
import { describe, expect, it, onTestFinished } from "vitest";
import { OutboxMail } from "~/models/index.server";
import { MAX_ATTEMPTS } from "~/services/mail.server";
import { PASSWORD, makeOperatorUser, uniqueEmail } from "../support/factories";
import { SCREENSHOTS, signInAs, startBrowserApp } from "../support/browser";
import { waitForMail } from "../support/mailbox";

describe("the admin's mail page", () => {
  it("shows the scheduled work running and sends a failed mail again", { timeout: 200_000 }, async () => {
    const admin = await makeOperatorUser("admin");
    const to = uniqueEmail("lost");
    // A mail that failed for good while the mail server refused it.
    await OutboxMail.create({
      to,
      subject: "Your offer was chosen",
      text: "Hello,\n\nThe buyer chose your offer.",
      html: null,
      status: "failed",
      attempts: MAX_ATTEMPTS,
      lastError: "connect ECONNREFUSED 127.0.0.1:25",
      sentAt: null,
      jobId: randomUUID(),
    });

    const app = await startBrowserApp();
    onTestFinished(() => app.close());
    const page = await app.newPage();
    await page.setViewportSize({ width: 1366, height: 768 });
    await signInAs(page, admin.email, PASSWORD);
    await page.waitForURL("**/admin/users");
    await page.goto("/admin/mail");
    const failedRow = page.getByRole("row").filter({ hasText: to });
    await expect.poll(() => failedRow.textContent()).toContain("connect ECONNREFUSED");

    // The server's cron runs the deadline check within the minute; the page says when it last finished.
    // pg-boss looks at its schedules every 30 s (its first look, as the server starts, comes before
    // the schedules are made), then its send and work queues poll every 5 s: up to ~45 s on a quiet
    // machine, more on a loaded one.
    const deadlines = page.getByRole("row").filter({ hasText: "Bid deadlines passing" });
    await expect
      .poll(
        async () => {
          await page.reload();
          return deadlines.textContent();
        },
        { timeout: 120_000, interval: 2_000 },
      )
      .toMatch(/every minute\d+ \w+ \d{4}, \d\d:\d\d UTC/);
    await page.screenshot({ path: path.join(SCREENSHOTS, "admin-mail.png"), fullPage: true });

    await failedRow.getByRole("button", { name: "Send again" }).click();
    await expect.poll(() => page.getByText(`The mail to ${to} is queued again.`).count()).toBe(1);
    const mail = await waitForMail(to, "Your offer was chosen", 15_000);
    expect(mail.text).toContain("The buyer chose your offer.");
    await expect.poll(async () => (await OutboxMail.findOne({ where: { to }, rejectOnEmpty: true })).status).toBe("sent");
    await page.context().close();
  });
});
