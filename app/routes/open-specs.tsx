import { Form, Link, useSearchParams } from "react-router";
import { formatDay } from "~/content/dates";
import type { Route } from "./+types/open-specs";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { Badge, Button, Card, EmptyState, Notice, PageHeader, Pager, TableScroll } from "~/components/ui";
import { ColumnHeads } from "~/components/column-heads";
import { BID_STATUS_LABELS, BID_STATUS_TONES } from "~/content/bid-status";
import { OPEN_SPEC_SORTS, OPEN_SPEC_SORT_LABELS, readOpenSpecsQuery, type OpenSpecParam } from "~/schemas/open-specs";
import { listOpenSpecsForShop } from "~/services/open-specs.server";
import { approvalStateOf, type ApprovalState } from "~/services/shop-approval.server";
import { formatQuantity, unitLabel, type UnitSystem } from "~/units";
import { profileLine } from "~/components/organisation-profile";

export const meta: Route.MetaFunction = () => [{ title: "Open specs · Tenderflow" }];

const FILTERS: OpenSpecParam[] = ["q", "region", "deadline", "pressureMin", "pressureMax", "flowMin", "flowMax"];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.bidding);
  const { query, problems, typed } = readOpenSpecsQuery(new URL(request.url).searchParams);
  // A shop not approved yet lists nothing (the service refuses it too) and reads why instead.
  const [{ specs, total, page, pageCount }, approval] = await Promise.all([listOpenSpecsForShop(user, query), approvalStateOf(user)]);
  return {
    approval,
    specs,
    total,
    page,
    pageCount,
    problems,
    typed,
    filtered: FILTERS.some((key) => typed[key]?.trim()),
    unitSystem: (user.unitSystem ?? "metric") as UnitSystem,
  };
}

const inputClass = "mt-1 block w-full rounded-md px-2 py-1.5 ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600";

function FilterField({
  name,
  label,
  typed,
  problem,
  type = "text",
  placeholder,
  inputMode,
}: {
  name: OpenSpecParam;
  label: string;
  typed: string | undefined;
  problem: string | undefined;
  type?: "text" | "search" | "date";
  placeholder?: string;
  inputMode?: "decimal";
}) {
  return (
    <label className="block">
      <span className="block font-semibold">{label}</span>
      <input
        name={name}
        type={type}
        defaultValue={typed ?? ""}
        placeholder={placeholder}
        inputMode={inputMode}
        aria-invalid={problem ? true : undefined}
        aria-describedby={problem ? `${name}-problem` : undefined}
        className={inputClass}
      />
      {problem ? (
        <span id={`${name}-problem`} className="mt-1 block text-xs font-semibold text-alarm-600">
          {problem}
        </span>
      ) : null}
    </label>
  );
}

/** What a shop reads on its home while an admin has not approved it. */
function NotApprovedYet({ approval }: { approval: ApprovalState }) {
  return (
    <>
      <PageHeader title="Open specs" lead="Specs from machine builders that are open for bids." />
      {approval.approval === "refused" ? (
        <EmptyState title="Your organisation was not approved to read specs">
          <p>
            Machine builders' specs are confidential, so Tenderflow approves each fluid-power shop before it reads them. Your organisation was not approved
            {approval.decidedAt ? ` on ${formatDay(approval.decidedAt)}` : ""}.
          </p>
          {approval.reason ? <p className="mt-2">The reason given: “{approval.reason}”</p> : null}
          <p className="mt-2">If something has changed, contact Tenderflow and an administrator will look at it again.</p>
        </EmptyState>
      ) : (
        <EmptyState title="Your organisation is waiting for approval">
          <p>
            Machine builders' specs are confidential, so Tenderflow checks each new fluid-power shop before it reads them. An administrator will look at your
            organisation shortly; you will get an e-mail as soon as it is decided. Until then no specs are shown here. You can already invite your colleagues
            from the Team page.
          </p>
        </EmptyState>
      )}
    </>
  );
}

