import type { AttachmentView } from "~/services/attachments.server";
import type { QuotationFacts } from "~/content/quotation-facts";
import { formatBytes } from "./attachment-uploader";
import { formatDay } from "~/content/dates";
import { Card } from "./ui";

const longDate = (iso: string) => formatDay(iso);

/** What the buyer asks to be quoted, and the drawings and photos that come with the spec. */
export function QuotationPanel({ facts, attachments }: { facts: QuotationFacts; attachments: AttachmentView[] }) {
  const rows: [string, string | null][] = [
    ["Mains voltage at the machine", facts.supplyVoltage],
    ["Hydraulic fluid", facts.fluid],
    ["Units wanted", facts.unitsWanted],
    ["Needed by", facts.dateNeeded ? longDate(facts.dateNeeded) : null],
    ["Delivered to", facts.deliveryRegion],
    ["Bids are priced in", facts.currency],
    ["Retainer paid on award", facts.retainerPercent ? `${facts.retainerPercent} % of the awarded price` : null],
  ];
  return (
    <Card>
      <h2 className="mb-3 font-semibold">The machine and what to quote</h2>
      <div className="mb-4 rounded-md bg-ink-50 p-3 text-sm">
        <p className="text-xs font-semibold uppercase tracking-wide text-ink-600">What the machine does</p>
        <p className="mt-1 whitespace-pre-line text-ink-900">
          {facts.purpose ?? <span className="text-ink-600">The machine builder did not describe it; the axis requirements below say what it must do.</span>}
        </p>
      </div>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[14rem_1fr]">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-ink-600">{label}</dt>
            <dd className="font-semibold">{value ?? "—"}</dd>
          </div>
        ))}
        <dt className="text-ink-600">Notes from the machine builder</dt>
        <dd className="whitespace-pre-line">{facts.notes ?? <span className="text-ink-600">None.</span>}</dd>
      </dl>
      <h3 className="mb-2 mt-6 font-semibold">Drawings and photos</h3>
      {attachments.length ? (
        <ul className="space-y-1 text-sm">
          {attachments.map((a) => (
            <li key={a.id}>
              <a className="font-semibold text-flow-700 hover:underline" href={a.downloadUrl} download>
                {a.fileName}
              </a>{" "}
              <span className="text-ink-600">
                · {a.kindLabel} · {formatBytes(a.sizeBytes)}
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-600">The machine builder attached no drawings or photos.</p>
      )}
    </Card>
  );
}
