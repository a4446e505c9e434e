// The audit log: entries keep their own copy of who and what, so they outlive the records they
// name, and what someone typed is bounded and cleaned before it is kept.
import { describe, expect, it } from "vitest";
import { AuditEvent } from "~/models/audit.server";
import { Organisation, User, sequelize } from "~/models/index.server";
import { recordAudit } from "~/services/audit.server";
import { makeMember, makeOperatorUser } from "../support/factories";

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
