import { A } from "./assumptions";
import { SAE_J517_HOSES, type HoseSize } from "./series";

export interface Fluid {
  viscosityMm2S: number;
  densityKgM3: number;
}

export const DEFAULT_FLUID: Fluid = { viscosityMm2S: A.viscosityMm2S.value, densityKgM3: A.densityKgM3.value };

/** d [mm] = √(4Q/(πv)) = 4.607·√(Q [L/min] / v [m/s]) — continuity [D]. */
export const lineDiameterMm = (flowLpm: number, velocityMS: number): number =>
  Math.sqrt((4 * flowLpm) / (60_000 * Math.PI * velocityMS)) * 1000;

/** v [m/s] = Q / A. */
export const lineVelocityMS = (flowLpm: number, diameterMm: number): number =>
  flowLpm / 60_000 / ((Math.PI * diameterMm * diameterMm) / 4 / 1e6);

/** Re = 1000·v [m/s]·d [mm] / ν [mm²/s]. */
export const reynoldsNumber = (velocityMS: number, diameterMm: number, viscosityMm2S: number): number =>
  (1000 * velocityMS * diameterMm) / viscosityMm2S;

export type FlowRegime = "laminar" | "transitional" | "turbulent";

export const flowRegime = (re: number): FlowRegime =>
  re < A.laminarReynoldsLimit.value ? "laminar" : re < 4000 ? "transitional" : "turbulent";

/**
 * Darcy friction factor: 64/Re when laminar; above Re ≈ 2000 the larger of 64/Re and Blasius
 * 0.3164·Re^−0.25 (smooth pipe, adequate for oil hydraulics to Re = 10⁵, Matthies/Renius).
 * Taking Blasius through the uncertain 2000–4000 zone errs on the safe side.
 */
export function frictionFactor(re: number): number {
  if (re <= 0) return 0;
  const laminar = 64 / re;
  if (re < A.laminarReynoldsLimit.value) return laminar;
  return Math.max(laminar, 0.3164 / Math.sqrt(Math.sqrt(re)));
}

/** Darcy–Weisbach Δp/L = f·(1/d)·ρv²/2, in bar per metre, from the friction factor and velocity. */
const darcyBarPerM = (f: number, diameterMm: number, densityKgM3: number, velocityMS: number): number =>
  (f * (1000 / diameterMm) * densityKgM3 * velocityMS * velocityMS) / 2 / 1e5;

/** Darcy–Weisbach Δp/L = f·(1/d)·ρv²/2, in bar per metre. */
export function pressureLossBarPerM(flowLpm: number, diameterMm: number, fluid: Fluid): number {
  const v = lineVelocityMS(flowLpm, diameterMm);
  const f = frictionFactor(reynoldsNumber(v, diameterMm, fluid.viscosityMm2S));
  return darcyBarPerM(f, diameterMm, fluid.densityKgM3, v);
}

/** Index of the smallest SAE J517 dash size whose nominal ID is at least the required diameter (the largest if none is). */
function hoseIndexFor(requiredMm: number): number {
  let i = 0;
  while (i < SAE_J517_HOSES.length - 1 && SAE_J517_HOSES[i].nominalIdMm < requiredMm) i++;
  return i;
}

/** Smallest SAE J517 dash size whose nominal ID is at least the required diameter. */
export function selectHose(requiredMm: number): { hose: HoseSize; inRange: boolean } {
  const hose = SAE_J517_HOSES[hoseIndexFor(requiredMm)];
  return { hose, inRange: hose.nominalIdMm >= requiredMm };
}

export interface LineSizing {
  /** index of the chosen size in SAE_J517_HOSES */
  hoseIndex: number;
  flowLpm: number;
  velocityLimitMS: number;
  requiredDiameterMm: number;
  dashSize: number;
  nominalInch: string;
  dn: number;
  innerDiameterMm: number;
  velocityMS: number;
  reynolds: number;
  regime: FlowRegime;
  frictionFactor: number;
  pressureLossBarPerM: number;
  lengthM: number;
  pressureLossBar: number;
  inRange: boolean;
}

