import { Op, QueryTypes, type Transaction } from "sequelize";
import type { BomLine } from "~/hydraulics";
import { Bid, BidVersion, Organisation, Spec, SpecRevision, User, sequelize } from "~/models/index.server";
import type { BidLine, BidOffer } from "~/models/bid.server";
import { validUntilOf, type BidInput } from "~/schemas/bid";
import { parseMoney } from "~/content/money";
import {
  alternativeTotals,
  offerTotals,
  termsWithRetainer,
  type AlternativeCircuit,
  type OfferExtra,
  type OfferTerms,
  type OwnLine,
} from "~/content/offer-terms";
import { compareBids, type ComparisonSort } from "./bid-comparison";
import { axisNamesOf, publishedDesignOf } from "./published-design";
import { FieldErrors, notFound } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { bidOfferedMail, bidWithdrawnMail } from "./mail-templates.server";
import { specFor } from "./spec-access.server";
import { PROFILE_ATTRIBUTES, profileOf } from "./organisation-profile.server";
import { authorize, bidsWhere, can, viewerOf } from "~/auth/access-policy.server";
import { formatDay, isoDay } from "~/content/dates";
import { takesBids, type SpecStatus } from "~/content/spec-status";
import type { BidStatus } from "~/content/bid-status";

// A shop's bid on a spec: one per shop organisation, priced line by line against the bill of
// materials of the spec's current revision. Every submission and withdrawal is kept as a
// version. Whether a spec still takes bids is decided inside the writing transaction, against
// the database clock, with the spec row share-locked so an award (which locks it for update)
// cannot slip in between.

/**
 * The bill shops price of a spec revision (the current one by default): the axis's, or the
 * machine's with its axis names (none for one axis), so each line can say which axis it serves.
 */
export async function billOfRevision(spec: Spec, revision = spec.currentRevision, transaction?: Transaction): Promise<{ bom: BomLine[]; axisNames: string[] }> {
  const row = await SpecRevision.findOne({ where: { specId: spec.id, number: revision }, transaction });
  const published = publishedDesignOf(row);
  return { bom: published?.design.bom ?? [], axisNames: axisNamesOf(published) };
}

/** The bill of materials of a spec revision (the current one by default). */
export async function bomOf(spec: Spec, revision = spec.currentRevision, transaction?: Transaction): Promise<BomLine[]> {
  return (await billOfRevision(spec, revision, transaction)).bom;
}

/** The acting shop's bid on a spec, or null. */
export async function bidOfShop(user: User, spec: Spec) {
  return Bid.findOne({ where: { specId: spec.id, organisationId: user.organisationId } });
}

const offerOf = (bid: Bid): BidOffer => ({
  lines: bid.lines,
  units: bid.units,
  setTotalCents: bid.setTotalCents,
  totalCents: bid.totalCents,
  currency: bid.currency,
  leadTimeWeeks: bid.leadTimeWeeks,
  validUntil: bid.validUntil,
  extras: bid.extras,
  ownLines: bid.ownLines,
  offerTerms: bid.offerTerms,
  alternativeCircuit: bid.alternativeCircuit,
  notes: bid.notes,
});

/** Locks the spec for sharing and refuses unless it takes bids right now. */
async function lockOpenSpec(specId: string, transaction: Transaction) {
  const [row] = await sequelize.query<{ status: string; deadline: Date | null }>(
    `SELECT status, bid_deadline AS deadline FROM specs WHERE id = :specId FOR SHARE`,
    { replacements: { specId }, transaction, type: QueryTypes.SELECT },
  );
  if (!row) notFound("No such spec.");
  if (row.status !== "open") throw new FieldErrors({ "": ["This spec no longer takes bids."] });
  if (!takesBids({ status: row.status, bidDeadline: row.deadline }))
    throw new FieldErrors({ "": ["The bid deadline has passed; nothing can be changed any more."] });
  return row as { status: string; deadline: Date };
}

/** The bid's lines: the revision's bill, in its order, with the shop's prices and alternatives. */
function priceLines(bom: BomLine[], input: BidInput["lines"]): BidLine[] {
  const byKey = new Map(input.map((l) => [l.key, l]));
  const missing = bom.filter((l) => !byKey.has(l.key));
  if (missing.length)
    throw new FieldErrors({ "": ["The bill of materials has changed since you opened the form. Reload the page to price the current bill."] });
  return bom.map((line) => {
    const typed = byKey.get(line.key)!;
    return {
      key: line.key,
      item: line.item,
      quantity: line.quantity,
      specification: line.specification,
      unitPriceCents: typed.unitPrice ? parseMoney(typed.unitPrice) : null,
      alternative: Boolean(typed.alternative),
      alternativeDescription: typed.alternative ? (typed.alternativeDescription ?? "") : "",
    };
  });
}

const cents = (text: string | undefined) => (text ? (parseMoney(text) ?? 0) : 0);

