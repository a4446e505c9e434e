import { getFormProps, getInputProps, getTextareaProps, useForm } from "@conform-to/react";
import { Fragment } from "react";
import { formatDay, formatMoment } from "~/content/dates";
import { takesBids } from "~/content/spec-status";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useNavigation } from "react-router";
import type { Route } from "./+types/spec-bid";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { FieldErrors as FieldErrorText, TextAreaField } from "~/components/form-field";
import { Badge, Button, Card, Notice, PageHeader, TableScroll } from "~/components/ui";
import { BID_STATUS_LABELS, BID_STATUS_TONES, type BidStatus } from "~/content/bid-status";
import { centsToInput, formatMoney, parseMoney } from "~/content/money";
import { offerDefaults, typedExtras, typedOwnLines } from "~/content/offer-form";
import { bidSchemaFor, linesMatchBill } from "~/schemas/bid";
import { bidOfShop, billOfRevision, bomOf, historyOf, saveBid, withdrawBid } from "~/services/bids.server";
import { servedBy } from "~/services/published-design";
import { ownOfferDocuments } from "~/services/offer-documents.server";
import { OfferDocumentsCard } from "~/components/offer-documents";
import { AlternativeCircuitFields, OfferExtrasFields, OfferTermsFields } from "~/components/offer-fields";
import { offerTotals } from "~/content/offer-terms";
import { fieldErrorReply, fieldErrorsOf } from "~/services/errors.server";
import { specForReader } from "~/services/spec-access.server";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `Your bid · ${d?.spec.title ?? "Spec"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.bidding);
  const spec = await specForReader(user, params.specId);
  const [{ bom, axisNames }, bid] = await Promise.all([billOfRevision(spec), bidOfShop(user, spec)]);
  const [history, documents] = await Promise.all([bid ? historyOf(bid) : [], ownOfferDocuments(spec, bid)]);
  const offered = new Map((bid?.lines ?? []).map((l) => [l.key, l]));
  return {
    spec: {
      id: spec.id,
      title: spec.title,
      revision: spec.currentRevision,
      currency: spec.currency,
      units: spec.unitsWanted ?? 1,
      retainerPercent: spec.retainerPercent ?? null,
      deadline: spec.bidDeadline?.toISOString() ?? null,
      accepting: takesBids(spec),
      /** a machine's axes, in order; none for one axis */
      axes: axisNames,
    },
    bill: bom.map((l) => ({
      key: l.key,
      item: l.item,
      quantity: l.quantity,
      specification: l.specification,
      rating: l.rating?.label ?? "",
      serves: servedBy(l.key, axisNames),
    })),
    bid: bid && {
      status: bid.status as BidStatus,
      version: bid.version,
      specRevision: bid.specRevision,
      totalCents: bid.totalCents,
      submittedAt: bid.submittedAt?.toISOString() ?? null,
    },
    defaults: {
      lines: bom.map((l) => {
        const o = offered.get(l.key);
        return {
          key: l.key,
          unitPrice: o?.unitPriceCents != null ? centsToInput(o.unitPriceCents) : "",
          alternative: o?.alternative ? "on" : undefined,
          alternativeDescription: o?.alternativeDescription ?? "",
        };
      }),
      leadTimeWeeks: bid?.leadTimeWeeks != null ? String(bid.leadTimeWeeks) : "",
      validUntil: bid?.validUntil ?? "",
      validDays: "",
      ...offerDefaults(bid),
      notes: bid?.notes ?? "",
    },
    documents,
    history: history.map((v) => ({
      id: v.id,
      version: v.version,
      event: v.event,
      specRevision: v.specRevision,
      totalCents: v.offer.totalCents,
      leadTimeWeeks: v.offer.leadTimeWeeks,
      by: (v as unknown as { createdBy?: { name: string } }).createdBy?.name ?? "",
      at: v.createdAt.toISOString(),
    })),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.bidding);
  const spec = await specForReader(user, params.specId);
  const formData = await request.formData();
  const back = `/specs/${spec.id}/bid`;
  if (formData.get("intent") === "withdraw") {
    try {
      await withdrawBid(user, spec.id);
    } catch (error) {
      return data({ result: null, withdrawError: fieldErrorsOf(error).message }, { status: 409 });
    }
    return redirectWithToast(request, back, "Your offer has been taken back. You can offer again until the deadline.");
  }
  const submission = parseWithZod(formData, { schema: bidSchemaFor(Number(spec.retainerPercent ?? 0)) });
  const bom = await bomOf(spec);
  if (
    !linesMatchBill(
      formData.entries(),
      bom.map((l) => l.key),
    )
  ) {
    const message =
      "The lines sent do not match the bill of materials (it may have changed since the form was opened). Nothing was saved: reload the page and price the current bill.";
    return data({ result: submission.reply({ formErrors: [message], resetForm: true }), withdrawError: null }, { status: 400 });
  }
  if (submission.status !== "success") return data({ result: submission.reply(), withdrawError: null }, { status: 400 });
  try {
    const bid = await saveBid(user, spec.id, submission.value);
    return redirectWithToast(
      request,
      back,
      submission.value.intent === "submit"
        ? `Offer ${bid.version} sent: ${formatMoney(bid.totalCents, bid.currency)}. The buyer has been told.`
        : "Draft saved. Only your shop can see it.",
    );
  } catch (error) {
    // A refusal of the whole offer (the "" key: deadline passed, spec awarded) is a conflict.
    const status = fieldErrorsOf(error).fieldErrors[""] ? 409 : 400;
    return data({ result: fieldErrorReply(submission, error), withdrawError: null }, { status });
  }
}

const dateText = (iso: string) => formatDay(iso);

export default function SpecBid({ loaderData: d, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: navigation.state === "idle" ? actionData?.result : null,
    defaultValue: d.defaults,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: bidSchemaFor(Number(d.spec.retainerPercent ?? 0)) }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const lines = fields.lines.getFieldList();
  // A preview only: the server prices the bid again from what is sent.
  const typed = (form.value?.lines ?? d.defaults.lines) as { unitPrice?: string; alternative?: string }[];
  const cents = d.bill.map((l, i) => ({ quantity: l.quantity, unitPriceCents: parseMoney(typed[i]?.unitPrice ?? "") }));
  const preview = offerTotals(
    cents.map((c) => ({ quantity: c.quantity, unitPriceCents: c.unitPriceCents ?? 0 })),
    d.spec.units,
    typedExtras(form.value),
    typedOwnLines(form.value),
  );
  const unpriced = cents.filter((c, i) => c.unitPriceCents === null && !(typed[i]?.unitPrice ?? "").trim()).length;
  const unreadable = cents.filter((c, i) => c.unitPriceCents === null && (typed[i]?.unitPrice ?? "").trim()).length;
  const offered = d.bid?.status === "submitted";
  const money = (c: number) => formatMoney(c, d.spec.currency);

  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={`/specs/${d.spec.id}`} className="text-flow-700 hover:underline">
          ← {d.spec.title}
        </Link>
      </p>
      <PageHeader
        title="Your bid"
        lead={
          <span className="flex flex-wrap items-center gap-2">
            {d.bid ? <Badge tone={BID_STATUS_TONES[d.bid.status]}>{BID_STATUS_LABELS[d.bid.status]}</Badge> : <Badge tone="neutral">Not started</Badge>}
            <span>
              Priced in {d.spec.currency} against revision {d.spec.revision} · {d.spec.units} unit{d.spec.units === 1 ? "" : "s"} wanted
              {d.spec.deadline ? ` · bids until ${dateText(d.spec.deadline)}` : ""}
            </span>
          </span>
        }
      />
      {d.bid && d.bid.specRevision < d.spec.revision ? (
        <div className="mb-4">
          <Notice tone="warn">
            Your offer was made against revision {d.bid.specRevision}; the buyer has since published revision {d.spec.revision}. The lines below are the current
            bill. Submit again so your offer matches it.
          </Notice>
        </div>
      ) : null}
      {!d.spec.accepting ? (
        <div className="mb-4">
          <Notice tone="warn">This spec no longer takes bids, so your bid can't be changed.</Notice>
        </div>
      ) : null}
      {form.errors?.length || actionData?.withdrawError ? (
        <div className="mb-4" id={form.errorId} role="alert">
          <Notice tone="bad">{[...(form.errors ?? []), actionData?.withdrawError].filter(Boolean).join(" ")}</Notice>
        </div>
      ) : null}

      <Form method="post" {...getFormProps(form)} className="space-y-6">
        <fieldset disabled={!d.spec.accepting} className="min-w-0 space-y-6">
          {/* Enter in a field presses the form's first submit button: this one, so Enter saves (the
              draft, or the revised offer once offered), never "Add a line of your own" further down. */}
          <button type="submit" name="intent" value={offered ? "submit" : "save"} hidden tabIndex={-1} aria-hidden="true" />
          <Card>
            <h2 className="mb-1 text-lg font-semibold">Price each line of the bill</h2>
            <p className="mb-4 text-sm text-ink-600">
              Enter the price of one item; the line total is that times the quantity. If you would fit a different part, tick “Alternative” and say what it is.
              Enter 0 for a line included in another.
              {d.spec.axes.length
                ? ` A machine of ${d.spec.axes.length} axes (${d.spec.axes.join(", ")}) on one power unit: the power unit's lines come first, then each axis's own.`
                : ""}
            </p>
            <TableScroll label="Prices by line">
              <table className="w-full text-left text-sm sm:min-w-[44rem]">
                <thead className="text-ink-600">
                  <tr>
                    <th scope="col" className="py-2 pr-3">
                      Line
                    </th>
                    <th scope="col" className="pr-3 text-right">
                      Qty
                    </th>
                    <th scope="col" className="w-28 pr-3 sm:w-40">
                      Unit price ({d.spec.currency})
                    </th>
                    <th scope="col" className="pr-3 text-right">
                      Line total
                    </th>
                    <th scope="col">Alternative</th>
                  </tr>
                </thead>
                <tbody>
                  {/* One row per bill line, whatever a stale form's result holds. */}
                  {lines.slice(0, d.bill.length).map((line, i) => {
                    const f = line.getFieldset();
                    const bill = d.bill[i];
                    const isAlternative = typed[i]?.alternative === "on";
                    const c = cents[i];
                    // A machine's bill is grouped: a heading row where the power unit or an axis begins.
                    const startsGroup = bill.serves !== null && bill.serves !== d.bill[i - 1]?.serves;
                    return (
                      <Fragment key={line.key}>
                        {startsGroup ? (
                          <tr className="border-t-2 border-ink-200" data-bill-group={bill.serves}>
                            <th scope="colgroup" colSpan={5} className="px-2 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-700">
                              {bill.serves}
                            </th>
                          </tr>
                        ) : null}
                        <tr className="border-t border-ink-100 align-top">
                          {/* On a phone the line's column (fixed while the row scrolls) stays narrow, so the price beside it is in view. */}
                          <td className="min-w-[8.5rem] py-2 pr-3 sm:min-w-0">
                            <input {...getInputProps(f.key, { type: "hidden" })} key={f.key.key} />
                            <label htmlFor={f.unitPrice.id} className="font-semibold text-ink-900">
                              {bill.item}
                            </label>
                            <p className="text-ink-600">{bill.specification}</p>
                          </td>
                          <td className="py-2 pr-3 text-right tabular-nums">{bill.quantity}</td>
                          <td className="py-2 pr-3">
                            <input
                              {...getInputProps(f.unitPrice, { type: "text" })}
                              key={f.unitPrice.key}
                              inputMode="decimal"
                              placeholder="0.00"
                              className="block w-full min-w-24 rounded-md bg-white px-2 py-1 text-right tabular-nums ring-1 ring-ink-200 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600"
                            />
                            <FieldErrorText id={f.unitPrice.errorId} errors={f.unitPrice.errors} />
                          </td>
                          <td className="py-2 pr-3 text-right tabular-nums">{c.unitPriceCents === null ? "—" : money(c.quantity * c.unitPriceCents)}</td>
                          <td className="py-2">
                            <label className="flex items-center gap-2">
                              <input {...getInputProps(f.alternative, { type: "checkbox" })} key={f.alternative.key} />
                              <span>Alternative</span>
                            </label>
                            {isAlternative ? null : <input type="hidden" name={f.alternativeDescription.name} value="" />}
                          </td>
                        </tr>
                        {/* The alternative is described across the whole table, under its line, not squeezed into the last column. */}
                        {isAlternative ? (
                          <tr className="align-top">
                            <td colSpan={5} className="pb-3">
                              <label htmlFor={f.alternativeDescription.id} className="block text-xs font-semibold text-ink-700">
                                What you offer instead of {bill.item}
                              </label>
                              <textarea
                                {...getTextareaProps(f.alternativeDescription)}
                                key={f.alternativeDescription.key}
                                rows={2}
                                placeholder="Make, model and why"
                                className="mt-1 block w-full rounded-md bg-white px-2 py-1 ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
                              />
                              <FieldErrorText id={f.alternativeDescription.errorId} errors={f.alternativeDescription.errors} />
                            </td>
                          </tr>
                        ) : null}
                      </Fragment>
                    );
                  })}
                </tbody>
                <tfoot className="border-t-2 border-ink-200 font-semibold">
                  <tr>
                    <td colSpan={3} className="py-2 pr-3 text-right">
                      One set
                    </td>
                    <td className="py-2 pr-3 text-right tabular-nums" data-testid="set-total">
                      {money(preview.setTotalCents)}
                    </td>
                    <td />
                  </tr>
                  <tr>
                    <td colSpan={3} className="py-2 pr-3 text-right">
                      × {d.spec.units} unit{d.spec.units === 1 ? "" : "s"}: the bill
                    </td>
                    <td className="py-2 pr-3 text-right text-base tabular-nums" data-testid="offer-total">
                      {money(preview.billCents)}
                    </td>
                    <td className="py-2 text-xs font-normal text-ink-600">
                      {[
                        unpriced ? `${unpriced} line${unpriced === 1 ? "" : "s"} not priced yet` : "",
                        unreadable ? `${unreadable} price${unreadable === 1 ? "" : "s"} to correct` : "",
                      ]
                        .filter(Boolean)
                        .join("; ") || "Every line priced"}
                    </td>
                  </tr>
                </tfoot>
              </table>
            </TableScroll>
          </Card>

          <OfferExtrasFields form={form} fields={fields} currency={d.spec.currency} />
          <OfferTermsFields fields={fields} retainerPercent={d.spec.retainerPercent} />
          <AlternativeCircuitFields form={form} fields={fields} currency={d.spec.currency} units={d.spec.units} />
          <Card>
            <TextAreaField meta={fields.notes} label="Notes for the buyer" placeholder="Anything the buyer should know about your offer" maxLength={4000} />
          </Card>

          <Card className="flex flex-wrap items-baseline gap-x-6 gap-y-1" data-testid="offer-summary">
            <span className="text-sm text-ink-600">
              Bill {money(preview.billCents)} + work beyond it {money(preview.extrasCents)}
              {preview.ownLinesCents ? ` + your own lines ${money(preview.ownLinesCents)}` : ""}
            </span>
            <span className="font-semibold">
              Your offer: <span data-testid="offer-grand-total">{money(preview.totalCents)}</span>
            </span>
          </Card>

          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" name="intent" value="submit">
              {offered ? "Send the revised offer" : "Submit the offer"}
            </Button>
            {!offered ? (
              <Button type="submit" name="intent" value="save" tone="secondary">
                Save as draft
              </Button>
            ) : null}
            <p className="text-sm text-ink-600">
              {offered
                ? "The buyer sees the revised offer as soon as you send it; the earlier one stays in the history."
                : "The buyer sees your offer once it is submitted; drafts stay with your shop."}
            </p>
          </div>
        </fieldset>
      </Form>

      {offered && d.spec.accepting ? (
        <Form
          method="post"
          className="mt-4"
          onSubmit={(event) => {
            if (!window.confirm("Take your offer back? The buyer will no longer see it; you can offer again until the deadline.")) event.preventDefault();
          }}
        >
          <Button type="submit" name="intent" value="withdraw" tone="danger">
            Take the offer back
          </Button>
        </Form>
      ) : null}

      <OfferDocumentsCard specId={d.spec.id} documents={d.documents} canChange={d.spec.accepting && d.bid !== null} saved={d.bid !== null} />

      {d.history.length ? (
        <Card className="mt-8">
          <h2 className="mb-3 text-lg font-semibold">History</h2>
          <ol className="space-y-2 text-sm">
            {d.history.map((h) => (
              <li key={h.id} className="flex flex-wrap gap-x-3">
                <span className="font-semibold">{h.event === "submitted" ? `Offer ${h.version}` : `Offer ${h.version} taken back`}</span>
                <span className="tabular-nums">{money(h.totalCents)}</span>
                {h.leadTimeWeeks ? <span>{h.leadTimeWeeks} weeks</span> : null}
                <span className="text-ink-600">
                  revision {h.specRevision} · {h.by} · {formatMoment(h.at)}
                </span>
              </li>
            ))}
          </ol>
        </Card>
      ) : null}
    </>
  );
}
