// Bidding on real PostgreSQL: the lifecycle of one shop's bid, the deadline, revisions, the
// comparison the buyer reads, the award (exactly once under a race) and the mail it sends.
import { describe, expect, it } from "vitest";
import * as bidRoute from "~/routes/spec-bid";
import * as bidsRoute from "~/routes/spec-bids";
import * as specPage from "~/routes/spec";
import { Bid, BidVersion, Job, Organisation, Spec, User, sequelize } from "~/models/index.server";
import type { BomLine } from "~/hydraulics";
import { bomOf, saveBid } from "~/services/bids.server";
import { startRevision, publish } from "~/services/specs.server";
import { deliverDueMail } from "~/services/mail.server";
import { waitForMail } from "../support/mailbox";
import { makeMember, makePublishedSpec, inDays, uniqueEmail } from "../support/factories";
import { Visitor } from "../support/routes";
import { bidFields, postBid } from "../support/bid-form";
import { signedIn } from "../support/sessions";

const post = postBid;

async function setting() {
  const buyer = await makeMember("buyer");
  const spec = await makePublishedSpec(buyer);
  const bom = await bomOf(spec);
  return { buyer, spec, bom };
}

describe("a shop's bid", () => {
  it("saves a draft, submits, revises with history, withdraws and offers again", async () => {
    const { buyer, spec, bom } = await setting();
    expect(bom.length).toBeGreaterThan(8);
    const shop = await makeMember("shop");
    const visitor = await signedIn(shop);

    // A draft may leave lines unpriced; nothing is offered yet.
    const draft = await post(visitor, spec.id, {
      intent: "save",
      ...bidFields(bom, (_, i) => (i === 0 ? "1000" : null), { leadTimeWeeks: "", validUntil: "" }),
    });
    expect(draft.status).toBe(302);
    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: shop.organisationId }, rejectOnEmpty: true });
    expect(bid.status).toBe("draft");
    expect(bid.version).toBe(0);
    expect(bid.lines[0].unitPriceCents).toBe(100_000);
    expect(bid.lines[1].unitPriceCents).toBeNull();
    expect(await BidVersion.count({ where: { bidId: bid.id } })).toBe(0);

    // Submitting needs every line priced, and says which.
    const incomplete = await post(visitor, spec.id, { intent: "submit", ...bidFields(bom, (_, i) => (i === 0 ? "1000" : null)) });
    expect(incomplete.status).toBe(400);
    expect(incomplete.data.result.error["lines[1].unitPrice"][0]).toMatch(/Price every line/);
    expect((await bid.reload()).status).toBe("draft");

    // Prices as people type them: thousands separators and one decimal are read exactly.
    const prices = (line: BomLine, i: number) => (i === 0 ? "1,234.5" : String(100 + i));
    const submitted = await post(visitor, spec.id, { intent: "submit", ...bidFields(bom, prices) });
    expect(submitted.status).toBe(302);
    await bid.reload();
    // Worked by hand: line 0 is 1234.50 each, line i is (100 + i) each, times each quantity;
    // the spec asks for 2 units, so the offer is twice the set.
    const expectedSet = bom.reduce((sum, line, i) => sum + line.quantity * (i === 0 ? 123_450 : (100 + i) * 100), 0);
    expect(bid.status).toBe("submitted");
    expect(bid.version).toBe(1);
    expect(bid.currency).toBe("GBP");
    expect(bid.setTotalCents).toBe(expectedSet);
    expect(bid.totalCents).toBe(expectedSet * 2);
    expect(bid.leadTimeWeeks).toBe(12);

    // The buyer hears of it.
    await deliverDueMail(500);
    const mail = await waitForMail(buyer.email, "New bid");
    expect(mail.text).toContain(`/specs/${spec.id}/bids`);

    // Revising: a second submission is version 2; version 1 stays in the history.
    const revised = await post(visitor, spec.id, {
      intent: "submit",
      ...bidFields(bom, (l, i) => (i === 0 ? "999.99" : prices(l, i)), { leadTimeWeeks: "10" }),
    });
    expect(revised.status).toBe(302);
    await bid.reload();
    expect(bid.version).toBe(2);
    expect(bid.leadTimeWeeks).toBe(10);
    const versions = await BidVersion.findAll({ where: { bidId: bid.id }, order: [["version", "ASC"]] });
    expect(versions.map((v) => [v.version, v.event, v.offer.totalCents])).toEqual([
      [1, "submitted", expectedSet * 2],
      [2, "submitted", (expectedSet - bom[0].quantity * (123_450 - 99_999)) * 2],
    ]);
    // An offered bid is not quietly turned back into a draft.
    const backToDraft = await post(visitor, spec.id, { intent: "save", ...bidFields(bom, prices) });
    expect(backToDraft.status).toBe(409);

    const withdrawn = await post(visitor, spec.id, { intent: "withdraw" });
    expect(withdrawn.status).toBe(302);
    expect((await bid.reload()).status).toBe("withdrawn");
    await deliverDueMail(500);
    expect((await waitForMail(buyer.email, "Offer taken back")).text).toContain(`/specs/${spec.id}/bids`);
    const again = await post(visitor, spec.id, { intent: "submit", ...bidFields(bom, prices) });
    expect(again.status).toBe(302);
    expect((await bid.reload()).version).toBe(3);
    expect(await BidVersion.count({ where: { bidId: bid.id } })).toBe(4);

    const page = await visitor.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(page.data.history.map((h: { version: number; event: string }) => `${h.version}${h.event[0]}`)).toEqual(["3s", "2w", "2s", "1s"]);
  });

  it("refuses bad prices and alternatives without a description, keeping what was saved", async () => {
    const { spec, bom } = await setting();
    const visitor = await signedIn(await makeMember("shop"));
    const bad = await post(visitor, spec.id, {
      intent: "submit",
      ...bidFields(bom, (_, i) => (i === 0 ? "12,50" : i === 1 ? "-5" : "10")),
      "lines[2].alternative": "on",
    });
    expect(bad.status).toBe(400);
    const errors = bad.data.result.error;
    expect(errors["lines[0].unitPrice"][0]).toBe("Use a point for decimals: 12.50.");
    expect(errors["lines[1].unitPrice"][0]).toMatch(/can't be negative/);
    expect(errors["lines[2].alternativeDescription"][0]).toMatch(/Describe/);
    expect(await Bid.count({ where: { specId: spec.id } })).toBe(0);

    const validity = await post(visitor, spec.id, { intent: "submit", ...bidFields(bom, () => "10", { validUntil: inDays(5) }) });
    expect(validity.status).toBe(400);
    expect(validity.data.result.error.validUntil[0]).toMatch(/at least until the bid deadline/);

    const withAlternative = await post(visitor, spec.id, {
      intent: "submit",
      ...bidFields(bom, () => "10"),
      "lines[2].alternative": "on",
      "lines[2].alternativeDescription": "Our own cast-iron gear pump, same displacement",
    });
    expect(withAlternative.status).toBe(302);
    const bid = await Bid.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(bid.lines[2]).toMatchObject({ alternative: true, alternativeDescription: "Our own cast-iron gear pump, same displacement" });
  });

  it("accepts nothing after the deadline, judged on the locked row by the one taking-bids rule", async () => {
    const { spec, bom } = await setting();
    const shop = await makeMember("shop");
    const visitor = await signedIn(shop);
    expect((await post(visitor, spec.id, { intent: "submit", ...bidFields(bom, () => "50") })).status).toBe(302);
    await sequelize.query("UPDATE specs SET bid_deadline = now() - interval '1 second' WHERE id = :id", { replacements: { id: spec.id } });

    for (const intent of ["submit", "save"]) {
      const late = await post(visitor, spec.id, { intent, ...bidFields(bom, () => "40") });
      expect(late.status).toBe(409);
      expect(late.data.result.error[""][0]).toMatch(/deadline has passed/);
    }
    const withdraw = await post(visitor, spec.id, { intent: "withdraw" });
    expect(withdraw.status).toBe(409);
    const bid = await Bid.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(bid.status).toBe("submitted");
    expect(bid.lines.every((l) => l.unitPriceCents === 5000)).toBe(true);
    // A shop that never bid can't start now either.
    const newcomer = await signedIn(await makeMember("shop"));
    expect((await post(newcomer, spec.id, { intent: "save", ...bidFields(bom, () => "1") })).status).toBe(409);
    expect(await Bid.count({ where: { specId: spec.id } })).toBe(1);
  });
});

