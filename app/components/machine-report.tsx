import type { MachineAxis, MachineCyclePhase, MachineDesign } from "~/hydraulics";
import { detailCounts, FoldedDetails, type ReportProps } from "./design-report";
import { servedBy } from "~/services/published-design";
import { formatQuantity } from "~/units";
import { CircuitViewer } from "./circuit-viewer";
import { centreName } from "./circuit-diagram/describe";
import { displayUnits, type DisplayUnits } from "./circuit-diagram/format";
import { CycleChart } from "./cycle-chart";
import { CautionsPanel, ComponentTable, pumpInWords, WarningsList } from "./design-panels";
import { DetailLinks } from "./folded-section";
import { Card, Notice } from "./ui";

/**
 * A machine as every page shows it: each axis with its own sizes, the one power unit that feeds
 * them, the machine's cycle, its warnings (each names its axis), the bill with the axis each
 * line serves, and the calculation trail. The single-axis DesignReport's sibling: same order,
 * same panels where they fit.
 */
export function MachineReport(report: ReportProps<MachineDesign>) {
  const { design, units, updating = false, componentsTitle = "Components", cautions = true } = report;
  const u = displayUnits(units);
  const names = design.axes.map((a) => a.name);
  return (
    <div className={`space-y-6 transition-opacity ${updating ? "opacity-70" : ""}`} data-machine-report="">
      <Card>
        <div className="mb-2 flex items-center justify-between gap-3">
          <h2 className="font-semibold">Preliminary circuit of the machine</h2>
          <span className="text-xs text-ink-400">{updating ? "Updating…" : `Engine ${design.engineVersion}`}</span>
        </div>
        <CircuitViewer circuit={design.circuit} units={units} />
        <DetailLinks componentsTitle={componentsTitle} bomLines={detailCounts(report).bill} />
      </Card>
      <section aria-labelledby="machine-axes-title">
        <h2 id="machine-axes-title" className="mb-3 font-semibold text-ink-900">
          The axes ({design.axes.length})
        </h2>
        <div className="grid gap-4 lg:grid-cols-2">
          {design.axes.map((axis, i) => (
            <AxisCard key={axis.name} axis={axis} number={i + 1} u={u} />
          ))}
        </div>
      </section>
      <PowerUnit design={design} u={u} />
      <CycleChart cycle={design.cycle} units={units} phaseName={machinePhaseName} drawnBy="Axes draw" />
      <WarningsList warnings={design.warnings} />
      {cautions ? <CautionsPanel /> : null}
      <FoldedDetails report={report} bill={(d) => <ComponentTable design={d} servedBy={(line) => servedBy(line.key, names)} />} />
    </div>
  );
}

const VERBS: Record<string, string> = {
  approach: "approaches",
  extend: "extends",
  pressing: "presses",
  dwell: "holds its force",
  retract: "returns",
};

/** "Clamp extends", "Feed extends, Clamp extends", "Idle, every valve in neutral": who does what in a phase. */
export function machinePhaseName(phase: Pick<MachineCyclePhase, "phase" | "motions">): string {
  if (phase.phase === "recharge") return "Pump refills the accumulator, every valve in neutral";
  if (phase.phase === "neutral" || !phase.motions.length) return "Idle, every valve in neutral";
  return phase.motions.map((m) => `${m.axis} ${VERBS[m.phase] ?? m.phase}`).join(", ");
}

interface Item {
  label: string;
  value: string;
  detail?: string;
}

function Facts({ items }: { items: Item[] }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-3">
      {items.map((item) => (
        <div key={item.label} data-key-size={item.label}>
          <dt className="text-xs text-ink-600">{item.label}</dt>
          <dd className="text-base font-semibold text-ink-900">{item.value}</dd>
          {item.detail ? <dd className="text-xs text-ink-600">{item.detail}</dd> : null}
        </div>
      ))}
    </dl>
  );
}

const SIDES = { rod: "rod side", cap: "cap side", both: "both sides" } as const;

/** How the axis holds its load: a counterbalance valve, leak-tight checks, or nothing needed. */
function loadHolding(axis: MachineAxis, u: DisplayUnits): Item {
  const { counterbalance: cb, holding: h } = axis;
  if (cb && h) {
    return {
      label: "Load holding",
      value: `Counterbalance ${u.pressure(cb.settingBar)} and pilot-operated checks`,
      detail: `counterbalance on the ${SIDES[cb.side]}, pilot ${cb.pilotRatio}:1; checks on the ${SIDES[h.side]}`,
    };
  }
  if (cb) return { label: "Counterbalance", value: u.pressure(cb.settingBar), detail: `${SIDES[cb.side]}, pilot ratio ${cb.pilotRatio}:1` };
  if (h) return { label: "Load holding", value: "Pilot-operated checks", detail: `${SIDES[h.side]}, pilot ratio ${h.pilotRatio}:1` };
  return { label: "Load holding", value: "None needed", detail: "no overrunning load, no long hold" };
}

