import type { CyclePhase } from "~/hydraulics/design";
import { formatQuantity, roundForDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from "~/units";
import { Card } from "./ui";
import { formatNumber } from "~/content/number-format";

// Pressure, flow and power over one cycle, drawn as steps since the engine gives each phase
// constant values. Plain SVG of a fixed size, drawn here rather than by a chart library: the
// drawing is three step lines over bands, and a chart library cost 38 ms of server time per page
// and 97 kB of the page's script. The server renders the
// same SVG the browser hydrates; a narrow set for phones and a wide one from the md breakpoint
// and in print, switched by CSS alone. The drawing is hidden from screen readers: the table
// below it carries every number, and is what a printed page or a small screen reads best.

export const PHASE_NAMES: Record<CyclePhase["phase"], string> = {
  approach: "Approach",
  extend: "Extend",
  pressing: "Pressing",
  dwell: "Dwell at force",
  retract: "Return",
  neutral: "Idle, valve in neutral",
};

const COLOURS = {
  pressure: "#1f2a37",
  delivery: "#0b7f71",
  demand: "#129b8a",
  power: "#e08a0b",
  grid: "#e6eaef",
  band: "#f4f6f8",
  text: "#3f4d5e",
};
const FONT = 11;
const PANEL_HEIGHT = 92;
const AXIS_HEIGHT = 22;
const SIZES = { wide: 640, narrow: 280 } as const;
const Y_AXIS_WIDTH = 52;
const RIGHT_MARGIN = 12;

interface Point {
  t: number;
  pressure: number;
  delivery: number;
  demand: number;
  power: number;
}

/** What the chart reads of a phase: an axis's cycle (CyclePhase) and a machine's (MachineCyclePhase) both have it. */
export type ChartPhase = Pick<CyclePhase, "durationS" | "shownS" | "demandLpm" | "pressureBar" | "pumpFlowLpm" | "hydraulicKw"> & { phase: string };

const seconds = (s: number): string => `${formatNumber(roundForDisplay(s, s >= 10 ? 0 : 1), 2)}\u00a0s`;

/** The axis top: the next of 1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × a power of ten above the highest value. */
function niceTop(max: number): number {
  if (!(max > 0)) return 1;
  const decade = 10 ** Math.floor(Math.log10(max));
  const step = [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10].find((m) => m * decade >= max * (1 + 1e-9))!;
  return step * decade;
}

/** Step points in display units: one at each phase start, and the last phase's values at the end. */
function stepPoints(cycle: ChartPhase[], units: UnitSystem): Point[] {
  const at = (q: Quantity, v: number) => toDisplay(q, v, units);
  let t = 0;
  const points = cycle.map((ph) => {
    const p = {
      t,
      pressure: at("pressure", ph.pressureBar),
      delivery: at("flow", ph.pumpFlowLpm),
      demand: at("flow", ph.demandLpm),
      power: at("power", ph.hydraulicKw),
    };
    t += ph.shownS;
    return p;
  });
  return [...points, { ...points[points.length - 1], t }];
}

/** "%.0f" from 10 up, one decimal below: the y axis's three marks. */
const tickValue = (v: number) => `${roundForDisplay(v, v >= 10 ? 0 : 1)}`;

/**
 * One panel: the phase bands, three grid lines (0, half, top), the step lines and, on the last
 * panel, the time marks. Steps after each point (a phase holds its values until the next starts).
 */
function Panel({
  id,
  width,
  data,
  bands,
  ticks,
  tickLabel,
  lines,
  unit,
  showTime,
  showBands,
}: {
  id: string;
  width: number;
  data: Point[];
  bands: { x1: number; x2: number; label: string }[];
  ticks: number[];
  tickLabel: (t: number) => string;
  lines: { key: keyof Point; colour: string; dashed?: boolean }[];
  unit: string;
  showTime: boolean;
  /** number the phase bands (the top panel only) */
  showBands: boolean;
}) {
  const end = data[data.length - 1].t;
  const top = niceTop(Math.max(...data.flatMap((p) => lines.map((l) => p[l.key]))));
  const [left, right] = [Y_AXIS_WIDTH, width - RIGHT_MARGIN];
  const [upper, lower] = [showBands ? 14 : 6, PANEL_HEIGHT - 6];
  const x = (t: number) => left + (end > 0 ? (t / end) * (right - left) : 0);
  const y = (v: number) => lower - (v / top) * (lower - upper);
  const text = { fontSize: FONT, fill: COLOURS.text };
  const step = (key: keyof Point) =>
    data.map((p, i) => (i === 0 ? `M${x(p.t)},${y(p[key])}` : `L${x(p.t)},${y(data[i - 1][key])}L${x(p.t)},${y(p[key])}`)).join("");
  return (
    <svg id={id} width={width} height={PANEL_HEIGHT + (showTime ? AXIS_HEIGHT : 0)} className="block" data-cycle-panel="">
      {bands.map((b, i) => (
        <g key={i}>
          <rect x={x(b.x1)} y={upper} width={x(b.x2) - x(b.x1)} height={lower - upper} fill={i % 2 ? "#ffffff" : COLOURS.band} />
          {showBands && b.label ? (
            <text x={(x(b.x1) + x(b.x2)) / 2} y={upper - 3} textAnchor="middle" {...text} fontSize={FONT - 1}>
              {b.label}
            </text>
          ) : null}
        </g>
      ))}
      {[0, top / 2, top].map((v) => (
        <g key={v}>
          <line x1={left} x2={right} y1={y(v)} y2={y(v)} stroke={COLOURS.grid} />
          <text x={left - 4} y={y(v)} dy="0.35em" textAnchor="end" {...text}>
            {tickValue(v)}
          </text>
        </g>
      ))}
      <text transform={`translate(12 ${(upper + lower) / 2}) rotate(-90)`} textAnchor="middle" {...text}>
        {unit}
      </text>
      {lines.map((l) => (
        <path key={l.key} fill="none" stroke={l.colour} strokeWidth={2} strokeDasharray={l.dashed ? "5 3" : undefined} data-cycle-line="" d={step(l.key)} />
      ))}
      {showTime
        ? ticks.map((t, i) => (
            <text key={t} x={x(t)} y={lower + 15} textAnchor={i === 0 ? "start" : i === ticks.length - 1 ? "end" : "middle"} {...text}>
              {tickLabel(t)}
            </text>
          ))
        : null}
    </svg>
  );
}

function Charts({ cycle, units, width, idPrefix }: { cycle: ChartPhase[]; units: UnitSystem; width: number; idPrefix: string }) {
  const data = stepPoints(cycle, units);
  const end = data[data.length - 1].t;
  // A band's number only where it has room (about 12 px).
  const pxPerS = (width - Y_AXIS_WIDTH - RIGHT_MARGIN) / end;
  const idle = cycle[cycle.length - 1].phase === "neutral" ? cycle[cycle.length - 1] : null;
  const bands = cycle.map((ph, i) => {
    const px = (data[i + 1].t - data[i].t) * pxPerS;
    const shortened = ph === idle && ph.shownS < ph.durationS && px >= 90;
    return {
      x1: data[i].t,
      x2: data[i + 1].t,
      label: px >= 12 ? `${i + 1}${shortened ? " (drawn shortened)" : ""}` : "",
    };
  });
  // Time marks where the moving phases end and at the end; a shortened idle ends at the real cycle time.
  const busyEnd = idle ? end - idle.shownS : end;
  const ticks = idle ? [0, busyEnd, end] : [0, end];
  const totalS = cycle.reduce((s, ph) => s + ph.durationS, 0);
  const tickLabel = (t: number) => (t === end ? seconds(totalS) : seconds(t));
  const common = { width, data, bands, ticks, tickLabel };
  return (
    <div className="space-y-1">
      <Panel
        id={`${idPrefix}-pressure`}
        {...common}
        unit={unitLabel("pressure", units)}
        lines={[{ key: "pressure", colour: COLOURS.pressure }]}
        showTime={false}
        showBands
      />
      <Panel
        id={`${idPrefix}-flow`}
        {...common}
        unit={unitLabel("flow", units)}
        lines={[
          { key: "delivery", colour: COLOURS.delivery },
          { key: "demand", colour: COLOURS.demand, dashed: true },
        ]}
        showTime={false}
        showBands={false}
      />
      <Panel
        id={`${idPrefix}-power`}
        {...common}
        unit={unitLabel("power", units)}
        lines={[{ key: "power", colour: COLOURS.power }]}
        showTime
        showBands={false}
      />
    </div>
  );
}

function Key({ colour, dashed, children }: { colour: string; dashed?: boolean; children: React.ReactNode }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <svg width="18" height="6" aria-hidden="true" className="shrink-0">
        <line x1="0" y1="3" x2="18" y2="3" stroke={colour} strokeWidth="2" strokeDasharray={dashed ? "5 3" : undefined} />
      </svg>
      {children}
    </span>
  );
}

