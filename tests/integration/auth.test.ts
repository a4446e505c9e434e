import { describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as signUp from "~/routes/sign-up";
import * as signUpConfirm from "~/routes/sign-up-confirm";
import * as signOut from "~/routes/sign-out";
import * as forgot from "~/routes/forgot-password";
import * as reset from "~/routes/reset-password";
import * as specs from "~/routes/specs";
import { Organisation, SignUpRequest, User } from "~/models/index.server";
import { deliverDueMail } from "~/services/mail.server";
import { linkIn, mailsTo, waitForMail } from "../support/mailbox";
import { PASSWORD, makeMember, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

const signUpFields = (email: string) => ({
  kind: "buyer",
  organisationName: "Fenwick Press Tools",
  name: "Rhea Fenwick",
  email,
  password: PASSWORD,
});

/** Follows the link of the sign-up mail to `email` and presses "Create my account". */
async function finishSignUp(visitor: Visitor, email: string) {
  await deliverDueMail(100);
  const link = new URL(linkIn(await waitForMail(email, "Finish creating your Tenderflow account"), "/sign-up/"));
  const token = link.pathname.split("/").pop()!;
  const page = await visitor.get(signUpConfirm.loader, link.pathname, { token });
  return { link, token, page, done: await visitor.post(signUpConfirm.action, link.pathname, {}, { token }) };
}

describe("sign up", () => {
  it("mails a link that creates the organisation and its first user, signs them in and lands on their home", async () => {
    const visitor = new Visitor();
    const email = uniqueEmail("signup");
    const res = await visitor.post(signUp.action, "/sign-up", signUpFields(email.toUpperCase()));
    expect(res.status).toBe(200);
    expect(res.data.sentTo).toBe(email);
    expect(visitor.signedIn).toBe(false);
    expect(await User.count({ where: { email } })).toBe(0); // nothing exists until the link is used

    const { link, token, page, done } = await finishSignUp(visitor, email);
    expect(page.data.pending).toMatchObject({ email, organisationName: "Fenwick Press Tools", kind: "buyer" });
    expect(done.status).toBe(302);
    expect(done.location).toBe("/specs");
    expect(visitor.signedIn).toBe(true);
    const user = await User.findOne({ where: { email }, include: [{ model: Organisation, as: "organisation" }] });
    expect(user?.role).toBe("buyer");
    expect(user?.organisation?.kind).toBe("buyer");
    expect(user?.passwordHash).toMatch(/^\$2[aby]\$1\d\$/); // bcrypt, cost >= 10
    expect((await visitor.get(specs.loader, "/specs")).status).toBe(200);
    // The password chosen on the form is the one that signs in.
    expect((await new Visitor().post(signIn.action, "/sign-in", { email, password: PASSWORD })).status).toBe(302);

    // The link works once.
    expect((await new Visitor().get(signUpConfirm.loader, link.pathname, { token })).data.pending).toBeNull();
    const again = await new Visitor().post(signUpConfirm.action, link.pathname, {}, { token });
    expect(again.status).toBe(400);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it("answers an address that has an account exactly as a new one, and mails its owner instead", async () => {
    const owner = await makeMember("shop");
    const newcomer = uniqueEmail("fresh");
    const organisations = await Organisation.count();
    const known = await new Visitor().post(signUp.action, "/sign-up", { ...signUpFields(owner.email), organisationName: "Another Ltd" });
    const fresh = await new Visitor().post(signUp.action, "/sign-up", { ...signUpFields(newcomer), organisationName: "Another Ltd" });
    // The same status, headers and body, but for the address the visitor typed.
    expect(known.status).toBe(fresh.status);
    expect(known.setCookie).toBeNull();
    expect(fresh.setCookie).toBeNull();
    expect(JSON.stringify(known.data).replaceAll(owner.email, "ADDRESS")).toBe(JSON.stringify(fresh.data).replaceAll(newcomer, "ADDRESS"));
    expect(await Organisation.count()).toBe(organisations);
    expect(await SignUpRequest.count({ where: { email: owner.email } })).toBe(0);

    await deliverDueMail(100);
    const notice = await waitForMail(owner.email, "Someone tried to sign up");
    expect(notice.text).toContain("/forgot-password");
    expect(notice.text).not.toMatch(/\/sign-up\//);
    await waitForMail(newcomer, "Finish creating your Tenderflow account");
  });

  it("refuses a second link for an address that got its account meanwhile", async () => {
    const email = uniqueEmail("twice");
    await new Visitor().post(signUp.action, "/sign-up", signUpFields(email));
    await new Visitor().post(signUp.action, "/sign-up", { ...signUpFields(email), organisationName: "Second Try Ltd" });
    await deliverDueMail(100);
    const links = (await mailsTo(email)).map((m) => new URL(linkIn(m, "/sign-up/")));
    expect(links).toHaveLength(2);
    const tokens = links.map((l) => l.pathname.split("/").pop()!);
    expect((await new Visitor().post(signUpConfirm.action, links[0].pathname, {}, { token: tokens[0] })).status).toBe(302);
    const second = await new Visitor().post(signUpConfirm.action, links[1].pathname, {}, { token: tokens[1] });
    expect(second.status).toBe(400);
    expect(second.data.errors[0]).toMatch(/already exists/);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it.each([
    ["empty fields", { kind: "", organisationName: "", name: "", email: "", password: "" }, ["kind", "organisationName", "name", "email", "password"]],
    ["an overlong company name", { ...signUpFields("long@example.test"), organisationName: "x".repeat(121) }, ["organisationName"]],
    ["a malformed e-mail", { ...signUpFields("not-an-email"), email: "not-an-email" }, ["email"]],
    ["a short password", { ...signUpFields("short@example.test"), password: "short" }, ["password"]],
    ["an unknown kind", { ...signUpFields("kind@example.test"), kind: "admin" }, ["kind"]],
  ])("gives field errors for %s and stores nothing", async (_label, fields, errored) => {
    const before = await SignUpRequest.count();
    const res = await new Visitor().post(signUp.action, "/sign-up", fields as Record<string, string>);
    expect(res.status).toBe(400);
    expect(Object.keys(res.data.result.error).sort()).toEqual([...errored].sort());
    expect(await SignUpRequest.count()).toBe(before);
  });
});

describe("sign in and out", () => {
  it("signs in with the right password and returns to the address it came from", async () => {
    const user = await makeMember("shop");
    const visitor = new Visitor();
    const res = await visitor.post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD, redirectTo: "/team" });
    expect(res.status).toBe(302);
    expect(res.location).toBe("/team");
    expect(visitor.signedIn).toBe(true);
  });

  it("ignores a return address on another site", async () => {
    const user = await makeMember("shop");
    const res = await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD, redirectTo: "//evil.test/x" });
    expect(res.location).toBe("/open-specs");
  });

  it("shows an error for a wrong password and starts no session", async () => {
    const user = await makeMember("buyer");
    const visitor = new Visitor();
    const res = await visitor.post(signIn.action, "/sign-in", { email: user.email, password: "wrong-password-here" });
    expect(res.status).toBe(400);
    expect(res.data.error[""]).toEqual(["The e-mail address or password is not right."]);
    expect(res.data.initialValue.password).toBeUndefined(); // the password is not echoed back
    expect(visitor.signedIn).toBe(false);
  });

  it("gives the same answer for an unknown e-mail", async () => {
    const res = await new Visitor().post(signIn.action, "/sign-in", { email: uniqueEmail("nobody"), password: PASSWORD });
    expect(res.status).toBe(400);
    expect(res.data.error[""]).toEqual(["The e-mail address or password is not right."]);
  });

  it("refuses a deactivated user, and drops the session of one deactivated while signed in", async () => {
    const user = await makeMember("buyer");
    const visitor = await signedIn(user);
    await user.update({ active: false });
    const page = await visitor.get(specs.loader, "/specs");
    expect(page.status).toBe(302);
    expect(page.location).toBe("/sign-in?redirectTo=%2Fspecs");
    expect(visitor.signedIn).toBe(false);
    const res = await visitor.post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD });
    expect(res.status).toBe(400);
    expect(res.data.error[""]).toEqual(["This account has been deactivated."]);
    expect(visitor.signedIn).toBe(false);
  });

  it("signs out", async () => {
    const user = await makeMember("buyer");
    const visitor = await signedIn(user);
    const res = await visitor.post(signOut.action, "/sign-out", {});
    expect(res.location).toBe("/sign-in");
    expect(visitor.signedIn).toBe(false);
    expect((await visitor.get(specs.loader, "/specs")).status).toBe(302);
  });

  it("sends a signed-in user away from the sign-in page to their home", async () => {
    const user = await makeMember("shop");
    const visitor = await signedIn(user);
    const res = await visitor.get(signIn.loader, "/sign-in");
    expect(res.location).toBe("/open-specs");
  });
});

describe("password reset by e-mail", () => {
  it("mails a link that sets a new password once", async () => {
    const user = await makeMember("buyer");
    const res = await new Visitor().post(forgot.action, "/forgot-password", { email: user.email });
    expect(res.data.sent).toBe(true);
    await deliverDueMail();
    const mail = await waitForMail(user.email, "Reset your Tenderflow password");
    const link = new URL(linkIn(mail, "/reset-password/"));
    const token = link.pathname.split("/").pop()!;

    const visitor = new Visitor();
    expect((await visitor.get(reset.loader, link.pathname, { token })).data.usable).toBe(true);
    const done = await visitor.post(reset.action, link.pathname, { password: "a-brand-new-password", confirm: "a-brand-new-password" }, { token });
    expect(done.status).toBe(302);
    expect(visitor.signedIn).toBe(true);

    // The old password no longer works, the new one does.
    expect((await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD })).status).toBe(400);
    expect((await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: "a-brand-new-password" })).status).toBe(302);

    // The link works once.
    expect((await new Visitor().get(reset.loader, link.pathname, { token })).data.usable).toBe(false);
    const again = await new Visitor().post(reset.action, link.pathname, { password: "yet-another-password", confirm: "yet-another-password" }, { token });
    expect(again.status).toBe(400);
    expect(again.data.error[""][0]).toMatch(/expired or was already used/);
    expect((await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: "yet-another-password" })).status).toBe(400);
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    const email = uniqueEmail("ghost");
    const res = await new Visitor().post(forgot.action, "/forgot-password", { email });
    expect(res.data.sent).toBe(true);
    expect(await deliverDueMail()).toBe(0);
  });

  it("rejects two different new passwords", async () => {
    const res = await new Visitor().post(
      reset.action,
      "/reset-password/x",
      { password: "a-brand-new-password", confirm: "something-else-entirely" },
      { token: "x".repeat(43) },
    );
    expect(res.status).toBe(400);
    expect(res.data.error.confirm).toEqual(["The two passwords differ."]);
  });
});

describe("settings", () => {
  it("saves the person's name and unit system, and refuses an unknown system", async () => {
    const { loader, action } = await import("~/routes/settings");
    const user = await makeMember("buyer");
    const visitor = await signedIn(user);
    expect((await visitor.get(loader, "/settings")).data.unitSystem).toBe("metric");
    const saved = await visitor.post(action, "/settings", { name: "Rhea F.", unitSystem: "us" });
    expect(saved.status).toBe(302);
    expect((await user.reload()).unitSystem).toBe("us");
    expect(user.name).toBe("Rhea F.");
    const bad = await visitor.post(action, "/settings", { name: "", unitSystem: "imperial-ish" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.error).sort()).toEqual(["name", "unitSystem"]);
    expect((await user.reload()).unitSystem).toBe("us");
    expect((await new Visitor().get(loader, "/settings")).status).toBe(302);
  });
});
