import type { Transaction } from "sequelize";
import type { AuditAction, AuditSubjectType } from "~/content/audit-actions";
import { AuditEvent, type AuditDetails } from "~/models/audit.server";
import { formatMoney } from "~/content/money";
import type { Payment, Refund, User } from "~/models/index.server";

// The audit log's one writer. Call it inside the transaction of the change it records (as
// enqueueMail is), so an entry exists exactly when the change does; a sign-in, which changes
// nothing else worth a transaction, records alone. Read by admins at /admin/audit.

/** Who acted: a person, the system (the card service's webhook), or someone who failed to sign in. */
export type AuditActor = Pick<User, "id" | "name" | "email"> | "system" | { typedEmail: string };

export interface AuditSubject {
  type: AuditSubjectType;
  id: string;
  /** The record's name as it is now (an organisation's name, a spec's title): kept as written. */
  label: string;
}

export interface AuditEntry {
  actor: AuditActor;
  action: AuditAction;
  subject?: AuditSubject | null;
  /** A few plain facts (an amount, a role before and after); never a password or a token. */
  details?: AuditDetails;
}

const MAX_DETAILS = 12;
const MAX_DETAIL_CHARS = 300;

/** Cuts a value to the column's size and drops control characters (what someone typed lands here). */
function bounded(value: string, max: number) {
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is dropped
  return value.replace(/[\u0000-\u001f\u007f]/g, " ").slice(0, max);
}

function actorColumns(actor: AuditActor) {
  if (actor === "system") return { actorId: null, actorName: "Tenderflow (automatic)", actorEmail: null };
  if ("typedEmail" in actor) return { actorId: null, actorName: "Unknown visitor", actorEmail: bounded(actor.typedEmail.trim(), 254) };
  return { actorId: actor.id, actorName: bounded(actor.name, 120), actorEmail: bounded(actor.email, 254) };
}

function boundedDetails(details: AuditDetails = {}): AuditDetails {
  const entries = Object.entries(details).slice(0, MAX_DETAILS);
  return Object.fromEntries(entries.map(([key, value]) => [bounded(key, 40), typeof value === "string" ? bounded(value, MAX_DETAIL_CHARS) : value]));
}

/** Writes one audit entry, in the caller's transaction when there is one. */
export async function recordAudit({ actor, action, subject, details }: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      action,
      ...actorColumns(actor),
      subjectType: subject?.type ?? null,
      subjectId: subject ? bounded(subject.id, 64) : null,
      subjectLabel: subject ? bounded(subject.label, 200) : null,
      details: boundedDetails(details),
    },
    { transaction },
  );
}

/** A payment as an audit subject: its amount and what it paid, as they were then. */
export const paymentSubject = (payment: Pick<Payment, "id" | "amountCents" | "currency" | "jobId">): AuditSubject => ({
  type: "payment",
  id: payment.id,
  label: `${formatMoney(payment.amountCents, payment.currency)} for job ${payment.jobId.slice(0, 8)}`,
});

/** A refund as an audit subject, named by its amount and the payment it pays back. */
export const refundSubject = (refund: Pick<Refund, "id" | "amountCents">, payment: Pick<Payment, "amountCents" | "currency" | "jobId">): AuditSubject => ({
  type: "refund",
  id: refund.id,
  label: `${formatMoney(refund.amountCents, payment.currency)} of ${formatMoney(payment.amountCents, payment.currency)} for job ${payment.jobId.slice(0, 8)}`,
});
