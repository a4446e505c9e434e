/**
 * Regenerative extension: during the approach the rod end's outflow is led into the cap end
 * together with the pump flow. Both sides of the piston then see (about) the same pressure, so
 * only the rod area is effective: the rod extends faster on the same pump flow, with less force
 * (textbook regenerative-circuit relations). The approach ends, and a pressing force is built on
 * the full cap area, when a pressure switch sees the pressure rise as the tool meets the work.
 *
 * Units as in the rest of the engine: Q L/min, A mm², v m/s, p bar, F N.
 */
import { A } from "./assumptions";
import type { CylinderCandidate } from "./cylinder";
import { num } from "./format";
import type { PumpType } from "./pump-choice";

/**
 * What ends a regenerative approach: the limit switch where a pressing stroke starts, a pressure
 * switch where the force comes at the end of the stroke, or nothing before the end of an
 * extension that asks for no force.
 */
export type RegenEnd = "limit-switch" | "pressure-switch" | "end-of-extension";

/** Rod (piston-rod cross-section) area A_rod = A1 − A3, the area regeneration leaves effective. */
export const rodAreaMm2 = (cyl: Pick<CylinderCandidate, "capAreaMm2" | "annulusAreaMm2">): number => cyl.capAreaMm2 - cyl.annulusAreaMm2;

/** v_regen = Q_p / (A_rod · 0.06): the pump flow fills only the rod's displacement. */
export const regenerativeSpeedMS = (pumpFlowLpm: number, rodArea: number): number => pumpFlowLpm / (rodArea * 0.06);

/** F_regen = p · A_rod / 10: the same pressure on both sides leaves the rod area as net area. */
export const regenerativeForceN = (pressureBar: number, rodArea: number): number => (pressureBar * rodArea) / 10;

/** Flow into the cap end, Q_p · A1 / A_rod (continuity): the cap port and cap line carry this, not Q_p. */
export const capInflowLpm = (pumpFlowLpm: number, capArea: number, rodArea: number): number => (pumpFlowLpm * capArea) / rodArea;

/** Flow out of the rod end that joins the pump flow, Q_p · A3 / A_rod (continuity). */
export const rodOutflowLpm = (pumpFlowLpm: number, annulusArea: number, rodArea: number): number => (pumpFlowLpm * annulusArea) / rodArea;

/** v_regen / v_retract on the same pump flow = A3 / A_rod (equal at φ = 2). */
export const regenToRetractSpeedRatio = (annulusArea: number, rodArea: number): number => annulusArea / rodArea;

/**
 * Pressure switch that ends the regenerative approach: above every pressure the approach needs
 * (acceleration and losses included), 10–20 % and at least 10 bar, rounded up to 5 bar, so it
 * does not trip on the way (common practice, the same margin as a high-low pump's unloading valve).
 */
export function regenSwitchSettingBar(approachBar: number): number {
  const step = A.reliefRoundingBar.value;
  const raw = Math.max(approachBar * (1 + A.regenSwitchMarginRatio.value), approachBar + A.regenSwitchMarginMinBar.value);
  return Math.ceil(raw / step - 1e-9) * step;
}

/**
 * The switch must also sit clearly below the pressing pressure at full area, or the press
 * stroke could stay regenerative (at half the force or less) and never switch over.
 */
export const regenSwitchFits = (switchBar: number, pressBar: number): boolean => switchBar <= A.regenSwitchBelowPressRatio.value * pressBar + 1e-9;

/**
 * Reasons that hold for every cylinder of the axis. Regeneration is not used:
 * - on an overrunning extension (rod down): the rod-side counterbalance valve must meter the
 *   rod end's outflow to tank to hold the load back, and leading that outflow into the cap
 *   line, which also pilots the valve, is a circuit common practice avoids;
 * - where a pilot-operated check closes the rod end for leak-tight holding: the rod end's
 *   outflow would pass it into the line that pilots it, which this sizing does not verify;
 * - where the buyer asked for a double pump: both remedies serve the same fast approach, and
 *   the double pump also cuts the pressing power, so one is enough.
 */
export function regenerationRuledOut(
  overrunningStroke: "extend" | "retract" | null,
  holdingSide: "rod" | "cap" | "both" | null,
  askedPump: PumpType | undefined,
): string | null {
  if (overrunningStroke === "extend") {
    return "the load overruns on extension, so the rod-side counterbalance valve meters the rod end's outflow to tank to hold it back; leading that outflow into the cap line, which pilots the same valve, is avoided (common practice)";
  }
  if (holdingSide === "rod" || holdingSide === "both") {
    return "a pilot-operated check closes the rod end for leak-tight holding; the rod end's outflow would have to pass it into the line that pilots it, an arrangement this preliminary sizing does not rely on";
  }
  if (askedPump === "double") {
    return "a double (high-low) pump was asked for, and it serves the fast approach itself";
  }
  return null;
}

