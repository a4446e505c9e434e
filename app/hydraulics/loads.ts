import { A } from "./assumptions";
import type { Requirements } from "./requirements";

export type Stroke = "extend" | "retract";

/** Forces along the axis that do not depend on speed. */
export interface AxisLoads {
  /** angle of the axis above horizontal */
  angleDeg: number;
  /** weight component along the axis, m·g·sin θ */
  gravityAlongAxisN: number;
  /** weight component across the guides, m·g·cos θ */
  normalForceN: number;
  /** guide friction, μ·m·g·cos θ; resists motion on both strokes */
  frictionN: number;
  processForceN: number;
  /** +1 when gravity resists extension (rod up), −1 when it helps (rod down), 0 horizontal */
  extendGravitySign: -1 | 0 | 1;
  /** the stroke on which the load moves down and can run away, if any */
  overrunningStroke: Stroke | null;
}

export function axisAngleDeg(req: Requirements): number {
  if (req.orientation === "horizontal") return 0;
  if (req.orientation === "vertical") return 90;
  return req.inclineDeg ?? 0;
}

export function axisLoads(req: Requirements): AxisLoads {
  const angleDeg = axisAngleDeg(req);
  const rad = (angleDeg * Math.PI) / 180;
  // Exact values at 0° and 90° so a vertical axis carries no guide load at all.
  const sin = angleDeg === 90 ? 1 : Math.sin(rad);
  const cos = angleDeg === 90 ? 0 : Math.cos(rad);
  const weightN = req.massKg * A.gravity.value;
  const extendGravitySign: -1 | 0 | 1 = req.orientation === "horizontal" ? 0 : req.rodDirection === "down" ? -1 : 1;
  const gravityAlongAxisN = req.orientation === "horizontal" ? 0 : weightN * sin;
  const frictionN = req.frictionCoefficient * weightN * cos;
  // The load overruns only where its weight along the axis beats the guide friction; a massless
  // rod or a shallow incline (tan θ ≤ μ) stays put without a counterbalance valve (statics [D]).
  const overrunningStroke: Stroke | null = extendGravitySign === 0 || gravityAlongAxisN <= frictionN ? null : extendGravitySign < 0 ? "extend" : "retract";
  return {
    angleDeg,
    gravityAlongAxisN,
    normalForceN: weightN * cos,
    frictionN,
    processForceN: req.processForceN,
    extendGravitySign,
    overrunningStroke,
  };
}

/** Force to bring the mass to speed in the acceleration time: F = m·v/t. */
export function accelerationForceN(massKg: number, speedMmS: number, accelTimeS: number): number {
  return (massKg * speedMmS) / 1000 / accelTimeS;
}

/** Force the cylinder must exert in the direction of motion; negative when the load pulls. */
export interface StrokeForces {
  /** at constant speed: friction ± gravity */
  steadyN: number;
  /** while accelerating: steady + m·v/t */
  movingN: number;
}

export function extendForces(loads: AxisLoads, accelN: number): StrokeForces {
  const steadyN = loads.frictionN + loads.extendGravitySign * loads.gravityAlongAxisN;
  return { steadyN, movingN: steadyN + accelN };
}

export function retractForces(loads: AxisLoads, accelN: number): StrokeForces {
  const steadyN = loads.frictionN - loads.extendGravitySign * loads.gravityAlongAxisN;
  return { steadyN, movingN: steadyN + accelN };
}

/**
 * Force at the end of the extend stroke while pressing: the process force acts once the
 * axis has stopped accelerating, so it is not added to the acceleration force. A weight that
 * resists extension adds to it; a weight that helps (rod down) is not counted, since the
 * counterbalance valve may be holding it back and the press force is the cylinder's to give.
 */
export function pressForceN(loads: AxisLoads): number {
  return loads.processForceN + loads.frictionN + Math.max(0, loads.extendGravitySign * loads.gravityAlongAxisN);
}
