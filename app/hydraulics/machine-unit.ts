/**
 * The power unit of a machine dressed as an axis design, so the axis's bill and circuit builders
 * (bom.ts, circuit.ts) write its lines and components once, the same way they do for an axis.
 * Only the power unit's parts are read from it (POWER_UNIT_KEYS, POWER_UNIT_IDS).
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import type { MachineDesign } from "./machine-design";
import { GAUGE_RANGES_BAR, nextInSeries } from "./series";

/** Bill lines that belong to the power unit: one each for the machine. */
export const POWER_UNIT_KEYS = new Set([
  "pump",
  "motor",
  "coupling-bellhousing",
  "reservoir",
  "suction-strainer",
  "return-filter",
  "relief-valve",
  "relief-vent-valve",
  "cooler",
  "gauge",
  "fluid-fill",
  "unloading-valve",
  "pump-check-valve",
  "hose-pressure",
  "hose-return",
  "hose-suction",
]);
/** Circuit components that belong to the power unit. */
export const POWER_UNIT_IDS = new Set([
  "tank",
  "strainer",
  "motor",
  "pump",
  "pump-large",
  "unloading",
  "pump-check",
  "relief",
  "gauge",
  "filter",
  "vent",
  "cooler",
]);

/** Gauge full scale: the next range above the relief by the gauge factor [CP], as for an axis. */
export const gaugeRangeBar = (reliefBar: number): number =>
  nextInSeries(GAUGE_RANGES_BAR, reliefBar * A.gaugeRangeFactor.value) ?? GAUGE_RANGES_BAR[GAUGE_RANGES_BAR.length - 1];

/** The first axis's design with the machine's power unit in place of its own. */
export function powerUnitDesign(m: MachineDesign, first: Design): Design {
  return {
    ...first,
    pump: m.pump,
    motor: { ...m.motor },
    flowsLpm: { ...first.flowsLpm, pump: m.flowsLpm.pump, returnMax: m.flowsLpm.returnMax },
    pressuresBar: { ...first.pressuresBar, reliefSetting: m.pressuresBar.reliefSetting },
    reservoir: m.reservoir,
    cooler: m.cooler,
    returnFilter: m.returnFilter,
    lines: { ...first.lines, pressure: m.lines.pressure, return: m.lines.return, suction: m.lines.suction },
    reliefVent: m.reliefVent,
    heat: { ...first.heat, averageLossKw: m.heat.averageLossKw, coolerKw: m.heat.coolerKw, tankDissipationKw: m.heat.tankDissipationKw },
  };
}