/** Sizes a line for its largest flow and reports the loss at that flow. */
export function sizeLine(flowLpm: number, velocityLimitMS: number, lengthM: number, fluid: Fluid): LineSizing {
  const requiredDiameterMm = lineDiameterMm(flowLpm, velocityLimitMS);
  const hoseIndex = hoseIndexFor(requiredDiameterMm);
  const hose = SAE_J517_HOSES[hoseIndex];
  const inRange = hose.nominalIdMm >= requiredDiameterMm;
  const d = hose.nominalIdMm;
  const velocityMS = lineVelocityMS(flowLpm, d);
  const reynolds = reynoldsNumber(velocityMS, d, fluid.viscosityMm2S);
  const f = frictionFactor(reynolds);
  const perM = darcyBarPerM(f, d, fluid.densityKgM3, velocityMS);
  return {
    hoseIndex, flowLpm, velocityLimitMS, requiredDiameterMm, dashSize: hose.dash, nominalInch: hose.inch, dn: hose.dn,
    innerDiameterMm: d, velocityMS, reynolds, regime: flowRegime(reynolds), frictionFactor: f,
    pressureLossBarPerM: perM, lengthM, pressureLossBar: perM * lengthM, inRange,
  };
}

/** Loss in an already sized line at another flow. */
export const lineLossBar = (line: LineSizing, flowLpm: number, fluid: Fluid): number =>
  pressureLossBarPerM(flowLpm, line.innerDiameterMm, fluid) * line.lengthM;

/**
 * Loss per metre the sizing search budgets for a line: the larger of its actual loss and the
 * worst loss any smaller hose reaches at the velocity limit. Stepping up a hose size can lower
 * the actual loss, so the actual loss alone would let a faster axis pass with a smaller
 * cylinder; this bound only grows with flow and is never below the actual loss.
 */
export function budgetLossBarPerM(line: LineSizing, fluid: Fluid): number {
  const peaks = peakLossTable(line.velocityLimitMS, fluid);
  const index = line.hoseIndex;
  return Math.max(line.pressureLossBarPerM, index > 0 ? peaks[index - 1] : 0);
}

/**
 * The search's budgeted loss per metre for a line sized for `flowLpm` at `velocityLimitMS`:
 * the same number as budgetLossBarPerM(sizeLine(...)), without building the LineSizing.
 */
export function budgetLossBarPerMFor(flowLpm: number, velocityLimitMS: number, fluid: Fluid): number {
  const index = hoseIndexFor(lineDiameterMm(flowLpm, velocityLimitMS));
  const d = SAE_J517_HOSES[index].nominalIdMm;
  const velocityMS = lineVelocityMS(flowLpm, d);
  const perM = darcyBarPerM(frictionFactor(reynoldsNumber(velocityMS, d, fluid.viscosityMm2S)), d, fluid.densityKgM3, velocityMS);
  return Math.max(perM, index > 0 ? peakLossTable(velocityLimitMS, fluid)[index - 1] : 0);
}

interface PeakTable { velocity: number; viscosity: number; density: number; cumulative: number[] }
const PEAK_TABLES: PeakTable[] = [];

/** Running maximum, over the hose sizes in order, of the loss at the velocity limit. */
function peakLossTable(velocityMS: number, fluid: Fluid): number[] {
  for (const t of PEAK_TABLES) {
    if (t.velocity === velocityMS && t.viscosity === fluid.viscosityMm2S && t.density === fluid.densityKgM3) return t.cumulative;
  }
  const cumulative: number[] = [];
  let max = 0;
  for (const hose of SAE_J517_HOSES) {
    const flowAtLimit = velocityMS * ((Math.PI * hose.nominalIdMm * hose.nominalIdMm) / 4 / 1e6) * 60_000;
    max = Math.max(max, pressureLossBarPerM(flowAtLimit, hose.nominalIdMm, fluid));
    cumulative.push(max);
  }
  PEAK_TABLES.push({ velocity: velocityMS, viscosity: fluid.viscosityMm2S, density: fluid.densityKgM3, cumulative });
  return cumulative;
}
