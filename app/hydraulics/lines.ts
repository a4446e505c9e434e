import { A } from "./assumptions";
import { SAE_J517_HOSES, type HoseSize } from "./series";

export interface Fluid {
  viscosityMm2S: number;
  densityKgM3: number;
}

export const DEFAULT_FLUID: Fluid = { viscosityMm2S: A.viscosityMm2S.value, densityKgM3: A.densityKgM3.value };

/** d [mm] = √(4Q/(πv)) = 4.607·√(Q [L/min] / v [m/s]) — continuity [D]. */
export const lineDiameterMm = (flowLpm: number, velocityMS: number): number => Math.sqrt((4 * flowLpm) / (60_000 * Math.PI * velocityMS)) * 1000;

/** v [m/s] = Q / A. */
export const lineVelocityMS = (flowLpm: number, diameterMm: number): number => flowLpm / 60_000 / ((Math.PI * diameterMm * diameterMm) / 4 / 1e6);

/** Re = 1000·v [m/s]·d [mm] / ν [mm²/s]. */
export const reynoldsNumber = (velocityMS: number, diameterMm: number, viscosityMm2S: number): number => (1000 * velocityMS * diameterMm) / viscosityMm2S;

export type FlowRegime = "laminar" | "transitional" | "turbulent";

export const flowRegime = (re: number): FlowRegime => (re < A.laminarReynoldsLimit.value ? "laminar" : re < 4000 ? "transitional" : "turbulent");

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

/**
 * Sizes a line for its largest flow and reports the loss at that flow. `upsize` takes that many
 * dash sizes above the smallest that meets the velocity limit (the search does, where a larger
 * hose saves a cylinder size step).
 */
export function sizeLine(flowLpm: number, velocityLimitMS: number, lengthM: number, fluid: Fluid, upsize = 0): LineSizing {
  const requiredDiameterMm = lineDiameterMm(flowLpm, velocityLimitMS);
  const hoseIndex = Math.min(SAE_J517_HOSES.length - 1, hoseIndexFor(requiredDiameterMm) + upsize);
  const hose = SAE_J517_HOSES[hoseIndex];
  const inRange = hose.nominalIdMm >= requiredDiameterMm;
  const d = hose.nominalIdMm;
  const velocityMS = lineVelocityMS(flowLpm, d);
  const reynolds = reynoldsNumber(velocityMS, d, fluid.viscosityMm2S);
  const f = frictionFactor(reynolds);
  const perM = darcyBarPerM(f, d, fluid.densityKgM3, velocityMS);
  return {
    hoseIndex,
    flowLpm,
    velocityLimitMS,
    requiredDiameterMm,
    dashSize: hose.dash,
    nominalInch: hose.inch,
    dn: hose.dn,
    innerDiameterMm: d,
    velocityMS,
    reynolds,
    regime: flowRegime(reynolds),
    frictionFactor: f,
    pressureLossBarPerM: perM,
    lengthM,
    pressureLossBar: perM * lengthM,
    inRange,
  };
}

/** Loss in an already sized line at another flow. */
export const lineLossBar = (line: LineSizing, flowLpm: number, fluid: Fluid): number =>
  pressureLossBarPerM(flowLpm, line.innerDiameterMm, fluid) * line.lengthM;