describe("comparison", () => {
  it("puts offers side by side, marks the lowest per line, the cheapest complete offer and older revisions", async () => {
    const { buyer, spec, bom } = await setting();
    const [a, b, c] = [
      await makeMember("shop", { organisationName: "Alder Hydraulics" }),
      await makeMember("shop", { organisationName: "Birch Fluid Power" }),
      await makeMember("shop", { organisationName: "Cedar Drives" }),
    ];
    // A is cheaper on line 0, B on every other line; B is cheaper overall.
    expect((await post(await signedIn(a), spec.id, { intent: "submit", ...bidFields(bom, (_, i) => (i === 0 ? "100" : "300")) })).status).toBe(302);
    expect(
      (await post(await signedIn(b), spec.id, { intent: "submit", ...bidFields(bom, (_, i) => (i === 0 ? "500" : "200"), { leadTimeWeeks: "8" }) })).status,
    ).toBe(302);
    // C only saves a draft: the buyer never sees drafts.
    expect((await post(await signedIn(c), spec.id, { intent: "save", ...bidFields(bom, () => "1") })).status).toBe(302);

    const visitor = await signedIn(buyer);
    const page = await visitor.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    expect(page.status).toBe(200);
    const { columns, rows, cheapestCompleteId } = page.data.comparison;
    expect(columns.map((col: { shop: string }) => col.shop)).toEqual(["Birch Fluid Power", "Alder Hydraulics"]);
    expect(cheapestCompleteId).toBe(columns[0].id);
    expect(columns[0]).toMatchObject({ cheapestComplete: true, shortestLead: true, olderRevision: false, complete: true });
    expect(rows[0].cells.map((cell: { lowest: boolean }) => cell.lowest)).toEqual([false, true]);
    expect(rows[1].cells.map((cell: { lowest: boolean }) => cell.lowest)).toEqual([true, false]);
    expect(JSON.stringify(page.data)).not.toContain("Cedar");

    // Sorted by shop name on request.
    const byShop = await visitor.get(bidsRoute.loader, `/specs/${spec.id}/bids?sort=shop`, { specId: spec.id });
    expect(byShop.data.comparison.columns.map((col: { shop: string }) => col.shop)).toEqual(["Alder Hydraulics", "Birch Fluid Power"]);

    // A new revision marks both offers as made on revision 1 until the shops offer again.
    await startRevision(buyer, spec.id);
    await publish(buyer, spec.id, { cautionsRead: true });
    const after = await visitor.get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    expect(after.data.comparison.columns.every((col: { olderRevision: boolean }) => col.olderRevision)).toBe(true);
    const shopPage = await (await signedIn(a)).get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id });
    expect(shopPage.data.bidding.ownBid).toMatchObject({ specRevision: 1 });
    expect(shopPage.data.latestRevision).toBe(2);
  });
});