/** The parts of an offer beyond the bill, from the parsed form (blank rows dropped). */
function offerPartsOf(input: BidInput, units: number, spec: Pick<Spec, "retainerPercent">) {
  // A draft keeps only the kinds answered so far; the form shows the others open again.
  const extras: OfferExtra[] = (input.extras ?? []).flatMap(({ kind, answer, price }) =>
    answer ? [{ kind, answer, priceCents: answer === "priced" ? cents(price) : null }] : [],
  );
  const ownLines: OwnLine[] = (input.ownLines ?? []).filter((l) => l.name).map((l) => ({ name: l.name!, priceCents: cents(l.price) }));
  const offerTerms: OfferTerms = {
    incoterm: input.incoterm ?? null,
    place: input.place ?? "",
    // The share with the order is the spec's retainer, paid through the portal (not the shop's to set).
    retainerPercent: spec.retainerPercent === null ? null : Number(spec.retainerPercent),
    onDeliveryPercent: input.onDeliveryPercent ?? null,
    balanceDays: input.balanceDays ?? null,
    warrantyMonths: input.warrantyMonths ?? null,
  };
  const altLines = (input.alternativeLines ?? [])
    .filter((l) => l.name)
    .map((l) => ({ name: l.name!, quantity: l.quantity ?? 1, unitPriceCents: cents(l.price) }));
  const alternativeCircuit: AlternativeCircuit | null =
    input.alternativeDescription && altLines.length
      ? { description: input.alternativeDescription, lines: altLines, ...alternativeTotals(altLines, units) }
      : null;
  return { extras, ownLines, offerTerms, alternativeCircuit };
}

/**
 * Saves a draft or submits the offer (a new version each time), before the deadline only.
 * Submitting prices the current revision's bill, so a bid made on an older revision is
 * brought up to date by submitting it again.
 */
export async function saveBid(user: User, specId: string | undefined, input: BidInput): Promise<Bid> {
  const submitting = input.intent === "submit";
  const spec = await specFor(user, specId, "spec.bid");
  const validUntil = validUntilOf(input) ?? null;
  const bid = await sequelize.transaction(async (transaction) => {
    const locked = await lockOpenSpec(spec.id, transaction);
    const fresh = await Spec.findByPk(spec.id, { transaction, rejectOnEmpty: true });
    if (validUntil && validUntil < isoDay(locked.deadline)) {
      throw new FieldErrors({
        [input.validDays !== undefined ? "validDays" : "validUntil"]: [
          `Keep the offer valid at least until the bid deadline (${formatDay(isoDay(locked.deadline))}), so the buyer can award it.`,
        ],
      });
    }
    const lines = priceLines(await bomOf(fresh, fresh.currentRevision, transaction), input.lines);
    const units = fresh.unitsWanted ?? 1;
    const parts = offerPartsOf(input, units, fresh);
    const { setTotalCents, totalCents } = offerTotals(
      lines.map((l) => ({ quantity: l.quantity, unitPriceCents: l.unitPriceCents ?? 0 })),
      units,
      parts.extras,
      parts.ownLines,
    );

    // One row per shop and spec: created on the first save, whoever of the shop's people races.
    await Bid.bulkCreate(
      [
        {
          specId: spec.id,
          organisationId: user.organisationId,
          createdById: user.id,
          specRevision: fresh.currentRevision,
          currency: fresh.currency,
          leadTimeWeeks: null,
          validUntil: null,
          submittedAt: null,
        },
      ],
      { ignoreDuplicates: true, transaction },
    );
    const row = await Bid.findOne({
      where: { specId: spec.id, organisationId: user.organisationId },
      lock: transaction.LOCK.UPDATE,
      transaction,
      rejectOnEmpty: true,
    });
    if (!submitting && row.status === "submitted") {
      throw new FieldErrors({ "": ["This bid is already offered. Submit the changes as a revised offer, or take it back first."] });
    }
    if (row.status === "won" || row.status === "not_selected") throw new FieldErrors({ "": ["The spec has been awarded."] });
    await row.update(
      {
        status: submitting ? "submitted" : "draft",
        lines,
        units,
        currency: fresh.currency,
        specRevision: fresh.currentRevision,
        setTotalCents,
        totalCents,
        ...parts,
        leadTimeWeeks: input.leadTimeWeeks ?? null,
        validUntil,
        notes: input.notes ?? "",
        ...(submitting ? { version: row.version + 1, submittedAt: new Date() } : {}),
      },
      { transaction },
    );
    if (submitting) {
      await BidVersion.create(
        { bidId: row.id, version: row.version, event: "submitted", specRevision: row.specRevision, offer: offerOf(row), createdById: user.id },
        { transaction },
      );
      const author = await User.findByPk(fresh.createdById, { transaction });
      const shop = await Organisation.findByPk(user.organisationId, { transaction, rejectOnEmpty: true });
      if (author?.active) {
        const mail = bidOfferedMail({ name: author.name, shopName: shop.name, specId: fresh.id, specTitle: fresh.title, version: row.version });
        await enqueueMail({ to: author.email, ...mail }, transaction);
      }
    }
    return row;
  });
  return bid;
}

