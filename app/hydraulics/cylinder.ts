import { ISO3320_BORES_MM, ISO6020_2, ISO6022, rodForAreaRatio, type CylinderSeries, type CylinderSeriesName } from "./series";

export interface CylinderCandidate {
  boreMm: number;
  rodMm: number;
  /** series the pair comes from; "ISO 3320" for bores beyond the pairing table */
  series: string;
  /** the pairing table the pair belongs to or, beyond it, extends */
  table: CylinderSeriesName;
  ratioClass: number;
  outOfSeries: boolean;
  /** pressure rating of the series the pair comes from */
  ratedPressureBar: number;
  capAreaMm2: number;
  annulusAreaMm2: number;
  areaRatio: number;
}

export const circleAreaMm2 = (diameterMm: number): number => (Math.PI * diameterMm * diameterMm) / 4;

/** F [N] = p [bar] · A [mm²] / 10 · η — textbook F = η·p·A. */
export const cylinderForceN = (pressureBar: number, areaMm2: number, efficiency: number): number => (pressureBar * areaMm2 * efficiency) / 10;

function candidate(boreMm: number, rodMm: number, table: CylinderSeries, ratioClass: number, outOfSeries: boolean): CylinderCandidate {
  const capAreaMm2 = circleAreaMm2(boreMm);
  const annulusAreaMm2 = capAreaMm2 - circleAreaMm2(rodMm);
  const series = outOfSeries ? "ISO 3320" : table.name;
  return {
    boreMm,
    rodMm,
    series,
    table: table.name,
    ratioClass,
    outOfSeries,
    ratedPressureBar: table.ratedPressureBar,
    capAreaMm2,
    annulusAreaMm2,
    areaRatio: capAreaMm2 / annulusAreaMm2,
  };
}

function buildCandidates(series: CylinderSeries): readonly CylinderCandidate[] {
  const list: CylinderCandidate[] = [];
  for (const [bore, thin, thick] of series.pairs) {
    list.push(candidate(bore, thin, series, series.ratioClasses[0], false));
    list.push(candidate(bore, thick, series, series.ratioClasses[1], false));
  }
  // Larger ISO 3320 bores, with the rod nearest each ratio class, flagged as out of series.
  const largest = series.pairs[series.pairs.length - 1][0];
  for (const bore of ISO3320_BORES_MM) {
    if (bore <= largest) continue;
    for (const ratio of series.ratioClasses) {
      list.push(candidate(bore, rodForAreaRatio(bore, ratio), series, ratio, true));
    }
  }
  return list;
}

/**
 * Both series in one list, so the series follows the pressure a pair needs, not the buyer's
 * allowed maximum: bore ascending; at one bore a pair of the table before one beyond it, the
 * 160 bar medium series (ISO 6020-2, the cheaper cylinder) before the 250 bar heavy series
 * (ISO 6022), and the thinner rod first.
 */
const CANDIDATES: readonly CylinderCandidate[] = [...buildCandidates(ISO6020_2), ...buildCandidates(ISO6022)]
  .map((cyl, index) => ({ cyl, index }))
  .sort((a, b) => a.cyl.boreMm - b.cyl.boreMm || Number(a.cyl.outOfSeries) - Number(b.cyl.outOfSeries) || a.index - b.index)
  .map(({ cyl }) => cyl);

/** Bore/rod pairs in the order the search tries them. */
export function cylinderCandidates(): readonly CylinderCandidate[] {
  return CANDIDATES;
}

/**
 * Highest pump working pressure a pair may need: the buyer's limit, and low enough that the
 * relief setting (about 10 % above it, common practice) stays within the pair's rating.
 */
export const workingLimitBar = (maxPressureBar: number, ratedPressureBar: number, reliefMargin: number): number =>
  Math.min(maxPressureBar, ratedPressureBar / (1 + reliefMargin));
