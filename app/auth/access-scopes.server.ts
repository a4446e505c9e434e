import { Op, type FindOptions, type Model, type ModelStatic, type WhereOptions } from "sequelize";
import { sequelize, type Bid, type Job, type Organisation, type Payment, type Spec, type SpecQuestion } from "~/models/index.server";
import { invariantResponse, requireId } from "~/services/errors.server";
import { isOperator, managedAccountsWhere, type Viewer } from "./viewer.server";

// What each viewer may list, as where-clauses: a list, a single read and a write all start from
// the same clause, so they cannot disagree. A record outside the clause is "not found".

/** A spec is published from its first revision on; drafts and withdrawn specs stay with the buyer. */
export const PUBLISHED_STATUSES = ["open", "closed", "awarded"] as const;
/** Bids a buyer sees: offered or decided, never drafts or taken-back ones. */
export const OFFERED_BID_STATUSES = ["submitted", "won", "not_selected"] as const;

/** Matches no row. */
const NOTHING = sequelize.literal("FALSE");

/** A scope that admits no record: a caller can answer "none" without asking the database. */
export const admitsNothing = (where: unknown) => where === NOTHING;

/** Rows of the buyer accounts the viewer manages, by the column naming the buyer organisation. */
const ofManagedAccounts = (viewer: Viewer, column: string) => (viewer.accounts === "all" ? {} : { [column]: [...viewer.accounts] });

/**
 * Specs: a buyer its organisation's (drafts too); an approved shop every published one; an
 * account manager the published specs of their accounts; an admin every published one.
 */
export function specsWhere(viewer: Viewer): WhereOptions<Spec> {
  if (viewer.role === "buyer") return { organisationId: viewer.organisationId };
  if (viewer.role === "shop") return viewer.approvedShop ? { status: [...PUBLISHED_STATUSES] } : NOTHING;
  if (isOperator(viewer)) return { status: [...PUBLISHED_STATUSES], ...ofManagedAccounts(viewer, "organisationId") };
  return NOTHING;
}

/**
 * Bids: a shop its own (drafts too); a buyer the offered and decided bids on its specs. Operator
 * staff read no bids: the awarded price reaches them through the job.
 */
export function bidsWhere(viewer: Viewer): WhereOptions<Bid> {
  if (viewer.role === "shop") return { organisationId: viewer.organisationId };
  if (viewer.role === "buyer") {
    const ownSpecs = sequelize.literal(`(SELECT id FROM specs WHERE organisation_id = ${sequelize.escape(viewer.organisationId)})`);
    return { status: [...OFFERED_BID_STATUSES], specId: { [Op.in]: ownSpecs } };
  }
  return NOTHING;
}

/**
 * Bids whose documents (quotation, datasheets, drawings) the viewer may read: a shop its own, the
 * buyer the offered bids on its specs, and, unlike the bids themselves, the buyer's account
 * manager and admins the offered bids on the specs of the accounts they manage.
 */
export function offerDocumentsWhere(viewer: Viewer): WhereOptions<Bid> {
  if (!isOperator(viewer)) return bidsWhere(viewer);
  const specs =
    viewer.accounts === "all"
      ? sequelize.literal("(SELECT id FROM specs)")
      : viewer.accounts.length
        ? sequelize.literal(`(SELECT id FROM specs WHERE organisation_id IN (${viewer.accounts.map((id) => sequelize.escape(id)).join(", ")}))`)
        : null;
  return specs ? { status: [...OFFERED_BID_STATUSES], specId: { [Op.in]: specs } } : NOTHING;
}

/** Jobs: the buyer's and the shop's own, an account manager's accounts', an admin every one. */
export function jobsWhere(viewer: Viewer): WhereOptions<Job> {
  if (viewer.role === "buyer") return { buyerOrganisationId: viewer.organisationId };
  if (viewer.role === "shop") return { shopOrganisationId: viewer.organisationId };
  if (isOperator(viewer)) return ofManagedAccounts(viewer, "buyerOrganisationId");
  return NOTHING;
}

/** Retainer payments: the paying buyer's, an account manager's accounts', an admin every one; no shop's. */
export function paymentsWhere(viewer: Viewer): WhereOptions<Payment> {
  if (viewer.role === "buyer") return { buyerOrganisationId: viewer.organisationId };
  if (isOperator(viewer)) return ofManagedAccounts(viewer, "buyerOrganisationId");
  return NOTHING;
}

/** Buyer accounts: the ones the viewer manages. */
export const accountsWhere = (viewer: Viewer): WhereOptions<Organisation> => managedAccountsWhere(viewer) ?? NOTHING;

/**
 * Organisations whose page (who they are, their people) a viewer opens: an admin every one; an
 * account manager their buyer accounts and the shops building those accounts' jobs; buyers and
 * shops none (their own people are on the team page).
 */
export function organisationsWhere(viewer: Viewer): WhereOptions<Organisation> {
  if (!isOperator(viewer)) return NOTHING;
  if (viewer.accounts === "all") return {};
  if (viewer.accounts.length === 0) return NOTHING;
  const accounts = viewer.accounts.map((id) => sequelize.escape(id)).join(", ");
  const theirShops = sequelize.literal(`(SELECT shop_organisation_id FROM jobs WHERE buyer_organisation_id IN (${accounts}))`);
  return { [Op.or]: [{ id: [...viewer.accounts] }, { id: { [Op.in]: theirShops } }] };
}

/**
 * Questions on a spec the viewer reads: a shop the answered ones and its own; the buyer and
 * operator staff every one (the asking shop's name is a separate rule, see `can`).
 */
export function questionsWhere(viewer: Viewer): WhereOptions<SpecQuestion> {
  if (viewer.role === "shop") return { [Op.or]: [{ answer: { [Op.ne]: null } }, { organisationId: viewer.organisationId }] };
  return {};
}

/**
 * One record by its id inside a scope, or a 404 with `missing` as its message: a malformed id,
 * a missing record and someone else's record look the same. Other find options (lock,
 * transaction, include) pass through.
 */
export async function findInScope<M extends Model>(
  model: ModelStatic<M>,
  scope: WhereOptions,
  id: string | undefined,
  options: Omit<FindOptions, "where"> & { missing: string },
): Promise<M> {
  const { missing, ...find } = options;
  const row = await model.findOne({ ...find, where: { [Op.and]: [scope, { id: requireId(id) }] } } as FindOptions);
  invariantResponse(row, missing, 404);
  return row;
}
