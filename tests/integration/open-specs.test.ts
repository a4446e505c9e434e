// The open-specs table of shops: filters, sorts and pages in PostgreSQL, bounds typed in the
// shop's own units, the shop's own bids marked, bad parameters reported on the page.
import { beforeAll, describe, expect, it } from "vitest";
import * as openSpecs from "~/routes/open-specs";
import { Bid, Spec, SpecRevision, type User } from "~/models/index.server";
import type { OpenSpecRow as Row } from "~/services/open-specs.server";
import { inDays, makeMember, makePublishedSpec } from "../support/factories";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

let buyer: User;
let shop: User;
let usShop: User;
let metric: Visitor;
let us: Visitor;
/** The open specs of the scenario, by a short name. */
const specs = {} as Record<"press" | "lift" | "deck" | "clamp", Spec>;

/** The titles the table lists for a query (signed in as `who`). */
async function titles(who: Visitor, search: string) {
  const res = await who.get(openSpecs.loader, `/open-specs${search}`);
  expect(res.status).toBe(200);
  return (res.data.specs as Row[]).map((s) => s.title);
}

beforeAll(async () => {
  buyer = await makeMember("buyer");
  shop = await makeMember("shop");
  usShop = await makeMember("shop");
  await usShop.update({ unitSystem: "us" });
  const builder = await import("~/models/index.server").then((m) => m.Organisation.findByPk(buyer.organisationId, { rejectOnEmpty: true }));
  await builder.update({ region: "UK — Black Country" });

  // Four open specs with known figures (the design's own are replaced so the bounds are exact).
  const plan = [
    ["press", "Panel press, main ram", "UK — West Midlands", 21, "GBP", "2", 100, 40, -3],
    ["lift", "Scissor lift table", "Ireland — Munster", 10, "EUR", "5", 160, 25, -2],
    ["deck", "Tilting deck for coil cars", "Sweden — Västra Götaland", 5, "SEK", "1", 210, 80, -1],
    ["clamp", "Clamp_block feed", "UK — North West", 30, "USD", "12", 315, 12, 0],
  ] as const;
  for (const [key, title, region, days, currency, units, bar, lpm, publishedDaysAgo] of plan) {
    const spec = await makePublishedSpec(buyer, {
      machine: { title },
      quotation: { deliveryRegion: region, bidDeadline: inDays(days), currency, unitsWanted: units },
    });
    await spec.update({ reliefSettingBar: bar, pumpFlowLpm: lpm, publishedAt: new Date(Date.now() + publishedDaysAgo * 86_400_000) });
    specs[key] = spec;
  }

  // Not listed: a draft, a closed spec and an open one whose deadline has passed.
  await Spec.create({
    organisationId: buyer.organisationId,
    createdById: buyer.id,
    title: "Panel press, draft",
    bidDeadline: null,
    retainerPercent: null,
    deliveryRegion: null,
    publishedAt: null,
  });
  const closed = await makePublishedSpec(buyer, { machine: { title: "Panel press, closed" } });
  await closed.update({ status: "closed" });
  const lapsed = await makePublishedSpec(buyer, { machine: { title: "Panel press, lapsed" } });
  await lapsed.update({ bidDeadline: new Date(Date.now() - 60_000) });

  metric = await signedIn(shop);
  us = await signedIn(usShop);
});

