import type { Job, Organisation, Payment, Spec } from "~/models/index.server";
import { forbidden, notFound } from "~/services/errors.server";
import { PUBLISHED_STATUSES } from "./access-scopes.server";
import { isOperator, manages, type Viewer } from "./viewer.server";

// The access policy: the one place that decides who may see and do what with a record. Reads
// are the where-clauses of access-scopes.server.ts (a record outside them is a 404); actions are
// the table below, asked through `can` (to show a button) and `authorize` (before a write).
// Services ask here; no other module tests a role for record access.

export { viewerOf, isOperator, managedAccountsWhere, type Viewer } from "./viewer.server";
export {
  PUBLISHED_STATUSES,
  OFFERED_BID_STATUSES,
  accountsWhere,
  admitsNothing,
  bidsWhere,
  findInScope,
  jobsWhere,
  offerDocumentsWhere,
  organisationsWhere,
  paymentsWhere,
  questionsWhere,
  specsWhere,
} from "./access-scopes.server";

type JobParties = Pick<Job, "buyerOrganisationId" | "shopOrganisationId">;
type PaymentParties = Pick<Payment, "buyerOrganisationId">;
type SpecFacts = Pick<Spec, "organisationId" | "status">;
type OrganisationFacts = Pick<Organisation, "id" | "kind">;

interface Refusal {
  status: 403 | 404;
  message: string;
}
interface Rule<R> {
  allows: (viewer: Viewer, record: R) => boolean;
  /** What a refused write answers: 404 where the record's existence is not the viewer's business. */
  refusal: Refusal;
}
const rule = <R>(allows: Rule<R>["allows"], refusal: Refusal): Rule<R> => ({ allows, refusal });
const forbid = (message = "You don't have access to this page."): Refusal => ({ status: 403, message });
const NO_SPEC: Refusal = { status: 404, message: "No such spec." };

const isPublished = (spec: Pick<Spec, "status">) => (PUBLISHED_STATUSES as readonly string[]).includes(spec.status);
const buyerOf = (viewer: Viewer, organisationId: string) => viewer.role === "buyer" && viewer.organisationId === organisationId;
const staffOf = (viewer: Viewer, organisationId: string) => isOperator(viewer) && manages(viewer, organisationId);
const readingShop = (viewer: Viewer, spec: SpecFacts) => viewer.role === "shop" && viewer.approvedShop && isPublished(spec);

/** Every action a person takes on a record, with who may take it. */
const POLICY = {
  // Jobs
  "job.recordProgress": rule<JobParties>(
    (v, job) => v.role === "shop" && v.organisationId === job.shopOrganisationId,
    forbid("Only the shop building this job records its progress."),
  ),
  "job.writeManagerNote": rule<JobParties>(
    (v, job) => staffOf(v, job.buyerOrganisationId),
    forbid("Only account managers and administrators write internal notes."),
  ),
  "job.readInternalNotes": rule<JobParties>(
    (v, job) => staffOf(v, job.buyerOrganisationId),
    forbid("Internal notes are for account managers and administrators."),
  ),
  "job.seePayments": rule<JobParties>(
    (v, job) => buyerOf(v, job.buyerOrganisationId) || staffOf(v, job.buyerOrganisationId),
    forbid("Payments are the buyer's and Tenderflow's business."),
  ),
  "job.payRetainer": rule<JobParties>((v, job) => buyerOf(v, job.buyerOrganisationId), forbid("Only the buyer pays the retainer.")),
  "job.acceptHandover": rule<JobParties>((v, job) => buyerOf(v, job.buyerOrganisationId), forbid("Only the buyer accepts the handover.")),
  "job.exchangeFiles": rule<JobParties>(
    (v, job) => buyerOf(v, job.buyerOrganisationId) || (v.role === "shop" && v.organisationId === job.shopOrganisationId),
    forbid("Files are exchanged by the buyer and the shop of the job."),
  ),
  "job.payBalance": rule<JobParties>((v, job) => buyerOf(v, job.buyerOrganisationId), forbid("Only the buyer pays the balance.")),
  "job.recordBankTransfer": rule<JobParties>(
    (v, job) => staffOf(v, job.buyerOrganisationId),
    forbid("Only account managers and administrators record a bank transfer."),
  ),
  // Payments
  "payment.refund": rule<PaymentParties>(
    (v, payment) => staffOf(v, payment.buyerOrganisationId),
    forbid("Only account managers and administrators pay back retainers."),
  ),
  // Specs: the buyer's side
  "spec.edit": rule<SpecFacts>((v, spec) => buyerOf(v, spec.organisationId), NO_SPEC),
  "spec.compareBids": rule<SpecFacts>((v, spec) => buyerOf(v, spec.organisationId), NO_SPEC),
  "spec.award": rule<SpecFacts>((v, spec) => buyerOf(v, spec.organisationId), NO_SPEC),
  "spec.answerQuestion": rule<SpecFacts>((v, spec) => buyerOf(v, spec.organisationId), NO_SPEC),
  "spec.seeAskers": rule<SpecFacts>((v, spec) => buyerOf(v, spec.organisationId), NO_SPEC),
  // Specs: the shops' side
  "spec.bid": rule<SpecFacts>(readingShop, NO_SPEC),
  "spec.askQuestion": rule<SpecFacts>(readingShop, NO_SPEC),
  // The buyer is named to its own people and its account's staff, never to a shop.
  "spec.seeBuyerName": rule<SpecFacts>(
    (v, spec) => v.organisationId === spec.organisationId || staffOf(v, spec.organisationId),
    forbid("The buyer is not named to shops."),
  ),
  // Organisations
  "shop.decide": rule<OrganisationFacts>((v, org) => v.role === "admin" && org.kind === "shop", forbid("Only administrators approve shops.")),
  "team.invite": rule<OrganisationFacts>((v, org) => v.organisationId === org.id && (org.kind !== "operator" || v.role === "admin"), forbid()),
  // New buyer accounts nobody follows yet: every account manager sees them, so none is missed.
  "account.seeUnassigned": rule<null>((v) => isOperator(v), forbid()),
  // A buyer account's notes: its account manager's and the admins'; others find no such account.
  "account.writeNote": rule<OrganisationFacts>((v, org) => org.kind === "buyer" && staffOf(v, org.id), { status: 404, message: "No such account." }),
  // The company profile: the organisation's own people (an operator's, its admins).
  "organisation.editProfile": rule<OrganisationFacts>(
    (v, org) => v.organisationId === org.id && (org.kind !== "operator" || v.role === "admin"),
    forbid("Only the organisation's own people edit its profile."),
  ),
  "platform.administer": rule<null>((v) => v.role === "admin", forbid()),
  "audit.read": rule<null>((v) => v.role === "admin", forbid("The audit log is for administrators.")),
} satisfies Record<string, Rule<never>>;

export type Action = keyof typeof POLICY;
export type RecordOf<A extends Action> = Parameters<(typeof POLICY)[A]["allows"]>[1];
export const ACTIONS = Object.keys(POLICY) as Action[];

/** Whether the viewer may take `action` on `record`: what a page's button is shown from. */
export function can<A extends Action>(viewer: Viewer, action: A, record: RecordOf<A>): boolean {
  return (POLICY[action].allows as (v: Viewer, r: RecordOf<A>) => boolean)(viewer, record);
}

/** Refuses the action (403 or 404, as the table says) unless the viewer may take it. */
export function authorize<A extends Action>(viewer: Viewer, action: A, record: RecordOf<A>): void {
  if (can(viewer, action, record)) return;
  const { status, message } = POLICY[action].refusal;
  if (status === 404) notFound(message);
  forbidden(message);
}