function AxisCard({ axis, number, u }: { axis: MachineAxis; number: number; u: DisplayUnits }) {
  const { cylinder: c, pressuresBar: p, flowsLpm: f, directionalValve: dv } = axis;
  const pressing = p.press !== undefined && p.approach !== undefined;
  const speed = (mmS: number) => formatQuantity("speed", mmS, u.system);
  const items: Item[] = [
    {
      label: "Bore / rod",
      value: u.boreRod(c.boreMm, c.rodMm, "metric"),
      detail: `${u.system === "us" ? `${u.boreRod(c.boreMm, c.rodMm, "inch")} · ` : ""}stroke ${u.length(c.strokeMm)}`,
    },
    pressing
      ? { label: "Approach / press pressure", value: `${u.pressure(p.approach!)} / ${u.pressure(p.press!)}`, detail: "at the pump" }
      : { label: "Extend pressure", value: u.pressure(p.extend), detail: "at the pump" },
    { label: "Retract pressure", value: u.pressure(p.retract), detail: "at the pump" },
    // Out and back apart: "47.1 L/min / 56.4 L/min" wraps badly in a narrow card.
    {
      label: "Flow out",
      value: u.flow(f.extend),
      detail: f.press !== undefined ? `pressing ${u.flow(f.press)}` : axis.regenerative ? "regenerative approach" : "cylinder flow",
    },
    { label: "Flow back", value: u.flow(f.retract), detail: "cylinder flow" },
    { label: "Speed out", value: speed(axis.speedsMmS.extendActual), detail: `asked ${speed(axis.speedsMmS.extendRequested)}` },
    { label: "Speed back", value: speed(axis.speedsMmS.retractActual), detail: `asked ${speed(axis.speedsMmS.retractRequested)}` },
    { label: "Directional valve", value: `ISO 4401-${dv.iso4401Size}`, detail: `${centreName(dv.center)}, ${dv.coilVoltage}` },
    loadHolding(axis, u),
  ];
  if (axis.speedControl) {
    items.push({ label: "Speed control", value: u.flow(axis.speedControl.flowLpm), detail: "meter-in flow control on the shared pump" });
  }
  return (
    <Card>
      <section aria-labelledby={`axis-${number}-title`} data-axis={axis.name}>
        <h3 id={`axis-${number}-title`} className="mb-3 font-semibold text-ink-900">
          <span className="mr-2 text-ink-400">{number}</span>
          {axis.name}
        </h3>
        <Facts items={items} />
      </section>
    </Card>
  );
}

/** A line by its bore, with the oil's speed in it below. */
function line(label: string, l: { innerDiameterMm: number; velocityMS: number }, u: DisplayUnits): Item {
  return { label, value: `${u.lengthValue(l.innerDiameterMm)} ${u.lengthUnit} bore`, detail: `oil at ${formatQuantity("velocity", l.velocityMS, u.system)}` };
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** The one power unit, sized over the machine's cycle. */
function PowerUnit({ design: m, u }: { design: Omit<MachineDesign, "bom" | "trail">; u: DisplayUnits }) {
  const pump = m.pump;
  const items: Item[] = [
    { label: "Pump", value: u.flow(m.flowsLpm.pump), detail: `${pumpInWords(m, u)} at ${pump.speedRpm} rpm` },
    { label: "Motor rating", value: u.motorRating(m.motor.ratedKw), detail: `needs ${u.power(m.motor.requiredKw)}` },
    { label: "Relief setting", value: u.pressure(m.pressuresBar.reliefSetting) },
  ];
  if (pump.compensatorBar !== undefined) items.push({ label: "Compensator", value: u.pressure(pump.compensatorBar) });
  if (pump.unloadingBar !== undefined) items.push({ label: "Unloads above", value: u.pressure(pump.unloadingBar) });
  // Older stored designs have no accumulator field at all.
  if (m.accumulator) {
    const acc = m.accumulator;
    items.push(
      {
        label: "Accumulator",
        value: u.volume(acc.nominalL),
        detail: `gas precharged to ${u.pressure(acc.prechargeBar)}; gives ${u.volume(acc.usableL)} between ${u.pressure(acc.minBar)} and ${u.pressure(acc.maxBar)}`,
      },
      { label: "Charging valve", value: `${u.pressure(acc.minBar)} to ${u.pressure(acc.maxBar)}`, detail: "loads and unloads the pump" },
    );
  }
  items.push(
    { label: "Reservoir", value: u.volume(m.reservoir.volumeL), detail: `sheds about ${u.power(m.reservoir.dissipationKw)}` },
    {
      label: "Cooler",
      value: m.cooler ? u.power(m.cooler.kw) : "None needed",
      detail: `average heat ${u.power(m.heat.averageLossKw)}`,
    },
    { label: "Return filter", value: u.flow(m.returnFilter.ratedFlowLpm), detail: "rated flow" },
    line("Pressure line", m.lines.pressure, u),
    line("Return line", m.lines.return, u),
    line("Suction line", m.lines.suction, u),
  );
  return (
    <Card>
      <section aria-labelledby="power-unit-title" data-power-unit="">
        <h2 id="power-unit-title" className="mb-1 font-semibold text-ink-900">
          The power unit, shared by every axis
        </h2>
        <p className="mb-3 text-sm text-ink-600">{capitalised(pump.reason)}</p>
        <Facts items={items} />
        {m.reliefVent ? (
          <div className="mt-3">
            <Notice>In neutral the relief is vented: the pump circulates at about {u.pressure(m.reliefVent.ventPressureBar)} until a valve shifts.</Notice>
          </div>
        ) : null}
      </section>
    </Card>
  );
}
