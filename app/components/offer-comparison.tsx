import { Fragment, type ReactNode } from "react";
import { Badge } from "./ui";
import { ColumnHeads } from "./column-heads";
import { EXTRA_ANSWER_LABELS } from "~/content/offer-terms";
import type { ComparisonColumn, ExtraRow } from "~/services/bid-comparison";
import type { AttachmentView } from "~/services/attachments.server";
import { DocumentLink } from "./offer-documents";

// The comparison's rows beyond the bill: the work each offer covers lined up by kind, the shop's
// own lines, what each leaves out, the terms side by side, its documents and an alternative
// circuit. Rows of the same table as the bill, so every offer keeps its column.

const rowHead = "sticky left-0 bg-white p-3 text-left font-normal";

/** One row of the comparison: its heading in the sticky first column, then each offer's cell (a `<td>`). */
export function OfferRow({
  label,
  columns,
  cell,
  className = "border-t border-ink-100 align-top",
  ...data
}: {
  label: ReactNode;
  columns: ComparisonColumn[];
  cell: (c: ComparisonColumn) => ReactNode;
  className?: string;
} & Record<`data-${string}`, string>) {
  return (
    <tr className={className} {...data}>
      <th scope="row" className={rowHead}>
        {label}
      </th>
      {columns.map((c) => (
        <Fragment key={c.id}>{cell(c)}</Fragment>
      ))}
    </tr>
  );
}

/** The kinds of work beyond the bill, then the shop's own lines and the like-for-like figure. */
export function ExtraRows({ rows, columns, money }: { rows: ExtraRow[]; columns: ComparisonColumn[]; money: (cents: number) => string }) {
  return (
    <>
      <tr className="border-t-2 border-ink-200" data-extras-heading="">
        <th scope="colgroup" colSpan={columns.length + 1} className="px-3 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-700">
          Work beyond the bill, for the whole order
        </th>
      </tr>
      {rows.map((row) => (
        <tr key={row.kind} className="border-t border-ink-100 align-top" data-extra-row={row.kind}>
          <th scope="row" className={rowHead}>
            <span className="font-semibold text-ink-900">{row.name}</span>
            {row.common ? <span className="block text-xs text-ink-600">every offer covers it</span> : null}
          </th>
          {row.cells.map((cell, i) => (
            <td key={columns[i].id} className={`p-3 text-right tabular-nums ${cell.lowest ? "bg-flow-50 font-semibold text-flow-700" : ""}`}>
              {cell.answer === "priced" ? (
                <>
                  {money(cell.priceCents ?? 0)}
                  {cell.lowest ? <span className="block text-xs">lowest</span> : null}
                </>
              ) : (
                <span className={cell.answer === "not_offered" ? "text-signal-700" : "text-ink-700"}>{EXTRA_ANSWER_LABELS[cell.answer]}</span>
              )}
            </td>
          ))}
        </tr>
      ))}
      <OfferRow
        label="The shop's own lines"
        columns={columns}
        data-own-lines=""
        cell={(c) => (
          <td className="p-3 text-right text-xs">
            {c.ownLines.length ? (
              <ul className="space-y-1">
                {c.ownLines.map((l, i) => (
                  <li key={i}>
                    {l.name}: <span className="tabular-nums">{l.priceCents ? money(l.priceCents) : "included"}</span>
                  </li>
                ))}
              </ul>
            ) : (
              <span className="text-ink-400">none</span>
            )}
          </td>
        )}
      />
    </>
  );
}

