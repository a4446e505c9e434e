import { beforeAll, describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as adminUsers from "~/routes/admin.users";
import * as adminOrgs from "~/routes/admin.organisations";
import * as accounts from "~/routes/accounts";
import { Organisation, type User } from "~/models/index.server";
import { PASSWORD, makeMember, makeOperatorUser } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

let admin: User;
let visitor: Visitor;

beforeAll(async () => {
  admin = await makeOperatorUser("admin");
  visitor = await signedIn(admin);
});

describe("admin: users", () => {
  it("searches by name, e-mail or organisation and pages through results", async () => {
    const target = await makeMember("shop", { organisationName: "Quillfield Hydraulic Works" });
    for (let i = 0; i < 21; i++) await makeMember("buyer");
    const found = await visitor.get(adminUsers.loader, "/admin/users?q=quillfield");
    expect(found.data.users.map((u: { id: string }) => u.id)).toEqual([target.id]);
    const wildcard = await visitor.get(adminUsers.loader, "/admin/users?q=%25");
    expect(wildcard.data.total).toBe(0); // a typed % is matched literally
    const first = await visitor.get(adminUsers.loader, "/admin/users");
    expect(first.data.users).toHaveLength(20);
    expect(first.data.pageCount).toBeGreaterThanOrEqual(2);
    const second = await visitor.get(adminUsers.loader, "/admin/users?page=2");
    expect(second.data.users.length).toBeGreaterThan(0);
    const ids = new Set(first.data.users.map((u: { id: string }) => u.id));
    expect(second.data.users.some((u: { id: string }) => ids.has(u.id))).toBe(false);
    const nonsense = await visitor.get(adminUsers.loader, "/admin/users?page=abc");
    expect(nonsense.data.page).toBe(1);
  });

  it("deactivates and reactivates a user", async () => {
    const user = await makeMember("buyer");
    const res = await visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: user.id, active: "false" });
    expect(res.status).toBe(302);
    expect((await user.reload()).active).toBe(false);
    const blocked = await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD });
    expect(blocked.status).toBe(400);
    await visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: user.id, active: "true" });
    expect((await new Visitor().post(signIn.action, "/sign-in", { email: user.email, password: PASSWORD })).status).toBe(302);
  });

  it("changes an operator's role once the admin types their own password, but never gives a buyer an operator role", async () => {
    const manager = await makeOperatorUser("account_manager");
    const change = { intent: "change-role", userId: manager.id, role: "admin" };
    const asked = await visitor.post(adminUsers.action, "/admin/users", change);
    expect(asked.status).toBe(400);
    expect(asked.data.confirm).toMatchObject({ userId: manager.id, name: manager.name, role: "admin" });
    expect(asked.data.confirm.passwordErrors).toBeUndefined();
    const empty = await visitor.post(adminUsers.action, "/admin/users", { ...change, confirm: "yes", currentPassword: "" });
    expect(empty.status).toBe(400);
    expect(empty.data.confirm.passwordErrors).toEqual(["Enter your password to confirm."]);
    const wrong = await visitor.post(adminUsers.action, "/admin/users", { ...change, confirm: "yes", currentPassword: "not-the-password" });
    expect(wrong.status).toBe(400);
    expect(wrong.data.confirm.passwordErrors).toEqual(["That is not your password."]);
    expect((await manager.reload()).role).toBe("account_manager");

    const promote = await visitor.post(adminUsers.action, "/admin/users", { ...change, confirm: "yes", currentPassword: PASSWORD });
    expect(promote.status).toBe(302);
    expect((await manager.reload()).role).toBe("admin");
    const buyer = await makeMember("buyer");
    const refused = await visitor.post(adminUsers.action, "/admin/users", {
      intent: "change-role",
      userId: buyer.id,
      role: "admin",
      confirm: "yes",
      currentPassword: PASSWORD,
    });
    expect(refused.status).toBe(400);
    expect(refused.data.confirm).toBeUndefined();
    expect((await buyer.reload()).role).toBe("buyer");
  });

  it("refuses to deactivate oneself, and rejects malformed changes", async () => {
    const self = await visitor.post(adminUsers.action, "/admin/users", { intent: "set-active", userId: admin.id, active: "false" });
    expect(self.status).toBe(400);
    expect((await admin.reload()).active).toBe(true);
    const junk = await visitor.post(adminUsers.action, "/admin/users", { intent: "explode", userId: "x" });
    expect(junk.status).toBe(400);
    const missing = await visitor.post(adminUsers.action, "/admin/users", {
      intent: "set-active",
      userId: "00000000-0000-4000-8000-000000000000",
      active: "false",
    });
    expect(missing.status).toBe(404);
  });
});

describe("admin: organisations and account managers", () => {
  it("assigns a buyer account to an account manager, who then sees it", async () => {
    const manager = await makeOperatorUser("account_manager");
    const buyer = await makeMember("buyer", { organisationName: "Ravensworth Balers" });
    const res = await visitor.post(adminOrgs.action, "/admin/organisations", { organisationId: buyer.organisationId, managerId: manager.id });
    expect(res.status).toBe(302);
    expect((await Organisation.findByPk(buyer.organisationId))?.accountManagerId).toBe(manager.id);

    const managerVisitor = await signedIn(manager);
    const list = await managerVisitor.get(accounts.loader, "/accounts");
    expect(list.data.accounts.map((a: { name: string }) => a.name)).toEqual(["Ravensworth Balers"]);
  });

  it("filters organisations by kind and refuses to assign a shop", async () => {
    const shop = await makeMember("shop");
    const manager = await makeOperatorUser("account_manager");
    const res = await visitor.post(adminOrgs.action, "/admin/organisations", { organisationId: shop.organisationId, managerId: manager.id });
    expect(res.status).toBe(404);
    const shops = await visitor.get(adminOrgs.loader, "/admin/organisations?kind=shop");
    expect(shops.data.organisations.every((o: { kind: string }) => o.kind === "shop")).toBe(true);
  });
});
