// The audit log: entries keep their own copy of who and what, so they outlive the records they
// name, and what someone typed is bounded and cleaned before it is kept.
import { describe, expect, it } from "vitest";
import { AuditEvent } from "~/models/audit.server";
import { Organisation, User, sequelize } from "~/models/index.server";
import { recordAudit } from "~/services/audit.server";
import * as signIn from "~/routes/sign-in";
import * as adminUsers from "~/routes/admin.users";
import * as adminOrgs from "~/routes/admin.organisations";
import * as adminAudit from "~/routes/admin.audit";
import { listAuditEvents } from "~/services/audit-log.server";
import { SIGN_IN_LIMITS } from "~/services/throttle.server";
import { awardedJob } from "../support/awards";
import { PASSWORD, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

describe("recordAudit", () => {
  it("keeps the names it was given when the people and records change or go", async () => {
    const admin = await makeOperatorUser("admin");
    const shop = await makeMember("shop", { organisationName: "Kestrel Fluid Works" });
    const organisation = await Organisation.findByPk(shop.organisationId, { rejectOnEmpty: true });
    await sequelize.transaction((transaction) =>
      recordAudit(
        {
          actor: admin,
          action: "shop-approved",
          subject: { type: "organisation", id: organisation.id, label: organisation.name },
          details: { note: "Known to us" },
        },
        transaction,
      ),
    );
    await User.destroy({ where: { id: shop.id } });
    await organisation.destroy();
    await admin.update({ name: "Renamed Admin" });
    const entry = await AuditEvent.findOne({ where: { subjectId: organisation.id }, rejectOnEmpty: true });
    expect(entry).toMatchObject({ action: "shop-approved", actorId: admin.id, subjectLabel: "Kestrel Fluid Works", details: { note: "Known to us" } });
    expect(entry.actorName).not.toBe("Renamed Admin");
  });

  it("is written with the transaction it belongs to, and not when that transaction fails", async () => {
    const admin = await makeOperatorUser("admin");
    await expect(
      sequelize.transaction(async (transaction) => {
        await recordAudit({ actor: admin, action: "role-changed", subject: { type: "user", id: admin.id, label: admin.name } }, transaction);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await AuditEvent.count({ where: { actorId: admin.id } })).toBe(0);
  });

  it("bounds and cleans a typed address and long details", async () => {
    const typed = `someone\u0000@example.test${"x".repeat(400)}`;
    await recordAudit({ actor: { typedEmail: typed }, action: "sign-in-failed", details: { reason: "y".repeat(1000) } });
    const entry = await AuditEvent.findOne({ where: { action: "sign-in-failed" }, order: [["at", "DESC"]], rejectOnEmpty: true });
    expect(entry.actorEmail).toHaveLength(254);
    expect(entry.actorEmail).not.toContain("\u0000");
    expect(entry.actorId).toBeNull();
    expect(String(entry.details.reason)).toHaveLength(300);
  });
});

/** The entries about one subject or actor, oldest first, as action names. */
const actionsOn = async (where: Record<string, string>) => (await AuditEvent.findAll({ where, order: [["at", "ASC"]] })).map((e) => e.action);

describe("what the audit log records", () => {
  it("a sign-in, and a failed one with the address typed but never the password", async () => {
    const buyer = await makeMember("buyer");
    await signedIn(buyer);
    expect(await actionsOn({ actorId: buyer.id })).toEqual(["sign-in"]);
    const res = await new Visitor().post(signIn.action, "/sign-in", { email: buyer.email, password: "a-wrong-password-here" });
    expect(res.status).toBe(400);
    const failed = await AuditEvent.findOne({ where: { action: "sign-in-failed", actorEmail: buyer.email }, rejectOnEmpty: true });
    expect(failed.actorId).toBeNull();
    expect(JSON.stringify(failed.toJSON())).not.toContain("a-wrong-password-here");
  });

  it("a sign-in refused by the rate limit, like a failed one, the password neither compared nor kept", async () => {
    const buyer = await makeMember("buyer");
    const attempt = (password: string) => new Visitor().post(signIn.action, "/sign-in", { email: buyer.email, password });
    for (let i = 0; i < SIGN_IN_LIMITS.perAccountClient; i++) expect((await attempt(`wrong-password-${i}`)).status).toBe(400);
    expect((await attempt(PASSWORD)).status).toBe(429);
    const refused = await AuditEvent.findAll({ where: { action: "sign-in-failed", actorEmail: buyer.email, details: { reason: "throttled" } } });
    expect(refused).toHaveLength(1);
    expect(refused[0].actorId).toBeNull();
    expect(JSON.stringify(refused[0].toJSON())).not.toContain(PASSWORD);
  });

  it("role changes, deactivations, assignments and shop decisions, by the admin who made them", async () => {
    const admin = await makeOperatorUser("admin");
    const visitor = await signedIn(admin);
    const manager = await makeOperatorUser("account_manager");
    const change = { intent: "change-role", userId: manager.id, role: "admin", confirm: "yes", currentPassword: PASSWORD };
    expect((await visitor.post(adminUsers.action, "/admin/users", change)).status).toBe(302);
    expect((await visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: manager.id, active: "false" })).status).toBe(302);
    expect(await actionsOn({ subjectId: manager.id })).toEqual(["role-changed", "user-deactivated"]);
    const role = await AuditEvent.findOne({ where: { subjectId: manager.id, action: "role-changed" }, rejectOnEmpty: true });
    expect(role).toMatchObject({ actorId: admin.id, details: { from: "account_manager", to: "admin" } });

    const shop = await makeMember("shop", { pending: true });
    const refuse = { intent: "refuse", organisationId: shop.organisationId, reason: "Not a fluid-power business" };
    expect((await visitor.post(adminOrgs.action, "/admin/organisations", refuse)).status).toBe(302);
    expect((await visitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: shop.organisationId })).status).toBe(302);
    expect(await actionsOn({ subjectId: shop.organisationId })).toEqual(["shop-refused", "shop-approved"]);

    const buyer = await makeMember("buyer");
    const other = await makeOperatorUser("account_manager");
    const assign = { organisationId: buyer.organisationId, managerId: other.id };
    expect((await visitor.post(adminOrgs.action, "/admin/organisations", assign)).status).toBe(302);
    const assigned = await AuditEvent.findOne({ where: { subjectId: buyer.organisationId }, rejectOnEmpty: true });
    expect(assigned).toMatchObject({ action: "account-manager-assigned", details: { manager: other.name } });
  });

  it("an award, by the buyer, with the shop and the price", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop", { organisationName: "Harrow Hydraulics" });
    const job = await awardedJob(buyer, shop);
    const award = await AuditEvent.findOne({ where: { action: "bid-awarded", subjectId: job.specId }, rejectOnEmpty: true });
    expect(award).toMatchObject({ actorId: buyer.id, details: { shop: "Harrow Hydraulics", jobId: job.id } });
  });
});