describe("award", () => {
  it("awards exactly one bid when two awards race, and tells every bidder", async () => {
    const { buyer, spec, bom } = await setting();
    const shops = [await makeMember("shop"), await makeMember("shop")];
    for (const [i, shop] of shops.entries()) {
      expect((await post(await signedIn(shop), spec.id, { intent: "submit", ...bidFields(bom, () => String(100 * (i + 1))) })).status).toBe(302);
    }
    const bids = await Bid.findAll({ where: { specId: spec.id }, order: [["totalCents", "ASC"]] });
    const [first, second] = [await signedIn(buyer), await signedIn(buyer)];
    const award = (visitor: Visitor, bid: Bid) =>
      visitor.post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId: bid.id, confirm: "on" }, { specId: spec.id });

    // Unconfirmed awards change nothing.
    expect((await first.post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId: bids[0].id }, { specId: spec.id })).status).toBe(400);

    const results = await Promise.all([award(first, bids[0]), award(second, bids[1])]);
    expect(results.map((r) => r.status).sort()).toEqual([302, 409]);
    expect(await Job.count({ where: { specId: spec.id } })).toBe(1);
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const winner = await Bid.findByPk(job.bidId, { rejectOnEmpty: true });
    const loser = bids.find((b) => b.id !== winner.id)!;
    expect(winner.status).toBe("won");
    expect((await loser.reload()).status).toBe("not_selected");
    expect((await spec.reload()).status).toBe("awarded");
    // The retainer owed: 20 % of the awarded total, in cents.
    expect(job.retainerCents).toBe(Math.round(winner.totalCents * 0.2));
    expect(results.find((r) => r.status === 409)!.data.error).toMatch(/already been awarded|not on offer/);

    await deliverDueMail(500);
    const winnerEmail = shops.find((s) => s.organisationId === winner.organisationId)!.email;
    const loserEmail = shops.find((s) => s.organisationId === loser.organisationId)!.email;
    expect((await waitForMail(winnerEmail, "Your bid was chosen")).text).toContain(`/jobs/${job.id}`);
    await waitForMail(loserEmail, "Not chosen this time");

    // Nothing moves after the award.
    const late = await post(await signedIn(shops[0]), spec.id, { intent: "submit", ...bidFields(bom, () => "1") });
    expect(late.status).toBe(409);
    expect((await award(first, loser)).status).toBe(409);
  });
});

