import { Op } from "sequelize";
import { Organisation, Spec, User } from "~/models/index.server";
import { admitsNothing, can, findInScope, organisationsWhere, specsWhere, viewerOf } from "~/auth/access-policy.server";
import type { OrganisationKind } from "~/auth/roles";
import type { Approval } from "~/content/shop-approval";
import { shownSpecStatus, type SpecStatus } from "~/content/spec-status";
import { listJobs } from "./job-reads.server";

// One organisation as operator staff see it: who it is, where it stands, its people, and the
// specs and jobs the viewer may read. Every part goes through the access policy: the page
// itself (organisationsWhere), the specs (specsWhere) and the jobs (jobsWhere, in listJobs).
// Bids are not listed: operator staff read no bids (bidsWhere); a shop's won work is its jobs.

const RECENT = 5;

export async function organisationPageOf(viewer: User, organisationId: string | undefined) {
  const policyViewer = await viewerOf(viewer);
  const organisation = (await findInScope(Organisation, organisationsWhere(policyViewer), organisationId, {
    missing: "No such organisation.",
    include: [
      { model: User, as: "users" },
      { model: User, as: "accountManager", required: false },
    ],
  })) as Organisation & { users: User[]; accountManager: User | null };
  const kind = organisation.kind as OrganisationKind;
  const party = kind === "shop" ? { shop: organisation.id } : kind === "buyer" ? { account: organisation.id } : null;
  const [specs, jobs] = await Promise.all([
    kind === "buyer"
      ? Spec.findAndCountAll({
          where: { [Op.and]: [specsWhere(policyViewer), { organisationId: organisation.id }] },
          attributes: ["id", "title", "status", "bidDeadline", "publishedAt"],
          order: [
            ["publishedAt", "DESC NULLS LAST"],
            ["id", "ASC"],
          ],
          limit: RECENT,
        })
      : null,
    party ? listJobs(viewer, party, { limit: RECENT }) : null,
  ]);
  const people = [...organisation.users].sort((a, b) => a.name.localeCompare(b.name));
  return {
    id: organisation.id,
    name: organisation.name,
    kind,
    region: organisation.region,
    since: organisation.createdAt.toISOString(),
    approval: organisation.approval as Approval | null,
    approvalReason: organisation.approvalReason as string | null,
    approvalDecidedAt: organisation.approvalDecidedAt?.toISOString() ?? null,
    canDecideApproval: can(policyViewer, "shop.decide", organisation),
    accountManager: organisation.accountManager?.name ?? null,
    people: people.map((u) => ({
      id: u.id,
      name: u.name,
      email: u.email,
      role: u.role,
      active: u.active,
      lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
    })),
    specs: specs
      ? {
          total: specs.count,
          recent: specs.rows.map((s) => ({
            id: s.id,
            title: s.title,
            status: shownSpecStatus(s.status as SpecStatus, s.bidDeadline),
            publishedAt: s.publishedAt?.toISOString() ?? null,
          })),
        }
      : null,
    jobs: jobs && party ? { total: jobs.total, recent: jobs.jobs, listLink: `/jobs?${kind === "shop" ? "shop" : "account"}=${organisation.id}` } : null,
  };
}

export type OrganisationPage = Awaited<ReturnType<typeof organisationPageOf>>;

/**
 * Which of these organisations the viewer may open the page of (the same organisationsWhere),
 * so a list links a name only where the page would open.
 */
export async function openableOrganisations(viewer: User, ids: string[]): Promise<string[]> {
  const unique = [...new Set(ids)];
  const scope = organisationsWhere(await viewerOf(viewer));
  if (unique.length === 0 || admitsNothing(scope)) return [];
  const rows = await Organisation.findAll({
    where: { [Op.and]: [scope, { id: unique }] },
    attributes: ["id"],
  });
  return rows.map((o) => o.id);
}
