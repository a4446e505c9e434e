/**
 * Works out one bore/rod candidate completely (flows, pump, lines, pressures, valves,
 * buckling) and whether it meets every limit. The search in size.ts calls this per candidate.
 */
import { A } from "./assumptions";
import { EULER_CASES, bucklingLengthMm, checkBuckling, criticalLoadN, type BucklingResult } from "./buckling";
import { cylinderSeriesFor, type CylinderCandidate } from "./cylinder";
import { DEFAULT_FLUID, budgetLossBarPerM, budgetLossBarPerMFor, lineLossBar, sizeLine, type Fluid, type LineSizing } from "./lines";
import {
  accelerationForceN, axisLoads, extendForces, pressForceN, retractForces, type AxisLoads, type StrokeForces,
} from "./loads";
import { displacementCcFor, motorSpeedRpm, pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import type { Requirements } from "./requirements";
import type { CylinderSeries } from "./series";
import {
  cbvSettingBar, choosePilotRatio, cylinderInletBar, cylinderInletBarCbv, hydraulicForceN, pilotOpeningBar, reliefSettingBar,
  type CbvSide, type PilotRatioChoice,
} from "./valves";

export interface SizingContext {
  req: Requirements;
  loads: AxisLoads;
  series: CylinderSeries;
  /** highest pump working pressure allowed: the buyer's limit, and low enough that relief stays within the rating */
  workingLimitBar: number;
  speedRpm: number;
  fluid: Fluid;
  buckling: { eulerCase: 1 | 2 | 3 | 4; k: number; description: string; lengthMm: number; rule: string };
  cbvSide: CbvSide | null;
  pilot: PilotRatioChoice | null;
  inertiaRatio: number;
  /** areas below these cannot reach the forces even with no losses (skips hopeless candidates) */
  minCapAreaMm2: number;
  minAnnulusAreaMm2: number;
  /** hydraulic force the extend stroke needs at least, F/η (no losses) */
  minExtendHydraulicN: number;
}

export function sizingContext(req: Requirements): SizingContext {
  const loads = axisLoads(req);
  const series = cylinderSeriesFor(req.maxPressureBar);
  const workingLimitBar = Math.min(req.maxPressureBar, series.ratedPressureBar / (1 + A.reliefMargin.value));
  const euler = EULER_CASES[req.mounting];
  const length = bucklingLengthMm(req.mounting, req.strokeMm);
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
    req, loads, series, workingLimitBar, speedRpm: motorSpeedRpm(req.supplyHz), fluid: DEFAULT_FLUID,
    buckling: { eulerCase: euler.eulerCase, k: euler.k, description: euler.description, lengthMm: length.lengthMm, rule: length.rule },
    cbvSide, pilot, inertiaRatio,
    minCapAreaMm2: (10 * extendNeed) / eta / workingLimitBar,
    minAnnulusAreaMm2: (10 * retractNeed) / eta / workingLimitBar,
    minExtendHydraulicN: extendNeed / eta,
  };
}

export interface CbvEvaluation {
  side: CbvSide;
  loadPressureBar: number;
  settingBar: number;
  ratio: number;
  areaTerm: number;
  pilotOpeningBar: number;
  /** pressure dropped across the valve while lowering at constant speed */
  loweringDropBar: number;
  flowLpm: number;
}

export interface Evaluation {
  cyl: CylinderCandidate;
  flowExtendLpm: number;
  flowRetractLpm: number;
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
  reliefBar: number;
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
 * Loss in a line at a flow. With `budget` the search's monotone bound is used instead (see
 * budgetLossBarPerM), at the line's sizing flow, which is at least the flow in question.
 */
function lineLoss(line: LineSizing, flowLpm: number, fluid: Fluid, budget: boolean): number {
  return budget ? budgetLossBarPerM(line, fluid) * line.lengthM : lineLossBar(line, flowLpm, fluid);
}

/**
 * Evaluates one pair. `budget` = true is the search mode: line losses are bounded from above so
 * that more flow never makes a pair look better; false gives the actual losses for reporting.
 */
