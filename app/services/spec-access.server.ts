import type { Transaction } from "sequelize";
import { Organisation, Spec, User } from "~/models/index.server";
import { notFound, requireId } from "./errors.server";

// Who may see a spec, in one place: its own buyer organisation always; shops once it has been
// published and only when an admin has approved the shop's organisation; account managers the
// published specs of the buyer accounts assigned to them; admins any published spec. Drafts
// stay with the buyer. Anyone else gets a 404.

export const PUBLISHED_STATUSES = ["open", "closed", "awarded"] as const;

/** A spec of the buyer's own organisation (to edit, publish, upload to). */
export async function specOfOwner(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findOne({ where: { id: requireId(specId), organisationId: user.organisationId } });
  if (!spec || user.role !== "buyer") notFound("No such spec.");
  return spec;
}

export const isPublished = (spec: Pick<Spec, "status">) => (PUBLISHED_STATUSES as readonly string[]).includes(spec.status);

type MaybeWithOrganisation = User & { organisation?: Organisation | null };

/**
 * Whether a shop user's organisation has been approved to read specs. Every reader of spec
 * content (the spec, its files, questions, bids, the bill workbook, the open-specs table)
 * passes here. The organisation the session loaded is used when present (it was read in this
 * request); otherwise it is read now.
 */
export async function shopMayReadSpecs(user: MaybeWithOrganisation): Promise<boolean> {
  if (user.role !== "shop") return false;
  const loaded = user.organisation && user.organisation.id === user.organisationId ? user.organisation : null;
  const organisation = loaded ?? (await Organisation.findByPk(user.organisationId, { attributes: ["id", "approval"] }));
  return organisation?.approval === "approved";
}

/** A spec's content is refused (as "not found") to a shop that is not approved. */
export async function requireApprovedShop(user: User): Promise<void> {
  if (!(await shopMayReadSpecs(user))) notFound("No such spec.");
}

/** The people a published spec is announced to: active users of approved shops. */
export function shopPeopleToTell(transaction?: Transaction) {
  return User.findAll({
    where: { role: "shop", active: true },
    include: [{ model: Organisation, as: "organisation", attributes: [], where: { kind: "shop", approval: "approved" } }],
    order: [["email", "ASC"]],
    transaction,
  });
}

/**
 * A spec the user may read: a buyer their own organisation's (drafts too); an approved shop a
 * published one; an account manager a published spec of a buyer account assigned to them
 * (organisations.account_manager_id); an admin a published one. Anything else is a 404.
 */
export async function specForReader(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findByPk(requireId(specId), {
    include: user.role === "account_manager" ? [{ model: Organisation, as: "organisation", attributes: ["id", "accountManagerId"] }] : [],
  });
  if (!spec) notFound("No such spec.");
  if (user.role === "buyer" && spec.organisationId === user.organisationId) return spec;
  if (user.role === "admin" && isPublished(spec)) return spec;
  if (user.role === "shop" && isPublished(spec) && (await shopMayReadSpecs(user))) return spec;
  if (user.role === "account_manager" && isPublished(spec)) {
    const account = (spec as Spec & { organisation?: Organisation }).organisation;
    if (account && account.accountManagerId === user.id) return spec;
  }
  notFound("No such spec.");
}

/**
 * The buyer's company as a reader of its spec may see it, for the spec page and every document
 * made from the spec alike: the buyer's own people and operator staff read the name; a shop
 * never does (buyers' machines are confidential, and the chosen shop meets its buyer on the
 * job, after the award). Null means "do not name the buyer".
 */
export async function buyerNameFor(reader: User, spec: Pick<Spec, "organisationId">): Promise<string | null> {
  const insider = reader.organisationId === spec.organisationId || reader.role === "admin" || reader.role === "account_manager";
  if (!insider) return null;
  return (await Organisation.findByPk(spec.organisationId, { attributes: ["name"] }))?.name ?? null;
}