describe("an expired offer", () => {
  it("can't be awarded until the shop renews it", async () => {
    const { buyer, spec, bom } = await setting();
    const shop = await makeMember("shop");
    expect((await post(await signedIn(shop), spec.id, { intent: "submit", ...bidFields(bom, () => "75") })).status).toBe(302);
    const bid = await Bid.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    await sequelize.query("UPDATE bids SET valid_until = current_date - 1 WHERE id = :id", { replacements: { id: bid.id } });
    const res = await (await signedIn(buyer)).post(bidsRoute.action, `/specs/${spec.id}/bids`, { bidId: bid.id, confirm: "on" }, { specId: spec.id });
    expect(res.status).toBe(409);
    expect(res.data.error).toMatch(/was valid until \d{1,2} \w{3} \d{4}\. Ask the shop to renew it/);
    expect((await spec.reload()).status).toBe("open");
    expect(await Job.count({ where: { specId: spec.id } })).toBe(0);
  });
});

describe("200 shops bidding at once", () => {
  it("stores every offer with the right total", async () => {
    const { spec, bom } = await setting();
    const passwordHash = (await User.findOne({ where: { role: "shop" } }))?.passwordHash ?? "x";
    const shops: User[] = [];
    for (let i = 0; i < 200; i++) {
      const org = await Organisation.create({ name: `Load shop ${i}`, kind: "shop", region: null, accountManagerId: null, approval: "approved" });
      shops.push(
        await User.create({ organisationId: org.id, email: uniqueEmail(`load${i}`), name: `Shop person ${i}`, passwordHash, role: "shop", lastSignInAt: null }),
      );
    }
    const input = (i: number) => ({
      intent: "submit" as const,
      lines: bom.map((l, j) => ({ key: l.key, unitPrice: `${i + 1}.${String(j % 100).padStart(2, "0")}` })),
      leadTimeWeeks: 6 + (i % 20),
      validUntil: inDays(60),
    });
    const results = await Promise.allSettled(shops.map((shop, i) => saveBid(shop, spec.id, input(i))));
    expect(results.filter((r) => r.status === "rejected")).toEqual([]);

    const stored = await Bid.findAll({ where: { specId: spec.id } });
    expect(stored).toHaveLength(200);
    expect(await BidVersion.count({ where: { bidId: stored.map((b) => b.id) } })).toBe(200);
    const byShop = new Map(shops.map((s, i) => [s.organisationId, i]));
    for (const bid of stored) {
      const i = byShop.get(bid.organisationId)!;
      const set = bom.reduce((sum, l, j) => sum + l.quantity * ((i + 1) * 100 + (j % 100)), 0);
      expect(bid.status).toBe("submitted");
      expect(bid.totalCents).toBe(set * 2);
    }
    expect((await Spec.findByPk(spec.id, { rejectOnEmpty: true })).status).toBe("open");
  }, 120_000);
});