const cell = "px-2 py-1.5 text-right tabular-nums whitespace-nowrap";
const head = "px-2 py-1.5 text-xs font-semibold text-ink-600";

/**
 * The cycle chart with its table, or nothing for a design stored before the engine listed its
 * cycle (published specs keep the design they were published with). A machine names its own
 * phases (which axes move) and says what its axes draw.
 */
export function CycleChart<P extends ChartPhase>({
  cycle,
  units = "metric",
  phaseName = (ph) => PHASE_NAMES[ph.phase as CyclePhase["phase"]],
  drawnBy = "Cylinder draws",
}: {
  cycle: P[] | undefined;
  units?: UnitSystem;
  phaseName?: (phase: P) => string;
  drawnBy?: string;
}) {
  if (!cycle?.length) return null;
  const idle = cycle.find((ph) => ph.phase === "neutral" && ph.shownS < ph.durationS);
  const f = (q: Quantity, v: number) => formatQuantity(q, v, units);
  return (
    <Card className="break-inside-avoid">
      <div data-cycle-chart="">
        <h2 className="font-semibold text-ink-900">One cycle, phase by phase</h2>
        <p className="mt-1 text-sm text-ink-600">
          Pump pressure, flow and hydraulic power (pressure × pump flow) in each phase; the numbered bands are the rows of the table.
          {idle ? ` The idle time is drawn shortened: it lasts ${seconds(idle.durationS)}.` : ""}
        </p>
        <div className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-700" aria-hidden="true">
          <Key colour={COLOURS.pressure}>Pump pressure</Key>
          <Key colour={COLOURS.delivery}>Pump delivers</Key>
          <Key colour={COLOURS.demand} dashed>
            {drawnBy}
          </Key>
          <Key colour={COLOURS.power}>Hydraulic power</Key>
        </div>
        <div aria-hidden="true" className="mt-2">
          <div className="hidden md:block print:block" data-cycle-size="wide">
            <Charts cycle={cycle} units={units} width={SIZES.wide} idPrefix="cycle-wide" />
          </div>
          <div className="overflow-x-auto md:hidden print:hidden" data-cycle-size="narrow">
            <Charts cycle={cycle} units={units} width={SIZES.narrow} idPrefix="cycle-narrow" />
          </div>
        </div>
        <div className="mt-4 overflow-x-auto">
          <table className="w-full text-left text-xs sm:text-sm" data-cycle-table="">
            <caption className="sr-only">Phases of one cycle with their time, pump pressure, flows and hydraulic power</caption>
            <thead className="border-b border-ink-200">
              <tr>
                <th scope="col" className={`${head} sticky left-0 bg-white`}>
                  Phase
                </th>
                <th scope="col" className={`${head} text-right`}>
                  Time
                </th>
                <th scope="col" className={`${head} text-right`}>
                  Pump pressure
                </th>
                <th scope="col" className={`${head} text-right`}>
                  {drawnBy}
                </th>
                <th scope="col" className={`${head} text-right`}>
                  Pump delivers
                </th>
                <th scope="col" className={`${head} text-right`}>
                  Hydraulic power
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {cycle.map((ph, i) => (
                <tr key={i} data-cycle-phase={ph.phase}>
                  <th scope="row" className="sticky left-0 min-w-[8.5rem] bg-white px-2 py-1.5 font-semibold text-ink-900 sm:whitespace-nowrap">
                    <span className="mr-1.5 inline-block w-4 text-ink-400">{i + 1}</span>
                    {phaseName(ph)}
                  </th>
                  <td className={cell}>{seconds(ph.durationS)}</td>
                  <td className={cell}>{f("pressure", ph.pressureBar)}</td>
                  <td className={cell}>{f("flow", ph.demandLpm)}</td>
                  <td className={cell}>{f("flow", ph.pumpFlowLpm)}</td>
                  <td className={cell}>{f("power", ph.hydraulicKw)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </Card>
  );
}
