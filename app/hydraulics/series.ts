/**
 * Standard series the engine picks from. Values marked [M] are from memory (see the shared
 * sources note) and should be checked against the standard before a design is approved.
 */

/** ISO 3320 preferred bore diameters, mm [M]. */
export const ISO3320_BORES_MM: readonly number[] = [8, 10, 12, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 320, 400];

/** ISO 3320 secondary bore diameters, mm [M]; ISO 6022 style pairings use 140 and 180. */
export const ISO3320_SECONDARY_BORES_MM: readonly number[] = [90, 110, 140, 180, 220, 280, 360];

/** ISO 3320 piston-rod diameters, mm [M]. */
export const ISO3320_RODS_MM: readonly number[] = [
  4, 5, 6, 8, 10, 12, 14, 16, 18, 20, 22, 25, 28, 32, 36, 40, 45, 50, 56, 63, 70, 80, 90, 100, 110, 125, 140, 160, 180, 200, 220, 250, 280, 320, 360,
];

export type CylinderSeriesName = "ISO 6020-2" | "ISO 6022";

export interface CylinderSeries {
  readonly name: CylinderSeriesName;
  readonly ratedPressureBar: number;
  /** [bore, thinner rod, thicker rod] — preferred pairings, all ISO 3320 sizes [M]. */
  readonly pairs: readonly (readonly [number, number, number])[];
  /** Nominal area-ratio classes of the two rods. */
  readonly ratioClasses: readonly [number, number];
}

/** ISO 6020-2 style, 160 bar compact tie-rod series, bores 25–200 (sources §1.2) [M]. */
export const ISO6020_2: CylinderSeries = {
  name: "ISO 6020-2",
  ratedPressureBar: 160,
  ratioClasses: [1.25, 2],
  pairs: [
    [25, 12, 18],
    [32, 14, 22],
    [40, 18, 28],
    [50, 22, 36],
    [63, 28, 45],
    [80, 36, 56],
    [100, 45, 70],
    [125, 56, 90],
    [160, 70, 110],
    [200, 90, 140],
  ],
};

/** ISO 6022 style, 250 bar series, bores 50–320 (sources §1.2) [M]. */
export const ISO6022: CylinderSeries = {
  name: "ISO 6022",
  ratedPressureBar: 250,
  ratioClasses: [1.6, 2],
  pairs: [
    [50, 32, 36],
    [63, 40, 45],
    [80, 50, 56],
    [100, 63, 70],
    [125, 80, 90],
    [140, 90, 100],
    [160, 100, 110],
    [180, 110, 125],
    [200, 125, 140],
    [250, 160, 180],
    [320, 200, 220],
  ],
};

/** ISO 3320 rod whose area ratio D²/(D²−d²) is nearest the target class. */
export function rodForAreaRatio(boreMm: number, ratio: number): number {
  const ideal = boreMm * Math.sqrt(1 - 1 / ratio);
  let best = ISO3320_RODS_MM[0];
  for (const rod of ISO3320_RODS_MM) {
    if (rod >= boreMm) break;
    if (Math.abs(rod - ideal) < Math.abs(best - ideal)) best = rod;
  }
  return best;
}

/** IEC 60072-1 / EN 50347 rated outputs, kW [M]. */
export const IEC60072_MOTOR_KW: readonly number[] = [
  0.06, 0.09, 0.12, 0.18, 0.25, 0.37, 0.55, 0.75, 1.1, 1.5, 2.2, 3, 4, 5.5, 7.5, 11, 15, 18.5, 22, 30, 37, 45, 55, 75, 90, 110, 132, 160, 200, 250, 315,
];

