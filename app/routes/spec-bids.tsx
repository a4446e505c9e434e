import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useEffect, useRef } from "react";
import { Form, Link, data, useNavigation, useSearchParams, type ShouldRevalidateFunction } from "react-router";
import { formatDay } from "~/content/dates";
import type { Route } from "./+types/spec-bids";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { FieldErrors, SubmitButton } from "~/components/form-field";
import { Badge, ButtonLink, Card, EmptyState, Notice, PageHeader, TableScroll } from "~/components/ui";
import { BID_STATUS_LABELS, BID_STATUS_TONES } from "~/content/bid-status";
import { formatMoney, retainerCents } from "~/content/money";
import { SPEC_STATUS_LABELS, type SpecStatus } from "~/content/spec-status";
import { awardSchema } from "~/schemas/bid";
import { awardBid, awardedJobOf, canAwardNow } from "~/services/award.server";
import { COMPARISON_SORTS, type ComparisonSort } from "~/services/bid-comparison";
import { comparisonOf } from "~/services/bids.server";
import { fieldErrorReply, fieldErrorsOf } from "~/services/errors.server";
import { specOfOwner } from "~/services/spec-access.server";
import { AlternativeCircuits, ExtraRows, OfferDocumentsRow, OfferRow, OfferTermsRows } from "~/components/offer-comparison";
import { documentsOfBids } from "~/services/offer-documents.server";
import { OrganisationProfileCard } from "~/components/organisation-profile";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `Bids · ${d?.spec.title ?? "Spec"} · Tenderflow` }];

const SORT_LABELS: Record<ComparisonSort, string> = { total: "Lowest total", lead: "Shortest lead time", valid: "Longest validity", shop: "Shop name" };

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await specOfOwner(user, params.specId);
  const url = new URL(request.url);
  const sortParam = url.searchParams.get("sort") ?? "total";
  const sort: ComparisonSort = (COMPARISON_SORTS as readonly string[]).includes(sortParam) ? (sortParam as ComparisonSort) : "total";
  const [{ comparison, profiles }, job, canAward] = await Promise.all([comparisonOf(user, spec, sort), awardedJobOf(user, spec), canAwardNow(user, spec)]);
  const documents = await documentsOfBids(
    spec.id,
    comparison.columns.map((c) => c.id),
  );
  const choosing = comparison.columns.find((c) => c.id === url.searchParams.get("award") && c.status === "submitted") ?? null;
  return {
    spec: {
      id: spec.id,
      title: spec.title,
      status: spec.status as SpecStatus,
      revision: spec.currentRevision,
      currency: spec.currency,
      units: spec.unitsWanted ?? 1,
      retainerPercent: spec.retainerPercent ?? "0",
      deadline: spec.bidDeadline?.toISOString() ?? null,
    },
    sort,
    comparison,
    documents,
    profiles,
    jobId: job?.id ?? null,
    canAward,
    choosing: choosing && { ...choosing, retainerCents: retainerCents(choosing.totalCents, spec.retainerPercent ?? "0") },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await specOfOwner(user, params.specId);
  const submission = parseWithZod(await request.formData(), { schema: awardSchema });
  if (submission.status !== "success") return data({ result: submission.reply(), error: null }, { status: 400 });
  try {
    const job = await awardBid(user, spec.id, submission.value);
    return redirectWithToast(request, `/jobs/${job.id}`, "Awarded. Every bidder has been told; the job and its milestones are below.");
  } catch (error) {
    // Refused (awarded meanwhile, the offer taken back or expired): a conflict, shown above the comparison.
    return data({ result: fieldErrorReply(submission, error), error: fieldErrorsOf(error).message }, { status: 409 });
  }
}

// A refused award (409: awarded meanwhile from another tab, or the offer withdrawn) still
// reloads the comparison, so the page shows the spec's new state beside the refusal.
export const shouldRevalidate: ShouldRevalidateFunction = ({ actionStatus, defaultShouldRevalidate }) =>
  actionStatus === 409 ? true : defaultShouldRevalidate;

const day = (iso: string) => formatDay(iso);

