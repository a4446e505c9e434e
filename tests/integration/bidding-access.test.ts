// Who may reach the bid form and the comparison: each role, other organisations, forged IDs,
// signed-out visitors. Other organisations' records are "not found", never "forbidden".
import { beforeAll, describe, expect, it } from "vitest";
import * as bidRoute from "~/routes/spec-bid";
import * as bidsRoute from "~/routes/spec-bids";
import * as specPage from "~/routes/spec";
import type { Role } from "~/auth/roles";
import type { Spec, User } from "~/models/index.server";
import { bomOf } from "~/services/bids.server";
import { createDraft } from "~/services/specs.server";
import { bidFields, postBid } from "../support/bid-form";
import { makeMember, makeOperatorUser, makePublishedSpec } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

const users = {} as Record<Role | "otherBuyer" | "otherShop", User>;
const visitors = {} as Record<keyof typeof users, Visitor>;
let spec: Spec;
let draft: Spec;

async function offer(visitor: Visitor, price: string) {
  return postBid(
    visitor,
    spec.id,
    bidFields(await bomOf(spec), () => price, { intent: "submit", leadTimeWeeks: "9" }),
  );
}

beforeAll(async () => {
  users.buyer = await makeMember("buyer");
  users.otherBuyer = await makeMember("buyer");
  users.shop = await makeMember("shop");
  users.otherShop = await makeMember("shop");
  users.account_manager = await makeOperatorUser("account_manager");
  users.admin = await makeOperatorUser("admin");
  for (const key of Object.keys(users) as (keyof typeof users)[]) visitors[key] = await signedIn(users[key]);
  spec = await makePublishedSpec(users.buyer);
  draft = await createDraft(users.buyer);
  expect((await offer(visitors.shop, "111.11")).status).toBe(302);
  expect((await offer(visitors.otherShop, "222.22")).status).toBe(302);
});

const ROUTES = [
  { name: "bid form", path: (id: string) => `/specs/${id}/bid`, loader: bidRoute.loader, action: bidRoute.action, allowed: ["shop"] as Role[] },
  { name: "comparison", path: (id: string) => `/specs/${id}/bids`, loader: bidsRoute.loader, action: bidsRoute.action, allowed: ["buyer"] as Role[] },
];

describe.each(ROUTES)("$name", ({ path, loader, action, allowed }) => {
  it.each(["buyer", "shop", "account_manager", "admin"] as Role[])("as %s", async (role) => {
    const res = await visitors[role].get(loader, path(spec.id), { specId: spec.id });
    expect(res.status).toBe(allowed.includes(role) ? 200 : 403);
    if (!allowed.includes(role)) expect((await visitors[role].post(action, path(spec.id), { intent: "save" }, { specId: spec.id })).status).toBe(403);
  });

  it("signed out: sent to sign-in and back", async () => {
    const res = await new Visitor().get(loader, path(spec.id), { specId: spec.id });
    expect(res.status).toBe(302);
    expect(res.location).toBe(`/sign-in?redirectTo=${encodeURIComponent(path(spec.id))}`);
    expect((await new Visitor().post(action, path(spec.id), {}, { specId: spec.id })).status).toBe(302);
  });

  it("forged and malformed IDs are not found", async () => {
    const visitor = visitors[allowed[0]];
    for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid", "1 OR 1=1"]) {
      expect((await visitor.get(loader, path(id), { specId: id })).status).toBe(404);
      expect((await visitor.post(action, path(id), { intent: "save" }, { specId: id })).status).toBe(404);
    }
  });
});

describe("other organisations", () => {
  it("a shop sees only its own bid, never another shop's prices", async () => {
    const own = await visitors.shop.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(own.data.defaults.lines[0].unitPrice).toBe("111.11");
    expect(JSON.stringify(own.data)).not.toContain("222.22");
    const page = await visitors.shop.get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
    expect(page.data.bidding.offers).toBeNull();
    expect(JSON.stringify(page.data)).not.toContain(users.otherShop.organisationId);
  });

  it("a shop can't bid on a draft it can't see", async () => {
    expect((await visitors.shop.get(bidRoute.loader, `/specs/${draft.id}/bid`, { specId: draft.id })).status).toBe(404);
  });

  it("another buyer neither compares nor awards this spec's bids", async () => {
    expect((await visitors.otherBuyer.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id })).status).toBe(404);
    const anyBid = await visitors.buyer.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    const bidId = anyBid.data.comparison.columns[0].id;
    const forged = await visitors.otherBuyer.post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId, confirm: "on" }, { specId: spec.id });
    expect(forged.status).toBe(404);
  });

  it("a bid of another spec can't be awarded through this one", async () => {
    const otherSpec = await makePublishedSpec(users.otherBuyer);
    const res = await visitors.otherBuyer.get(bidsRoute.loader, `/specs/${otherSpec.id}/bids`, { specId: otherSpec.id });
    expect(res.data.comparison.columns).toEqual([]);
    const ours = await visitors.buyer.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    const attempt = await visitors.otherBuyer.post(
      bidsRoute.action,
      `/specs/${otherSpec.id}/bids`,
      { bidId: ours.data.comparison.columns[0].id, confirm: "on" },
      { specId: otherSpec.id },
    );
    expect(attempt.status).toBe(409);
    expect(attempt.data.error).toMatch(/not on offer/);
  });
});