describe("the open-specs table", () => {
  it("lists the specs open for bids, soonest deadline first, with their figures copied at publishing", async () => {
    const res = await metric.get(openSpecs.loader, "/open-specs");
    const rows = res.data.specs as Row[];
    expect(rows.map((r) => r.title)).toEqual(["Tilting deck for coil cars", "Scissor lift table", "Panel press, main ram", "Clamp_block feed"]);
    expect(res.data.total).toBe(4);
    expect(res.data.problems).toEqual({});
    const press = rows.find((r) => r.id === specs.press.id)!;
    expect(press).toMatchObject({
      deliveryRegion: "UK — West Midlands",
      buyerRegion: "UK — Black Country",
      reliefSettingBar: 100,
      pumpFlowLpm: 40,
      unitsWanted: 2,
      currency: "GBP",
      ownBidStatus: null,
    });

    // Publishing copies the design's relief setting and pump flow onto the spec.
    const fresh = await makePublishedSpec(buyer, { machine: { title: "Press copy check" } });
    const revision = await SpecRevision.findOne({ where: { specId: fresh.id }, rejectOnEmpty: true });
    const design = revision.axes[0].design as { pressuresBar: { reliefSetting: number }; flowsLpm: { pump: number } };
    expect(fresh.reliefSettingBar).toBeCloseTo(design.pressuresBar.reliefSetting, 3);
    expect(fresh.pumpFlowLpm).toBeCloseTo(design.flowsLpm.pump, 3);
    await fresh.destroy();
  });

  it("searches titles and delivery regions as substrings, ignoring case, with % and _ taken literally", async () => {
    expect(await titles(metric, "?q=PRESS")).toEqual(["Panel press, main ram"]);
    expect(await titles(metric, "?q=deck")).toEqual(["Tilting deck for coil cars"]);
    expect(await titles(metric, "?region=midlands")).toEqual(["Panel press, main ram"]);
    expect(await titles(metric, "?region=uk%20%E2%80%94")).toEqual(["Panel press, main ram", "Clamp_block feed"]);
    expect(await titles(metric, "?q=_")).toEqual(["Clamp_block feed"]);
    expect(await titles(metric, "?q=%25")).toEqual([]);
    expect(await titles(metric, "?region=%25")).toEqual([]);
    expect(await titles(metric, "?q=press&region=ireland")).toEqual([]);
  });

  it("keeps specs whose bids close on or before the chosen day", async () => {
    expect(await titles(metric, `?deadline=${inDays(10)}`)).toEqual(["Tilting deck for coil cars", "Scissor lift table"]);
    expect(await titles(metric, `?deadline=${inDays(9)}`)).toEqual(["Tilting deck for coil cars"]);
    expect(await titles(metric, `?deadline=${inDays(4)}`)).toEqual([]);
  });

  it("filters by relief setting and pump flow in bar and L/min", async () => {
    expect(await titles(metric, "?pressureMin=150&sort=pressure")).toEqual(["Scissor lift table", "Tilting deck for coil cars", "Clamp_block feed"]);
    expect(await titles(metric, "?pressureMax=100")).toEqual(["Panel press, main ram"]);
    expect(await titles(metric, "?pressureMin=150&pressureMax=250&sort=pressure")).toEqual(["Scissor lift table", "Tilting deck for coil cars"]);
    expect(await titles(metric, "?flowMin=25&flowMax=40&sort=flow")).toEqual(["Scissor lift table", "Panel press, main ram"]);
    expect(await titles(metric, "?flowMin=30&pressureMax=200")).toEqual(["Panel press, main ram"]);
  });

  it("reads a US shop's bounds in psi and US gpm, inclusive as the table shows the values", async () => {
    // 160 bar is 2320.6 psi, shown as "2,321 psi"; 40 L/min is 10.57 US gpm, shown as "10.6 US gpm".
    const res = await us.get(openSpecs.loader, "/open-specs?pressureMin=2000&pressureMax=2500");
    expect(res.data.unitSystem).toBe("us");
    expect((res.data.specs as Row[]).map((r) => r.title)).toEqual(["Scissor lift table"]);
    expect(await titles(us, "?pressureMax=2321&sort=pressure")).toEqual(["Panel press, main ram", "Scissor lift table"]);
    expect(await titles(us, "?pressureMax=2320&sort=pressure")).toEqual(["Panel press, main ram"]);
    expect(await titles(us, "?flowMin=10.6&flowMax=10.6")).toEqual(["Panel press, main ram"]);
    expect(await titles(us, "?flowMin=10.7&sort=flow")).toEqual(["Tilting deck for coil cars"]);
    // The same numbers read as bar by a metric shop match nothing.
    expect(await titles(metric, "?pressureMin=2000&pressureMax=2500")).toEqual([]);
  });

  it("sorts by deadline, newest, title, pressure and flow", async () => {
    const { press, lift, deck, clamp } = specs;
    const ids = async (sort: string) => ((await metric.get(openSpecs.loader, `/open-specs?sort=${sort}`)).data.specs as Row[]).map((r) => r.id);
    expect(await ids("deadline")).toEqual([deck.id, lift.id, press.id, clamp.id]);
    expect(await ids("newest")).toEqual([clamp.id, deck.id, lift.id, press.id]);
    expect(await ids("title")).toEqual([clamp.id, press.id, lift.id, deck.id]);
    expect(await ids("pressure")).toEqual([press.id, lift.id, deck.id, clamp.id]);
    expect(await ids("flow")).toEqual([clamp.id, lift.id, press.id, deck.id]);
  });

  it("marks the specs the shop's own organisation has a bid on, and no other shop's", async () => {
    await Bid.create({
      specId: specs.lift.id,
      organisationId: shop.organisationId,
      createdById: shop.id,
      specRevision: 1,
      currency: "EUR",
      leadTimeWeeks: null,
      validUntil: null,
      submittedAt: null,
    });
    const other = await makeMember("shop");
    await Bid.create({
      specId: specs.deck.id,
      organisationId: other.organisationId,
      createdById: other.id,
      specRevision: 1,
      currency: "SEK",
      status: "submitted",
      leadTimeWeeks: 6,
      validUntil: null,
      submittedAt: new Date(),
    });
    const rows = (await metric.get(openSpecs.loader, "/open-specs")).data.specs as Row[];
    expect(Object.fromEntries(rows.map((r) => [r.title, r.ownBidStatus]))).toEqual({
      "Tilting deck for coil cars": null,
      "Scissor lift table": "draft",
      "Panel press, main ram": null,
      "Clamp_block feed": null,
    });
    const theirs = (await (await signedIn(other)).get(openSpecs.loader, "/open-specs")).data.specs as Row[];
    expect(theirs.filter((r) => r.ownBidStatus).map((r) => [r.title, r.ownBidStatus])).toEqual([["Tilting deck for coil cars", "submitted"]]);
  });

  it("pages by 25, keeps the order across pages and shows the last page for a page beyond it", async () => {
    const extra = await Spec.bulkCreate(
      Array.from({ length: 30 }, (_, i) => ({
        organisationId: buyer.organisationId,
        createdById: buyer.id,
        title: `Feed table ${String(i).padStart(2, "0")}`,
        status: "open" as const,
        bidDeadline: new Date(Date.now() + (40 + i) * 86_400_000),
        retainerPercent: "20",
        deliveryRegion: "Norway — Rogaland",
        publishedAt: new Date(),
        currentRevision: 1,
        reliefSettingBar: 180,
        pumpFlowLpm: 30,
      })),
    );
    try {
      const first = await metric.get(openSpecs.loader, "/open-specs?region=norway");
      expect(first.data).toMatchObject({ total: 30, page: 1, pageCount: 2 });
      expect(first.data.specs).toHaveLength(25);
      const second = await metric.get(openSpecs.loader, "/open-specs?region=norway&page=2");
      expect((second.data.specs as Row[]).map((r) => r.title)).toEqual(["Feed table 25", "Feed table 26", "Feed table 27", "Feed table 28", "Feed table 29"]);
      const both = [...(first.data.specs as Row[]), ...(second.data.specs as Row[])].map((r) => r.title);
      expect(new Set(both).size).toBe(30);
      const beyond = await metric.get(openSpecs.loader, "/open-specs?region=norway&page=9");
      expect(beyond.data.page).toBe(2);
      expect(beyond.data.specs).toHaveLength(5);
      // Without a filter every open spec counts: 4 + 30.
      expect((await metric.get(openSpecs.loader, "/open-specs")).data).toMatchObject({ total: 34, pageCount: 2 });
    } finally {
      await Spec.destroy({ where: { id: extra.map((s) => s.id) } });
    }
  });

  it("reports each bad parameter on the page, applies the rest and keeps what was typed", async () => {
    const res = await metric.get(openSpecs.loader, "/open-specs?pressureMin=lots&q=press&flowMin=-4&page=abc&sort=sideways");
    expect(res.status).toBe(200);
    expect(Object.keys(res.data.problems).sort()).toEqual(["flowMin", "page", "pressureMin", "sort"]);
    expect(res.data.problems.pressureMin).toMatch(/enter a number/);
    expect(res.data.problems.flowMin).toMatch(/cannot be negative/);
    expect(res.data.problems.sort).toMatch(/closing soonest first/);
    expect(res.data.typed).toMatchObject({ pressureMin: "lots", q: "press", flowMin: "-4" });
    expect((res.data.specs as Row[]).map((r) => r.title)).toEqual(["Panel press, main ram"]);

    const reversed = await metric.get(openSpecs.loader, "/open-specs?pressureMin=200&pressureMax=100&sort=pressure");
    expect(reversed.data.problems).toEqual({ pressureMax: "The highest relief setting is below the lowest one." });
    expect((reversed.data.specs as Row[]).map((r) => r.title)).toEqual(["Tilting deck for coil cars", "Clamp_block feed"]);

    const past = await metric.get(openSpecs.loader, "/open-specs?deadline=2020-01-01");
    expect(past.data.problems.deadline).toMatch(/today or a later day/);
    expect(past.data.total).toBe(4);
    const garbled = await metric.get(openSpecs.loader, "/open-specs?deadline=soon&region=" + "x".repeat(81));
    expect(garbled.data.problems.deadline).toMatch(/choose a date/);
    expect(garbled.data.problems.region).toMatch(/at most 80/);
    expect((await metric.get(openSpecs.loader, "/open-specs?flowMax=Infinity")).data.problems.flowMax).toMatch(/enter a number/);
    // Blank fields, as an empty filter form sends them, are no filter at all.
    const blank = await metric.get(openSpecs.loader, "/open-specs?q=&region=&deadline=&pressureMin=&pressureMax=&flowMin=&flowMax=&sort=deadline");
    expect(blank.data).toMatchObject({ total: 4, problems: {}, filtered: false });
  });

  it("is for shops only; signed-out visitors are sent to sign in and back", async () => {
    expect((await (await signedIn(buyer)).get(openSpecs.loader, "/open-specs")).status).toBe(403);
    const res = await new Visitor().get(openSpecs.loader, "/open-specs?q=press&page=2");
    expect(res.status).toBe(302);
    expect(res.location).toBe(`/sign-in?redirectTo=${encodeURIComponent("/open-specs?q=press&page=2")}`);
  });
});
