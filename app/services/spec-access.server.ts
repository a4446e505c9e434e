import { Spec } from "~/models/index.server";
import type { User } from "~/models/index.server";
import { notFound, requireId } from "./errors.server";

// Who may see a spec, in one place: its own buyer organisation always; shops once it has been
// published; account managers for the buyer accounts they follow. Anyone else gets a 404.

export const PUBLISHED_STATUSES = ["open", "closed", "awarded"] as const;

/** A spec of the buyer's own organisation (to edit, publish, upload to). */
export async function specOfOwner(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findOne({ where: { id: requireId(specId), organisationId: user.organisationId } });
  if (!spec || user.role !== "buyer") notFound("No such spec.");
  return spec;
}

/** A spec the user may read: their own, or a published one for shops. */
export async function specForReader(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await Spec.findByPk(requireId(specId));
  if (!spec) notFound("No such spec.");
  if (user.role === "buyer" && spec.organisationId === user.organisationId) return spec;
  if (user.role === "shop" && (PUBLISHED_STATUSES as readonly string[]).includes(spec.status)) return spec;
  notFound("No such spec.");
}
