import type { Transaction } from "sequelize";
import { Organisation, Spec, User } from "~/models/index.server";
import { readOncePerRequest } from "~/http/request-scope.server";
import { authorize, can, findInScope, specsWhere, viewerOf, type Action, type Viewer } from "~/auth/access-policy.server";

// Loading a spec for a reader or for an action. Who may read which spec, and who may act on it,
// is the access policy's (specsWhere, can): a spec outside the reader's scope is a 404.

type LoadOptions = { transaction?: Transaction; lock?: boolean };

function loadSpec(viewer: Viewer, specId: string | undefined, { transaction, lock }: LoadOptions) {
  const load = () =>
    findInScope(Spec, specsWhere(viewer), specId, { missing: "No such spec.", transaction, lock: lock ? transaction?.LOCK.UPDATE : undefined });
  // A page's loaders each check the same spec: read once per page view (never inside a transaction).
  return transaction ? load() : readOncePerRequest(`spec ${specId} for ${viewer.id}`, load);
}

/** A spec the user may read (a buyer its own, drafts too; see specsWhere), or a 404. */
export async function specForReader(user: User, specId: string | undefined, options: LoadOptions = {}): Promise<Spec> {
  return loadSpec(await viewerOf(user, options.transaction), specId, options);
}

/** A spec the user may read and take `action` on; refused as the policy says (a 404 for a spec's actions). */
export async function specFor(user: User, specId: string | undefined, action: Action & `spec.${string}`, options: LoadOptions = {}): Promise<Spec> {
  const viewer = await viewerOf(user, options.transaction);
  const spec = await loadSpec(viewer, specId, options);
  authorize(viewer, action, spec);
  return spec;
}

/** A spec of the buyer's own organisation, to edit, publish, upload to or delete. */
export const specOfOwner = (user: User, specId: string | undefined, options: LoadOptions = {}) => specFor(user, specId, "spec.edit", options);

/** The people a published spec is announced to: active users of approved shops (a shop holds only shop users). */
export function shopPeopleToTell(transaction?: Transaction) {
  return User.findAll({
    where: { active: true },
    include: [{ model: Organisation, as: "organisation", attributes: [], where: { kind: "shop", approval: "approved" } }],
    order: [["email", "ASC"]],
    transaction,
  });
}

/**
 * The buyer's company as a reader of its spec may see it, for the spec page and every document
 * made from the spec alike: the buyer's own people and operator staff read the name; a shop
 * never does (buyers' machines are confidential, and the chosen shop meets its buyer on the
 * job, after the award). Null means "do not name the buyer".
 */
export async function buyerNameFor(reader: User, spec: Pick<Spec, "organisationId" | "status">): Promise<string | null> {
  if (!can(await viewerOf(reader), "spec.seeBuyerName", spec)) return null;
  return (await Organisation.findByPk(spec.organisationId, { attributes: ["name"] }))?.name ?? null;
}
