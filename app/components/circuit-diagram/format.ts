import { UNITS, formatQuantity, roundForDisplay, toDisplay, type UnitSystem } from "~/units";
import { formatNumber } from "~/content/number-format";

/**
 * Display formatting for the diagram and the design panels. The engine works in the units its
 * fields name (bar, mm, L/min…); conversions and unit labels come from app/units, so the
 * diagram, the panels and the forms always agree.
 */
export interface DisplayUnits {
  system: UnitSystem;
  pressure(bar: number): string;
  length(mm: number): string;
  /** a diameter or length as a bare number, for compact forms such as Ø80 / Ø36 × 400 mm */
  lengthValue(mm: number): string;
  lengthUnit: string;
  flow(lpm: number): string;
  displacement(cm3PerRev: number): string;
  volume(litres: number): string;
  /** a small volume of oil, such as what a compressed cap end gives back: cm³ or in³ */
  smallVolume(cm3: number): string;
  power(kw: number): string;
  /**
   * Catalogue parts are metric sizes (ISO 3320 bores, ISO 3662 displacements, IEC motor
   * ratings): a US reader sees the metric size first and the inch or hp value beside it,
   * "Ø125 / Ø56 mm (4.92 / 2.20 in)", never an odd inch size.
   */
  boreRod(boreMm: number, rodMm: number, part?: "metric" | "inch"): string;
  motorRating(kw: number): string;
}

export function displayUnits(system: UnitSystem = "metric"): DisplayUnits {
  const { decimals, label } = UNITS.diameter[system];
  return {
    system,
    pressure: (bar) => formatQuantity("pressure", bar, system),
    length: (mm) => formatQuantity("length", mm, system),
    lengthValue: (mm) => String(roundForDisplay(toDisplay("diameter", mm, system), decimals)),
    lengthUnit: label,
    flow: (lpm) => formatQuantity("flow", lpm, system),
    displacement: (cc) =>
      system === "us"
        ? `${formatQuantity("displacement", cc, "metric")} (${formatQuantity("displacement", cc, "us")})`
        : formatQuantity("displacement", cc, system),
    volume: (l) => formatQuantity("volume", l, system),
    // 1 in = 2.54 cm exactly, so 1 in³ = 2.54³ cm³
    smallVolume: (cm3) => (system === "us" ? `${readable(cm3 / 2.54 ** 3)} in³` : `${Math.round(cm3).toLocaleString("en-GB")} cm³`),
    power: (kw) => formatQuantity("power", kw, system),
    // part: only the metric size, or only the inches ("4.92 / 2.20 in"); both by default for a US reader.
    boreRod: (bore, rod, part) => {
      const metric = `Ø${bore} / Ø${rod} mm`;
      const inchValue = (mm: number) => roundForDisplay(toDisplay("diameter", mm, "us"), 2).toFixed(2);
      const inches = `${inchValue(bore)} / ${inchValue(rod)} in`;
      if (part === "metric") return metric;
      if (part === "inch") return inches;
      return system === "us" ? `${metric} (${inches})` : metric;
    },
    motorRating: (kw) =>
      system === "us" ? `${formatQuantity("power", kw, "metric")} (${formatQuantity("power", kw, "us")})` : formatQuantity("power", kw, system),
  };
}

/** Rounds a value of any unit to a sensible number of figures for reading. */
export function readable(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  const digits = Number.isInteger(value) || abs >= 100 ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3;
  return formatNumber(Number(value.toFixed(digits)), digits);
}
