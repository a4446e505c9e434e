import { Op, literal, type Order, type WhereOptions } from "sequelize";
import type { BidStatus } from "~/content/bid-status";
import { Organisation, Spec, sequelize } from "~/models/index.server";
import type { User } from "~/models/index.server";
import { OPEN_SPECS_PAGE_SIZE, type OpenSpecSort, type OpenSpecsQuery } from "~/schemas/open-specs";
import { UNITS, fromDisplay, type Quantity, type UnitSystem } from "~/units";
import { specsWhere, viewerOf } from "~/auth/access-policy.server";
import { likePattern, pageCountOf } from "./list-query.server";

// The table of specs open for bids that shops browse. Everything is filtered, sorted and paged
// in PostgreSQL: "open, deadline ahead" is served by the partial indexes of migration 0005, the
// substring searches on title and delivery region by its trigram indexes.

// Every order ends on the id, so rows with equal keys keep one order from page to page.
const ORDERS: Record<OpenSpecSort, Order> = {
  deadline: [
    ["bidDeadline", "ASC"],
    ["id", "ASC"],
  ],
  newest: [
    ["publishedAt", "DESC"],
    ["id", "ASC"],
  ],
  title: [
    ["title", "ASC"],
    ["id", "ASC"],
  ],
  pressure: [
    ["reliefSettingBar", "ASC NULLS LAST"],
    ["id", "ASC"],
  ],
  flow: [
    ["pumpFlowLpm", "ASC NULLS LAST"],
    ["id", "ASC"],
  ],
};

/**
 * A range typed in the shop's units, in the column's unit. Each bound is widened by half the
 * last shown digit, so a row the table shows as "2,320 psi" is inside "at most 2320" even when
 * its exact value is 2,320.3.
 */
function rangeOf(quantity: Quantity, system: UnitSystem, min: number | undefined, max: number | undefined) {
  const half = 0.5 * 10 ** -UNITS[quantity][system].decimals;
  const range: Record<symbol, number> = {};
  if (min !== undefined) range[Op.gte] = fromDisplay(quantity, Math.max(0, min - half), system);
  if (max !== undefined) range[Op.lte] = fromDisplay(quantity, max + half, system);
  return Object.getOwnPropertySymbols(range).length ? range : null;
}

/** The first moment after the chosen day (bids close at the end of a UTC day). */
const dayAfter = (isoDate: string) => new Date(Date.parse(`${isoDate}T00:00:00Z`) + 86_400_000);

/** The search as a WHERE clause; exported for the benchmark, which times the same queries. */
function openSpecsWhere(user: Pick<User, "unitSystem">, query: OpenSpecsQuery, now = new Date()): WhereOptions<Spec> {
  const system = (user.unitSystem ?? "metric") as UnitSystem;
  const where: Record<string | symbol, unknown> = {
    status: "open",
    bidDeadline: query.deadline ? { [Op.gt]: now, [Op.lt]: dayAfter(query.deadline) } : { [Op.gt]: now },
  };
  if (query.q) where.title = { [Op.iLike]: likePattern(query.q) };
  if (query.region) where.deliveryRegion = { [Op.iLike]: likePattern(query.region) };
  const pressure = rangeOf("pressure", system, query.pressureMin, query.pressureMax);
  if (pressure) where.reliefSettingBar = pressure;
  const flow = rangeOf("flow", system, query.flowMin, query.flowMax);
  if (flow) where.pumpFlowLpm = flow;
  return where as WhereOptions<Spec>;
}

export interface OpenSpecRow {
  id: string;
  title: string;
  deliveryRegion: string | null;
  buyerRegion: string | null;
  reliefSettingBar: number | null;
  pumpFlowLpm: number | null;
  unitsWanted: number | null;
  currency: string;
  bidDeadline: string;
  publishedAt: string | null;
  revision: number;
  /** The status of this shop's bid on the spec, or null when it has none. */
  ownBidStatus: BidStatus | null;
}

/**
 * One page of the specs open for bids, as a shop sees them: filtered by the query (pressure and
 * flow bounds in the shop's units), sorted, 25 a page, each row saying whether the shop's own
 * organisation already has a bid. A page past the last shows the last. A shop not (yet)
 * approved to read specs gets no rows.
 */
export async function listOpenSpecsForShop(user: User, query: OpenSpecsQuery, now = new Date()) {
  // Within what the shop may read (specsWhere: nothing until an admin approves the shop).
  const where = { [Op.and]: [specsWhere(await viewerOf(user)), openSpecsWhere(user, query, now)] };
  const total = await Spec.count({ where });
  const pageCount = pageCountOf(total, OPEN_SPECS_PAGE_SIZE);
  const page = Math.min(query.page ?? 1, pageCount);
  // One bid per organisation and spec (unique index), read beside each row.
  const ownBid = literal(`(SELECT b.status FROM bids AS b WHERE b.spec_id = "Spec"."id" AND b.organisation_id = ${sequelize.escape(user.organisationId)})`);
  const rows = await Spec.findAll({
    where,
    attributes: [
      "id",
      "title",
      "deliveryRegion",
      "reliefSettingBar",
      "pumpFlowLpm",
      "unitsWanted",
      "currency",
      "bidDeadline",
      "publishedAt",
      "currentRevision",
      [ownBid, "ownBidStatus"],
    ],
    include: [{ model: Organisation, as: "organisation", attributes: ["region"] }],
    order: ORDERS[query.sort ?? "deadline"],
    limit: OPEN_SPECS_PAGE_SIZE,
    offset: (page - 1) * OPEN_SPECS_PAGE_SIZE,
  });
  const specs: OpenSpecRow[] = rows.map((s) => ({
    id: s.id,
    title: s.title,
    deliveryRegion: s.deliveryRegion,
    buyerRegion: (s as Spec & { organisation?: Organisation }).organisation?.region ?? null,
    reliefSettingBar: s.reliefSettingBar,
    pumpFlowLpm: s.pumpFlowLpm,
    unitsWanted: s.unitsWanted,
    currency: s.currency,
    bidDeadline: s.bidDeadline!.toISOString(),
    publishedAt: s.publishedAt?.toISOString() ?? null,
    revision: s.currentRevision,
    ownBidStatus: (s.get("ownBidStatus") as BidStatus | null) ?? null,
  }));
  return { specs, total, page, pageCount };
}
