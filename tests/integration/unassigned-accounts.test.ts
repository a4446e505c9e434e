// A new machine builder is not invisible: until an admin assigns it an account manager it is
// listed as unassigned on the admin's home and on every account manager's dashboard, and the
// admins are mailed when it signs up.
import { Op } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import * as adminUsers from "~/routes/admin.users";
import * as jobs from "~/routes/jobs";
import { Organisation, OutboxMail, type User } from "~/models/index.server";
import { signUp } from "~/services/accounts.server";
import { PASSWORD, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";
import type { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

let admin: User;
let adminVisitor: Visitor;
let manager: Visitor;

beforeAll(async () => {
  admin = await makeOperatorUser("admin");
  adminVisitor = await signedIn(admin);
  manager = await signedIn(await makeOperatorUser("account_manager"));
});

const listed = (outcome: { data: { unassigned: { accounts: { name: string }[] } | null } }) => outcome.data.unassigned?.accounts.map((a) => a.name) ?? [];

describe("unassigned machine builders", () => {
  it("are mailed to the admins, shown to the admin and every account manager, and leave the lists once assigned", async () => {
    const buyer = await signUp({
      kind: "buyer",
      organisationName: "Pellow Baling Machines",
      name: "Tamsin Pellow",
      email: uniqueEmail("tamsin"),
      password: PASSWORD,
    });
    const mail = await OutboxMail.findOne({ where: { to: admin.email, subject: "New machine builder without an account manager: Pellow Baling Machines" } });
    expect(mail?.text).toContain(buyer.email);
    // A shop is announced by its approval list, not by this mail.
    await signUp({ kind: "shop", organisationName: "Quay Fluid Power", name: "Ola Quay", email: uniqueEmail("ola"), password: PASSWORD });
    expect(await OutboxMail.count({ where: { to: admin.email, subject: { [Op.like]: "%Quay Fluid Power%" } } })).toBe(0);

    const home = await adminVisitor.get(adminUsers.loader, "/admin/users");
    expect(listed(home)).toContain("Pellow Baling Machines");
    expect(listed(home)).not.toContain("Quay Fluid Power");
    expect(home.data.unassigned.accounts.find((a: { name: string }) => a.name === "Pellow Baling Machines").people).toEqual([
      { name: "Tamsin Pellow", email: buyer.email },
    ]);
    expect(listed(await manager.get(jobs.loader, "/jobs"))).toContain("Pellow Baling Machines");
    const another = await signedIn(await makeOperatorUser("account_manager"));
    expect(listed(await another.get(jobs.loader, "/jobs"))).toContain("Pellow Baling Machines");
    // Buyers and shops are not shown other organisations.
    expect((await (await signedIn(await makeMember("buyer"))).get(jobs.loader, "/jobs")).data.unassigned).toBeNull();

    const chosen = (await adminVisitor.get(adminUsers.loader, "/admin/users")).data.managers[0].id;
    const empty = await adminVisitor.post(adminUsers.action, "/admin/users", { intent: "assign-manager", organisationId: buyer.organisationId, managerId: "" });
    expect(empty.status).toBe(400);
    expect(empty.data.error).toBe("Choose an account manager.");
    const assign = await adminVisitor.post(adminUsers.action, "/admin/users", {
      intent: "assign-manager",
      organisationId: buyer.organisationId,
      managerId: chosen,
    });
    expect(assign.status).toBe(302);
    expect((await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).accountManagerId).toBe(chosen);
    expect(listed(await adminVisitor.get(adminUsers.loader, "/admin/users"))).not.toContain("Pellow Baling Machines");
    expect(listed(await manager.get(jobs.loader, "/jobs"))).not.toContain("Pellow Baling Machines");
  });

  it("is assigned by admins only, to buyer organisations only", async () => {
    const buyer = await makeMember("buyer");
    const shop = await makeMember("shop");
    const managerId = (await adminVisitor.get(adminUsers.loader, "/admin/users")).data.managers[0].id;
    const post = (visitor: Visitor, organisationId: string) =>
      visitor.post(adminUsers.action, "/admin/users", { intent: "assign-manager", organisationId, managerId });
    expect((await post(manager, buyer.organisationId)).status).toBe(403);
    expect((await post(adminVisitor, shop.organisationId)).status).toBe(404);
    expect((await post(adminVisitor, "00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true })).accountManagerId).toBeNull();
  });
});
