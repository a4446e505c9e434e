import { beforeAll, describe, expect, it } from "vitest";
import * as signIn from "~/routes/sign-in";
import * as adminUsers from "~/routes/admin.users";
import * as adminOrgs from "~/routes/admin.organisations";
import * as accounts from "~/routes/accounts";
import * as account from "~/routes/account";
import * as adminMail from "~/routes/admin.mail";
import * as jobs from "~/routes/jobs";
import * as jobRoute from "~/routes/job";
import * as payments from "~/routes/payments";
import { Organisation, OutboxMail, Payment, User as UserModel, type User } from "~/models/index.server";
import { enqueueMail } from "~/services/mail.server";
import { newAttempt } from "~/services/payments.server";
import { PASSWORD, makeJob, makeMember, makeOperatorUser } from "../support/factories";
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

const names = (rows: { name: string }[]) => rows.map((r) => r.name);
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000);

/** A buyer organisation of each name, made that many hours ago (and given `fields`), for the order of a list. */
async function buyersMade(hoursAgoByName: Record<string, number>, fields: { accountManagerId?: string } = {}) {
  for (const [name, hours] of Object.entries(hoursAgoByName)) {
    const member = await makeMember("buyer", { organisationName: name });
    await Organisation.update({ ...fields, createdAt: hoursAgo(hours) }, { where: { id: member.organisationId }, silent: true });
  }
}

describe("admin lists: a stated order the admin can change", () => {
  it("users: newest first by default, by name or last sign-in on asking; a bad sort is the default, never an error", async () => {
    const people = [
      { name: "Brenna Oduya", createdAt: hoursAgo(3), lastSignInAt: hoursAgo(1) },
      { name: "alun Marsh", createdAt: hoursAgo(1), lastSignInAt: null },
      { name: "Cato Lindqvist", createdAt: hoursAgo(2), lastSignInAt: hoursAgo(2) },
    ];
    for (const p of people) {
      const user = await makeMember("buyer", { organisationName: "Sortwell Presses" });
      await UserModel.update(p, { where: { id: user.id }, silent: true });
    }
    const list = async (query: string) => {
      const res = await visitor.get(adminUsers.loader, `/admin/users?q=sortwell${query}`);
      expect(res.status).toBe(200);
      return res.data;
    };
    const newest = await list("");
    expect(newest.sort).toBe("newest");
    expect(names(newest.users)).toEqual(["alun Marsh", "Cato Lindqvist", "Brenna Oduya"]);
    expect(names((await list("&sort=name")).users)).toEqual(["alun Marsh", "Brenna Oduya", "Cato Lindqvist"]); // case does not matter
    expect(names((await list("&sort=last-sign-in")).users)).toEqual(["Brenna Oduya", "Cato Lindqvist", "alun Marsh"]); // never signed in last
    for (const bad of ["bogus", "name;drop", "", "%00"]) {
      const fallback = await list(`&sort=${bad}`);
      expect(fallback.sort).toBe("newest");
      expect(names(fallback.users)).toEqual(names(newest.users));
    }
  });

  it("organisations: newest first by default, by name on asking", async () => {
    await buyersMade({ "Orderly Zephyr Hydraulics": 5, "orderly Aster Builders": 4, "Orderly Mistral Works": 6 });
    const list = async (query: string) => (await visitor.get(adminOrgs.loader, `/admin/organisations?q=orderly${query}`)).data;
    expect(names((await list("")).organisations)).toEqual(["orderly Aster Builders", "Orderly Zephyr Hydraulics", "Orderly Mistral Works"]);
    expect(names((await list("&sort=name")).organisations)).toEqual(["orderly Aster Builders", "Orderly Mistral Works", "Orderly Zephyr Hydraulics"]);
    const bad = await list("&sort=kind");
    expect(bad.sort).toBe("newest");
    expect(names(bad.organisations)[0]).toBe("orderly Aster Builders");
  });

  it("mail: last tried first by default, longest waiting or by recipient on asking", async () => {
    const make = async (to: string, queuedHoursAgo: number, triedHoursAgo: number) => {
      const mail = await enqueueMail({ to, subject: "Sorted mail", text: "Body" });
      await OutboxMail.update(
        { status: "failed", attempts: 8, lastError: "refused", createdAt: hoursAgo(queuedHoursAgo), updatedAt: hoursAgo(triedHoursAgo) },
        { where: { id: mail.id }, silent: true },
      );
    };
    await make("b-mid@example.test", 5, 2);
    await make("a-old@example.test", 9, 3);
    await make("c-new@example.test", 1, 1);
    const order = async (query: string) => {
      const res = await visitor.get(adminMail.loader, `/admin/mail${query}`);
      expect(res.status).toBe(200);
      return res.data.mails.map((m: { to: string }) => m.to);
    };
    expect(await order("")).toEqual(["c-new@example.test", "b-mid@example.test", "a-old@example.test"]);
    expect(await order("?sort=longest-waiting")).toEqual(["a-old@example.test", "b-mid@example.test", "c-new@example.test"]);
    expect(await order("?sort=recipient")).toEqual(["a-old@example.test", "b-mid@example.test", "c-new@example.test"]);
    expect(await order("?sort=<script>")).toEqual(await order(""));
  });

  it("an account manager's accounts: by name by default, newest customers first on asking", async () => {
    const manager = await makeOperatorUser("account_manager");
    await buyersMade({ "Wrenfield Balers": 2, "Ashgrove Presses": 1, "Marlow Forming": 3 }, { accountManagerId: manager.id });
    const managerVisitor = await signedIn(manager);
    const list = async (query: string) => names((await managerVisitor.get(accounts.loader, `/accounts${query}`)).data.accounts);
    expect(await list("")).toEqual(["Ashgrove Presses", "Marlow Forming", "Wrenfield Balers"]);
    expect(await list("?sort=newest")).toEqual(["Ashgrove Presses", "Wrenfield Balers", "Marlow Forming"]);
    expect(await list("?sort=oldest")).toEqual(await list(""));
  });
});

