import Qty from "js-quantities";
import type { UnitSystem } from "./systems";
import { formatNumber } from "~/content/number-format";

export { UNIT_SYSTEMS, UNIT_SYSTEM_LABELS, type UnitSystem } from "./systems";

/**
 * Display units. Inside the app every value is in the unit its field names (mm, kg, N, mm/s,
 * bar, L/min, kW, °C, L, cm³/rev); a person sees and types metric or US customary. The
 * conversions come from js-quantities, a general-purpose unit library, not our own factors.
 */
interface DisplayUnit {
  /** js-quantities unit name */
  qty: string;
  label: string;
  decimals: number;
}

const unit = (qty: string, label: string, decimals: number): DisplayUnit => ({ qty, label, decimals });

export const UNITS = {
  length: { metric: unit("mm", "mm", 0), us: unit("in", "in", 2) },
  diameter: { metric: unit("mm", "mm", 0), us: unit("in", "in", 3) },
  mass: { metric: unit("kg", "kg", 0), us: unit("lb", "lb", 0) },
  force: { metric: unit("N", "N", 0), us: unit("lbf", "lbf", 0) },
  speed: { metric: unit("mm/s", "mm/s", 0), us: unit("in/s", "in/s", 2) },
  velocity: { metric: unit("m/s", "m/s", 2), us: unit("ft/s", "ft/s", 1) },
  // One decimal in bar, as the bill and the trail write settings (39.8 bar on every page, not 40 here and 39.8 there).
  pressure: { metric: unit("bar", "bar", 1), us: unit("psi", "psi", 0) },
  flow: { metric: unit("L/min", "L/min", 1), us: unit("gal/min", "US gpm", 1) },
  power: { metric: unit("kW", "kW", 2), us: unit("hp", "hp", 2) },
  temperature: { metric: unit("tempC", "°C", 0), us: unit("tempF", "°F", 0) },
  volume: { metric: unit("L", "L", 0), us: unit("gal", "US gal", 1) },
  displacement: { metric: unit("cm^3", "cm³/rev", 1), us: unit("in^3", "in³/rev", 2) },
} as const satisfies Record<string, Record<UnitSystem, DisplayUnit>>;

export type Quantity = keyof typeof UNITS;

// swiftConverter builds a plain function once per unit pair: fast enough for every render.
const converters = new Map<string, (value: number) => number>();
function converter(from: string, to: string) {
  const key = `${from}>${to}`;
  let convert = converters.get(key);
  if (!convert) {
    if (from === to) convert = (v: number) => v;
    // swiftConverter fails on temperatures (offset scales), so those take the slower full path.
    else if (from.startsWith("temp")) convert = (v: number) => Qty(v, from).to(to).scalar;
    else convert = Qty.swiftConverter(from, to) as (value: number) => number;
    converters.set(key, convert);
  }
  return convert;
}

/** A value in the app's unit, in the person's unit system. */
export function toDisplay(quantity: Quantity, value: number, system: UnitSystem): number {
  return converter(UNITS[quantity].metric.qty, UNITS[quantity][system].qty)(value);
}

/** What a person typed in their unit system, back in the app's unit. */
export function fromDisplay(quantity: Quantity, value: number, system: UnitSystem): number {
  return converter(UNITS[quantity][system].qty, UNITS[quantity].metric.qty)(value);
}

/**
 * A number typed with its own unit ("150 kN", "6 in", "2 t") in the app's unit for this
 * quantity; null when the text is not one number and one unit of this kind. A comma reads as
 * the decimal point, as in plain numbers. Temperatures are typed as plain numbers only.
 */
export function parseWithUnit(quantity: Quantity, text: string): number | null {
  const target = UNITS[quantity].metric.qty;
  const trimmed = text.trim().replace(",", ".");
  // A bare unit ("kN") would read as one of it: a number must come first.
  if (target.startsWith("temp") || trimmed.length > 40 || !/^[+-]?\.?\d/.test(trimmed)) return null;
  const parsed = Qty.parse(trimmed);
  if (!parsed || !parsed.isCompatible(target)) return null;
  const value = parsed.to(target).scalar;
  return Number.isFinite(value) ? value : null;
}

export function unitLabel(quantity: Quantity, system: UnitSystem): string {
  return UNITS[quantity][system].label;
}

/** Rounds for display without losing small values (0.004 kW stays visible). */
export function roundForDisplay(value: number, decimals: number): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  const needed = Math.max(decimals, Math.min(4, Math.ceil(-Math.log10(Math.abs(value))) + 1));
  const factor = 10 ** needed;
  return Math.round(value * factor) / factor;
}

/** "12.5 bar", "181 psi": a value in the app's unit shown in the person's system. */
export function formatQuantity(quantity: Quantity, value: number, system: UnitSystem): string {
  const { decimals, label } = UNITS[quantity][system];
  const shown = roundForDisplay(toDisplay(quantity, value, system), decimals);
  return `${formatNumber(shown, 4)} ${label}`;
}
