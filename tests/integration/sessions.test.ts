// Sessions are rows in PostgreSQL: each one ends on sign-out, on a password reset, on
// deactivation, on "sign out everywhere", after idling and at its maximum age, and a cookie
// that names an ended session opens nothing, even replayed by hand.
import { describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as signOut from "~/routes/sign-out";
import * as forgot from "~/routes/forgot-password";
import * as reset from "~/routes/reset-password";
import * as settings from "~/routes/settings";
import * as specs from "~/routes/specs";
import * as adminUsers from "~/routes/admin.users";
import { popToast } from "~/auth/session.server";
import { User, UserSession } from "~/models/index.server";
import { deliverDueMail } from "~/services/mail.server";
import { linkIn, waitForMail } from "../support/mailbox";
import { PASSWORD, makeMember, makeOperatorUser } from "../support/factories";
import { Visitor, call } from "../support/routes";
import { signInAs } from "../support/sessions";

/** Signs in through the page; returns the browser and the cookie it was given. */
/** A signed-in browser and the session cookie it holds, for tests that replay or compare cookies. */
async function signedIn(user: User) {
  const visitor = new Visitor();
  const res = await signInAs(visitor, user);
  return { visitor, cookie: res.setCookie!.split(";")[0] };
}

/** Opens /specs with exactly this cookie, as a copied cookie would be replayed. */
const replay = (cookie: string) => call(specs.loader, new Request("http://127.0.0.1:3000/specs", { headers: { Cookie: cookie } }));

const refused = (res: { status: number; location: string | null }) => {
  expect(res.status).toBe(302);
  expect(res.location).toBe("/sign-in?redirectTo=%2Fspecs");
};

describe("server-side sessions", () => {
  it("keeps only a random id in the cookie and its hash in the database", async () => {
    const user = await makeMember("buyer");
    const { cookie } = await signedIn(user);
    const rows = await UserSession.findAll({ where: { userId: user.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0].id).toMatch(/^[0-9a-f]{64}$/);
    expect(decodeURIComponent(cookie)).not.toContain(rows[0].id);
    expect(decodeURIComponent(cookie)).not.toContain(user.id);
    expect((await replay(cookie)).status).toBe(200);
  });

  it("refuses a cookie replayed after sign-out", async () => {
    const user = await makeMember("buyer");
    const { visitor, cookie } = await signedIn(user);
    await visitor.post(signOut.action, "/sign-out", {});
    const res = await replay(cookie);
    refused(res);
    expect(res.setCookie).toMatch(/Expires=Thu, 01 Jan 1970/i); // and the browser is told to drop it
  });

  it("issues a new session id at sign-in, so an id planted earlier is worth nothing", async () => {
    const user = await makeMember("buyer");
    const first = await signedIn(user);
    const again = await call(
      signIn.action,
      first.visitor.request("/sign-in", { method: "POST", body: new URLSearchParams({ email: user.email, password: PASSWORD }) }),
    );
    const second = again.setCookie!.split(";")[0];
    expect(second).not.toBe(first.cookie);
    refused(await replay(first.cookie));
    expect((await replay(second)).status).toBe(200);
  });

  it("ends every session of the account when its password is reset", async () => {
    const user = await makeMember("buyer");
    const elsewhere = await signedIn(user);
    const laptop = await signedIn(user);
    await new Visitor().post(forgot.action, "/forgot-password", { email: user.email });
    await deliverDueMail(100);
    const link = new URL(linkIn(await waitForMail(user.email, "Reset your Tenderflow password"), "/reset-password/"));
    const token = link.pathname.split("/").pop()!;
    const resetter = new Visitor();
    const done = await resetter.post(reset.action, link.pathname, { password: "a-brand-new-password", confirm: "a-brand-new-password" }, { token });
    expect(done.status).toBe(302);

    refused(await replay(elsewhere.cookie));
    refused(await elsewhere.visitor.get(specs.loader, "/specs"));
    refused(await laptop.visitor.get(specs.loader, "/specs"));
    expect((await resetter.get(specs.loader, "/specs")).status).toBe(200); // the browser that reset it is signed in
  });

  it("ends every session of a deactivated user, and reactivating brings none back", async () => {
    const admin = await signedIn(await makeOperatorUser("admin"));
    const user = await makeMember("buyer");
    const browser = await signedIn(user);
    const off = await admin.visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: user.id, active: "false" });
    expect(off.status).toBe(302);
    expect(await UserSession.count({ where: { userId: user.id, revokedAt: null } })).toBe(0);
    await admin.visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: user.id, active: "true" });
    expect((await user.reload()).active).toBe(true);
    refused(await replay(browser.cookie));
    expect((await signedIn(user)).visitor.signedIn).toBe(true); // signing in afresh works
  });

  it("signs out everywhere from the settings, this browser included, and says so on the sign-in page", async () => {
    const user = await makeMember("shop");
    const phone = await signedIn(user);
    const desk = await signedIn(user);
    const page = await desk.visitor.get(settings.loader, "/settings");
    expect(page.data.sessions).toHaveLength(2);
    expect(page.data.sessions.filter((s: { current: boolean }) => s.current)).toHaveLength(1);

    const res = await desk.visitor.post(settings.action, "/settings", { intent: "sign-out-everywhere" });
    expect(res.status).toBe(302);
    expect(res.location).toBe("/sign-in");
    const { toast } = await popToast(desk.visitor.request("/sign-in"));
    expect(toast).toMatch(/signed out on every browser/);
    refused(await replay(desk.cookie));
    refused(await replay(phone.cookie));
    expect(await UserSession.count({ where: { userId: user.id, revokedAt: null } })).toBe(0);
  });

  it("ends a session left idle longer than SESSION_IDLE_MINUTES, and one past its maximum age", async () => {
    const user = await makeMember("buyer");
    const idle = await signedIn(user);
    const busy = await signedIn(user);
    const old = await signedIn(user);
    const [idleRow, busyRow, oldRow] = await UserSession.findAll({ where: { userId: user.id }, order: [["createdAt", "ASC"]] });
    const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000);
    await idleRow.update({ lastSeenAt: minutesAgo(121) }); // the default is 120 minutes
    await busyRow.update({ lastSeenAt: minutesAgo(119) });
    await oldRow.update({ expiresAt: minutesAgo(1) });

    refused(await replay(idle.cookie));
    refused(await replay(old.cookie));
    expect((await replay(busy.cookie)).status).toBe(200);
    // The request counted as activity, so the busy session has two more hours.
    expect((await busyRow.reload()).lastSeenAt.getTime()).toBeGreaterThan(Date.now() - 60_000);
  });

  it("writes last_seen_at at most once a minute, not on every request", async () => {
    const user = await makeMember("buyer");
    const { cookie } = await signedIn(user);
    const row = await UserSession.findOne({ where: { userId: user.id }, rejectOnEmpty: true });
    const recent = new Date(Date.now() - 30_000);
    await row.update({ lastSeenAt: recent });
    await replay(cookie);
    expect((await row.reload()).lastSeenAt.getTime()).toBe(recent.getTime());
    const stale = new Date(Date.now() - 90_000);
    await row.update({ lastSeenAt: stale });
    await replay(cookie);
    expect((await row.reload()).lastSeenAt.getTime()).toBeGreaterThan(stale.getTime());
  });

  it("ignores a cookie that is not one of ours", async () => {
    const forged = await replay("tenderflow=not-a-signed-value");
    expect(forged.status).toBe(302);
    const foreign = await replay("__tenderflow=eyJ1c2VySWQiOiJ4In0%3D.abc");
    expect(foreign.status).toBe(302);
  });
});