describe("organisation names link to the organisation page where the viewer may open it", () => {
  it("in the admin's users and organisations lists, and in staff's jobs and payments lists and job page, never for buyers and shops", async () => {
    const manager = await makeOperatorUser("account_manager");
    const buyer = await makeMember("buyer", { organisationName: "Linkmoor Tooling" });
    const shop = await makeMember("shop", { organisationName: "Linkmoor Fluid Power" });
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
    const { job } = await makeJob(buyer, shop);
    await Payment.create(newAttempt(job, buyer.id));

    const users = (await visitor.get(adminUsers.loader, "/admin/users?q=linkmoor")).data.users;
    expect(users.map((u: { organisationId: string; organisationLinked: boolean }) => [u.organisationId, u.organisationLinked]).sort()).toEqual(
      [
        [buyer.organisationId, true],
        [shop.organisationId, true],
      ].sort(),
    );
    const orgs = (await visitor.get(adminOrgs.loader, "/admin/organisations?q=linkmoor")).data.organisations;
    expect(orgs.every((o: { linked: boolean }) => o.linked)).toBe(true);

    const managerVisitor = await signedIn(manager);
    const managerJobs = (await managerVisitor.get(jobs.loader, "/jobs")).data;
    expect(managerJobs.openable.sort()).toEqual([buyer.organisationId, shop.organisationId].sort());
    const managerPayments = (await managerVisitor.get(payments.loader, "/payments")).data.payments;
    expect(managerPayments[0].buyer).toEqual({ id: buyer.organisationId, name: "Linkmoor Tooling", linked: true });
    expect(managerPayments[0].shop).toEqual({ id: shop.organisationId, name: "Linkmoor Fluid Power", linked: true });

    const jobPage = (await managerVisitor.get(jobRoute.loader, `/jobs/${job.id}`, { jobId: job.id })).data;
    expect(jobPage.openable.sort()).toEqual([buyer.organisationId, shop.organisationId].sort());

    // The buyer and the shop see the names only: they have no organisation pages.
    expect((await (await signedIn(shop)).get(jobRoute.loader, `/jobs/${job.id}`, { jobId: job.id })).data.openable).toEqual([]);
    expect((await (await signedIn(buyer)).get(jobs.loader, "/jobs")).data.openable).toEqual([]);
    expect((await (await signedIn(shop)).get(jobs.loader, "/jobs")).data.openable).toEqual([]);
    expect((await (await signedIn(buyer)).get(payments.loader, "/payments")).data.payments[0].shop.linked).toBe(false);
  });
});

describe("the organisation page", () => {
  it("shows a buyer account's people, manager, published specs (no drafts) and jobs; a shop's approval and the jobs it builds", async () => {
    const manager = await makeOperatorUser("account_manager");
    const buyer = await makeMember("buyer", { organisationName: "Pagewell Stamping" });
    const shop = await makeMember("shop", { organisationName: "Pagewell Hydraulic Services" });
    await Organisation.update({ accountManagerId: manager.id, region: "Midlands" }, { where: { id: buyer.organisationId } });
    const { spec, job } = await makeJob(buyer, shop, { title: "Trim press, main ram" });
    const { createDraft } = await import("~/services/specs.server");
    await createDraft(buyer);

    const managerVisitor = await signedIn(manager);
    const page = (await managerVisitor.get(account.loader, "/accounts/x", { organisationId: buyer.organisationId })).data;
    expect(page.organisation).toMatchObject({ name: "Pagewell Stamping", kind: "buyer", region: "Midlands", approval: null, accountManager: manager.name });
    expect(page.organisation.people).toEqual([expect.objectContaining({ email: buyer.email, role: "buyer", active: true })]);
    expect(page.organisation.specs.total).toBe(1); // the draft stays with the buyer
    expect(page.organisation.specs.recent.map((s: { id: string }) => s.id)).toEqual([spec.id]);
    expect(page.organisation.jobs.recent.map((j: { id: string }) => j.id)).toEqual([job.id]);
    expect(page.organisation.jobs.listLink).toBe(`/jobs?account=${buyer.organisationId}`);
    expect(page.back).toEqual({ to: "/accounts", label: "My accounts" });

    const shopPage = (await managerVisitor.get(account.loader, "/accounts/x", { organisationId: shop.organisationId })).data.organisation;
    expect(shopPage).toMatchObject({ kind: "shop", approval: "approved", canDecideApproval: false, specs: null });
    expect(shopPage.jobs.recent.map((j: { buyerName: string }) => j.buyerName)).toEqual(["Pagewell Stamping"]);
    // The shop's link opens the job list on its jobs only.
    expect(shopPage.jobs.listLink).toBe(`/jobs?shop=${shop.organisationId}`);
    const shopJobs = (await managerVisitor.get(jobs.loader, shopPage.jobs.listLink)).data;
    expect(shopJobs.jobs.map((j: { id: string }) => j.id)).toEqual([job.id]);
    expect((await managerVisitor.get(jobs.loader, "/jobs?shop=not-an-id")).status).toBe(200);

    const pending = await makeMember("shop", { pending: true });
    const adminView = (await visitor.get(account.loader, "/accounts/x", { organisationId: pending.organisationId })).data;
    expect(adminView.organisation).toMatchObject({ approval: "pending", canDecideApproval: true, jobs: { total: 0, recent: [] } });
    expect(adminView.back).toEqual({ to: "/admin/organisations", label: "Organisations" });
  });
});