/** What one cylinder candidate offers with and without regeneration, for the verdict below. */
export interface RegenerationOptions {
  /** reason that holds for the whole axis, from regenerationRuledOut */
  ruledOut: string | null;
  /** the pump the engine would give this cylinder without regeneration */
  normal: { displacementCc: number; pumpType: PumpType };
  /** the same cylinder with a regenerative approach; null when ruled out */
  regen: {
    displacementCc: number;
    /** v_regen / v_retract on the same pump flow, A3 / A_rod */
    speedRatioToRetract: number;
    approachBar: number;
    limitBar: number;
    /** every limit the full-area design meets is met too (pressures, counterbalance rating, buckling at the higher relief) */
    passes: boolean;
    endsBy: RegenEnd;
    /** switch-over pressure and the pressing pressure it must stay below; null without a pressure switch */
    switchOver: { switchBar: number; pressBar: number } | null;
  } | null;
}

export interface RegenerationVerdict {
  use: boolean;
  reason: string;
}

const f1 = (x: number): string => num(x);
const SWITCHED_OFF: Record<RegenEnd, string> = {
  "pressure-switch": ", switched off by a pressure switch so the force is built on the full area",
  "limit-switch": ", switched off where the pressing stroke starts so it presses on the full area",
  "end-of-extension": "",
};

/**
 * Regeneration pays where it lets a smaller pump (at least one displacement size step) give the
 * asked approach speed with the approach force carried on the rod area within the working limit
 * (common practice: regeneration for a fast, low-force approach, the force then built at full
 * area). Where the engine would give a double pump, that pump is kept instead: it also keeps the
 * large flow off the pressing pressure, which regeneration cannot.
 */
export function regenerationVerdict(o: RegenerationOptions): RegenerationVerdict {
  if (o.ruledOut) return { use: false, reason: o.ruledOut };
  if (o.normal.pumpType === "double") {
    return {
      use: false,
      reason:
        "a double (high-low) pump already gives the fast approach and leaves only its small section at pressing pressure; regeneration would add a valve and a switch-over for a flow the pump delivers anyway (common practice: one remedy, the one that also cuts the pressing power)",
    };
  }
  const r = o.regen;
  if (!r) return { use: false, reason: "not considered for this axis" };
  if (r.approachBar > r.limitBar + 1e-9) {
    return {
      use: false,
      reason: `the approach force on the rod area alone would need ${f1(r.approachBar)} bar, above the ${f1(r.limitBar)} bar working limit`,
    };
  }
  if (r.switchOver && !regenSwitchFits(r.switchOver.switchBar, r.switchOver.pressBar)) {
    return {
      use: false,
      reason: `the pressure switch that ends it (${f1(r.switchOver.switchBar)} bar, above the ${f1(r.approachBar)} bar regenerative approach) cannot sit clearly below the ${f1(r.switchOver.pressBar)} bar pressing pressure`,
    };
  }
  if (!r.passes)
    return {
      use: false,
      reason:
        "its higher approach pressure would raise the relief so far that this cylinder no longer meets a limit it meets at full area (pressure rating or rod buckling under the stall thrust)",
    };
  // A thin rod leaves the pump sized for the return, and that flow on the small rod area would
  // drive the approach far faster than asked, with a cap inflow to match: regeneration suits a
  // cylinder whose rod area is near its annulus (φ near 2), where both strokes run alike. A
  // property of the cylinder, not of the speeds, so a slower approach never loses it.
  if (r.speedRatioToRetract > A.regenMaxSpeedRatio.value + 1e-9) {
    return {
      use: false,
      reason: `the rod is thin for it: on one pump flow the regenerative approach would run ${num(r.speedRatioToRetract, 2)} × as fast as the return (A3/A_rod), more than ${A.regenMaxSpeedRatio.value} ×; regeneration suits a cylinder whose rod area is near its annulus (area ratio near 2)`,
    };
  }
  if (r.displacementCc >= o.normal.displacementCc) {
    return {
      use: false,
      reason: `it would not make the pump smaller: the retract or pressing flow already needs the ${f1(o.normal.displacementCc)} cm³/rev pump`,
    };
  }
  return {
    use: true,
    reason: `the approach on the rod area needs ${f1(r.approachBar)} bar, within the ${f1(r.limitBar)} bar limit, and a ${f1(r.displacementCc)} cm³/rev pump gives the asked speed where full-area extension needs ${f1(o.normal.displacementCc)} cm³/rev (common practice: regeneration for a fast, low-force approach${SWITCHED_OFF[r.endsBy]})`,
  };
}
