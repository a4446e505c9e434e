import { Link } from "react-router";
import type { Route } from "./+types/account";
import { requireRole } from "~/auth/permissions.server";
import { OPERATOR_ROLES } from "~/auth/roles";
import { Badge, Card, PageHeader, TableScroll } from "~/components/ui";
import { accountOf } from "~/services/admin.server";
import { listJobs } from "~/services/job-reads.server";
import { JOB_STAGE_LABELS } from "~/content/job-milestones";
import { formatDay, formatMoment } from "~/content/dates";
import { requireId } from "~/services/errors.server";
import type { User } from "~/models/index.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.name ?? "Account"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requireRole(request, OPERATOR_ROLES);
  const organisation = await accountOf(viewer, requireId(params.organisationId));
  const users = ((organisation as typeof organisation & { users?: User[] }).users ?? []).map((u) => ({
    id: u.id,
    name: u.name,
    email: u.email,
    active: u.active,
    lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
  }));
  const jobs = await listJobs(viewer, { account: organisation.id }, { limit: 5 });
  return { id: organisation.id, name: organisation.name, region: organisation.region, users, jobs: jobs.jobs, jobCount: jobs.total };
}

export default function Account({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/accounts" className="text-flow-700 hover:underline">
          ← All accounts
        </Link>
      </p>
      <PageHeader title={loaderData.name} lead={loaderData.region ? `Machine builder · ${loaderData.region}` : "Machine builder"} />
      <Card className="mb-6">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h2 className="font-semibold">Jobs</h2>
          {loaderData.jobCount > 0 ? (
            <Link to={`/jobs?account=${loaderData.id}`} className="text-sm text-flow-700 hover:underline">
              All {loaderData.jobCount} job{loaderData.jobCount === 1 ? "" : "s"} of this account →
            </Link>
          ) : null}
        </div>
        {loaderData.jobs.length === 0 ? (
          <p className="text-sm text-ink-600">No awarded job yet. Jobs appear here when this account awards a bid.</p>
        ) : (
          <ul className="divide-y divide-ink-100 text-sm">
            {loaderData.jobs.map((j) => (
              <li key={j.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <Link to={`/jobs/${j.id}`} className="font-semibold text-flow-700 hover:underline">
                  {j.specTitle || "Untitled spec"}
                </Link>
                <span className="flex flex-wrap items-center gap-2 text-ink-600">
                  {JOB_STAGE_LABELS[j.stage]} · {j.shopName}
                  {j.next?.targetDate ? ` · next: ${j.next.label} by ${formatDay(j.next.targetDate)}` : ""}
                  {j.overdue ? <Badge tone="bad">Overdue</Badge> : null}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <Card>
        <h2 className="mb-3 font-semibold">People</h2>
        <TableScroll label="People">
          <table className="w-full min-w-[30rem] text-left text-sm">
            <thead className="text-ink-600">
              <tr>
                <th className="py-2">Name</th>
                <th>E-mail</th>
                <th>Status</th>
                <th>Last signed in</th>
              </tr>
            </thead>
            <tbody>
              {loaderData.users.map((u) => (
                <tr key={u.id} className="border-t border-ink-100">
                  <td className="py-2 font-semibold">{u.name}</td>
                  <td>{u.email}</td>
                  <td>{u.active ? <Badge tone="good">Active</Badge> : <Badge tone="bad">Deactivated</Badge>}</td>
                  <td>{u.lastSignInAt ? formatMoment(u.lastSignInAt) : "Never"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      </Card>
    </>
  );
}
