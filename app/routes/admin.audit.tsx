import { Form, Link, useSearchParams } from "react-router";
import type { Route } from "./+types/admin.audit";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { Badge, Button, Card, ListTable, PageHeader } from "~/components/ui";
import { FieldErrors as FieldErrorText } from "~/components/form-field";
import { AUDIT_ACTIONS, AUDIT_ACTION_KEYS, type AuditAction } from "~/content/audit-actions";
import { countOf } from "~/content/count";
import { formatMoment } from "~/content/dates";
import { readAuditQuery, type AuditFilter } from "~/schemas/audit";
import { listAuditEvents } from "~/services/audit-log.server";

export const meta: Route.MetaFunction = () => [{ title: "Audit log · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const { query, problems } = readAuditQuery(new URL(request.url).searchParams);
  return { problems, ...(await listAuditEvents(admin, query)) };
}

const TONES: Partial<Record<AuditAction, "good" | "warn" | "bad">> = {
  "sign-in-failed": "warn",
  "user-deactivated": "bad",
  "shop-refused": "bad",
  "refund-failed": "bad",
  "payment-paid": "good",
  "shop-approved": "good",
};

/** A text or date filter with its problem under it; what was typed stays in the field. */
function FilterField({ name, label, placeholder, problem }: { name: AuditFilter; label: string; placeholder?: string; problem?: string }) {
  const [params] = useSearchParams();
  const errorId = `${name}-error`;
  return (
    <div className="max-w-56">
      <label htmlFor={name} className="block text-xs font-semibold text-ink-600">
        {label}
      </label>
      <input
        id={name}
        name={name}
        // Days are typed as text, not a date picker, so an impossible one comes back as it was typed.
        type="text"
        placeholder={placeholder}
        defaultValue={params.get(name) ?? ""}
        aria-invalid={problem ? true : undefined}
        aria-describedby={problem ? errorId : undefined}
        className="mt-1 w-full rounded-md px-2 py-1.5 text-sm ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
      />
      <FieldErrorText id={errorId} errors={problem ? [problem] : undefined} />
    </div>
  );
}

export default function AdminAudit({ loaderData: d }: Route.ComponentProps) {
  const [params] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Audit log"
        lead={`${countOf(d.total, "entry", "entries")}. Sign-ins, changes to people and shops, awards, payments and refunds, newest first; each entry keeps the names as they were.`}
      />
      <Card>
        <Form method="get" className="mb-4 flex flex-wrap items-start gap-3" aria-label="Filter the audit log">
          <div>
            <label htmlFor="action" className="block text-xs font-semibold text-ink-600">
              What happened
            </label>
            <select
              id="action"
              name="action"
              defaultValue={params.get("action") ?? ""}
              aria-invalid={d.problems.action ? true : undefined}
              className="mt-1 rounded-md px-2 py-2 text-sm ring-1 ring-ink-200"
            >
              <option value="">Everything</option>
              {AUDIT_ACTION_KEYS.map((a) => (
                <option key={a} value={a}>
                  {AUDIT_ACTIONS[a]}
                </option>
              ))}
            </select>
            <FieldErrorText id="action-error" errors={d.problems.action ? [d.problems.action] : undefined} />
          </div>
          <FilterField name="actor" label="Who (name or e-mail)" problem={d.problems.actor} />
          <FilterField name="from" label="From (day, UTC)" placeholder="2026-03-01" problem={d.problems.from} />
          <FilterField name="to" label="Until (day, UTC)" placeholder="2026-03-31" problem={d.problems.to} />
          <Button type="submit" className="mt-5 px-3 py-1.5">
            Filter
          </Button>
        </Form>
        <ListTable
          label="Audit log"
          columns={["When", "What", "Who", "About", "Details"]}
          minWidth="min-w-[52rem]"
          empty="No entry matches these filters."
          pager={{ page: d.page, pageCount: d.pageCount, search: params }}
        >
          {d.entries.map((e) => (
            <tr key={e.id} className="border-t border-ink-100 align-top">
              <td className="py-2 pr-3 whitespace-nowrap">{formatMoment(e.at)}</td>
              <td className="py-2 pr-3">
                <Badge tone={TONES[e.action as AuditAction] ?? "neutral"}>{AUDIT_ACTIONS[e.action as AuditAction] ?? e.action}</Badge>
              </td>
              <td className="py-2 pr-3">
                {e.actorName}
                {e.actorEmail ? <span className="block text-xs break-all text-ink-600">{e.actorEmail}</span> : null}
              </td>
              <td className="py-2 pr-3 break-words">
                {e.jobId ? (
                  <Link to={`/jobs/${e.jobId}`} className="text-flow-700 hover:underline">
                    {e.subjectLabel ?? "The job"}
                  </Link>
                ) : (
                  (e.subjectLabel ?? "—")
                )}
              </td>
              <td className="py-2 pr-3 text-xs text-ink-600">
                {e.details.map((line) => (
                  <span key={line} className="block break-words">
                    {line}
                  </span>
                ))}
              </td>
            </tr>
          ))}
        </ListTable>
      </Card>
    </>
  );
}
