import { Op, type WhereOptions } from "sequelize";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import { addDays } from "~/content/dates";
import { AuditEvent } from "~/models/audit.server";
import { Payment, Refund, type User } from "~/models/index.server";
import type { AuditQuery } from "~/schemas/audit";
import { ROLE_LABELS, type Role } from "~/auth/roles";
import { likePattern, pageCountOf, pageOf } from "./list-query.server";

// Reading the audit log: admins only (the access policy's audit.read), newest first, filtered by
// kind of entry, by who acted (name or address, literally) and by UTC calendar days.

const PAGE_SIZE = 50;

// An entry's details as an admin reads them: each fact by its name in words and a role by its
// label, never the key the service stored ("jobId", "account_manager"). A fact not listed here
// still shows, under its stored name, so nothing recorded is hidden.
const DETAIL_NAMES: Record<string, string> = {
  shop: "Shop",
  total: "Total",
  by: "Paid by",
  reference: "Reference",
  from: "Before",
  to: "After",
  manager: "Account manager",
  reason: "Reason",
  answer: "The card service said",
};
const SIGN_IN_FAILURES: Record<string, string> = { invalid: "wrong address or password", deactivated: "account deactivated", throttled: "too many tries" };

function detailLines(action: string, details: Record<string, unknown>) {
  return Object.entries(details).flatMap(([key, raw]) => {
    // The award's job is linked from the entry, not spelled out as an id.
    if (key === "jobId") return [];
    const value = String(raw);
    const words =
      action === "role-changed" && (key === "from" || key === "to")
        ? (ROLE_LABELS[value as Role] ?? value)
        : action === "sign-in-failed" && key === "reason"
          ? (SIGN_IN_FAILURES[value] ?? value)
          : value;
    return [`${DETAIL_NAMES[key] ?? key}: ${words}`];
  });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The job each entry speaks of, for a link: an award's job, a recorded balance's job, the job of a
 * payment or a refund (none once that payment is gone; the entry keeps its words either way).
 */
async function jobsOf(entries: AuditEvent[]): Promise<Map<string, string>> {
  const ids = (type: string) => entries.filter((e) => e.subjectType === type && UUID.test(e.subjectId ?? "")).map((e) => e.subjectId!);
  const [payments, refunds] = await Promise.all([
    Payment.findAll({ where: { id: ids("payment") }, attributes: ["id", "jobId"] }),
    Refund.findAll({ where: { id: ids("refund") }, attributes: ["id"], include: [{ model: Payment, as: "payment", attributes: ["jobId"] }] }),
  ]);
  const jobOfRecord = new Map<string, string>([
    ...payments.map((p) => [p.id, p.jobId] as [string, string]),
    ...refunds.flatMap((r) => {
      const payment = (r as Refund & { payment?: Payment }).payment;
      return payment ? [[r.id, payment.jobId] as [string, string]] : [];
    }),
  ]);
  const found = new Map<string, string>();
  for (const e of entries) {
    const job =
      typeof e.details.jobId === "string" ? e.details.jobId : e.subjectType === "job" ? e.subjectId : e.subjectId ? jobOfRecord.get(e.subjectId) : undefined;
    if (job && UUID.test(job)) found.set(e.id, job);
  }
  return found;
}

export async function listAuditEvents(admin: User, query: AuditQuery) {
  authorize(await viewerOf(admin), "audit.read", null);
  const { page, offset, limit } = pageOf(query.page, PAGE_SIZE);
  const conditions: WhereOptions<AuditEvent>[] = [];
  if (query.action) conditions.push({ action: query.action });
  if (query.actor) {
    const pattern = likePattern(query.actor);
    conditions.push({ [Op.or]: [{ actorName: { [Op.iLike]: pattern } }, { actorEmail: { [Op.iLike]: pattern } }] });
  }
  // "Until" includes the whole of its day.
  if (query.from) conditions.push({ at: { [Op.gte]: new Date(`${query.from}T00:00:00Z`) } });
  if (query.to) conditions.push({ at: { [Op.lt]: new Date(`${addDays(query.to, 1)}T00:00:00Z`) } });
  const { rows, count } = await AuditEvent.findAndCountAll({
    where: { [Op.and]: conditions },
    order: [
      ["at", "DESC"],
      ["id", "ASC"],
    ],
    offset,
    limit,
  });
  const jobs = await jobsOf(rows);
  return {
    entries: rows.map((e) => ({
      id: e.id,
      at: e.at.toISOString(),
      action: e.action,
      actorName: e.actorName,
      actorEmail: e.actorEmail,
      subjectType: e.subjectType,
      subjectLabel: e.subjectLabel,
      details: detailLines(e.action, e.details),
      jobId: jobs.get(e.id) ?? null,
    })),
    total: count,
    page,
    pageCount: pageCountOf(count, PAGE_SIZE),
  };
}
