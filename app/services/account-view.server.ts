import { Op } from "sequelize";
import { authorize, can, findInScope, jobsWhere, organisationsWhere, paymentsWhere, specsWhere, viewerOf } from "~/auth/access-policy.server";
import { daysBetween, isoDay, todayUtc } from "~/content/dates";
import { AccountNote } from "~/models/account-note.server";
import { Bid, Job, Organisation, Payment, Spec, type User } from "~/models/index.server";
import { OFFERED_BID_STATUSES } from "~/auth/access-scopes.server";
import { notFound } from "./errors.server";
import { PROFILE_ATTRIBUTES, profileOf } from "./organisation-profile.server";
import { balanceCentsOf } from "./balance.server";

// What an account manager follows per buyer account, beyond the organisation page: its open
// specs with the bids received and how long past the deadline, its payments, its company
// profile (the contact for quotes), and the notes kept on it. Only for those who manage the
// account (the access policy's account.writeNote); anyone else gets null.

const PAYMENTS_SHOWN = 10;

export async function accountViewOf(viewer: User, organisationId: string) {
  const policyViewer = await viewerOf(viewer);
  const organisation = await Organisation.findByPk(organisationId, { attributes: PROFILE_ATTRIBUTES });
  if (!organisation || !can(policyViewer, "account.writeNote", organisation)) return null;
  const today = todayUtc();
  const [openSpecs, payments, transfers, notes] = await Promise.all([
    Spec.findAll({
      where: { [Op.and]: [specsWhere(policyViewer), { organisationId, status: "open" }] },
      attributes: ["id", "title", "bidDeadline"],
      order: [
        ["bidDeadline", "ASC NULLS LAST"],
        ["id", "ASC"],
      ],
    }),
    Payment.findAll({
      where: { [Op.and]: [paymentsWhere(policyViewer), { buyerOrganisationId: organisationId }] },
      include: [{ model: Job, as: "job", attributes: ["id", "specId"], include: [{ model: Spec, as: "spec", attributes: ["title"] }] }],
      order: [
        ["createdAt", "DESC"],
        ["id", "ASC"],
      ],
      limit: PAYMENTS_SHOWN,
    }),
    // A balance the manager recorded as paid by bank transfer is a payment too, with no card row.
    Job.findAll({
      where: { [Op.and]: [jobsWhere(policyViewer), { buyerOrganisationId: organisationId, balanceMethod: "bank_transfer" }] },
      attributes: ["id", "totalCents", "retainerCents", "currency", "balancePaidAt"],
      include: [{ model: Spec, as: "spec", attributes: ["title"] }],
      order: [
        ["balancePaidAt", "DESC"],
        ["id", "ASC"],
      ],
      limit: PAYMENTS_SHOWN,
    }),
    AccountNote.findAll({
      where: { organisationId },
      include: [
        { association: "author", attributes: ["name"] },
        { association: "editedBy", attributes: ["name"] },
      ],
      order: [
        ["createdAt", "DESC"],
        ["id", "ASC"],
      ],
    }),
  ]);
  // Counted, not read: operator staff see how many offers came, never the offers (bidsWhere).
  const counts = await Bid.count({ where: { specId: openSpecs.map((s) => s.id), status: [...OFFERED_BID_STATUSES] }, group: ["specId"] });
  const bidsBySpec = new Map(counts.map((c) => [c.specId as string, Number(c.count)]));
  return {
    profile: profileOf(organisation),
    openSpecs: openSpecs.map((s) => {
      const bids = bidsBySpec.get(s.id) ?? 0;
      const passed = s.bidDeadline !== null && s.bidDeadline.getTime() < Date.now();
      return {
        id: s.id,
        title: s.title,
        deadline: s.bidDeadline?.toISOString() ?? null,
        bids,
        // Past its deadline and still open: the buyer has not awarded (or no bid came).
        daysLate: passed ? Math.max(1, daysBetween(isoDay(s.bidDeadline!), today)) : 0,
      };
    }),
    payments: [
      ...payments.map((p) => {
        const job = (p as Payment & { job: Job & { spec: Spec } }).job;
        return {
          id: p.id,
          jobId: p.jobId,
          specTitle: job.spec.title,
          purpose: p.purpose,
          byTransfer: false,
          status: p.status,
          amountCents: p.amountCents,
          refundedCents: p.refundedCents,
          currency: p.currency,
          paidAt: p.paidAt?.toISOString() ?? null,
          createdAt: p.createdAt.toISOString(),
        };
      }),
      ...transfers.map((j) => ({
        id: `transfer-${j.id}`,
        jobId: j.id,
        specTitle: (j as Job & { spec: Spec }).spec.title,
        purpose: "balance" as const,
        byTransfer: true,
        status: "paid" as const,
        amountCents: balanceCentsOf(j),
        refundedCents: 0,
        currency: j.currency,
        paidAt: j.balancePaidAt!.toISOString(),
        createdAt: j.balancePaidAt!.toISOString(),
      })),
    ]
      // Newest first, card payments and transfers together.
      .sort((a, b) => (b.paidAt ?? b.createdAt).localeCompare(a.paidAt ?? a.createdAt))
      .slice(0, PAYMENTS_SHOWN),
    notes: notes.map((n) => ({
      id: n.id,
      body: n.body,
      author: n.author?.name ?? "A former colleague",
      createdAt: n.createdAt.toISOString(),
      editedBy: n.editedById ? (n.editedBy?.name ?? "A former colleague") : null,
      updatedAt: n.updatedAt.toISOString(),
    })),
  };
}

export type AccountView = NonNullable<Awaited<ReturnType<typeof accountViewOf>>>;

/** The buyer account a note is written on, if the viewer manages it (else 404, as for a page they cannot open). */
async function managedAccount(viewer: User, organisationId: string | undefined) {
  const policyViewer = await viewerOf(viewer);
  const organisation = await findInScope(Organisation, organisationsWhere(policyViewer), organisationId, { missing: "No such account." });
  authorize(policyViewer, "account.writeNote", organisation);
  return organisation;
}

export async function addAccountNote(viewer: User, organisationId: string | undefined, { body }: { body: string }) {
  const organisation = await managedAccount(viewer, organisationId);
  return AccountNote.create({ organisationId: organisation.id, body, authorId: viewer.id, editedById: null });
}

export async function editAccountNote(viewer: User, organisationId: string | undefined, { noteId, body }: { noteId: string; body: string }) {
  const organisation = await managedAccount(viewer, organisationId);
  const note = await AccountNote.findOne({ where: { id: noteId, organisationId: organisation.id } });
  if (!note) notFound("No such note.");
  if (note.body !== body) await note.update({ body, editedById: viewer.id });
  return note;
}

/** Whole days a job's next milestone is past its target, 0 when it is not late. */
export function daysLate(job: { overdue: boolean; next: { targetDate: string | null } | null }, today = todayUtc()) {
  if (!job.overdue || !job.next?.targetDate) return 0;
  return Math.max(0, daysBetween(job.next.targetDate, today));
}
