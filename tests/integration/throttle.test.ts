// Brute force and mail floods: wrong passwords are counted per account and client, per account
// and per client; mail forms per client and per address. Blocks are short, say how long, and
// a reset by e-mail always gets the owner in.
import { beforeEach, describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as signUp from "~/routes/sign-up";
import * as forgot from "~/routes/forgot-password";
import * as reset from "~/routes/reset-password";
import * as team from "~/routes/team";
import { OutboxMail, PasswordReset, User, sequelize } from "~/models/index.server";
import { MAIL_LIMITS, SIGN_IN_LIMITS, Throttled, throttledPasswordCheck } from "~/services/throttle.server";
import { deliverDueMail } from "~/services/mail.server";
import { linkIn, mailsTo, waitForMail } from "../support/mailbox";
import { PASSWORD, makeMember, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

// Every test starts with no counts (all requests here come from the same client).
beforeEach(async () => {
  await sequelize.query("DELETE FROM rate_limits");
});

const attempt = (email: string, password: string) => new Visitor().post(signIn.action, "/sign-in", { email, password });
const formError = (res: { data: { error: Record<string, string[]> } }) => res.data.error[""][0];

describe("sign-in throttle", () => {
  it("answers the 6th attempt after 5 wrong passwords with 429, even with the right password, and lets the owner in after a reset", async () => {
    const user = await makeMember("buyer");
    for (let i = 0; i < SIGN_IN_LIMITS.perAccountClient; i++) {
      const wrong = await attempt(user.email, `wrong-password-${i}`);
      expect(wrong.status).toBe(400);
    }
    const right = await attempt(user.email, PASSWORD);
    expect(right.status).toBe(429);
    expect(formError(right)).toBe("Too many attempts for this account. Try again in 5 minutes, or reset your password by e-mail.");
    expect(Number(right.headers.get("Retry-After"))).toBeGreaterThan(240);
    expect(right.setCookie).toBeNull();

    // The reset link still works, signs the owner in, and the account's count starts over.
    await new Visitor().post(forgot.action, "/forgot-password", { email: user.email });
    await deliverDueMail(100);
    const link = new URL(linkIn(await waitForMail(user.email, "Reset your Tenderflow password"), "/reset-password/"));
    const owner = new Visitor();
    const done = await owner.post(
      reset.action,
      link.pathname,
      { password: "a-brand-new-password", confirm: "a-brand-new-password" },
      { token: link.pathname.split("/").pop()! },
    );
    expect(done.status).toBe(302);
    expect((await attempt(user.email, "a-brand-new-password")).status).toBe(302);
  });

  it("blocks for a short time only, longer after each new block, and a success clears the count", async () => {
    const user = await makeMember("shop");
    const fail = async (times: number) => {
      for (let i = 0; i < times; i++) await attempt(user.email, "not-the-password");
    };
    await fail(4);
    expect((await attempt(user.email, PASSWORD)).status).toBe(302); // 4 wrong, then right: in
    await fail(4);
    expect((await attempt(user.email, "not-the-password")).status).toBe(400); // the count started over
    expect(formError(await attempt(user.email, PASSWORD))).toMatch(/in 5 minutes/);

    // The block runs out (its time is moved into the past here) and the next one lasts longer.
    await sequelize.query("UPDATE rate_limits SET expire = 1 WHERE key LIKE 'signin-account-client:%'");
    await fail(5);
    const second = await attempt(user.email, PASSWORD);
    expect(second.status).toBe(429);
    expect(formError(second)).toMatch(/in 10 minutes/);
  });

  it("counts the same for an address with no account, so a block reveals nothing", async () => {
    const ghost = uniqueEmail("ghost");
    for (let i = 0; i < SIGN_IN_LIMITS.perAccountClient; i++) expect((await attempt(ghost, "whatever-it-is")).status).toBe(400);
    const res = await attempt(ghost, "whatever-it-is");
    expect(res.status).toBe(429);
    expect(formError(res)).toMatch(/^Too many attempts for this account/);
  });

  it("limits one client's wrong passwords across many accounts", async () => {
    const users = await Promise.all(Array.from({ length: 8 }, () => makeMember("buyer")));
    let failures = 0;
    for (const user of users) {
      for (let i = 0; i < 4 && failures < SIGN_IN_LIMITS.perClient; i++, failures++) {
        expect((await attempt(user.email, "guessing-again")).status).toBe(400);
      }
    }
    const fresh = await makeMember("buyer");
    const res = await attempt(fresh.email, PASSWORD);
    expect(res.status).toBe(429);
    expect(formError(res)).toMatch(/^Too many failed sign-ins from your network\. Try again in \d+ minutes?\.$/);
  });

  it("limits wrong passwords for one account from many clients, and only for a while", async () => {
    const email = uniqueEmail("target");
    const wrong = async () => null;
    // 4 clients x 5 guesses = 20: each client stays under its own limit, the account does not.
    for (let c = 0; c < 4; c++) {
      for (let i = 0; i < 5; i++) {
        if (c * 5 + i < SIGN_IN_LIMITS.perAccount) await throttledPasswordCheck(`203.0.113.${c}`, email, wrong).catch(() => null);
      }
    }
    const fromElsewhere = throttledPasswordCheck("198.51.100.7", email, async () => "signed in");
    await expect(fromElsewhere).rejects.toBeInstanceOf(Throttled);
    const rejection = (await fromElsewhere.catch((e: Throttled) => e)) as Throttled;
    expect(rejection.retryAfterS).toBeLessThanOrEqual(3600);
    // Another account from that client is not affected.
    await expect(throttledPasswordCheck("198.51.100.7", uniqueEmail("other"), async () => "signed in")).resolves.toBe("signed in");
  });
});

describe("mail throttle", () => {
  it("sends at most 3 reset links an hour to an address, answering the same each time", async () => {
    const user = await makeMember("buyer");
    const answers = [];
    for (let i = 0; i < 5; i++) answers.push(await new Visitor().post(forgot.action, "/forgot-password", { email: user.email }));
    expect(answers.map((a) => [a.status, a.data.sent])).toEqual(Array(5).fill([200, true]));
    expect(await PasswordReset.count({ where: { userId: user.id } })).toBe(MAIL_LIMITS.perAddressHour);
    expect(await OutboxMail.count({ where: { to: user.email, subject: "Reset your Tenderflow password" } })).toBe(MAIL_LIMITS.perAddressHour);
    await deliverDueMail(100);
    await waitForMail(user.email, "Reset your Tenderflow password");
    expect((await mailsTo(user.email)).filter((m) => m.subject.includes("Reset"))).toHaveLength(MAIL_LIMITS.perAddressHour);
  });

  it("caps sign-up mail to one address the same way, whether it has an account or not", async () => {
    const owner = await makeMember("shop");
    const fresh = uniqueEmail("fresh");
    const fields = (email: string) => ({ kind: "buyer", organisationName: "Eskdale Presses", name: "Ana Roe", email, password: PASSWORD });
    for (let i = 0; i < 5; i++) {
      const [known, unknown] = [
        await new Visitor().post(signUp.action, "/sign-up", fields(owner.email)),
        await new Visitor().post(signUp.action, "/sign-up", fields(fresh)),
      ];
      expect([known.status, unknown.status]).toEqual([200, 200]);
      expect(known.data.sentTo).toBe(owner.email);
    }
    expect(await OutboxMail.count({ where: { to: owner.email } })).toBe(MAIL_LIMITS.perAddressHour);
    expect(await OutboxMail.count({ where: { to: fresh } })).toBe(MAIL_LIMITS.perAddressHour);
  });

  it("limits one client's mail forms with a clear 429", async () => {
    for (let i = 0; i < MAIL_LIMITS.perClientHour; i++) {
      expect((await new Visitor().post(forgot.action, "/forgot-password", { email: uniqueEmail("flood") })).status).toBe(200);
    }
    const over = await new Visitor().post(forgot.action, "/forgot-password", { email: uniqueEmail("flood") });
    expect(over.status).toBe(429);
    expect(over.data.result.error[""][0]).toMatch(/^Too many requests from your network\. Try again in \d+ minutes?\.$/);
    const signUpOver = await new Visitor().post(signUp.action, "/sign-up", {
      kind: "buyer",
      organisationName: "X Ltd",
      name: "X",
      email: uniqueEmail(),
      password: PASSWORD,
    });
    expect(signUpOver.status).toBe(429);
    expect(await User.count({ where: { email: over.data.result.initialValue.email } })).toBe(0);
  });

  it("limits the invitations one person sends in an hour", async () => {
    const inviter = await makeMember("buyer");
    const visitor = await signedIn(inviter);
    for (let i = 0; i < MAIL_LIMITS.invitationsPerUserHour; i++) {
      expect((await visitor.post(team.action, "/team", { email: uniqueEmail("invitee") })).status).toBe(302);
    }
    const over = await visitor.post(team.action, "/team", { email: uniqueEmail("invitee") });
    expect(over.status).toBe(429);
    expect(over.data.error[""][0]).toMatch(/invitations in the last hour/);
  });
});
