import { Op, type WhereOptions } from "sequelize";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import { addDays } from "~/content/dates";
import { AuditEvent } from "~/models/audit.server";
import type { User } from "~/models/index.server";
import type { AuditQuery } from "~/schemas/audit";
import { likePattern, pageCountOf, pageOf } from "./list-query.server";

// Reading the audit log: admins only (the access policy's audit.read), newest first, filtered by
// kind of entry, by who acted (name or address, literally) and by UTC calendar days.

const PAGE_SIZE = 50;

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
  return {
    entries: rows.map((e) => ({
      id: e.id,
      at: e.at.toISOString(),
      action: e.action,
      actorName: e.actorName,
      actorEmail: e.actorEmail,
      subjectType: e.subjectType,
      subjectLabel: e.subjectLabel,
      details: Object.entries(e.details).map(([key, value]) => `${key}: ${String(value)}`),
    })),
    total: count,
    page,
    pageCount: pageCountOf(count, PAGE_SIZE),
  };
}
