import { Link, useSearchParams } from "react-router";
import type { Route } from "./+types/jobs";
import { RetainerBadge } from "~/components/retainer-badge";
import { requireUser } from "~/auth/permissions.server";
import type { Role } from "~/auth/roles";
import { JobsByStageChart } from "~/components/jobs-by-stage-chart";
import { Card, EmptyState, FilterSelects, ListTable, type ListFilter, PageHeader, SearchBar } from "~/components/ui";
import { OrganisationName } from "~/components/organisation-link";
import { countOf } from "~/content/count";
import { formatMoney } from "~/content/money";
import { formatDay } from "~/content/dates";
import { JOB_STAGES, JOB_STAGE_LABELS } from "~/content/job-milestones";
import { jobListQuerySchema } from "~/schemas/jobs";
import { listJobs } from "~/services/job-reads.server";
import { can, viewerOf } from "~/auth/access-policy.server";
import { unassignedAccounts } from "~/services/unassigned-accounts.server";
import { UnassignedAccounts } from "~/components/unassigned-accounts";
import { openableOrganisations } from "~/services/organisation-page.server";
import { daysLate } from "~/services/account-view.server";
import { AfterHandoverNote, OverdueBadge } from "~/components/job-state";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data ? HEADINGS[data.role].title : "Jobs"} · Tenderflow` }];

const HEADINGS: Record<Role, { title: string; lead: string; empty: string }> = {
  buyer: {
    title: "Jobs",
    lead: "Specs you have awarded, from the retainer to the hand-over.",
    empty: "When you award a bid on one of your specs, the job appears here and the shop records its progress.",
  },
  shop: {
    title: "Jobs",
    lead: "Work you have won: record each milestone as the unit takes shape.",
    empty: "When a machine builder chooses your bid, the job appears here with its milestones and target dates.",
  },
  account_manager: {
    title: "Job dashboard",
    lead: "Every awarded job of the buyer accounts you follow: what is paid, what is moving, what is late.",
    empty: "No job yet for your accounts. Jobs appear here as soon as one of your accounts awards a bid.",
  },
  admin: {
    title: "All jobs",
    lead: "Every awarded job on Tenderflow.",
    empty: "Nobody has awarded a bid yet.",
  },
};

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const query = jobListQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const list = await listJobs(user, query);
  const openable = await openableOrganisations(
    user,
    list.jobs.flatMap((j) => [j.buyerId, j.shopId]),
  );
  return {
    // New buyer accounts nobody follows, on every account manager's dashboard (operators only).
    unassigned: can(await viewerOf(user), "account.seeUnassigned", null) ? await unassignedAccounts(user) : null,
    role: user.role,
    filtered: Boolean(query.q || query.stage || query.retainer || query.overdue || query.account || query.shop),
    ...list,
    // How late, in days, as on an account's page: the dashboard is where lateness is looked for.
    jobs: list.jobs.map((j) => ({ ...j, daysLate: daysLate(j) })),
    openable,
  };
}

const RETAINER_CHOICES = { paid: "Retainer paid", unpaid: "Retainer not paid", refunded: "Retainer paid back (part or all)" };

/** The list's filters; the account filter only where the viewer follows several buyers. */
function filtersFor(accounts: { id: string; name: string }[]): ListFilter[] {
  const filters: ListFilter[] = [
    { name: "stage", label: "Stage", any: "Any stage", options: JOB_STAGES.map((s) => ({ value: s, label: JOB_STAGE_LABELS[s] })) },
    { name: "retainer", label: "Retainer", any: "Retainer paid or not", options: Object.entries(RETAINER_CHOICES).map(([value, label]) => ({ value, label })) },
  ];
  if (accounts.length > 0)
    filters.push({ name: "account", label: "Buyer account", any: "Every buyer", options: accounts.map((a) => ({ value: a.id, label: a.name })) });
  return filters;
}

export default function Jobs({ loaderData: d }: Route.ComponentProps) {
  const [params] = useSearchParams();
  const heading = HEADINGS[d.role];
  const anyJobs = d.byStage.some((s) => s.count > 0) || d.filtered;
  return (
    <>
      <PageHeader title={heading.title} lead={heading.lead} />
      {d.unassigned ? <UnassignedAccounts {...d.unassigned} /> : null}
      {!anyJobs ? (
        <EmptyState title="No jobs yet">
          <p>{heading.empty}</p>
        </EmptyState>
      ) : (
        <div className="space-y-6">
          <Card>
            <JobsByStageChart data={d.byStage} caption="Jobs by stage (with the filters below, any stage)" />
          </Card>
          <Card>
            <SearchBar label="Search jobs by spec title" placeholder="Spec title" value={params.get("q") ?? ""}>
              <FilterSelects filters={filtersFor(d.accounts)} search={params} />
              {params.get("shop") ? <input type="hidden" name="shop" value={params.get("shop") ?? ""} /> : null}
              <label className="flex items-center gap-2 px-2 text-sm">
                <input type="checkbox" name="overdue" value="1" defaultChecked={params.has("overdue")} />
                Overdue only
              </label>
            </SearchBar>
            <p className="mb-2 text-sm text-ink-600">{countOf(d.total, "job")}. Overdue jobs come first, then the most recently awarded.</p>
            <ListTable
              label="Jobs"
              pager={{ page: d.page, pageCount: d.pageCount, search: params }}
              empty="No job matches these filters."
              columns={[
                "Spec",
                "Buyer",
                "Shop",
                "Stage",
                { label: "Total", className: "pl-3 text-right" },
                { label: "Retainer", className: "pl-3 text-right" },
                { label: "Days since award", className: "pl-3 text-right" },
                { label: "Next milestone", className: "pl-4" },
              ]}
            >
              {d.jobs.map((j) => (
                <tr key={j.id} className={`border-t border-ink-100 align-top ${j.overdue ? "bg-alarm-50/50" : ""}`}>
                  <td className="py-2 pr-2">
                    <Link to={`/jobs/${j.id}`} className="font-semibold text-flow-700 hover:underline">
                      {j.specTitle || "Untitled spec"}
                    </Link>
                  </td>
                  <td className="pr-2">
                    <OrganisationName id={j.buyerId} name={j.buyerName} linked={d.openable.includes(j.buyerId)} />
                  </td>
                  <td className="pr-2">
                    <OrganisationName id={j.shopId} name={j.shopName} linked={d.openable.includes(j.shopId)} />
                  </td>
                  <td className="pr-2">
                    {JOB_STAGE_LABELS[j.stage]}
                    <AfterHandoverNote job={j} />
                  </td>
                  <td className="pl-3 text-right tabular-nums">{formatMoney(j.totalCents, j.currency)}</td>
                  <td className="whitespace-nowrap pl-3 text-right tabular-nums">
                    <span className="block">{formatMoney(j.retainerCents, j.currency)}</span>
                    <RetainerBadge paidAt={j.retainerPaidAt} refundedCents={j.retainerRefundedCents} retainerCents={j.retainerCents} />
                  </td>
                  <td className="pl-3 text-right tabular-nums">{j.daysSinceAward}</td>
                  <td className="pl-4">
                    {j.next ? (
                      <>
                        <span className="block">{j.next.label}</span>
                        <span className="block text-xs text-ink-600">{j.next.targetDate ? `target ${formatDay(j.next.targetDate)}` : "no target date"}</span>
                      </>
                    ) : (
                      <span className="text-ink-600">All reached</span>
                    )}
                    {j.overdue ? (
                      <span className="mt-1 block">
                        <OverdueBadge daysLate={j.daysLate} />
                      </span>
                    ) : null}
                  </td>
                </tr>
              ))}
            </ListTable>
          </Card>
        </div>
      )}
    </>
  );
}
