/**
 * Stroke-end cushioning and piston speed (shared sources on piston speed and cushioning): a
 * piston that reaches the end of its stroke faster than about 0.1 m/s, or with a heavy load,
 * needs cushions or a stop outside the cylinder [CP]; about 0.5 m/s is the usual ceiling for
 * elastomer seals [M]. The cushion absorbs E = ½·m·v² over its length s_c, a force F_c = E / s_c
 * (plus the weight where the load moves down), a pressure p_c = 10·F_c / A on the trapped side,
 * on top of the pressure still driven in (on the rod side φ times the cap pressure).
 */
import { A } from "./assumptions";
import type { CylinderCandidate } from "./cylinder";
import type { AxisLoads } from "./loads";

export interface StrokeEnd {
  /** piston speed arriving at this end */
  speedMmS: number;
  cushioned: boolean;
  energyJ: number;
  /** cushion pressure from braking the load alone, on the trapped side */
  cushionBar: number;
  /** cushion pressure plus what is still driven in, the peak the trapped side sees */
  peakBar: number;
}

export interface Cushioning {
  /** arriving fully extended: the rod side is trapped */
  extend: StrokeEnd;
  /** arriving fully retracted: the cap side is trapped */
  retract: StrokeEnd;
  cushionLengthMm: number;
}

function end(massKg: number, speedMmS: number, downN: number, trappedAreaMm2: number, drivenBar: number): StrokeEnd {
  const v = speedMmS / 1000;
  const energyJ = 0.5 * massKg * v * v;
  const forceN = energyJ / (A.cushionLengthMm.value / 1000) + downN;
  const cushionBar = (10 * forceN) / trappedAreaMm2;
  return { speedMmS, cushioned: speedMmS > A.cushionSpeedMmS.value, energyJ, cushionBar, peakBar: cushionBar + drivenBar };
}

/**
 * Cushions at the ends arrived at faster than the threshold. `extendInletBar` / `retractInletBar`
 * are the pump-side pressures at the cylinder while moving; the rod side also carries φ × the cap
 * pressure while the cap side pushes into the cushion.
 */
export function cushioningFor(
  massKg: number,
  loads: AxisLoads,
  cyl: CylinderCandidate,
  extendMmS: number,
  retractMmS: number,
  extendInletBar: number,
  retractInletBar: number,
): Cushioning {
  // The weight adds to the cushion force at the end the load moves down into.
  const downOnExtend = loads.extendGravitySign < 0 ? loads.gravityAlongAxisN : 0;
  const downOnRetract = loads.extendGravitySign > 0 ? loads.gravityAlongAxisN : 0;
  return {
    extend: end(massKg, extendMmS, downOnExtend, cyl.annulusAreaMm2, cyl.areaRatio * Math.max(0, extendInletBar)),
    retract: end(massKg, retractMmS, downOnRetract, cyl.capAreaMm2, Math.max(0, retractInletBar) / cyl.areaRatio),
    cushionLengthMm: A.cushionLengthMm.value,
  };
}