describe("the admin's audit log page", () => {
  it("filters by kind, by who and by days, newest first, and says which filter it could not read", async () => {
    const admin = await makeOperatorUser("admin");
    const visitor = await signedIn(admin);
    const someone = await makeMember("buyer", { email: uniqueEmail("wren.talbot") });
    await signedIn(someone);
    await AuditEvent.create({
      action: "sign-in",
      actorId: someone.id,
      actorName: someone.name,
      actorEmail: someone.email,
      subjectType: null,
      subjectId: null,
      subjectLabel: null,
      details: {},
      at: new Date("2025-01-10T12:00:00Z"),
    });

    const mine = await visitor.get(adminAudit.loader, `/admin/audit?action=sign-in&actor=wren.talbot`);
    expect(mine.status).toBe(200);
    expect(mine.data.entries.map((e: { actorEmail: string }) => e.actorEmail)).toEqual([someone.email, someone.email]);
    const january = await visitor.get(adminAudit.loader, `/admin/audit?actor=wren.talbot&from=2025-01-10&to=2025-01-10`);
    expect(january.data.entries).toHaveLength(1);
    expect(january.data.entries[0].at).toBe("2025-01-10T12:00:00.000Z");

    const impossible = await visitor.get(adminAudit.loader, `/admin/audit?actor=wren.talbot&from=2025-02-30&to=2025-01-01x`);
    expect(impossible.status).toBe(200);
    expect(impossible.data.problems.from).toMatch(/not a date on the calendar/);
    expect(impossible.data.problems.to).toMatch(/year-month-day/);
    // The filters it could read still apply.
    expect(impossible.data.entries).toHaveLength(2);
    const backwards = await visitor.get(adminAudit.loader, `/admin/audit?from=2025-03-01&to=2025-01-01`);
    expect(backwards.data.problems.to).toMatch(/on or after/);
    const odd = await visitor.get(adminAudit.loader, `/admin/audit?action=drop-table&page=-3&actor=${"x".repeat(300)}`);
    expect(odd.status).toBe(200);
    expect(odd.data.problems).toMatchObject({ action: expect.any(String), actor: expect.any(String) });
  });

  it("is the admins' only: an account manager gets 403 from the page and the service", async () => {
    const manager = await makeOperatorUser("account_manager");
    expect((await (await signedIn(manager)).get(adminAudit.loader, "/admin/audit")).status).toBe(403);
    await expect(listAuditEvents(manager, {})).rejects.toMatchObject({ init: { status: 403 } });
  });
});
