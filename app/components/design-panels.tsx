import { CIRCUIT_CAUTIONS } from "~/content/cautions";
import { warningTitle } from "~/content/warning-titles";
import type { BomLine, Design, TrailEntry, Warning } from "~/hydraulics/design";
import type { TrailInput } from "~/hydraulics/trail";
import type { UnitSystem } from "~/units";
import { centreName } from "./circuit-diagram/describe";
import { ColumnHeads } from "./column-heads";
import { displayUnits, readable } from "./circuit-diagram/format";
import { Badge, Card, Notice } from "./ui";

/**
 * The panels beside the circuit diagram: headline sizes, warnings, cautions, the bill of
 * materials and the calculation trail. They only read a Design, so the design page, the
 * quick-sizing page and the review step show the same thing.
 */

const cell = "px-3 py-2 align-top";
const headCell = `${cell} text-xs font-semibold uppercase tracking-wide text-ink-600`;

/** "3:1", "90°", "12 bar": a value with the engine's unit, "-" meaning no unit. */
function withUnit(value: number | string, unit: string): string {
  const shown = typeof value === "number" ? readable(value) : value;
  if (!unit || unit === "-") return shown;
  return /^[:°%]/.test(unit) ? `${shown}${unit}` : `${shown} ${unit}`;
}

// ---- Key sizes ------------------------------------------------------------------------------

export function KeySizes({ design, units = "metric" }: { design: Omit<Design, "bom" | "trail">; units?: UnitSystem }) {
  const u = displayUnits(units);
  const { cylinder: c, pressuresBar: p, counterbalance: cb, directionalValve: dv } = design;
  const items: { label: string; value: string; detail?: string }[] = [
    // The catalogue size stays on one line (also in the narrow live preview); inches for a US reader go below it.
    {
      label: "Bore / rod",
      value: u.boreRod(c.boreMm, c.rodMm, "metric"),
      detail: `${units === "us" ? `${u.boreRod(c.boreMm, c.rodMm, "inch")} · ` : ""}stroke ${u.length(c.strokeMm)}`,
    },
    { label: "Extend pressure", value: u.pressure(p.extend), detail: "at the pump" },
    { label: "Retract pressure", value: u.pressure(p.retract), detail: "at the pump" },
    { label: "Pump flow", value: u.flow(design.flowsLpm.pump), detail: `${pumpInWords(design, u)} at ${design.pump.speedRpm} rpm` },
    { label: "Motor rating", value: u.motorRating(design.motor.ratedKw), detail: `needs ${u.power(design.motor.requiredKw)}` },
    { label: "Relief setting", value: u.pressure(p.reliefSetting) },
  ];
  if (cb) {
    items.push({ label: "Counterbalance setting", value: u.pressure(cb.settingBar), detail: `${cb.side} side, pilot ratio ${cb.pilotRatio}:1` });
  }
  items.push(
    { label: "Directional valve", value: `ISO 4401-${dv.iso4401Size}`, detail: centreName(dv.center) },
    { label: "Reservoir", value: u.volume(design.reservoir.volumeL) },
    {
      label: "Average heat",
      value: u.power(design.heat.averageLossKw),
      detail: design.heat.coolerKw > 0 ? `cooler ${u.power(design.heat.coolerKw)}` : "tank sheds it",
    },
  );
  return (
    <Card>
      <h2 className="mb-3 font-semibold text-ink-900">Key sizes</h2>
      {/* Three columns only where the panel itself is wide (a container query): in the narrow live
          preview beside a form, three unbroken values would run into each other. */}
      <div className="@container">
        <dl className="grid grid-cols-2 gap-x-6 gap-y-3 @xl:grid-cols-3">
          {items.map((item) => (
            <div key={item.label} data-key-size={item.label}>
              <dt className="text-xs text-ink-600">{item.label}</dt>
              <dd className="whitespace-nowrap text-lg font-semibold text-ink-900">{item.value}</dd>
              {item.detail ? <dd className="text-xs text-ink-600">{item.detail}</dd> : null}
            </div>
          ))}
        </dl>
      </div>
    </Card>
  );
}

/** "double pump, 112 + 6.3 cm³/rev": the kind of pump a shop prices, with its sections. Designs from before the pump choice have no type: a fixed pump. */
export function pumpInWords(design: { pump: Design["pump"] }, u: ReturnType<typeof displayUnits>): string {
  const p = design.pump;
  if (p.type === "double" && p.displacementsCcRev?.length === 2) {
    return `double pump, ${p.displacementsCcRev.map((cc) => u.displacement(cc)).join(" + ")}`;
  }
  return `${p.type === "compensated" ? "compensated pump" : "fixed pump"}, ${u.displacement(p.displacementCcRev)}`;
}

// ---- Warnings -------------------------------------------------------------------------------