export function evaluateCandidate(ctx: SizingContext, cyl: CylinderCandidate, budget = false): Evaluation {
  const { req, loads, fluid } = ctx;
  const eta = A.cylinderEfficiency.value;
  const etaV = A.volumetricEfficiency.value;
  const a1 = cyl.capAreaMm2;
  const a3 = cyl.annulusAreaMm2;
  const phi = cyl.areaRatio;

  // Flows for the requested speeds, Q = A·v; a fixed pump must deliver the larger.
  const flowExtendLpm = (a1 * req.extendSpeedMmS * 0.06) / 1000;
  const flowRetractLpm = (a3 * req.retractSpeedMmS * 0.06) / 1000;
  const pumpRequiredLpm = Math.max(flowExtendLpm, flowRetractLpm);
  const needCc = requiredDisplacementCc(pumpRequiredLpm, ctx.speedRpm, etaV);
  const { displacementCc, inSeries } = selectDisplacementCc(needCc);
  const qp = pumpDeliveryLpm(displacementCc, ctx.speedRpm, etaV);

  // Both strokes get the whole pump flow, so the actual speeds follow from it.
  const extendActualMmS = (qp * 1000) / (a1 * 0.06);
  const retractActualMmS = (qp * 1000) / (a3 * 0.06);
  const accelExtendN = accelerationForceN(req.massKg, extendActualMmS, req.accelTimeS);
  const accelRetractN = accelerationForceN(req.massKg, retractActualMmS, req.accelTimeS);
  const extend = extendForces(loads, accelExtendN);
  const retract = retractForces(loads, accelRetractN);
  const pressN = pressForceN(loads);

  // Lines, each sized for the largest flow it carries (retracting returns φ·Q_p from the cap).
  const vp = A.pressureVelocityLimit.value;
  const lines = {
    pressure: sizeLine(qp, vp, A.pressureLineLengthM.value, fluid),
    capWork: sizeLine(qp * phi, vp, A.workLineLengthM.value, fluid),
    rodWork: sizeLine(qp, vp, A.workLineLengthM.value, fluid),
    return: sizeLine(qp * phi, A.returnVelocityLimit.value, A.returnLineLengthM.value, fluid),
  };
  const dcv = A.dcvPathDropBar.value;
  const filter = A.returnFilterDropBar.value;
  const check = A.cbvCheckDropBar.value;
  const pressureLine = lineLoss(lines.pressure, qp, fluid, budget);
  const extendSupplyLossBar =
    pressureLine + dcv + lineLoss(lines.capWork, qp, fluid, budget) + (ctx.cbvSide === "cap" ? check : 0);
  const extendBackBar =
    lineLoss(lines.rodWork, qp / phi, fluid, budget) + dcv + lineLoss(lines.return, qp / phi, fluid, budget) + filter;
  const retractSupplyLossBar =
    pressureLine + dcv + lineLoss(lines.rodWork, qp, fluid, budget) + (ctx.cbvSide === "rod" ? check : 0);
  const retractBackBar =
    lineLoss(lines.capWork, qp * phi, fluid, budget) + dcv + lineLoss(lines.return, qp * phi, fluid, budget) + filter;

  // Counterbalance on the side the load pressurises; its setting is from the static load.
  let cbv: CbvEvaluation | null = null;
  if (ctx.cbvSide && ctx.pilot) {
    const outletArea = ctx.cbvSide === "rod" ? a3 : a1;
    const loadPressureBar = (10 * loads.gravityAlongAxisN) / outletArea;
    const settingBar = cbvSettingBar(loadPressureBar);
    const areaTerm = ctx.cbvSide === "rod" ? phi : 1 / phi;
    cbv = {
      side: ctx.cbvSide, loadPressureBar, settingBar, ratio: ctx.pilot.ratio, areaTerm,
      pilotOpeningBar: pilotOpeningBar(settingBar, loadPressureBar, ctx.pilot.ratio, areaTerm),
      loweringDropBar: 0,
      flowLpm: ctx.cbvSide === "rod" ? qp / phi : qp * phi,
    };
  }
  const rodCbv = cbv && cbv.side === "rod" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;
  const capCbv = cbv && cbv.side === "cap" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;

  let extendInletBar = cylinderInletBar(hydraulicForceN(extend.movingN, eta), a1, a3, extendBackBar, rodCbv);
  let retractInletBar = cylinderInletBar(hydraulicForceN(retract.movingN, eta), a3, a1, retractBackBar, capCbv);
  if (budget) {
    // Search only: on a lowering stroke do not credit the load for pushing the oil out through
    // a wide-open valve, so a heavier load never makes a pair look better.
    if (rodCbv) extendInletBar = Math.max(extendInletBar, cylinderInletBar(0, a1, a3, extendBackBar));
    if (capCbv) retractInletBar = Math.max(retractInletBar, cylinderInletBar(0, a3, a1, retractBackBar));
  }
  const extendMovingBar = extendInletBar + extendSupplyLossBar;
  // Pressing happens at (near) standstill: no flow, so no line or valve losses.
  const extendPressBar = cylinderInletBar(hydraulicForceN(pressN, eta), a1, a3, 0, rodCbv);
  const extendBar = Math.max(extendMovingBar, extendPressBar);
  const retractBar = retractInletBar + retractSupplyLossBar;
  // Constant-speed pressures feed only the heat balance, which the search does not need.
  let extendSteadyBar = 0;
  let retractSteadyBar = 0;
  if (!budget) {
    const extendSteadyInlet = cylinderInletBar(hydraulicForceN(extend.steadyN, eta), a1, a3, extendBackBar, rodCbv);
    const retractSteadyInlet = cylinderInletBar(hydraulicForceN(retract.steadyN, eta), a3, a1, retractBackBar, capCbv);
    extendSteadyBar = extendSteadyInlet + extendSupplyLossBar;
    retractSteadyBar = retractSteadyInlet + retractSupplyLossBar;
    if (cbv) setLoweringDrop(cbv, cbv.side === "rod" ? extendSteadyInlet : retractSteadyInlet, cbv.side === "rod" ? extendBackBar : retractBackBar);
  }
  const workingBar = Math.max(extendBar, retractBar);
  const reliefBar = reliefSettingBar(workingBar);
  const rodSidePeakBar = Math.max(retractInletBar, cbv?.side === "rod" ? cbv.settingBar : extendBackBar);

  // The rod can be driven to the relief pressure against a stop: check that too.
  const stallN = (reliefBar * a1) / 10;
  const compressiveN = Math.max(extend.movingN, pressN, stallN);
  const buckling = checkBuckling(cyl.rodMm, ctx.buckling.lengthMm, ctx.buckling.k, compressiveN);

  return {
    cyl, flowExtendLpm, flowRetractLpm, pumpRequiredLpm, requiredDisplacementCc: needCc, displacementCc,
    pumpInSeries: inSeries, pumpFlowLpm: qp, extendActualMmS, retractActualMmS, accelExtendN, accelRetractN,
    extend, retract, pressN, lines, extendSupplyLossBar, extendBackBar, retractSupplyLossBar, retractBackBar,
    cbv, extendInletBar, extendMovingBar, extendPressBar, extendBar, retractInletBar, retractBar,
    extendSteadyBar, retractSteadyBar, workingBar, reliefBar, rodSidePeakBar, compressiveN, buckling,
    pressureOk: workingBar <= ctx.workingLimitBar + 1e-9,
    cbvOk: !cbv || cbv.settingBar <= ctx.series.ratedPressureBar + 1e-9,
    bucklingOk: buckling.safetyFactor >= A.bucklingSafetyFactor.value,
  };
}

