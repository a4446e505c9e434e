import { Bid, Organisation, Spec, SpecRevision, type User } from "~/models/index.server";
import { quotationFacts } from "~/content/quotation-facts";
import type { UnitSystem } from "~/units";
import { COMPARISON_SORTS, type ComparisonSort } from "../bid-comparison";
import { comparisonOf } from "../bids.server";
import { offerSummary } from "../offer-summary";
import { notFound } from "../errors.server";
import { scopedJob } from "../job-reads.server";
import { buyerNameFor, specFor, specForReader } from "../spec-access.server";
import { designOfRevision, revisionsOf } from "../specs.server";
import { axisNamesOf, publishedDesignOf } from "../published-design";
import type { BillInput } from "./bill-workbook.server";
import type { ComparisonInput } from "./comparison-workbook.server";
import type { PricedBillInput } from "./priced-bill-workbook.server";

// What each workbook shows, read for the acting user through the same rules as the pages:
// - the bill of materials: whoever may read the published spec (specForReader): its buyer, any
//   approved shop (every such shop may read an open spec and needs the bill to prepare a bid,
//   not only shops that already bid), the account's account manager, admins; it names the
//   buyer only to whom the spec page would (buyerNameFor), never to a shop;
// - the priced bill: whoever may read the job the award opened (scopedJob): the buyer, the
//   winning shop, the account's account manager, admins;
// - the comparison: the spec's own buyer only (the route lets only buyers in).
// Everyone else gets the same 404 as for a spec or job that does not exist.

async function organisationName(id: string) {
  return (await Organisation.findByPk(id, { attributes: ["name"] }))?.name ?? "";
}

/** The bill of a spec's revision: `?revision=N` as on the spec page, the latest by default. */
export async function billSource(user: User, specId: string | undefined, revisionParam: string | null): Promise<BillInput> {
  const spec = await specForReader(user, specId);
  const revisions = await revisionsOf(spec);
  const asked = Number(revisionParam);
  const revision = (revisionParam ? revisions.find((r) => r.number === asked) : revisions[0]) ?? null;
  const published = await designOfRevision(revision);
  if (!revision || !published) notFound(revisionParam ? "No such revision." : "This spec has no published revision yet.");
  return {
    title: spec.title,
    revision: revision.number,
    publishedAt: revision.createdAt,
    engineVersion: revision.engineVersion,
    buyerName: await buyerNameFor(user, spec),
    published,
    answers: revision.answers,
    enteredIn: revision.unitSystem,
    readerUnits: (user.unitSystem ?? "metric") as UnitSystem,
    quotation: quotationFacts(revision.answers),
    exportedAt: new Date(),
  };
}

/** The awarded bid of a job, as offered, with the retainer the job records. */
export async function pricedBillSource(user: User, jobId: string | undefined): Promise<PricedBillInput> {
  const job = await scopedJob(user, jobId);
  const [bid, spec] = await Promise.all([Bid.findByPk(job.bidId, { rejectOnEmpty: true }), Spec.findByPk(job.specId, { rejectOnEmpty: true })]);
  const revision = await SpecRevision.findOne({ where: { specId: spec.id, number: bid.specRevision }, rejectOnEmpty: true });
  const summary = offerSummary(bid, job.retainerPercent);
  return {
    title: spec.title,
    revision: bid.specRevision,
    engineVersion: revision.engineVersion,
    buyerName: await organisationName(job.buyerOrganisationId),
    shopName: await organisationName(job.shopOrganisationId),
    awardedAt: job.awardedAt,
    currency: job.currency,
    lines: bid.lines,
    units: bid.units,
    setTotalCents: bid.setTotalCents,
    totalCents: job.totalCents,
    retainerPercent: job.retainerPercent,
    retainerCents: job.retainerCents,
    leadTimeWeeks: bid.leadTimeWeeks,
    validUntil: bid.validUntil,
    terms: summary.termsText.join(" "),
    beyondBill: [
      ...summary.extras.filter((e) => e.answer === "priced").map((e) => ({ name: e.name, cents: e.priceCents ?? 0 })),
      ...summary.ownLines.filter((l) => l.priceCents > 0).map((l) => ({ name: l.name, cents: l.priceCents })),
    ],
    notes: bid.notes,
    axisNames: axisNamesOf(publishedDesignOf(revision)),
    warnings: publishedDesignOf(revision)?.design.warnings ?? [],
    exportedAt: new Date(),
  };
}

/** The buyer's comparison of the offers on their spec, in the page's order (`?sort=`). */
export async function comparisonSource(user: User, specId: string | undefined, sortParam: string | null): Promise<ComparisonInput> {
  const spec = await specFor(user, specId, "spec.compareBids");
  const sort: ComparisonSort = (COMPARISON_SORTS as readonly string[]).includes(sortParam ?? "") ? (sortParam as ComparisonSort) : "total";
  const [{ bids, comparison }, revision] = await Promise.all([
    comparisonOf(user, spec, sort),
    SpecRevision.findOne({ where: { specId: spec.id, number: spec.currentRevision } }),
  ]);
  if (!revision) notFound("This spec has no published revision yet.");
  return {
    title: spec.title,
    revision: spec.currentRevision,
    engineVersion: revision.engineVersion,
    buyerName: await organisationName(spec.organisationId),
    currency: spec.currency,
    comparison,
    offers: Object.fromEntries(bids.map((b) => [b.id, { units: b.units, notes: b.notes }])),
    warnings: publishedDesignOf(revision)?.design.warnings ?? [],
    exportedAt: new Date(),
  };
}