export default function SpecBids({ loaderData: d, actionData }: Route.ComponentProps) {
  const [params] = useSearchParams();
  const navigation = useNavigation();
  // A refusal is brought into view and focused: the buyer was looking at the confirm button, far below.
  const refusal = useRef<HTMLDivElement>(null);
  // The award on the same Conform pattern as every form: the schema judges it here and on the server.
  const [form, fields] = useForm({
    lastResult: navigation.state === "idle" ? actionData?.result : null,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: awardSchema }),
    shouldValidate: "onSubmit",
  });
  useEffect(() => {
    if (!actionData?.error || !refusal.current) return;
    refusal.current.scrollIntoView({ block: "center" });
    refusal.current.focus();
  }, [actionData]);
  const { columns, rows, subtotals, extraRows, cheapestCompleteId } = d.comparison;
  const money = (c: number) => formatMoney(c, d.spec.currency);
  const cheapest = columns.find((c) => c.id === cheapestCompleteId);
  const { canAward } = d;
  const withSort = (sort: string) => {
    const next = new URLSearchParams(params);
    next.set("sort", sort);
    next.delete("award");
    return `?${next}`;
  };

  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={`/specs/${d.spec.id}`} className="text-flow-700 hover:underline">
          ← {d.spec.title}
        </Link>
      </p>
      <PageHeader
        title="Compare the bids"
        lead={`${columns.length} offer${columns.length === 1 ? "" : "s"} on revision ${d.spec.revision} · ${d.spec.units} unit${d.spec.units === 1 ? "" : "s"} · prices in ${d.spec.currency} · ${SPEC_STATUS_LABELS[d.spec.status]}`}
        actions={
          <>
            {columns.length ? (
              <ButtonLink to={`/specs/${d.spec.id}/bids.xlsx?sort=${d.sort}`} reloadDocument tone="secondary">
                Download the comparison (XLSX)
              </ButtonLink>
            ) : null}
            {d.jobId ? <ButtonLink to={`/jobs/${d.jobId}`}>Follow the job</ButtonLink> : null}
          </>
        }
      />
      {actionData?.error ? (
        <div ref={refusal} tabIndex={-1} className="mb-4 outline-none" data-refusal="">
          <Notice tone="bad">
            {actionData.error}
            {d.jobId ? (
              <>
                {" "}
                <Link to={`/jobs/${d.jobId}`} className="font-semibold underline">
                  Follow the job
                </Link>
              </>
            ) : null}
          </Notice>
        </div>
      ) : null}

      {columns.length === 0 ? (
        <EmptyState title="No offers yet">
          <p>Shops have been told about this spec. Their offers appear here side by side as they arrive, and you get an e-mail for each.</p>
        </EmptyState>
      ) : (
        <>
          {cheapest ? (
            <div className="mb-4 rounded-lg bg-flow-50 p-4 ring-1 ring-flow-600" data-testid="cheapest-summary">
              <p className="text-sm font-semibold uppercase tracking-wide text-flow-700">Cheapest complete offer, like for like</p>
              <p className="text-xl font-semibold text-ink-900">
                {cheapest.shop}: {money(cheapest.totalCents)}
              </p>
              <p className="text-sm text-ink-700">
                Every line of the current bill priced · {money(cheapest.likeForLikeCents)} for the bill and the work every offer covers
                {cheapest.leavesOut.length ? ` · ${cheapest.leavesOut.join(", ")}` : ""} · {cheapest.leadTimeWeeks ?? "?"} weeks · valid until{" "}
                {cheapest.validUntil ? day(cheapest.validUntil) : "—"}
                {cheapest.alternatives ? ` · ${cheapest.alternatives} alternative part${cheapest.alternatives === 1 ? "" : "s"}` : ""}
                {cheapest.olderRevision ? ` · made on revision ${cheapest.specRevision}` : ""}
              </p>
              {/* The page's decision within reach at once; the line-by-line table and each offer's terms stay below. */}
              {canAward && cheapest.status === "submitted" && !d.choosing ? (
                <p className="mt-3 flex flex-wrap items-center gap-x-4 gap-y-2 text-sm text-ink-700">
                  <ButtonLink to={`?sort=${d.sort}&award=${cheapest.id}#award-confirmation`}>Award the cheapest offer, {cheapest.shop}…</ButtonLink>
                  <span>or compare every line, the terms and the notes below first.</span>
                </p>
              ) : null}
            </div>
          ) : (
            <div className="mb-4">
              <Notice tone="warn">No offer prices every line of the current bill yet; the totals below are not like for like.</Notice>
            </div>
          )}

          {d.choosing ? (
            <Card className="mb-6 scroll-mt-4 ring-2 ring-flow-600">
              <h2 id="award-confirmation" tabIndex={-1} className="text-lg font-semibold">
                Award this spec to {d.choosing.shop}?
              </h2>
              <p className="mt-1 text-sm text-ink-700">
                {money(d.choosing.totalCents)} for {d.spec.units} unit{d.spec.units === 1 ? "" : "s"}, {d.choosing.leadTimeWeeks} weeks. The retainer of{" "}
                <strong>{money(d.choosing.retainerCents)}</strong> ({Number(d.spec.retainerPercent)} %) is paid by card after the award. Every other bidder is
                told they were not chosen, and bidding closes. This can't be undone.
              </p>
              <Form method="post" {...getFormProps(form)} className="mt-4 flex flex-wrap items-center gap-4">
                <input type="hidden" name={fields.bidId.name} value={d.choosing.id} />
                <label className="flex items-center gap-2 text-sm">
                  <input {...getInputProps(fields.confirm, { type: "checkbox", value: "on" })} key={fields.confirm.key} required />
                  <span>I award this spec to {d.choosing.shop}.</span>
                </label>
                <SubmitButton>Confirm the award</SubmitButton>
                <Link to={withSort(d.sort)} className="text-sm text-flow-700 hover:underline">
                  Cancel
                </Link>
                <FieldErrors id={fields.confirm.errorId} errors={fields.confirm.errors} />
              </Form>
            </Card>
          ) : null}

          <nav aria-label="Sort the offers" className="mb-3 flex flex-wrap items-center gap-2 text-sm">
            <span className="text-ink-600">Order:</span>
            {COMPARISON_SORTS.map((s) => (
              <Link
                key={s}
                to={withSort(s)}
                aria-current={s === d.sort ? "true" : undefined}
                className={`rounded-md px-2 py-1 ring-1 ${s === d.sort ? "bg-flow-600 text-white ring-flow-600" : "ring-ink-200 hover:bg-ink-100"}`}
              >
                {SORT_LABELS[s]}
              </Link>
            ))}
          </nav>

          <TableScroll label="Offers side by side" className="rounded-lg bg-white ring-1 ring-ink-200">
            <table className="w-full text-sm sm:min-w-[36rem]" data-testid="comparison">
              <caption className="sr-only">Offers by line; the lowest price of each line and the cheapest complete offer are marked.</caption>
              <thead>
                <tr className="align-bottom">
                  <th scope="col" className="sticky left-0 z-10 min-w-[9rem] bg-white p-3 text-left sm:min-w-[16rem]">
                    Line
                  </th>
                  {columns.map((c) => (
                    <th key={c.id} scope="col" className={`w-48 min-w-[11rem] p-3 text-right ${c.cheapestComplete ? "bg-flow-50" : ""}`} data-bid={c.id}>
                      <span className="block text-base text-ink-900">{c.shop}</span>
                      <span className="mt-1 flex flex-wrap justify-end gap-1 font-normal">
                        <Badge tone={BID_STATUS_TONES[c.status]}>{BID_STATUS_LABELS[c.status]}</Badge>
                        {c.cheapestComplete ? <Badge tone="good">Cheapest complete</Badge> : null}
                        {c.olderRevision ? <Badge tone="warn">On revision {c.specRevision}</Badge> : null}
                        {!c.complete ? <Badge tone="warn">Lines missing</Badge> : null}
                        {c.alternatives ? (
                          <Badge tone="neutral">
                            {c.alternatives} alternative{c.alternatives === 1 ? "" : "s"}
                          </Badge>
                        ) : null}
                      </span>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rows.map((row) => (
                  <tr key={row.key} className="border-t border-ink-100 align-top">
                    <th scope="row" className="sticky left-0 z-10 bg-white p-3 text-left font-normal">
                      {row.serves ? (
                        <span className="block text-xs font-semibold uppercase tracking-wide text-ink-500" data-serves="">
                          {row.serves}
                        </span>
                      ) : null}
                      <span className="font-semibold text-ink-900">{row.item}</span>
                      <span className="text-ink-600"> × {row.quantity}</span>
                      {!row.inCurrentBill ? <span className="block text-xs text-signal-700">Only in an earlier revision</span> : null}
                    </th>
                    {row.cells.map((cell, i) => (
                      <td
                        key={columns[i].id}
                        className={`p-3 text-right tabular-nums ${cell?.lowest ? "bg-flow-50 font-semibold text-flow-700" : columns[i].cheapestComplete ? "bg-flow-50/40" : ""}`}
                      >
                        {cell?.included ? (
                          <span className="block text-ink-700" title="Priced 0: the shop includes this line elsewhere in its offer">
                            Included
                            <span className="block text-xs font-normal text-ink-600">in another line</span>
                          </span>
                        ) : cell ? (
                          <>
                            <span className="block">{money(cell.lineTotalCents)}</span>
                            {row.quantity > 1 ? <span className="block text-xs font-normal text-ink-600">{money(cell.unitPriceCents)} each</span> : null}
                            {cell.lowest ? <span className="block text-xs">lowest</span> : null}
                            {cell.alternative ? (
                              <span className="mt-1 block max-w-[14rem] text-left text-xs font-normal text-ink-700">
                                <Badge tone="warn">Alternative</Badge> {cell.alternativeDescription}
                              </span>
                            ) : null}
                          </>
                        ) : (
                          <span className="text-ink-400">not priced</span>
                        )}
                      </td>
                    ))}
                  </tr>
                ))}
                <ExtraRows rows={extraRows} columns={columns} money={money} />
              </tbody>
              <tfoot className="border-t-2 border-ink-300">
                {/* A machine: what each offer asks for the power unit and for each axis (one set), so parts compare like for like. */}
                {subtotals.map((g) => (
                  <tr key={g.serves} className="border-b border-ink-100" data-subtotal={g.serves}>
                    <th scope="row" className="sticky left-0 bg-white p-3 text-left font-normal">
                      {g.serves}, one set
                    </th>
                    {g.cents.map((cents, i) => (
                      <td key={columns[i].id} className="p-3 text-right tabular-nums">
                        {cents === null ? <span className="text-ink-400">not priced</span> : money(cents)}
                      </td>
                    ))}
                  </tr>
                ))}
                <tr>
                  <th scope="row" className="sticky left-0 bg-white p-3 text-left">
                    Offer total, {d.spec.units} unit{d.spec.units === 1 ? "" : "s"}
                    <span className="block text-xs font-normal text-ink-600">the bill and all the work offered</span>
                  </th>
                  {columns.map((c) => (
                    <td key={c.id} className={`p-3 text-right text-base font-semibold tabular-nums ${c.cheapestComplete ? "bg-flow-50 text-flow-700" : ""}`}>
                      {money(c.totalCents)}
                      {d.spec.units > 1 ? <span className="block text-xs font-normal text-ink-600">bill {money(c.setTotalCents)} a set</span> : null}
                      {cheapest && !c.cheapestComplete && c.likeForLikeCents > cheapest.likeForLikeCents ? (
                        <span className="block text-xs font-normal text-signal-700">
                          {money(c.likeForLikeCents - cheapest.likeForLikeCents)} more like for like (
                          {(((c.likeForLikeCents - cheapest.likeForLikeCents) / cheapest.likeForLikeCents) * 100).toFixed(1)} %)
                        </span>
                      ) : null}
                    </td>
                  ))}
                </tr>
                <OfferRow
                  label="Lead time"
                  columns={columns}
                  className="border-t border-ink-100"
                  cell={(c) => (
                    <td className={`p-3 text-right ${c.shortestLead ? "font-semibold text-flow-700" : ""}`}>
                      {c.leadTimeWeeks ? `${c.leadTimeWeeks} weeks` : "—"}
                      {c.shortestLead ? <span className="block text-xs">shortest</span> : null}
                    </td>
                  )}
                />
                <OfferRow
                  label="Valid until"
                  columns={columns}
                  className="border-t border-ink-100"
                  cell={(c) => <td className="p-3 text-right">{c.validUntil ? day(c.validUntil) : "—"}</td>}
                />
                {/* What each price includes and on what terms, beside the prices, so nobody awards blind. */}
                <OfferTermsRows columns={columns} money={money} />
                <OfferDocumentsRow columns={columns} documents={d.documents} />
                <OfferRow
                  label="The shop"
                  columns={columns}
                  cell={(c) => (
                    <td className="p-3 text-left text-xs" data-profile={c.id}>
                      <OrganisationProfileCard profile={d.profiles[c.id]} />
                    </td>
                  )}
                />
                <OfferRow
                  label="Notes from the shop"
                  columns={columns}
                  cell={(c) => (
                    <td className="p-3 text-left text-xs whitespace-pre-line text-ink-800" data-notes={c.id}>
                      {c.notes || <span className="text-ink-400">none</span>}
                    </td>
                  )}
                />
                {canAward ? (
                  <OfferRow
                    label="Decision"
                    columns={columns}
                    className="border-t border-ink-100"
                    cell={(c) => (
                      <td className="p-3 text-right">
                        {c.status === "submitted" ? (
                          <span className="flex justify-end">
                            <ButtonLink
                              to={`?sort=${d.sort}&award=${c.id}#award-confirmation`}
                              tone={c.cheapestComplete ? "primary" : "secondary"}
                              aria-label={`Award to ${c.shop}`}
                            >
                              Award…
                            </ButtonLink>
                          </span>
                        ) : null}
                      </td>
                    )}
                  />
                ) : null}
              </tfoot>
            </table>
          </TableScroll>
          <AlternativeCircuits columns={columns} money={money} units={d.spec.units} />
        </>
      )}
    </>
  );
}
