/**
 * Leak-tight holding for a load held at rest longer than a few minutes: spool valves leak, and a
 * counterbalance valve is not meant to hold a load for long, so pilot-operated check valves
 * (poppets) close the cylinder ports (sizing contract; shared sources on holding a load without
 * drift: spool valves leak internally under pressure; a POCV added where a load is held long).
 */
import { A } from "./assumptions";
import type { CylinderCandidate } from "./cylinder";
import type { AxisLoads } from "./loads";
import type { Requirements } from "./requirements";

export type HoldingSide = "rod" | "cap" | "both";

export interface HoldingDesign {
  kind: "pilot-operated-check";
  side: HoldingSide;
  pilotRatio: number;
  /** pilot pressure that opens the valve on the loaded side with the outlet at tank pressure */
  pilotOpeningBar: number;
  /** the loaded side's pressure at the moment it opens (rod side: intensified by φ·p_pilot) */
  openingLoadSideBar: number;
  /** largest flow through a valve: its check on the way in, the opened poppet on the way out */
  flowLpm: number;
  reason: string;
}

/** The side holdingFor closes, or null where no leak-tight holding is asked (the same rule, for the search). */
export function holdingSide(req: Requirements, loads: AxisLoads): HoldingSide | null {
  if (req.holdMinutes <= A.leakTightHoldMinutes.value) return null;
  if (loads.overrunningStroke === "extend") return "rod";
  if (loads.overrunningStroke === "retract" || req.processForceN > 0) return "cap";
  return "both";
}

/**
 * Which port holds the load: the one the weight pressurises for a hanging or lifted load; the
 * cap end for a clamp held at its working force; both ends for an axis held in position against
 * forces either way (a bypassing piston seal would otherwise let it drift).
 */
export function holdingFor(
  req: Requirements,
  loads: AxisLoads,
  cyl: CylinderCandidate,
  pumpFlowLpm: number,
  /** flow into the cap end during a regenerative approach (through the cap-side check), if any */
  capInflowLpm = 0,
): HoldingDesign | null {
  if (holdingSide(req, loads) === null) return null;
  const R = A.pocvPilotRatio.value;
  const phi = cyl.areaRatio;
  const overrun = loads.overrunningStroke;
  if (overrun === "extend") {
    // Rod down: the weight hangs on the annulus. p1 = (F/A3)/(R − φ), p2 = F/A3 + φ·p1 (force balance).
    const loadBar = (10 * loads.gravityAlongAxisN) / cyl.annulusAreaMm2;
    const p1 = loadBar / (R - phi);
    return {
      kind: "pilot-operated-check",
      side: "rod",
      pilotRatio: R,
      pilotOpeningBar: p1,
      openingLoadSideBar: loadBar + phi * p1,
      flowLpm: pumpFlowLpm,
      reason: "the hanging load pressurises the rod end",
    };
  }
  if (overrun === "retract" || req.processForceN > 0) {
    // Weight on the cap end (rod up), or a clamp held at its force: p3 = (F/A1)/(R − 1/φ).
    const forceN = overrun === "retract" ? loads.gravityAlongAxisN : req.processForceN;
    const loadBar = (10 * forceN) / cyl.capAreaMm2;
    return {
      kind: "pilot-operated-check",
      side: "cap",
      pilotRatio: R,
      pilotOpeningBar: loadBar / (R - 1 / phi),
      openingLoadSideBar: loadBar,
      flowLpm: Math.max(pumpFlowLpm * phi, capInflowLpm),
      reason: overrun === "retract" ? "the lifted load pressurises the cap end" : "the clamping force is held on the cap end",
    };
  }
  return {
    kind: "pilot-operated-check",
    side: "both",
    pilotRatio: R,
    pilotOpeningBar: 0,
    openingLoadSideBar: 0,
    flowLpm: Math.max(pumpFlowLpm * phi, capInflowLpm),
    reason: "no weight or working force loads one end, so both ends are closed to hold the position against forces either way",
  };
}