export function WarningsList({ warnings }: { warnings: Warning[] }) {
  return (
    <Card>
      <h2 className="mb-3 font-semibold text-ink-900">Warnings {warnings.length ? <Badge tone="warn">{warnings.length}</Badge> : null}</h2>
      {warnings.length === 0 ? (
        <Notice tone="good">No warnings: nothing in this design is flagged for a reviewer beyond the cautions.</Notice>
      ) : (
        <ul className="space-y-2">
          {warnings.map((w, i) => (
            <li key={`${w.code}-${i}`} data-warning={w.code} className="rounded-md border-l-4 border-signal-500 bg-signal-50 px-4 py-3 text-sm">
              <p className="font-semibold text-signal-700">{warningTitle(w.code)}</p>
              <p className="mt-1 text-ink-800">{w.message}</p>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

// ---- Cautions -------------------------------------------------------------------------------

export function CautionsPanel() {
  return (
    <Card className="border-l-4 border-alarm-600">
      <h2 className="mb-3 font-semibold text-ink-900">Before anyone builds this</h2>
      <ul className="list-disc space-y-1.5 pl-5 text-sm text-ink-800 marker:text-alarm-600">
        {CIRCUIT_CAUTIONS.map((text) => (
          <li key={text}>{text}</li>
        ))}
      </ul>
    </Card>
  );
}

// ---- Bill of materials ----------------------------------------------------------------------

function rating(line: BomLine): string {
  return `${withUnit(line.rating.value, line.rating.unit)} ${line.rating.label}`;
}

/** The bill, line by line; a machine's names the axis each line serves (or the power unit). */
export function ComponentTable({ design, servedBy }: { design: { bom: BomLine[] }; servedBy?: (line: BomLine) => string | null }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Bill of materials: one line per component</caption>
        <thead className="border-b border-ink-200">
          <ColumnHeads heads={["Item", !!servedBy && "Serves", ["Qty", "text-right"], "Specification", "Rating"]} className={headCell} />
        </thead>
        <tbody className="divide-y divide-ink-100">
          {design.bom.map((line) => (
            <tr key={line.key} data-bom-key={line.key}>
              <th scope="row" className={`${cell} font-semibold text-ink-900`}>
                {line.item}
              </th>
              {servedBy ? (
                <td className={`${cell} whitespace-nowrap text-ink-800`} data-serves="">
                  {servedBy(line)}
                </td>
              ) : null}
              <td className={`${cell} text-right tabular-nums`}>{line.quantity}</td>
              <td className={`${cell} text-ink-700`}>{line.specification}</td>
              <td className={`${cell} whitespace-nowrap text-ink-700`}>{rating(line)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

// ---- Calculation trail ----------------------------------------------------------------------

function Inputs({ inputs }: { inputs: Record<string, TrailInput> }) {
  const entries = Object.entries(inputs);
  if (!entries.length) return <span className="text-ink-400">none</span>;
  return (
    <ul className="space-y-0.5">
      {entries.map(([name, input]) => (
        <li key={name} className="whitespace-nowrap">
          <span className="font-mono">{name}</span> = {withUnit(input.value, input.unit)}
        </li>
      ))}
    </ul>
  );
}

/** Every number the engine reached, in the order it reached them, with formula and source. */
export function CalculationTrail({ trail }: { trail: TrailEntry[] }) {
  return (
    <>
      <p className="text-sm text-ink-700">{trail.length} calculation steps, each with its formula, inputs and source.</p>
      <p className="mt-2 text-xs text-ink-600" data-trail-legend="">
        Sources are marked: <strong>[S]</strong> taken from a published source (a standard, a textbook, a maker's table) we have read; <strong>[M]</strong> a
        published value quoted from memory, to be verified before anyone relies on it; <strong>[CP]</strong> common practice of the trade, a sensible default
        rather than a rule; <strong>[D]</strong> worked out from the numbers above.
      </p>
      <div className="mt-3 overflow-x-auto">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Calculation trail</caption>
          <thead className="border-b border-ink-200">
            <ColumnHeads heads={["Quantity", ["Value", "text-right"], "Formula", "Inputs", "Source"]} className={headCell} />
          </thead>
          <tbody className="divide-y divide-ink-100">
            {trail.map((entry, i) => (
              <tr key={i} data-trail-row="">
                <th scope="row" className={`${cell} font-semibold text-ink-900`}>
                  {entry.quantity}
                </th>
                <td className={`${cell} whitespace-nowrap text-right tabular-nums text-flow-700`}>{withUnit(entry.value, entry.unit)}</td>
                <td className={`${cell} font-mono text-xs text-ink-800`}>{entry.formula}</td>
                <td className={`${cell} text-xs text-ink-700`}>
                  <Inputs inputs={entry.inputs} />
                </td>
                <td className={`${cell} text-xs text-ink-600`}>{entry.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