/** What each offer leaves out, its like-for-like figure, and its terms side by side. */
export function OfferTermsRows({ columns, money }: { columns: ComparisonColumn[]; money: (cents: number) => string }) {
  const rows: [string, string, (c: ComparisonColumn) => React.ReactNode][] = [
    [
      "Like for like",
      "like-for-like",
      (c) => (
        <span className={`tabular-nums ${c.cheapestComplete ? "font-semibold text-flow-700" : ""}`}>
          {money(c.likeForLikeCents)}
          <span className="block text-xs font-normal text-ink-600">the bill and the work every offer covers</span>
        </span>
      ),
    ],
    [
      "Leaves out",
      "leaves-out",
      (c) =>
        c.leavesOut.length ? <span className="text-signal-700">{c.leavesOut.join("; ")}</span> : <span className="text-ink-600">nothing asked about</span>,
    ],
    ["Delivery", "delivery", (c) => c.delivery ?? <span className="text-ink-400">not stated</span>],
    ["Payment", "payment", (c) => c.payment ?? <span className="text-ink-400">not stated</span>],
    ["Warranty", "warranty", (c) => c.warranty ?? <span className="text-ink-400">not stated</span>],
  ];
  return (
    <>
      {rows.map(([label, key, cell]) => (
        <OfferRow
          key={key}
          label={label}
          columns={columns}
          cell={(c) => (
            <td className="p-3 text-right text-xs text-ink-800" data-offer-term={key} data-bid={c.id}>
              {cell(c)}
            </td>
          )}
        />
      ))}
    </>
  );
}

/** The shop's documents on each offer, each a download. */
export function OfferDocumentsRow({ columns, documents }: { columns: ComparisonColumn[]; documents: Record<string, AttachmentView[]> }) {
  return (
    <OfferRow
      label="Documents"
      columns={columns}
      cell={(c) => (
        <td className="p-3 text-left text-xs" data-documents={c.id}>
          {documents[c.id]?.length ? (
            <ul className="space-y-1">
              {documents[c.id].map((doc) => (
                <li key={doc.id}>
                  <DocumentLink doc={doc} stacked />
                </li>
              ))}
            </ul>
          ) : (
            <span className="text-ink-400">none</span>
          )}
        </td>
      )}
    />
  );
}

/** Alternative circuits, each beside the like-for-like offers and plainly not one of them. */
export function AlternativeCircuits({ columns, money, units }: { columns: ComparisonColumn[]; money: (cents: number) => string; units: number }) {
  const offers = columns.filter((c) => c.alternativeCircuit);
  if (!offers.length) return null;
  return (
    <section aria-labelledby="alternatives-heading" className="mt-8">
      <h2 id="alternatives-heading" className="text-lg font-semibold">
        Alternative circuits
      </h2>
      <p className="mb-3 text-sm text-ink-600">
        A shop may propose building the machine another way. These are not like for like and are not ranked with the offers above; ask the shop before you award
        on one.
      </p>
      <div className="grid gap-4 lg:grid-cols-2">
        {offers.map((c) => {
          const alt = c.alternativeCircuit!;
          return (
            <article key={c.id} className="rounded-lg bg-white p-4 ring-1 ring-signal-600/40" data-alternative-circuit={c.id}>
              <p className="flex flex-wrap items-center gap-2">
                <Badge tone="warn">Alternative circuit</Badge>
                <span className="font-semibold">{c.shop}</span>
              </p>
              <p className="mt-2 whitespace-pre-line text-sm text-ink-800">{alt.description}</p>
              <table className="mt-3 w-full text-sm">
                <caption className="sr-only">The alternative circuit&apos;s bill from {c.shop}</caption>
                <thead className="text-ink-600">
                  <ColumnHeads
                    heads={[
                      ["Part", "text-left"],
                      ["Qty", "text-right"],
                      ["Line total", "text-right"],
                    ]}
                  />
                </thead>
                <tbody>
                  {alt.lines.map((l, i) => (
                    <tr key={i} className="border-t border-ink-100">
                      <td className="py-1 pr-2">{l.name}</td>
                      <td className="py-1 pr-2 text-right tabular-nums">{l.quantity}</td>
                      <td className="py-1 text-right tabular-nums">{money(l.quantity * l.unitPriceCents)}</td>
                    </tr>
                  ))}
                </tbody>
                <tfoot className="border-t-2 border-ink-200 font-semibold">
                  <tr>
                    <td colSpan={2} className="py-1 pr-2 text-right">
                      × {units} unit{units === 1 ? "" : "s"}
                    </td>
                    <td className="py-1 text-right tabular-nums">{money(alt.totalCents)}</td>
                  </tr>
                </tfoot>
              </table>
              <p className="mt-2 text-xs text-ink-600">Its bill only; the work beyond the bill and the terms are those of {c.shop}&apos;s offer above.</p>
            </article>
          );
        })}
      </div>
    </section>
  );
}