/** EN 50347 4-pole TEFC frame for a rated output (sources §4) [M]. */
export const FOUR_POLE_FRAMES: ReadonlyMap<number, string> = new Map([
  [0.25, "71"],
  [0.37, "71"],
  [0.55, "80"],
  [0.75, "80"],
  [1.1, "90S"],
  [1.5, "90L"],
  [2.2, "100L"],
  [3, "100L"],
  [4, "112M"],
  [5.5, "132S"],
  [7.5, "132M"],
  [11, "160M"],
  [15, "160L"],
  [18.5, "180M"],
  [22, "180L"],
  [30, "200L"],
  [37, "225S"],
  [45, "225M"],
  [55, "250M"],
  [75, "280S"],
  [90, "280M"],
  [110, "315S"],
  [132, "315M"],
]);

/** ISO 3662 geometric displacements, R10-based, cm³/rev [M]. */
export const ISO3662_DISPLACEMENTS_CC: readonly number[] = [
  1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8, 10, 12.5, 16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500,
];

export interface HoseSize {
  readonly dash: number;
  readonly inch: string;
  readonly nominalIdMm: number;
  readonly dn: number;
}

/**
 * SAE J517 dash sizes: nominal ID in sixteenths of an inch ([S] for the convention), with
 * the ISO 18752 / EN 853 DN beside it ([M]). -40 and -48 are beyond the sources table and
 * from memory [M].
 */
export const SAE_J517_HOSES: readonly HoseSize[] = [
  { dash: 4, inch: "1/4", nominalIdMm: 6.35, dn: 6 },
  { dash: 5, inch: "5/16", nominalIdMm: 7.94, dn: 8 },
  { dash: 6, inch: "3/8", nominalIdMm: 9.53, dn: 10 },
  { dash: 8, inch: "1/2", nominalIdMm: 12.7, dn: 12 },
  { dash: 10, inch: "5/8", nominalIdMm: 15.9, dn: 16 },
  { dash: 12, inch: "3/4", nominalIdMm: 19.05, dn: 19 },
  { dash: 16, inch: "1", nominalIdMm: 25.4, dn: 25 },
  { dash: 20, inch: "1 1/4", nominalIdMm: 31.75, dn: 31 },
  { dash: 24, inch: "1 1/2", nominalIdMm: 38.1, dn: 38 },
  { dash: 32, inch: "2", nominalIdMm: 50.8, dn: 51 },
  { dash: 40, inch: "2 1/2", nominalIdMm: 63.5, dn: 63 },
  { dash: 48, inch: "3", nominalIdMm: 76.2, dn: 76 },
];

export type Iso4401Size = "03" | "05" | "07" | "08" | "10";

/** ISO 4401 interface sizes with the lower end of their typical max flow (sources §7) [CP]. */
export const ISO4401_SIZES: readonly { size: Iso4401Size; nominal: string; typicalMaxLpm: number }[] = [
  { size: "03", nominal: "NG6", typicalMaxLpm: 60 },
  { size: "05", nominal: "NG10", typicalMaxLpm: 100 },
  { size: "07", nominal: "NG16", typicalMaxLpm: 250 },
  { size: "08", nominal: "NG25", typicalMaxLpm: 500 },
  { size: "10", nominal: "NG32", typicalMaxLpm: 900 },
];

/** ISO 3448 viscosity grades: mid-point and ±10 % band at 40 °C, mm²/s [S]. */
export const ISO3448_GRADES: Readonly<Record<"VG32" | "VG46" | "VG68", { mid: number; min: number; max: number }>> = {
  VG32: { mid: 32, min: 28.8, max: 35.2 },
  VG46: { mid: 46, min: 41.4, max: 50.6 },
  VG68: { mid: 68, min: 61.2, max: 74.8 },
};

/** EN 837-1 style gauge full-scale ranges, bar [M]. */
export const GAUGE_RANGES_BAR: readonly number[] = [40, 60, 100, 160, 250, 400, 600];

/** Smallest series value ≥ x, or undefined when the series ends below x. */
export function nextInSeries(series: readonly number[], x: number): number | undefined {
  const floor = x - 1e-9; // tolerance so a value that is exactly on the series is kept
  for (let i = 0; i < series.length; i++) if (series[i] >= floor) return series[i];
  return undefined;
}
