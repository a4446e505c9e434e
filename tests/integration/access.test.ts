// Each role against each page of the foundation: allowed (200), wrong role (403),
// another organisation's record (404), signed out (redirect to sign-in with a return address).
import { beforeAll, describe, expect, it } from "vitest";
import * as specs from "~/routes/specs";
import * as openSpecs from "~/routes/open-specs";
import * as team from "~/routes/team";
import * as accounts from "~/routes/accounts";
import * as account from "~/routes/account";
import * as jobs from "~/routes/jobs";
import * as adminUsers from "~/routes/admin.users";
import * as adminOrgs from "~/routes/admin.organisations";
import * as adminMail from "~/routes/admin.mail";
import * as adminAudit from "~/routes/admin.audit";
import type { Role } from "~/auth/roles";
import { Organisation, type User } from "~/models/index.server";
import { makeJob, makeMember, makeOperatorUser } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- every route's own args type, called alike
type Loader = (args: any) => unknown;
const PAGES: { path: string; loader: Loader; allowed: Role[] }[] = [
  { path: "/specs", loader: specs.loader, allowed: ["buyer"] },
  { path: "/open-specs", loader: openSpecs.loader, allowed: ["shop"] },
  { path: "/team", loader: team.loader, allowed: ["buyer", "shop", "admin"] },
  { path: "/accounts", loader: accounts.loader, allowed: ["account_manager", "admin"] },
  { path: "/jobs", loader: jobs.loader, allowed: ["buyer", "shop", "account_manager", "admin"] },
  { path: "/admin/users", loader: adminUsers.loader, allowed: ["admin"] },
  { path: "/admin/organisations", loader: adminOrgs.loader, allowed: ["admin"] },
  { path: "/admin/mail", loader: adminMail.loader, allowed: ["admin"] },
  { path: "/admin/audit", loader: adminAudit.loader, allowed: ["admin"] },
];

const visitors = {} as Record<Role, Visitor>;
const users = {} as Record<Role, User>;

beforeAll(async () => {
  users.buyer = await makeMember("buyer");
  users.shop = await makeMember("shop");
  users.account_manager = await makeOperatorUser("account_manager");
  users.admin = await makeOperatorUser("admin");
  for (const role of Object.keys(users) as Role[]) {
    visitors[role] = await signedIn(users[role]);
  }
});

describe.each(PAGES)("$path", ({ path, loader, allowed }) => {
  it.each(["buyer", "shop", "account_manager", "admin"] as Role[])("as %s", async (role) => {
    const res = await visitors[role].get(loader, path);
    expect(res.status).toBe(allowed.includes(role) ? 200 : 403);
  });

  it("signed out: redirects to sign-in and back", async () => {
    const res = await new Visitor().get(loader, path);
    expect(res.status).toBe(302);
    expect(res.location).toBe(`/sign-in?redirectTo=${encodeURIComponent(path)}`);
  });
});

describe("records of other organisations", () => {
  it("an account manager opens their own account, and gets 404 for one they do not follow", async () => {
    const own = await makeMember("buyer");
    const other = await makeMember("buyer");
    await Organisation.update({ accountManagerId: users.account_manager.id }, { where: { id: own.organisationId } });
    const mine = await visitors.account_manager.get(account.loader, "/accounts/x", { organisationId: own.organisationId });
    expect(mine.status).toBe(200);
    expect(mine.data.organisation.people.map((u: { email: string }) => u.email)).toEqual([own.email]);
    const theirs = await visitors.account_manager.get(account.loader, "/accounts/x", { organisationId: other.organisationId });
    expect(theirs.status).toBe(404);
    const forged = await visitors.account_manager.get(account.loader, "/accounts/x", { organisationId: "1; drop table users" });
    expect(forged.status).toBe(404);
  });

  it("a buyer's team page lists only their own organisation", async () => {
    const colleague = await makeMember("buyer");
    const res = await visitors.buyer.get(team.loader, "/team");
    const emails = res.data.members.map((m: { email: string }) => m.email);
    expect(emails).toEqual([users.buyer.email]);
    expect(emails).not.toContain(colleague.email);
  });

  it("a buyer asking for an account page gets 403, not the account", async () => {
    const res = await visitors.buyer.get(account.loader, "/accounts/x", { organisationId: users.buyer.organisationId });
    expect(res.status).toBe(403);
  });

  it("the organisation page: an admin opens every organisation; an account manager their accounts and the shops building their jobs", async () => {
    const manager = await makeOperatorUser("account_manager");
    const managerVisitor = await signedIn(manager);
    const managed = await makeMember("buyer");
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: managed.organisationId } });
    const building = await makeMember("shop");
    const elsewhere = await makeMember("shop");
    const otherBuyer = await makeMember("buyer");
    await makeJob(managed, building);
    await makeJob(otherBuyer, elsewhere);
    const open = (visitor: Visitor, organisationId: string) => visitor.get(account.loader, "/accounts/x", { organisationId });

    for (const organisationId of [managed.organisationId, building.organisationId]) {
      expect((await open(managerVisitor, organisationId)).status).toBe(200);
    }
    // A shop that builds nothing for their accounts, another buyer and the operator are not theirs.
    for (const organisationId of [elsewhere.organisationId, otherBuyer.organisationId, manager.organisationId]) {
      expect((await open(managerVisitor, organisationId)).status).toBe(404);
    }
    for (const organisationId of [
      managed.organisationId,
      building.organisationId,
      elsewhere.organisationId,
      otherBuyer.organisationId,
      manager.organisationId,
    ]) {
      expect((await open(visitors.admin, organisationId)).status).toBe(200);
    }
    // Buyers and shops have no organisation pages, not even their own (their people are on the team page).
    expect((await open(visitors.shop, users.shop.organisationId)).status).toBe(403);
    expect((await open(await signedIn(building), building.organisationId)).status).toBe(403);
  });
});
