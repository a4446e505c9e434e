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

type MountingStyle = NonNullable<Requirements["mountingStyle"]>;

const FRONT_RULE = (style: string) =>
  `${style}: L = s + e, e = ${A.flangeAllowanceMm.value} mm from the mounting face to the rod-end connection, retracted (assumed)`;
const REAR_RULE = (style: string) => `${style}: L = L₀ + 2·s, L₀ = ${A.pivotLengthAtZeroStrokeMm.value} mm mounting point to rod end at zero stroke (assumed)`;

/** Where the body is held: at the front (the column is the stroke plus the head) or at the rear (the whole cylinder). */
const STYLE_COLUMN: Readonly<Record<MountingStyle, { front: boolean; pivoted: boolean; name: string }>> = {
  "front-flange": { front: true, pivoted: false, name: "front flange" },
  // feet hold the body along its length: the rod is free from the head on, as with a front flange
  foot: { front: true, pivoted: false, name: "feet" },
  "rear-flange": { front: false, pivoted: false, name: "rear flange" },
  // a trunnion's place on the body is not asked: the rear trunnion, the longest, is taken
  trunnion: { front: false, pivoted: true, name: "trunnion, taken at the rear" },
  clevis: { front: false, pivoted: true, name: "rear clevis" },
};

export interface BucklingColumn {
  eulerCase: 1 | 2 | 3 | 4;
  k: number;
  description: string;
  /** mounting point to rod-end connection at full extension */
  lengthMm: number;
  rule: string;
  /** the body's mounting style was not given, so the longest free length was taken */
  styleAssumed: boolean;
  /** a pivoted body with an unguided rod end: a mechanism, not a column */
  unstable: boolean;
}

/**
 * The rod's free buckling length from how the body is held (mountingStyle) and how the rod end
 * is held (the end conditions in `mounting`), per the shared sources' buckling-length-by-mounting
 * rules [CP]/[D]: front mountings span s + e, rear ones L₀ + 2·s; a fixed body takes K from the
 * rod end (free 2, pinned and guided 0.7, fixed and guided 0.5), a pivoted body K = 1. Without a
 * style, the longest length the end conditions allow is taken: a rear mounting.
 */
export function bucklingColumn(mounting: Mounting, style: MountingStyle | undefined, strokeMm: number): BucklingColumn {
  const pivotedEnds = mounting === "pinned-pinned";
  const chosen = style ?? (pivotedEnds ? "clevis" : "rear-flange");
  const column = STYLE_COLUMN[chosen];
  const lengthMm = column.front ? strokeMm + A.flangeAllowanceMm.value : A.pivotLengthAtZeroStrokeMm.value + 2 * strokeMm;
  const rule = (column.front ? FRONT_RULE : REAR_RULE)(style ? column.name : `${column.name} assumed (no mounting style given: the longest free length)`);
  const rodFree = mounting === "fixed-free";
  if (column.pivoted) {
    // A pivoted body: the rod end must be pinned and guided (case 2); fixed is taken as pinned (safe side).
    const c = rodFree ? EULER_CASES["fixed-free"] : EULER_CASES["pinned-pinned"];
    return { ...c, lengthMm, rule, styleAssumed: style === undefined, unstable: rodFree };
  }
  // A fixed body: a rod end the buyer called pinned at both ends is pinned and guided (case 3).
  const c = EULER_CASES[pivotedEnds ? "fixed-pinned" : mounting];
  return { ...c, lengthMm, rule, styleAssumed: style === undefined, unstable: false };
}

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