/** Takes a submitted offer back, before the deadline; the shop may offer again later. */
export async function withdrawBid(user: User, specId: string | undefined) {
  const spec = await specFor(user, specId, "spec.bid");
  await sequelize.transaction(async (transaction) => {
    await lockOpenSpec(spec.id, transaction);
    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: user.organisationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!bid || bid.status !== "submitted") throw new FieldErrors({ "": ["Only an offered bid can be taken back."] });
    await bid.update({ status: "withdrawn" }, { transaction });
    await BidVersion.create(
      { bidId: bid.id, version: bid.version, event: "withdrawn", specRevision: bid.specRevision, offer: offerOf(bid), createdById: user.id },
      { transaction },
    );
    const author = await User.findByPk(spec.createdById, { transaction });
    const shop = await Organisation.findByPk(user.organisationId, { transaction, rejectOnEmpty: true });
    if (author?.active) {
      await enqueueMail(
        { to: author.email, ...bidWithdrawnMail({ name: author.name, shopName: shop.name, specId: spec.id, specTitle: spec.title }) },
        transaction,
      );
    }
  });
}

/** Every submission and withdrawal of a bid, newest first, with who made it. */
export async function historyOf(bid: Bid) {
  return BidVersion.findAll({
    where: { bidId: bid.id },
    include: [{ model: User, as: "createdBy", attributes: ["name"] }],
    order: [
      ["createdAt", "DESC"],
      ["version", "DESC"],
    ],
  });
}

/** Bids the buyer compares: every one offered (or decided), never drafts or taken-back ones. */
async function offeredBids(user: User, spec: Spec) {
  const viewer = await viewerOf(user);
  authorize(viewer, "spec.compareBids", spec);
  return Bid.findAll({
    // bidsWhere leaves the buyer the offered and decided bids only.
    where: { [Op.and]: [bidsWhere(viewer), { specId: spec.id }] },
    include: [{ model: Organisation, as: "organisation", attributes: PROFILE_ATTRIBUTES }],
    order: [
      ["totalCents", "ASC"],
      ["id", "ASC"],
    ],
  });
}

/** The buyer's side-by-side comparison of a spec's offers (page and workbook alike). */
export async function comparisonOf(user: User, spec: Spec, sort: ComparisonSort = "total") {
  const [{ bom, axisNames }, bids] = await Promise.all([billOfRevision(spec), offeredBids(user, spec)]);
  const comparison = compareBids(
    bom,
    spec.currentRevision,
    bids.map((b) => ({
      id: b.id,
      shop: (b as Bid & { organisation: Organisation }).organisation.name,
      status: b.status,
      specRevision: b.specRevision,
      lines: b.lines,
      setTotalCents: b.setTotalCents,
      totalCents: b.totalCents,
      leadTimeWeeks: b.leadTimeWeeks,
      validUntil: b.validUntil,
      extras: b.extras,
      ownLines: b.ownLines,
      offerTerms: b.offerTerms && termsWithRetainer(b.offerTerms, spec.retainerPercent),
      alternativeCircuit: b.alternativeCircuit,
      notes: b.notes,
    })),
    sort,
    axisNames,
  );
  // Each shop's company profile beside its offer.
  const profiles = Object.fromEntries(bids.map((b) => [b.id, profileOf((b as Bid & { organisation: Organisation }).organisation)]));
  return { bids, comparison, profiles };
}

/**
 * The spec page's bidding strip for a reader of the spec: a shop that may bid sees its own bid,
 * the buyer the number of offers; what is shown comes from the policy, not from the role.
 */
export async function biddingPanelOf(user: User, spec: Spec) {
  const viewer = await viewerOf(user);
  const canBid = can(viewer, "spec.bid", spec);
  const bid = canBid ? await bidOfShop(user, spec) : null;
  return {
    canBid,
    accepting: takesBids(spec),
    specStatus: spec.status as SpecStatus,
    currency: spec.currency,
    ownBid: bid && { status: bid.status as BidStatus, totalCents: bid.totalCents, version: bid.version, specRevision: bid.specRevision },
    offers: can(viewer, "spec.compareBids", spec) ? ((await offerCounts([spec.id])).get(spec.id) ?? 0) : null,
  };
}

/** How many offers a buyer's specs have, for their list. */
export async function offerCounts(specIds: string[]) {
  if (!specIds.length) return new Map<string, number>();
  const rows = await sequelize.query<{ spec_id: string; count: number }>(
    `SELECT spec_id, count(*)::int AS count FROM bids WHERE spec_id IN (:specIds) AND status IN ('submitted', 'won', 'not_selected') GROUP BY spec_id`,
    { replacements: { specIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.spec_id, r.count]));
}
