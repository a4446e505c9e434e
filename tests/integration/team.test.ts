import { describe, expect, it } from "vitest";
import * as team from "~/routes/team";
import * as join from "~/routes/join";
import * as revoke from "~/routes/team.revoke-invitation";
import { Invitation, User } from "~/models/index.server";
import { linkIn, waitForMail } from "../support/mailbox";
import { deliverDueMail } from "~/services/mail.server";
import { makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { popToast } from "~/auth/session.server";

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

  it("answers an address with an account elsewhere as any other, and tells its owner instead of the inviter", async () => {
    const inviter = await makeMember("buyer");
    const existing = await makeMember("shop");
    const newcomer = uniqueEmail("newcomer");
    const visitor = await signedIn(inviter);
    const known = await visitor.post(team.action, "/team", { email: existing.email });
    const knownToast = (await popToast(visitor.request("/team"))).toast;
    const fresh = await visitor.post(team.action, "/team", { email: newcomer });
    const freshToast = (await popToast(visitor.request("/team"))).toast;
    expect([known.status, known.location]).toEqual([302, "/team"]);
    expect([fresh.status, fresh.location]).toEqual([302, "/team"]);
    expect(knownToast).toBe(`Invitation sent to ${existing.email}.`);
    expect(freshToast).toBe(`Invitation sent to ${newcomer}.`);
    // Both wait for an answer on the team page alike.
    const page = await visitor.get(team.loader, "/team");
    expect(page.data.invitations.map((i: { email: string }) => i.email).sort()).toEqual([existing.email, newcomer].sort());

    await deliverDueMail(100);
    const notice = await waitForMail(existing.email, "invited you");
    expect(notice.text).toMatch(/already has a Tenderflow account with another organisation/);
    expect(notice.text).not.toMatch(/\/join\//);
    expect(linkIn(await waitForMail(newcomer, "invited you"), "/join/")).toBeTruthy();
    expect((await existing.reload()).organisationId).not.toBe(inviter.organisationId);
  });

  it("says plainly when the person is in the team already, and refuses a malformed address", async () => {
    const inviter = await makeMember("buyer");
    const visitor = await signedIn(inviter);
    const self = await visitor.post(team.action, "/team", { email: inviter.email });
    expect(self.status).toBe(400);
    expect(self.data.error.email[0]).toMatch(/already in your team/);
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