export default function OpenSpecs({ loaderData: d }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  if (d.approval && d.approval.approval !== "approved") return <NotApprovedYet approval={d.approval} />;
  const pressure = unitLabel("pressure", d.unitSystem);
  const flow = unitLabel("flow", d.unitSystem);
  const problems = Object.values(d.problems);
  const sizeFiltersUsed = (["pressureMin", "pressureMax", "flowMin", "flowMax"] as const).some((k) => Boolean(d.typed[k]?.trim() || d.problems[k]));
  if (d.total === 0 && !d.filtered && problems.length === 0) {
    return (
      <>
        <PageHeader title="Open specs" lead="Specs from machine builders that are open for bids." />
        <EmptyState title="No specs are open for bids right now">
          <p>
            When a machine builder publishes a spec, it appears here with its preliminary circuit and bill of materials, and you can ask questions and bid line
            by line. You'll also get an e-mail.
          </p>
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="Open specs"
        lead={
          d.filtered
            ? `${d.total} open spec${d.total === 1 ? " matches" : "s match"} your filters.`
            : `${d.total} spec${d.total === 1 ? " from a machine builder is" : "s from machine builders are"} open for bids.`
        }
      />
      {problems.length ? (
        <div className="mb-4">
          <Notice tone="bad">
            {problems.length === 1 ? "One part of the search was left out: " : "Some parts of the search were left out: "}
            {problems.join(" ")}
          </Notice>
        </div>
      ) : null}
      <Card>
        <Form method="get" role="search" className="mb-4 grid gap-3 text-sm sm:grid-cols-2 lg:grid-cols-4">
          <FilterField name="q" type="search" label="Title contains" typed={d.typed.q} problem={d.problems.q} placeholder="e.g. press" />
          <FilterField name="region" label="Delivered to" typed={d.typed.region} problem={d.problems.region} placeholder="e.g. Midlands" />
          <FilterField name="deadline" type="date" label="Bids close by" typed={d.typed.deadline} problem={d.problems.deadline} />
          <label className="block">
            <span className="block font-semibold">Sort by</span>
            <select name="sort" defaultValue={d.typed.sort && !d.problems.sort ? d.typed.sort : "deadline"} className={inputClass}>
              {OPEN_SPEC_SORTS.map((s) => (
                <option key={s} value={s}>
                  {OPEN_SPEC_SORT_LABELS[s]}
                </option>
              ))}
            </select>
            {d.problems.sort ? <span className="mt-1 block text-xs font-semibold text-alarm-600">{d.problems.sort}</span> : null}
          </label>
          {/* The size filters fold away, so on a phone the list starts on the first screen; they open when used. */}
          <details className="sm:col-span-2 lg:col-span-4" open={sizeFiltersUsed} data-size-filters="">
            <summary className="cursor-pointer font-semibold text-flow-700">Filter by relief setting and pump flow</summary>
            <div className="mt-2 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
              <FilterField
                name="pressureMin"
                label={`Relief setting from (${pressure})`}
                typed={d.typed.pressureMin}
                problem={d.problems.pressureMin}
                inputMode="decimal"
              />
              <FilterField
                name="pressureMax"
                label={`Relief setting up to (${pressure})`}
                typed={d.typed.pressureMax}
                problem={d.problems.pressureMax}
                inputMode="decimal"
              />
              <FilterField name="flowMin" label={`Pump flow from (${flow})`} typed={d.typed.flowMin} problem={d.problems.flowMin} inputMode="decimal" />
              <FilterField name="flowMax" label={`Pump flow up to (${flow})`} typed={d.typed.flowMax} problem={d.problems.flowMax} inputMode="decimal" />
            </div>
          </details>
          <div className="flex items-end gap-3 sm:col-span-2 lg:col-span-4">
            <Button type="submit" tone="secondary">
              Apply
            </Button>
            {d.filtered || searchParams.size > 0 ? (
              <Link to="/open-specs" className="text-flow-700 hover:underline">
                Clear the filters
              </Link>
            ) : null}
          </div>
        </Form>
        {d.specs.length === 0 ? (
          <div className="py-6 text-center text-ink-600">
            <p className="font-semibold text-ink-800">No open spec matches these filters.</p>
            <p className="mt-1">Try a wider pressure or flow range, a later closing date or part of a region's name.</p>
          </div>
        ) : (
          <TableScroll label="Open specs">
            <table className="w-full min-w-[40rem] text-left text-sm">
              <thead className="text-ink-600">
                <ColumnHeads
                  heads={[
                    ["Spec", "py-2"],
                    "Region",
                    ["Relief setting", "text-right"],
                    ["Pump flow", "text-right"],
                    ["Units", "text-right"],
                    ["Currency", "pl-4"],
                    "Bids until",
                    <span key="bid" className="sr-only">
                      Your bid
                    </span>,
                  ]}
                />
              </thead>
              <tbody>
                {d.specs.map((s) => (
                  <tr key={s.id} className="border-t border-ink-100 align-top">
                    <td className="py-2 pr-3">
                      <Link to={`/specs/${s.id}`} className="font-semibold text-flow-700 hover:underline">
                        {s.title}
                      </Link>
                      {s.revision > 1 ? <span className="ml-2 text-xs text-ink-400">revision {s.revision}</span> : null}
                    </td>
                    <td className="py-2 pr-3">
                      <span className="block">{s.deliveryRegion ?? "—"}</span>
                      {s.buyerRegion ? <span className="block text-xs text-ink-600">{profileLine({ kind: "buyer", region: s.buyerRegion })}</span> : null}
                    </td>
                    <td className="py-2 text-right tabular-nums">
                      {s.reliefSettingBar === null ? "—" : formatQuantity("pressure", s.reliefSettingBar, d.unitSystem)}
                    </td>
                    <td className="py-2 text-right tabular-nums">{s.pumpFlowLpm === null ? "—" : formatQuantity("flow", s.pumpFlowLpm, d.unitSystem)}</td>
                    <td className="py-2 text-right tabular-nums">{s.unitsWanted ?? "—"}</td>
                    <td className="py-2 pl-4">{s.currency}</td>
                    <td className="py-2">{formatDay(s.bidDeadline)}</td>
                    <td className="py-2 text-right">
                      {s.ownBidStatus ? (
                        <span title={`Your bid: ${BID_STATUS_LABELS[s.ownBidStatus]}`}>
                          <Badge tone={BID_STATUS_TONES[s.ownBidStatus]}>Your bid: {BID_STATUS_LABELS[s.ownBidStatus]}</Badge>
                        </span>
                      ) : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
        <Pager page={d.page} pageCount={d.pageCount} search={searchParams} />
      </Card>
    </>
  );
}
