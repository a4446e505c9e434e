import { A } from "./assumptions";
import type { Requirements } from "./requirements";

type Mounting = Requirements["mounting"];

/** Euler's four cases: effective length L_K = K·L (Timoshenko & Gere) [M]. */
export const EULER_CASES: Readonly<Record<Mounting, { eulerCase: 1 | 2 | 3 | 4; k: number; description: string }>> = {
  "fixed-free": { eulerCase: 1, k: 2, description: "case 1, fixed – free" },
  "pinned-pinned": { eulerCase: 2, k: 1, description: "case 2, pinned – pinned (guided)" },
  "fixed-pinned": { eulerCase: 3, k: 0.7, description: "case 3, fixed – pinned (guided)" },
  "fixed-fixed": { eulerCase: 4, k: 0.5, description: "case 4, fixed – fixed (guided)" },
};

/**
 * Length from the mounting point to the rod-end connection at full extension (sources §3,
 * common practice): a rear pivot with a rod eye spans L₀ + 2·stroke; the fixed cases are taken
 * as a front flange, spanning stroke + the flange-to-rod-end allowance.
 */
export function bucklingLengthMm(mounting: Mounting, strokeMm: number): { lengthMm: number; rule: string } {
  if (mounting === "pinned-pinned") {
    return { lengthMm: A.pivotLengthAtZeroStrokeMm.value + 2 * strokeMm, rule: PIVOT_RULE };
  }
  return { lengthMm: strokeMm + A.flangeAllowanceMm.value, rule: FLANGE_RULE };
}

const PIVOT_RULE = `rear pivot + rod eye: L = L₀ + 2·s with L₀ = ${A.pivotLengthAtZeroStrokeMm.value} mm assumed`;
const FLANGE_RULE = `front flange: L = s + ${A.flangeAllowanceMm.value} mm flange-to-rod-end allowance`;

/** Trail formula for the effective length, per Euler case. */
export const EFFECTIVE_LENGTH_FORMULA: Readonly<Record<1 | 2 | 3 | 4, string>> = Object.fromEntries(
  Object.values(EULER_CASES).map((c) => [c.eulerCase, `L_K = K·L, Euler case ${c.eulerCase} (K = ${c.k})`]),
) as Record<1 | 2 | 3 | 4, string>;

/** Euler load F_K = π²·E·I / L_K² (N, with E in N/mm², I in mm⁴, L_K in mm). */
export const eulerLoadN = (elasticModulus: number, inertiaMm4: number, effectiveLengthMm: number): number =>
  (Math.PI * Math.PI * elasticModulus * inertiaMm4) / (effectiveLengthMm * effectiveLengthMm);

/** Second moment of area of a solid round rod, I = π·d⁴/64. */
export const rodInertiaMm4 = (rodMm: number): number => (Math.PI * rodMm * rodMm * rodMm * rodMm) / 64;

export interface BucklingResult {
  effectiveLengthMm: number;
  slenderness: number;
  regime: "Euler" | "Tetmajer";
  criticalLoadN: number;
  safetyFactor: number;
}

/** Critical load of a solid steel rod: Euler at or above the limit slenderness λ₀, Tetmajer below it. */
export function criticalLoadN(rodMm: number, effectiveLengthMm: number, slenderness: number): number {
  return slenderness >= A.limitSlenderness.value
    ? eulerLoadN(A.elasticModulus.value, rodInertiaMm4(rodMm), effectiveLengthMm)
    : (A.tetmajerA.value - A.tetmajerB.value * slenderness) * ((Math.PI * rodMm * rodMm) / 4);
}

/** Buckling of a solid steel rod: Euler above the limit slenderness, Tetmajer below it. */
export function checkBuckling(rodMm: number, lengthMm: number, k: number, compressiveN: number): BucklingResult {
  const effectiveLengthMm = k * lengthMm;
  const slenderness = (4 * effectiveLengthMm) / rodMm; // λ = L_K / i, i = d/4
  const critical = criticalLoadN(rodMm, effectiveLengthMm, slenderness);
  const safetyFactor = compressiveN > 0 ? critical / compressiveN : Number.POSITIVE_INFINITY;
  return { effectiveLengthMm, slenderness, regime: slenderness >= A.limitSlenderness.value ? "Euler" : "Tetmajer", criticalLoadN: critical, safetyFactor };
}
