import { Organisation, Spec } from "~/models/index.server";
import type { User } from "~/models/index.server";
import { notFound, requireId } from "./errors.server";

// Who may see a spec, in one place: its own buyer organisation always; shops once it has been
// published; account managers the published specs of the buyer accounts assigned to them;
// admins any published spec. Drafts stay with the buyer. Anyone else gets a 404.

export const PUBLISHED_STATUSES = ["open", "closed", "awarded"] as const;

/** A spec of the buyer's own organisation (to edit, publish, upload to). */
export async function specOfOwner(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findOne({ where: { id: requireId(specId), organisationId: user.organisationId } });
  if (!spec || user.role !== "buyer") notFound("No such spec.");
  return spec;
}

export const isPublished = (spec: Pick<Spec, "status">) => (PUBLISHED_STATUSES as readonly string[]).includes(spec.status);

/**
 * A spec the user may read: a buyer their own organisation's (drafts too); a shop a published
 * one; an account manager a published spec of a buyer account assigned to them
 * (organisations.account_manager_id); an admin a published one. Anything else is a 404.
 */
export async function specForReader(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findByPk(requireId(specId), {
    include: user.role === "account_manager" ? [{ model: Organisation, as: "organisation", attributes: ["id", "accountManagerId"] }] : [],
  });
  if (!spec) notFound("No such spec.");
  if (user.role === "buyer" && spec.organisationId === user.organisationId) return spec;
  if ((user.role === "shop" || user.role === "admin") && isPublished(spec)) return spec;
  if (user.role === "account_manager" && isPublished(spec)) {
    const account = (spec as Spec & { organisation?: Organisation }).organisation;
    if (account && account.accountManagerId === user.id) return spec;
  }
  notFound("No such spec.");
}
