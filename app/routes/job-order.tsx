import { Link } from "react-router";
import type { Route } from "./+types/job-order";
import { requireUser } from "~/auth/permissions.server";
import { Button, ButtonLink, EmptyState } from "~/components/ui";
import { formatDay } from "~/content/dates";
import { formatMoney } from "~/content/money";
import type { OrderDocument } from "~/content/order-document";
import { OrganisationProfileCard } from "~/components/organisation-profile";
import { orderConfirmationFor } from "~/services/order-confirmation.server";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.order ? `Order ${d.order.number}` : "Order confirmation"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return orderConfirmationFor(user, params.jobId);
}

// The order confirmation as both parties agreed it at the award: on screen, and printed from the
// browser as a clean A4 sheet (app.css prints a [data-print-document] page without the app's
// navigation), or downloaded as the PDF drawn on the server.
export default function JobOrder({ loaderData: { jobId, order } }: Route.ComponentProps) {
  return (
    <>
      <div data-print-hidden className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <Link to={`/jobs/${jobId}`} className="text-sm text-flow-700 hover:underline">
          ← Back to the job
        </Link>
        {order ? (
          <div className="flex flex-wrap gap-2">
            <Button type="button" tone="secondary" onClick={() => window.print()}>
              Print
            </Button>
            <ButtonLink to={`/jobs/${jobId}/order.pdf`} reloadDocument>
              Download the PDF
            </ButtonLink>
          </div>
        ) : null}
      </div>
      {order ? (
        <OrderSheet order={order} />
      ) : (
        <EmptyState title="No order confirmation">
          This job was awarded before Tenderflow made order confirmations; its award is in the job's history.
        </EmptyState>
      )}
    </>
  );
}

const LINE_COLUMNS = [
  { title: "Item", numeric: false },
  { title: "Specification", numeric: false },
  { title: "Qty", numeric: true },
  { title: "Unit price", numeric: true },
  { title: "Line total", numeric: true },
];

function OrderSheet({ order }: { order: OrderDocument }) {
  const money = (cents: number) => formatMoney(cents, order.currency);
  return (
    <article
      data-print-document
      className="mx-auto max-w-4xl bg-white p-6 shadow-sm ring-1 ring-ink-100 sm:p-10 print:max-w-none print:p-0 print:shadow-none print:ring-0"
    >
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink-200 pb-4">
        <div>
          <h1 className="text-2xl font-bold">Order confirmation</h1>
          <p className="text-sm text-ink-600">Issued {formatDay(order.issuedAt)} through Tenderflow</p>
        </div>
        <p className="text-lg font-semibold tabular-nums">{order.number}</p>
      </header>
      <div className="mt-6 grid gap-6 sm:grid-cols-2 print:grid-cols-2">
        <OrganisationProfileCard title="Buyer" profile={order.buyer} className="print:bg-transparent print:p-0" />
        <OrganisationProfileCard title="Supplier (shop)" profile={order.shop} className="print:bg-transparent print:p-0" />
      </div>
      <dl className="mt-6 grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[12rem_1fr] print:grid-cols-[12rem_1fr]">
        <dt className="text-ink-600">Spec</dt>
        <dd>
          {order.spec.title || "Untitled spec"}, revision {order.spec.revision}
        </dd>
        <dt className="text-ink-600">Awarded by</dt>
        <dd>
          {order.awardedBy}, {formatDay(order.issuedAt)}
        </dd>
      </dl>
      <h2 className="mt-8 font-semibold">Lines offered</h2>
      <div className="mt-2 overflow-x-auto">
        <table className="w-full min-w-[36rem] text-sm print:min-w-0">
          <thead>
            <tr className="border-b border-ink-200 text-left">
              {LINE_COLUMNS.map((c) => (
                <th key={c.title} scope="col" className={`py-2 pr-3 font-semibold ${c.numeric ? "text-right" : ""}`}>
                  {c.title}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {order.lines.map((line, i) => (
              <tr key={i} className="break-inside-avoid border-b border-ink-100 align-top">
                <td className="py-2 pr-3">{line.item}</td>
                <td className="py-2 pr-3">
                  {line.specification}
                  {line.alternative ? <span className="block text-ink-600">Alternative: {line.note}</span> : null}
                </td>
                <td className="py-2 pr-3 text-right tabular-nums">{line.quantity}</td>
                <td className="py-2 pr-3 text-right tabular-nums">{money(line.unitPriceCents)}</td>
                <td className="py-2 text-right tabular-nums">{money(line.totalCents)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {order.extras.length || order.ownLines.length ? (
        <Facts
          title="Work beyond the bill"
          rows={[
            ...order.extras.map((e) => [e.name, e.priceCents === null ? "Included" : money(e.priceCents)]),
            ...order.ownLines.map((l) => [l.name, money(l.priceCents)]),
          ]}
        />
      ) : null}
      {order.leavesOut.length ? <p className="mt-2 text-sm text-ink-600">Not in this order: {order.leavesOut.join("; ")}.</p> : null}
      <div className="mt-6 grid gap-8 sm:grid-cols-2 print:grid-cols-2">
        <Facts
          title="Price"
          rows={[
            ...(order.units > 1
              ? [
                  ["Bill, one set", money(order.setTotalCents)],
                  ["Units", String(order.units)],
                ]
              : []),
            ["Total", money(order.totalCents)],
            [`Retainer (${Number(order.retainerPercent)} %)`, money(order.retainerCents)],
            ["Balance after the handover", money(order.balanceCents)],
          ]}
        />
        <Facts
          title="Dates and terms"
          rows={[
            ["Lead time", order.leadTimeWeeks ? `${order.leadTimeWeeks} weeks` : "Not stated"],
            ["Handover planned by", order.handoverBy ? formatDay(order.handoverBy) : "Not planned yet"],
            ["Offer valid until", order.offerValidUntil ? formatDay(order.offerValidUntil) : "Not stated"],
            ["Terms", order.terms.join("\n") || "None stated"],
            ...(order.notes ? [["Shop's notes", order.notes]] : []),
          ]}
        />
      </div>
      <p className="mt-8 border-t border-ink-200 pt-3 text-xs text-ink-600">
        Made at the award and kept unchanged with the job. The retainer is paid by card after the award; the balance after the handover.
      </p>
    </article>
  );
}

function Facts({ title, rows }: { title: string; rows: string[][] }) {
  return (
    <section className="mt-6 break-inside-avoid">
      <h2 className="font-semibold">{title}</h2>
      <dl className="mt-2 space-y-1 text-sm">
        {rows.map(([label, value]) => (
          <div key={label} className="flex justify-between gap-4 border-b border-ink-100 py-1">
            <dt className="text-ink-600">{label}</dt>
            {/* Several lines (the terms) read as a list, not a right-aligned block. */}
            <dd className={`font-semibold whitespace-pre-wrap tabular-nums ${value.includes("\n") ? "text-left" : "text-right"}`}>{value}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
