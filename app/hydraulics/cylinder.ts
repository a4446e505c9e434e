import { ISO3320_BORES_MM, ISO6020_2, ISO6022, rodForAreaRatio, type CylinderSeries } from "./series";

export interface CylinderCandidate {
  boreMm: number;
  rodMm: number;
  /** series the pair comes from; "ISO 3320" for bores beyond the pairing table */
  series: string;
  ratioClass: number;
  outOfSeries: boolean;
  capAreaMm2: number;
  annulusAreaMm2: number;
  areaRatio: number;
}

export const circleAreaMm2 = (diameterMm: number): number => (Math.PI * diameterMm * diameterMm) / 4;

/** F [N] = p [bar] · A [mm²] / 10 · η — textbook F = η·p·A. */
export const cylinderForceN = (pressureBar: number, areaMm2: number, efficiency: number): number =>
  (pressureBar * areaMm2 * efficiency) / 10;

/** The 160 bar series covers buyers up to 160 bar; above that the 250 bar series. */
export function cylinderSeriesFor(maxPressureBar: number): CylinderSeries {
  return maxPressureBar <= ISO6020_2.ratedPressureBar ? ISO6020_2 : ISO6022;
}

function candidate(boreMm: number, rodMm: number, series: string, ratioClass: number, outOfSeries: boolean): CylinderCandidate {
  const capAreaMm2 = circleAreaMm2(boreMm);
  const annulusAreaMm2 = capAreaMm2 - circleAreaMm2(rodMm);
  return { boreMm, rodMm, series, ratioClass, outOfSeries, capAreaMm2, annulusAreaMm2, areaRatio: capAreaMm2 / annulusAreaMm2 };
}

function buildCandidates(series: CylinderSeries): readonly CylinderCandidate[] {
  const list: CylinderCandidate[] = [];
  for (const [bore, thin, thick] of series.pairs) {
    list.push(candidate(bore, thin, series.name, series.ratioClasses[0], false));
    list.push(candidate(bore, thick, series.name, series.ratioClasses[1], false));
  }
  // Larger ISO 3320 bores, with the rod nearest each ratio class, flagged as out of series.
  const largest = series.pairs[series.pairs.length - 1][0];
  for (const bore of ISO3320_BORES_MM) {
    if (bore <= largest) continue;
    for (const ratio of series.ratioClasses) {
      list.push(candidate(bore, rodForAreaRatio(bore, ratio), "ISO 3320", ratio, true));
    }
  }
  return list;
}

const CANDIDATES = new Map<string, readonly CylinderCandidate[]>([
  [ISO6020_2.name, buildCandidates(ISO6020_2)],
  [ISO6022.name, buildCandidates(ISO6022)],
]);

/** Bore/rod pairs in the order they are tried: bore ascending, thinner rod first. */
export function cylinderCandidates(series: CylinderSeries): readonly CylinderCandidate[] {
  return CANDIDATES.get(series.name)!;
}