// ---- The search's check ----------------------------------------------------------------------

export const SEARCH_PRESSURE_OK = 1;
export const SEARCH_CBV_OK = 2;
export const SEARCH_BUCKLING_OK = 4;

/**
 * What evaluateCandidate(ctx, cyl, true) decides, as flags (SEARCH_*_OK), with the same
 * arithmetic in the same order but none of the objects: the search tries several pairs per
 * design and keeps only the answer. A unit test holds the two to the same flags.
 */
export function searchCheck(ctx: SizingContext, cyl: CylinderCandidate): number {
  const { req, loads, fluid } = ctx;
  const eta = A.cylinderEfficiency.value;
  const etaV = A.volumetricEfficiency.value;
  const a1 = cyl.capAreaMm2;
  const a3 = cyl.annulusAreaMm2;
  const phi = cyl.areaRatio;

  const flowExtendLpm = (a1 * req.extendSpeedMmS * 0.06) / 1000;
  const flowRetractLpm = (a3 * req.retractSpeedMmS * 0.06) / 1000;
  const needCc = requiredDisplacementCc(Math.max(flowExtendLpm, flowRetractLpm), ctx.speedRpm, etaV);
  const qp = pumpDeliveryLpm(displacementCcFor(needCc), ctx.speedRpm, etaV);
  const extendActualMmS = (qp * 1000) / (a1 * 0.06);
  const retractActualMmS = (qp * 1000) / (a3 * 0.06);
  const gravityN = loads.extendGravitySign * loads.gravityAlongAxisN;
  const extendMovingN = loads.frictionN + gravityN + accelerationForceN(req.massKg, extendActualMmS, req.accelTimeS);
  const retractMovingN = loads.frictionN - gravityN + accelerationForceN(req.massKg, retractActualMmS, req.accelTimeS);
  const pressN = pressForceN(loads);

  // Budgeted line losses: the pressure and rod lines are sized for Q_p, the cap and return lines for φ·Q_p.
  const vp = A.pressureVelocityLimit.value;
  const atPump = budgetLossBarPerMFor(qp, vp, fluid);
  const pressureLine = atPump * A.pressureLineLengthM.value;
  const rodWork = atPump * A.workLineLengthM.value;
  const capWork = budgetLossBarPerMFor(qp * phi, vp, fluid) * A.workLineLengthM.value;
  const returnLine = budgetLossBarPerMFor(qp * phi, A.returnVelocityLimit.value, fluid) * A.returnLineLengthM.value;
  const dcv = A.dcvPathDropBar.value;
  const filter = A.returnFilterDropBar.value;
  const check = A.cbvCheckDropBar.value;
  const extendSupplyLossBar = pressureLine + dcv + capWork + (ctx.cbvSide === "cap" ? check : 0);
  const extendBackBar = rodWork + dcv + returnLine + filter;
  const retractSupplyLossBar = pressureLine + dcv + rodWork + (ctx.cbvSide === "rod" ? check : 0);
  const retractBackBar = capWork + dcv + returnLine + filter;

  let flags = SEARCH_CBV_OK;
  let extendInletBar: number;
  let retractInletBar: number;
  let extendPressBar: number;
  const extendH = hydraulicForceN(extendMovingN, eta);
  const retractH = hydraulicForceN(retractMovingN, eta);
  const pressH = hydraulicForceN(pressN, eta);
  if (ctx.cbvSide && ctx.pilot) {
    const rod = ctx.cbvSide === "rod";
    const settingBar = cbvSettingBar((10 * loads.gravityAlongAxisN) / (rod ? a3 : a1));
    const ratio = ctx.pilot.ratio;
    if (!(settingBar <= ctx.series.ratedPressureBar + 1e-9)) flags = 0;
    if (rod) {
      extendInletBar = Math.max(cylinderInletBarCbv(extendH, a1, a3, extendBackBar, settingBar, ratio), cylinderInletBar(0, a1, a3, extendBackBar));
      retractInletBar = cylinderInletBar(retractH, a3, a1, retractBackBar);
      extendPressBar = cylinderInletBarCbv(pressH, a1, a3, 0, settingBar, ratio);
    } else {
      extendInletBar = cylinderInletBar(extendH, a1, a3, extendBackBar);
      retractInletBar = Math.max(cylinderInletBarCbv(retractH, a3, a1, retractBackBar, settingBar, ratio), cylinderInletBar(0, a3, a1, retractBackBar));
      extendPressBar = cylinderInletBar(pressH, a1, a3, 0);
    }
  } else {
    extendInletBar = cylinderInletBar(extendH, a1, a3, extendBackBar);
    retractInletBar = cylinderInletBar(retractH, a3, a1, retractBackBar);
    extendPressBar = cylinderInletBar(pressH, a1, a3, 0);
  }
  const extendBar = Math.max(extendInletBar + extendSupplyLossBar, extendPressBar);
  const workingBar = Math.max(extendBar, retractInletBar + retractSupplyLossBar);
  if (workingBar <= ctx.workingLimitBar + 1e-9) flags |= SEARCH_PRESSURE_OK;

  const compressiveN = Math.max(extendMovingN, pressN, (reliefSettingBar(workingBar) * a1) / 10);
  const effectiveLengthMm = ctx.buckling.k * ctx.buckling.lengthMm;
  const critical = criticalLoadN(cyl.rodMm, effectiveLengthMm, (4 * effectiveLengthMm) / cyl.rodMm);
  const safetyFactor = compressiveN > 0 ? critical / compressiveN : Number.POSITIVE_INFINITY;
  if (safetyFactor >= A.bucklingSafetyFactor.value) flags |= SEARCH_BUCKLING_OK;
  return flags;
}
