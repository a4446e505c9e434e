import { z } from "zod";
import { AUDIT_ACTION_KEYS } from "~/content/audit-actions";
import { isIsoDay } from "~/content/dates";

// The audit log's filters (GET parameters). Each is read on its own: a bad one is reported beside
// its field and left out, so the other filters still apply and what was typed stays in the form.

const blank = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
const day = (what: string) =>
  z.preprocess(
    blank,
    z
      .string()
      .trim()
      .max(10, `${what}: write the date as year-month-day, e.g. 2026-03-14.`)
      .refine(isIsoDay, `${what}: that is not a date on the calendar; write it as year-month-day, e.g. 2026-03-14.`)
      .optional(),
  );

const FILTERS = {
  action: z.preprocess(blank, z.enum(AUDIT_ACTION_KEYS, { error: "That is not one of the kinds of entry; every kind is shown." }).optional()),
  actor: z.preprocess(blank, z.string().trim().max(100, "Search for a name or address of at most 100 characters.").optional()),
  from: day("From"),
  to: day("Until"),
  page: z.preprocess(blank, z.coerce.number().int().min(1).max(100_000).optional()),
};

export type AuditFilter = keyof typeof FILTERS;
export type AuditQuery = { [K in AuditFilter]?: z.output<(typeof FILTERS)[K]> };

export interface ReadAuditQuery {
  query: AuditQuery;
  /** One message per filter that was left out. */
  problems: Partial<Record<AuditFilter, string>>;
}

export function readAuditQuery(params: URLSearchParams): ReadAuditQuery {
  const query: Record<string, unknown> = {};
  const problems: ReadAuditQuery["problems"] = {};
  for (const key of Object.keys(FILTERS) as AuditFilter[]) {
    const parsed = FILTERS[key].safeParse(params.get(key) ?? undefined);
    if (parsed.success) query[key] = parsed.data;
    // The page number falls back to the first page: nobody types it.
    else if (key !== "page") problems[key] = parsed.error.issues[0]?.message ?? "Not understood.";
  }
  const { from, to } = query as AuditQuery;
  if (from && to && to < from) {
    problems.to = "Until: choose a day on or after the From day.";
    delete query.to;
  }
  return { query: query as AuditQuery, problems };
}
