import { describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as team from "~/routes/team";
import * as join from "~/routes/join";
import * as revoke from "~/routes/team.revoke-invitation";
import { Invitation, User } from "~/models/index.server";
import { linkIn, waitForMail } from "../support/mailbox";
import { deliverDueMail } from "~/services/mail.server";
import { PASSWORD, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";

async function signedIn(user: User) {
  const visitor = new Visitor();
  await visitor.post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD });
  return visitor;
}

describe("inviting a colleague", () => {
  it("e-mails an invitation whose link makes the colleague a member of the same organisation", async () => {
    const inviter = await makeMember("shop");
    const visitor = await signedIn(inviter);
    const email = uniqueEmail("colleague");
    const res = await visitor.post(team.action, "/team", { email });
    expect(res.status).toBe(302);

    // The request only queued the invitation; the mail worker sends it.
    await deliverDueMail(100);
    const mail = await waitForMail(email, "invited you");
    const link = new URL(linkIn(mail, "/join/"));
    const token = link.pathname.split("/").pop()!;
    const newcomer = new Visitor();
    const page = await newcomer.get(join.loader, link.pathname, { token });
    expect(page.data.invitation).toMatchObject({ email, role: "shop" });

    const accepted = await newcomer.post(join.action, link.pathname, { name: "Ines Duarte", password: "her-own-password" }, { token });
    expect(accepted.status).toBe(302);
    expect(accepted.location).toBe("/open-specs");
    const colleague = await User.findOne({ where: { email } });
    expect(colleague?.organisationId).toBe(inviter.organisationId);
    expect(colleague?.role).toBe("shop");

    // The link works once.
    expect((await new Visitor().get(join.loader, link.pathname, { token })).data.invitation).toBeNull();
    const twice = await new Visitor().post(join.action, link.pathname, { name: "Someone", password: "another-password" }, { token });
    expect(twice.status).toBe(400);
  });

  it("refuses an address that already has an account, and a malformed one", async () => {
    const inviter = await makeMember("buyer");
    const existing = await makeMember("shop");
    const visitor = await signedIn(inviter);
    const dupe = await visitor.post(team.action, "/team", { email: existing.email });
    expect(dupe.status).toBe(400);
    expect(dupe.data.error.email[0]).toMatch(/already has a Tenderflow account/);
    const bad = await visitor.post(team.action, "/team", { email: "not an address" });
    expect(bad.status).toBe(400);
    expect(bad.data.error.email).toBeDefined();
    expect(await Invitation.count({ where: { organisationId: inviter.organisationId } })).toBe(0);
  });

  it("does not let a buyer or shop invite someone as an admin", async () => {
    const inviter = await makeMember("buyer");
    const res = await (await signedIn(inviter)).post(team.action, "/team", { email: uniqueEmail(), role: "admin" });
    expect(res.status).toBe(400);
    expect(res.data.error.role[0]).toMatch(/does not belong/);
  });

  it("lets an admin invite an account manager into the operator organisation", async () => {
    const admin = await makeOperatorUser("admin");
    const email = uniqueEmail("manager");
    await (await signedIn(admin)).post(team.action, "/team", { email, role: "account_manager" });
    const invitation = await Invitation.findOne({ where: { email } });
    expect(invitation?.role).toBe("account_manager");
    expect(invitation?.organisationId).toBe(admin.organisationId);
  });

  it("revokes an invitation of one's own organisation; another organisation's is not found", async () => {
    const owner = await makeMember("buyer");
    const stranger = await makeMember("buyer");
    const email = uniqueEmail("revoked");
    await (await signedIn(owner)).post(team.action, "/team", { email });
    const invitation = await Invitation.findOne({ where: { email }, rejectOnEmpty: true });

    const foreign = await (await signedIn(stranger)).post(revoke.action, "/x", {}, { invitationId: invitation.id });
    expect(foreign.status).toBe(404);
    expect((await invitation.reload()).revokedAt).toBeNull();

    const forged = await (await signedIn(owner)).post(revoke.action, "/x", {}, { invitationId: "not-a-uuid" });
    expect(forged.status).toBe(404);

    const own = await (await signedIn(owner)).post(revoke.action, "/x", {}, { invitationId: invitation.id });
    expect(own.status).toBe(302);
    expect((await invitation.reload()).revokedAt).not.toBeNull();
  });
});
