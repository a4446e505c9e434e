/**
 * Works out one bore/rod candidate completely (flows, pump, lines, pressures, valves,
 * buckling) and whether it meets every limit. The search in size.ts calls this per candidate.
 */
import { A } from "./assumptions";
import { bucklingColumn, checkBuckling, type BucklingColumn, type BucklingResult } from "./buckling";
import { workingLimitBar, type CylinderCandidate } from "./cylinder";
import { DEFAULT_FLUID, lineLossBar, sizeLine, type Fluid, type LineSizing } from "./lines";
import { accelerationForceN, axisLoads, extendForces, pressForceN, retractForces, type AxisLoads, type StrokeForces } from "./loads";
import { holdingSide } from "./holding";
import { phaseFlowLpm } from "./phases";
import { pressBypassDropBar, pressNeedsControl } from "./press-speed";
import { choosePump, type PumpChoice } from "./pump-choice";
import { motorSpeedRpm, pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import {
  capInflowLpm,
  regenerationRuledOut,
  regenerationVerdict,
  regenSwitchFits,
  regenSwitchSettingBar,
  regenToRetractSpeedRatio,
  rodAreaMm2,
  rodOutflowLpm,
  type RegenEnd,
} from "./regeneration";
import type { Requirements } from "./requirements";
import {
  brakingLoadPressureBar,
  cbvSettingBar,
  choosePilotRatio,
  cylinderInletBar,
  hydraulicForceN,
  pilotOpeningBar,
  reliefSettingBar,
  type CbvSide,
  type PilotRatioChoice,
} from "./valves";

export interface SizingContext {
  req: Requirements;
  loads: AxisLoads;
  speedRpm: number;
  fluid: Fluid;
  buckling: BucklingColumn;
  cbvSide: CbvSide | null;
  pilot: PilotRatioChoice | null;
  inertiaRatio: number;
  /** why no cylinder of this axis may extend regeneratively; null where each candidate is judged */
  regenRuledOut: string | null;
  /** hydraulic force each stroke needs at least, F/η with no losses (skips hopeless candidates) */
  minExtendHydraulicN: number;
  minRetractHydraulicN: number;
  /** the axis is one of several on a machine's pump: sized on a pump of one section (machine.ts) */
  singleSectionPump: boolean;
}

/** How an axis is sized: alone, or as one of a machine's axes, whose pump the machine chooses. */
export interface SizingOptions {
  singleSectionPump?: boolean;
}

export function sizingContext(req: Requirements, options: SizingOptions = {}): SizingContext {
  const loads = axisLoads(req);
  const eta = A.cylinderEfficiency.value;

  let cbvSide: CbvSide | null = null;
  let pilot: PilotRatioChoice | null = null;
  let inertiaRatio = 0;
  if (loads.overrunningStroke) {
    cbvSide = loads.overrunningStroke === "extend" ? "rod" : "cap";
    const loweringSpeed = loads.overrunningStroke === "extend" ? req.extendSpeedMmS : req.retractSpeedMmS;
    // (m·v/t) / (m·g·sin θ): the mass cancels, so the ratio is a property of the motion.
    const sin = Math.sin((loads.angleDeg * Math.PI) / 180);
    inertiaRatio = loweringSpeed / 1000 / req.accelTimeS / (A.gravity.value * sin);
    const processOnLowering = loads.overrunningStroke === "extend" && req.processForceN > 0;
    pilot = choosePilotRatio(inertiaRatio, processOnLowering);
  }

  const extAccel = accelerationForceN(req.massKg, req.extendSpeedMmS, req.accelTimeS);
  const retAccel = accelerationForceN(req.massKg, req.retractSpeedMmS, req.accelTimeS);
  const extendNeed = Math.max(extendForces(loads, extAccel).movingN, pressForceN(loads), 0);
  const retractNeed = Math.max(retractForces(loads, retAccel).movingN, 0);

  return {
    req,
    loads,
    speedRpm: motorSpeedRpm(req.supplyHz),
    fluid: DEFAULT_FLUID,
    buckling: bucklingColumn(req.mounting, req.mountingStyle, req.strokeMm),
    cbvSide,
    pilot,
    inertiaRatio,
    regenRuledOut: regenerationRuledOut(loads.overrunningStroke, holdingSide(req, loads), req.pumpType),
    minExtendHydraulicN: extendNeed / eta,
    minRetractHydraulicN: retractNeed / eta,
    singleSectionPump: options.singleSectionPump ?? false,
  };
}

export interface CbvEvaluation {
  side: CbvSide;
  loadPressureBar: number;
  /** load pressure while the lowering load is braked to a stop in decelTimeS */
  brakingPressureBar: number;
  loweringSpeedMmS: number;
  settingBar: number;
  ratio: number;
  areaTerm: number;
  pilotOpeningBar: number;
  /** pressure dropped across the valve while lowering at constant speed */
  loweringDropBar: number;
  flowLpm: number;
}

/** A regenerative approach on this candidate (rod end joined to the cap end). */
export interface RegenEvaluation {
  rodAreaMm2: number;
  /** flow into the cap end and out of the rod end during the approach, Q_p·A1/A_rod and Q_p·A3/A_rod */
  capInflowLpm: number;
  rodOutflowLpm: number;
  /** v_regen / v_retract = A3 / A_rod */
  speedRatioToRetract: number;
  /** what ends it: a pressure switch before a force at the end of the stroke, the limit switch where a pressing stroke starts, or the end of the extension */
  endsBy: RegenEnd;
  /** pressure switch setting where a pressure switch ends it, else null */
  switchBar: number | null;
  switchFits: boolean;
}

export interface Evaluation {
  cyl: CylinderCandidate;
  /** the approach (the whole extension without a pressing stroke) runs regeneratively; null at full area */
  regen: RegenEvaluation | null;
  /** why regeneration is or is not used, set by the search (evaluateWithRegenerationChoice) */
  regenReason: string;
  /** dash sizes the pressure, work and return hoses are above the velocity-limit size */
  hoseUpsize: number;
  /** highest pump working pressure this pair may need (buyer's limit and its rating) */
  workingLimitBar: number;
  flowExtendLpm: number;
  flowRetractLpm: number;
  /** cylinder flow while pressing; null without a pressing stroke */
  flowPressLpm: number | null;
  pumpRequiredLpm: number;
  requiredDisplacementCc: number;
  displacementCc: number;
  pumpInSeries: boolean;
  pumpFlowLpm: number;
  extendActualMmS: number;
  retractActualMmS: number;
  accelExtendN: number;
  accelRetractN: number;
  extend: StrokeForces;
  retract: StrokeForces;
  pressN: number;
  /** lines that carry pressure to or from the cylinder (the suction line is sized with the design) */
  lines: { pressure: LineSizing; capWork: LineSizing; rodWork: LineSizing; return: LineSizing };
  /** drop across the pressing-speed control's bypass valve in the approach; 0 without the control */
  pressBypassDropBar: number;
  extendSupplyLossBar: number;
  extendBackBar: number;
  retractSupplyLossBar: number;
  retractBackBar: number;
  cbv: CbvEvaluation | null;
  extendInletBar: number;
  extendMovingBar: number;
  extendPressBar: number;
  extendBar: number;
  retractInletBar: number;
  retractBar: number;
  extendSteadyBar: number;
  retractSteadyBar: number;
  workingBar: number;
  /** the relief: a fixed or double pump's 1.1 × working pressure, a compensated pump's set from its compensator */
  reliefBar: number;
  /** the pump this candidate gets, with its pressure and delivery in each phase */
  pump: PumpChoice;
  rodSidePeakBar: number;
  compressiveN: number;
  buckling: BucklingResult;
  pressureOk: boolean;
  cbvOk: boolean;
  bucklingOk: boolean;
}

/** While throttling, p_port1 = p_set − R·p_pilot; the drop is what is left above the back-pressure. */
function setLoweringDrop(cbv: CbvEvaluation, steadyInletBar: number, backBar: number): void {
  cbv.loweringDropBar = Math.max(0, cbv.settingBar - cbv.ratio * steadyInletBar - backBar);
}

/**
 * Evaluates one pair with the actual line losses: each line at the flow it carries in that
 * stroke, in the hose sized for its largest flow. The search and the design use the same numbers.
 * Where a pressing-speed control is fitted, the approach runs through its bypass valve; the
 * control is fitted unless the pump gives the pressing speed itself (a double pump's small
 * section close enough to it), which the pump choice decides, so the pair is first evaluated
 * without the bypass and again with it where the chosen pump needs the control.
 */
export function evaluateCandidate(ctx: SizingContext, cyl: CylinderCandidate, hoseUpsize = 0, regenerative = false): Evaluation {
  const plain = evaluateWithPumpSizes(ctx, cyl, hoseUpsize, regenerative, false);
  return needsPressControl(plain, ctx.speedRpm) ? evaluateWithPumpSizes(ctx, cyl, hoseUpsize, regenerative, true) : plain;
}

/** How the pump is fixed for one evaluation: its total displacement, or that a double pump is ruled out. */
interface PumpSize {
  displacementCc?: number;
  noDouble?: boolean;
}

/**
 * A double pump's sections are two ISO 3662 sizes whose total is rarely the size a fixed pump would
 * have, and its delivery sets the speeds, line losses and pressures: where the pump choice turns to
 * one, the pair is evaluated again at the sections' total. Should that turn the choice away from the
 * double pump, the pair is evaluated as though a double pump could not be built, so the numbers
 * always belong to the pump named.
 */
function evaluateWithPumpSizes(ctx: SizingContext, cyl: CylinderCandidate, hoseUpsize: number, regenerative: boolean, bypass: boolean): Evaluation {
  const first = evaluateOnce(ctx, cyl, hoseUpsize, regenerative, bypass, { noDouble: ctx.singleSectionPump });
  if (first.pump.type !== "double") return first;
  const totalCc = first.pump.displacementsCcRev.reduce((a, b) => a + b, 0);
  if (Math.abs(totalCc - first.displacementCc) < 1e-9) return first;
  const atSections = evaluateOnce(ctx, cyl, hoseUpsize, regenerative, bypass, { displacementCc: totalCc });
  return atSections.pump.type === "double" ? atSections : evaluateOnce(ctx, cyl, hoseUpsize, regenerative, bypass, { noDouble: true });
}

/** Whether this evaluation's pump offers more than the pressing speed asks (press-speed.ts). */
function needsPressControl(ev: Evaluation, speedRpm: number): boolean {
  if (ev.flowPressLpm === null) return false;
  const offers = ev.pump.type === "double" ? pumpDeliveryLpm(ev.pump.displacementsCcRev[1], speedRpm, A.volumetricEfficiency.value) : ev.pumpFlowLpm;
  return pressNeedsControl(offers, ev.flowPressLpm);
}

function evaluateOnce(
  ctx: SizingContext,
  cyl: CylinderCandidate,
  hoseUpsize: number,
  regenerative: boolean,
  bypassFitted: boolean,
  pumpSize: PumpSize = {},
): Evaluation {
  const { req, loads, fluid } = ctx;
  const eta = A.cylinderEfficiency.value;
  const etaV = A.volumetricEfficiency.value;
  const a1 = cyl.capAreaMm2;
  const a3 = cyl.annulusAreaMm2;
  const phi = cyl.areaRatio;
  const aRod = rodAreaMm2(cyl);
  const hasPressPhase = req.pressStrokeMm > 0 && req.pressSpeedMmS !== undefined;
  const flowPressLpm = hasPressPhase ? phaseFlowLpm(a1, req.pressSpeedMmS!) : null;

  // Flows for the requested speeds, Q = A·v (cylinder flows); a fixed pump must deliver the
  // larger. Regenerating, the pump fills only the rod's displacement during the approach
  // (A_rod·v), while the pressing stroke at full area still takes A1·v_press from it.
  const flowExtendLpm = phaseFlowLpm(a1, req.extendSpeedMmS);
  const flowRetractLpm = phaseFlowLpm(a3, req.retractSpeedMmS);
  const pumpRequiredLpm = regenerative
    ? Math.max(phaseFlowLpm(aRod, req.extendSpeedMmS), flowRetractLpm, flowPressLpm ?? 0)
    : Math.max(flowExtendLpm, flowRetractLpm);
  const needCc = requiredDisplacementCc(pumpRequiredLpm, ctx.speedRpm, etaV);
  const catalogue = selectDisplacementCc(needCc);
  const { inSeries } = catalogue;
  const displacementCc = pumpSize.displacementCc ?? catalogue.displacementCc;
  const qp = pumpDeliveryLpm(displacementCc, ctx.speedRpm, etaV);

  // Both strokes get the whole pump flow, so the actual speeds follow from it (regenerating, on the rod area).
  const extendActualMmS = (qp * 1000) / ((regenerative ? aRod : a1) * 0.06);
  const capInLpm = regenerative ? capInflowLpm(qp, a1, aRod) : 0;
  const rodOutLpm = regenerative ? rodOutflowLpm(qp, a3, aRod) : 0;
  const retractActualMmS = (qp * 1000) / (a3 * 0.06);
  const accelExtendN = accelerationForceN(req.massKg, extendActualMmS, req.accelTimeS);
  const accelRetractN = accelerationForceN(req.massKg, retractActualMmS, req.accelTimeS);
  const extend = extendForces(loads, accelExtendN);
  const retract = retractForces(loads, accelRetractN);
  const pressN = pressForceN(loads);

  // Lines, each sized for the largest flow it carries (retracting returns φ·Q_p from the cap; a
  // regenerative approach puts Q_p·A1/A_rod into the cap line and Q_p·A3/A_rod out of the rod line,
  // joined at the valve stack).
  const vp = A.pressureVelocityLimit.value;
  const lines = {
    pressure: sizeLine(qp, vp, A.pressureLineLengthM.value, fluid, hoseUpsize),
    capWork: sizeLine(Math.max(qp * phi, capInLpm), vp, A.workLineLengthM.value, fluid, hoseUpsize),
    rodWork: sizeLine(Math.max(qp, rodOutLpm), vp, A.workLineLengthM.value, fluid, hoseUpsize),
    return: sizeLine(qp * phi, A.returnVelocityLimit.value, A.returnLineLengthM.value, fluid, hoseUpsize),
  };
  const dcv = A.dcvPathDropBar.value;
  const filter = A.returnFilterDropBar.value;
  const check = A.cbvCheckDropBar.value;
  const pressureLine = lineLossBar(lines.pressure, qp, fluid);
  const capCheck = ctx.cbvSide === "cap" ? check : 0;
  // The bypass valve across the pressing-speed control sits in the cap line past the regeneration
  // join, so it carries the whole approach inflow to the cap end (Q_p, or the cap inflow).
  const bypassDropBar = bypassFitted ? pressBypassDropBar(regenerative ? capInLpm : qp) : 0;
  // Regenerating, the supply loss runs from the pump to the cap (the cap line at the cap inflow),
  // and the "back-pressure" is how far the rod side stands above the cap side: the rod line and
  // the regeneration valve at the rod outflow, then the cap line to the cap end.
  const capInLossBar = regenerative ? lineLossBar(lines.capWork, capInLpm, fluid) + capCheck + bypassDropBar : 0;
  const extendSupplyLossBar = regenerative
    ? pressureLine + dcv + capInLossBar
    : pressureLine + dcv + lineLossBar(lines.capWork, qp, fluid) + capCheck + bypassDropBar;
  const extendBackBar = regenerative
    ? lineLossBar(lines.rodWork, rodOutLpm, fluid) + dcv + capInLossBar
    : lineLossBar(lines.rodWork, qp / phi, fluid) + dcv + lineLossBar(lines.return, qp / phi, fluid) + filter;
  const retractSupplyLossBar = pressureLine + dcv + lineLossBar(lines.rodWork, qp, fluid) + (ctx.cbvSide === "rod" ? check : 0);
  const retractBackBar = lineLossBar(lines.capWork, qp * phi, fluid) + dcv + lineLossBar(lines.return, qp * phi, fluid) + filter;

  // Counterbalance on the side the load pressurises, set for the load while it is braked from
  // the actual lowering speed (its pilot opening still follows the load at rest).
  let cbv: CbvEvaluation | null = null;
  if (ctx.cbvSide && ctx.pilot) {
    const rodSide = ctx.cbvSide === "rod";
    const outletArea = rodSide ? a3 : a1;
    const loadPressureBar = (10 * loads.gravityAlongAxisN) / outletArea;
    const loweringMmS = rodSide ? extendActualMmS : retractActualMmS;
    const brakingPressureBar = brakingLoadPressureBar(loads.gravityAlongAxisN, req.massKg, loweringMmS, req.decelTimeS, outletArea);
    const settingBar = cbvSettingBar(brakingPressureBar);
    const areaTerm = rodSide ? phi : 1 / phi;
    cbv = {
      side: ctx.cbvSide,
      loadPressureBar,
      brakingPressureBar,
      loweringSpeedMmS: loweringMmS,
      settingBar,
      ratio: ctx.pilot.ratio,
      areaTerm,
      pilotOpeningBar: pilotOpeningBar(settingBar, loadPressureBar, ctx.pilot.ratio, areaTerm),
      loweringDropBar: 0,
      // The larger of the two flows it carries: lowering through 1→2 (Q_p/φ from the rod end,
      // φ·Q_p from the cap end) and lifting through its check 2→1 (the full pump flow).
      // A regenerative approach lifts through the cap-side check with the cap inflow.
      flowLpm: ctx.cbvSide === "rod" ? Math.max(qp, qp / phi) : Math.max(qp, qp * phi, capInLpm),
    };
  }
  const rodCbv = cbv && cbv.side === "rod" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;
  const capCbv = cbv && cbv.side === "cap" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;

  // Regenerating: p_cap·A1 − (p_cap + Δp)·A3 = 10·F_h, so p_cap = (10·F_h + Δp·A3) / A_rod.
  const extendInArea = regenerative ? aRod : a1;
  const extendInletBar = cylinderInletBar(hydraulicForceN(extend.movingN, eta), extendInArea, a3, extendBackBar, rodCbv);
  const retractInletBar = cylinderInletBar(hydraulicForceN(retract.movingN, eta), a3, a1, retractBackBar, capCbv);
  const extendMovingBar = extendInletBar + extendSupplyLossBar;
  // Without a pressing stroke the force is reached at (near) standstill: no flow, no line or valve losses.
  // With a pressing stroke the cylinder moves at pressing speed against the process force, so
  // the lines and valves pass the pressing flow and their losses count (small at low flow).
  // The valve and filter allowances hold at the pump flow; through the same orifices the drop
  // goes with the square of the flow (orifice equation, Δp ∝ Q²) [D].
  const orificeScale = flowPressLpm === null ? 0 : (flowPressLpm / qp) ** 2;
  const pressSupplyLossBar =
    flowPressLpm === null
      ? 0
      : lineLossBar(lines.pressure, flowPressLpm, fluid) +
        dcv * orificeScale +
        lineLossBar(lines.capWork, flowPressLpm, fluid) +
        (ctx.cbvSide === "cap" ? check : 0);
  const pressBackBar =
    flowPressLpm === null
      ? 0
      : lineLossBar(lines.rodWork, flowPressLpm / phi, fluid) +
        ((dcv + filter) * orificeScale) / phi ** 2 +
        lineLossBar(lines.return, flowPressLpm / phi, fluid);
  const extendPressBar = cylinderInletBar(hydraulicForceN(pressN, eta), a1, a3, pressBackBar, rodCbv) + pressSupplyLossBar;
  const extendBar = Math.max(extendMovingBar, extendPressBar);
  const retractBar = retractInletBar + retractSupplyLossBar;
  // Constant-speed pressures feed the heat balance.
  const extendSteadyInlet = cylinderInletBar(hydraulicForceN(extend.steadyN, eta), extendInArea, a3, extendBackBar, rodCbv);
  const retractSteadyInlet = cylinderInletBar(hydraulicForceN(retract.steadyN, eta), a3, a1, retractBackBar, capCbv);
  const extendSteadyBar = extendSteadyInlet + extendSupplyLossBar;
  const retractSteadyBar = retractSteadyInlet + retractSupplyLossBar;
  if (cbv) setLoweringDrop(cbv, cbv.side === "rod" ? extendSteadyInlet : retractSteadyInlet, cbv.side === "rod" ? extendBackBar : retractBackBar);
  const limitBar = workingLimitBar(req.maxPressureBar, cyl.ratedPressureBar, A.reliefMargin.value);
  const workingBar = Math.max(extendBar, retractBar);
  const fixedReliefBar = reliefSettingBar(workingBar);
  // The pump choice sets a compensated pump's relief from its compensator; others keep 1.1 × p_working.
  const pump = choosePump(
    {
      approachBar: extendMovingBar,
      retractBar,
      press: flowPressLpm !== null ? { bar: extendPressBar, flowLpm: flowPressLpm } : null,
      reliefBar: fixedReliefBar,
      workingBar,
      ratedBar: cyl.ratedPressureBar,
      requiredDisplacementCc: needCc,
      displacementCc,
      pumpFlowLpm: qp,
      speedRpm: ctx.speedRpm,
      noDouble: pumpSize.noDouble,
    },
    req.pumpType,
  );
  const reliefBar = pump.reliefBar;
  // Regenerating, the rod side stands Δp above the cap side; otherwise it carries the back-pressure.
  const rodSidePeakBar = Math.max(retractInletBar, cbv?.side === "rod" ? cbv.settingBar : regenerative ? extendInletBar + extendBackBar : extendBackBar);
  // What ends a regenerative approach: with a pressing stroke the limit switch where it starts (the
  // same position changes over to the pressing speed); with a force at the end of the stroke a
  // pressure switch once the pressure rises above the approach's; the force is built on the full area.
  const endsBy: RegenEnd = hasPressPhase ? "limit-switch" : req.processForceN > 0 ? "pressure-switch" : "end-of-extension";
  const switchBar = regenerative && endsBy === "pressure-switch" ? regenSwitchSettingBar(extendMovingBar) : null;
  const regen: RegenEvaluation | null = regenerative
    ? {
        rodAreaMm2: aRod,
        capInflowLpm: capInLpm,
        rodOutflowLpm: rodOutLpm,
        speedRatioToRetract: regenToRetractSpeedRatio(a3, aRod),
        endsBy,
        switchBar,
        switchFits: switchBar === null || regenSwitchFits(switchBar, extendPressBar),
      }
    : null;

  // The rod can be driven to the relief pressure against a stop: check that too.
  const stallN = (reliefBar * a1) / 10;
  const compressiveN = Math.max(extend.movingN, pressN, stallN);
  const buckling = checkBuckling(cyl.rodMm, ctx.buckling.lengthMm, ctx.buckling.k, compressiveN);

  return {
    cyl,
    regen,
    regenReason: "",
    hoseUpsize,
    workingLimitBar: limitBar,
    flowExtendLpm,
    flowRetractLpm,
    flowPressLpm,
    pumpRequiredLpm,
    requiredDisplacementCc: needCc,
    displacementCc,
    pumpInSeries: inSeries,
    pumpFlowLpm: qp,
    extendActualMmS,
    retractActualMmS,
    accelExtendN,
    accelRetractN,
    extend,
    retract,
    pressN,
    lines,
    pressBypassDropBar: bypassDropBar,
    extendSupplyLossBar,
    extendBackBar,
    retractSupplyLossBar,
    retractBackBar,
    cbv,
    extendInletBar,
    extendMovingBar,
    extendPressBar,
    extendBar,
    retractInletBar,
    retractBar,
    extendSteadyBar,
    retractSteadyBar,
    workingBar,
    reliefBar,
    pump,
    rodSidePeakBar,
    compressiveN,
    buckling,
    pressureOk: workingBar <= limitBar + 1e-9,
    cbvOk: !cbv || cbv.settingBar <= cyl.ratedPressureBar + 1e-9,
    bucklingOk: buckling.safetyFactor >= A.bucklingSafetyFactor.value,
  };
}

/**
 * Largest flow through a path of the valve stack: P→A/B and A/B→T at Q_p, φ·Q_p and Q_p/φ and, with
 * a regeneration valve on the same ISO 4401 interface, the cap inflow and rod outflow.
 */
export function valveStackFlowLpm(ev: Evaluation): number {
  const qp = ev.pumpFlowLpm;
  const phi = ev.cyl.areaRatio;
  return Math.max(qp, qp * phi, qp / phi, ev.regen?.capInflowLpm ?? 0, ev.regen?.rodOutflowLpm ?? 0);
}

/**
 * One candidate at full area and, where the axis allows it, with a regenerative approach; the
 * regenerative one is kept where it pays (regenerationVerdict), and the reason rides along.
 */
export function evaluateWithRegenerationChoice(ctx: SizingContext, cyl: CylinderCandidate, hoseUpsize = 0): Evaluation {
  const normal = evaluateCandidate(ctx, cyl, hoseUpsize);
  const regen = ctx.regenRuledOut === null ? evaluateCandidate(ctx, cyl, hoseUpsize, true) : null;
  const verdict = regenerationVerdict({
    ruledOut: ctx.regenRuledOut,
    normal: { displacementCc: normal.displacementCc, pumpType: normal.pump.type },
    regen: regen && {
      displacementCc: regen.displacementCc,
      speedRatioToRetract: regen.regen!.speedRatioToRetract,
      approachBar: regen.extendMovingBar,
      limitBar: regen.workingLimitBar,
      // It must meet every limit the full-area design meets: a higher approach pressure raises the
      // relief, and with it the stall thrust the rod must carry without buckling.
      passes: regen.pressureOk && regen.cbvOk && (regen.bucklingOk || !normal.bucklingOk),
      endsBy: regen.regen!.endsBy,
      switchOver: regen.regen!.switchBar !== null ? { switchBar: regen.regen!.switchBar, pressBar: regen.extendPressBar } : null,
    },
  });
  const chosen = verdict.use && regen ? regen : normal;
  chosen.regenReason = verdict.reason;
  return chosen;
}
