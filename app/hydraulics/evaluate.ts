/**
 * Works out one bore/rod candidate completely (flows, pump, lines, pressures, valves,
 * buckling) and whether it meets every limit. The search in size.ts calls this per candidate.
 */
import { A } from "./assumptions";
import { bucklingColumn, checkBuckling, type BucklingColumn, type BucklingResult } from "./buckling";
import { workingLimitBar, type CylinderCandidate } from "./cylinder";
import { DEFAULT_FLUID, lineLossBar, sizeLine, type Fluid, type LineSizing } from "./lines";
import {
  accelerationForceN, axisLoads, extendForces, pressForceN, retractForces, type AxisLoads, type StrokeForces,
} from "./loads";
import { phaseFlowLpm } from "./phases";
import { motorSpeedRpm, pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import type { Requirements } from "./requirements";
import {
  brakingLoadPressureBar, cbvSettingBar, choosePilotRatio, cylinderInletBar, hydraulicForceN, pilotOpeningBar, reliefSettingBar,
  type CbvSide, type PilotRatioChoice,
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
  /** hydraulic force each stroke needs at least, F/η with no losses (skips hopeless candidates) */
  minExtendHydraulicN: number;
  minRetractHydraulicN: number;
}

export function sizingContext(req: Requirements): SizingContext {
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
    req, loads, speedRpm: motorSpeedRpm(req.supplyHz), fluid: DEFAULT_FLUID,
    buckling: bucklingColumn(req.mounting, req.mountingStyle, req.strokeMm),
    cbvSide, pilot, inertiaRatio,
    minExtendHydraulicN: extendNeed / eta,
    minRetractHydraulicN: retractNeed / eta,
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

export interface Evaluation {
  cyl: CylinderCandidate;
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
 * Evaluates one pair with the actual line losses: each line at the flow it carries in that
 * stroke, in the hose sized for its largest flow. The search and the design use the same numbers.
 */
export function evaluateCandidate(ctx: SizingContext, cyl: CylinderCandidate, hoseUpsize = 0): Evaluation {
  const { req, loads, fluid } = ctx;
  const eta = A.cylinderEfficiency.value;
  const etaV = A.volumetricEfficiency.value;
  const a1 = cyl.capAreaMm2;
  const a3 = cyl.annulusAreaMm2;
  const phi = cyl.areaRatio;

  // Flows for the requested speeds, Q = A·v; a fixed pump must deliver the larger.
  const flowExtendLpm = phaseFlowLpm(a1, req.extendSpeedMmS);
  const flowRetractLpm = phaseFlowLpm(a3, req.retractSpeedMmS);
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
    pressure: sizeLine(qp, vp, A.pressureLineLengthM.value, fluid, hoseUpsize),
    capWork: sizeLine(qp * phi, vp, A.workLineLengthM.value, fluid, hoseUpsize),
    rodWork: sizeLine(qp, vp, A.workLineLengthM.value, fluid, hoseUpsize),
    return: sizeLine(qp * phi, A.returnVelocityLimit.value, A.returnLineLengthM.value, fluid, hoseUpsize),
  };
  const dcv = A.dcvPathDropBar.value;
  const filter = A.returnFilterDropBar.value;
  const check = A.cbvCheckDropBar.value;
  const pressureLine = lineLossBar(lines.pressure, qp, fluid);
  const extendSupplyLossBar =
    pressureLine + dcv + lineLossBar(lines.capWork, qp, fluid) + (ctx.cbvSide === "cap" ? check : 0);
  const extendBackBar =
    lineLossBar(lines.rodWork, qp / phi, fluid) + dcv + lineLossBar(lines.return, qp / phi, fluid) + filter;
  const retractSupplyLossBar =
    pressureLine + dcv + lineLossBar(lines.rodWork, qp, fluid) + (ctx.cbvSide === "rod" ? check : 0);
  const retractBackBar =
    lineLossBar(lines.capWork, qp * phi, fluid) + dcv + lineLossBar(lines.return, qp * phi, fluid) + filter;

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
      side: ctx.cbvSide, loadPressureBar, brakingPressureBar, loweringSpeedMmS: loweringMmS, settingBar, ratio: ctx.pilot.ratio, areaTerm,
      pilotOpeningBar: pilotOpeningBar(settingBar, loadPressureBar, ctx.pilot.ratio, areaTerm),
      loweringDropBar: 0,
      // The larger of the two flows it carries: lowering through 1→2 (Q_p/φ from the rod end,
      // φ·Q_p from the cap end) and lifting through its check 2→1 (the full pump flow).
      flowLpm: ctx.cbvSide === "rod" ? Math.max(qp, qp / phi) : Math.max(qp, qp * phi),
    };
  }
  const rodCbv = cbv && cbv.side === "rod" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;
  const capCbv = cbv && cbv.side === "cap" ? { settingBar: cbv.settingBar, ratio: cbv.ratio } : undefined;

  const extendInletBar = cylinderInletBar(hydraulicForceN(extend.movingN, eta), a1, a3, extendBackBar, rodCbv);
  const retractInletBar = cylinderInletBar(hydraulicForceN(retract.movingN, eta), a3, a1, retractBackBar, capCbv);
  const extendMovingBar = extendInletBar + extendSupplyLossBar;
  // Without a pressing stroke the force is reached at (near) standstill: no flow, no line or valve losses.
  // With a pressing stroke the cylinder moves at pressing speed against the process force, so
  // the lines and valves pass the pressing flow and their losses count (small at low flow).
  const hasPressPhase = req.pressStrokeMm > 0 && req.pressSpeedMmS !== undefined;
  const flowPressLpm = hasPressPhase ? phaseFlowLpm(a1, req.pressSpeedMmS!) : null;
  // The valve and filter allowances hold at the pump flow; through the same orifices the drop
  // goes with the square of the flow (orifice equation, Δp ∝ Q²) [D].
  const orificeScale = flowPressLpm === null ? 0 : (flowPressLpm / qp) ** 2;
  const pressSupplyLossBar = flowPressLpm === null ? 0
    : lineLossBar(lines.pressure, flowPressLpm, fluid) + dcv * orificeScale + lineLossBar(lines.capWork, flowPressLpm, fluid) + (ctx.cbvSide === "cap" ? check : 0);
  const pressBackBar = flowPressLpm === null ? 0
    : lineLossBar(lines.rodWork, flowPressLpm / phi, fluid) + (dcv + filter) * orificeScale / phi ** 2 + lineLossBar(lines.return, flowPressLpm / phi, fluid);
  const extendPressBar = cylinderInletBar(hydraulicForceN(pressN, eta), a1, a3, pressBackBar, rodCbv) + pressSupplyLossBar;
  const extendBar = Math.max(extendMovingBar, extendPressBar);
  const retractBar = retractInletBar + retractSupplyLossBar;
  // Constant-speed pressures feed the heat balance.
  const extendSteadyInlet = cylinderInletBar(hydraulicForceN(extend.steadyN, eta), a1, a3, extendBackBar, rodCbv);
  const retractSteadyInlet = cylinderInletBar(hydraulicForceN(retract.steadyN, eta), a3, a1, retractBackBar, capCbv);
  const extendSteadyBar = extendSteadyInlet + extendSupplyLossBar;
  const retractSteadyBar = retractSteadyInlet + retractSupplyLossBar;
  if (cbv) setLoweringDrop(cbv, cbv.side === "rod" ? extendSteadyInlet : retractSteadyInlet, cbv.side === "rod" ? extendBackBar : retractBackBar);
  const limitBar = workingLimitBar(req.maxPressureBar, cyl.ratedPressureBar, A.reliefMargin.value);
  const workingBar = Math.max(extendBar, retractBar);
  const reliefBar = reliefSettingBar(workingBar);
  const rodSidePeakBar = Math.max(retractInletBar, cbv?.side === "rod" ? cbv.settingBar : extendBackBar);

  // The rod can be driven to the relief pressure against a stop: check that too.
  const stallN = (reliefBar * a1) / 10;
  const compressiveN = Math.max(extend.movingN, pressN, stallN);
  const buckling = checkBuckling(cyl.rodMm, ctx.buckling.lengthMm, ctx.buckling.k, compressiveN);

  return {
    cyl, hoseUpsize, workingLimitBar: limitBar, flowExtendLpm, flowRetractLpm, flowPressLpm, pumpRequiredLpm, requiredDisplacementCc: needCc, displacementCc,
    pumpInSeries: inSeries, pumpFlowLpm: qp, extendActualMmS, retractActualMmS, accelExtendN, accelRetractN,
    extend, retract, pressN, lines, extendSupplyLossBar, extendBackBar, retractSupplyLossBar, retractBackBar,
    cbv, extendInletBar, extendMovingBar, extendPressBar, extendBar, retractInletBar, retractBar,
    extendSteadyBar, retractSteadyBar, workingBar, reliefBar, rodSidePeakBar, compressiveN, buckling,
    pressureOk: workingBar <= limitBar + 1e-9,
    cbvOk: !cbv || cbv.settingBar <= cyl.ratedPressureBar + 1e-9,
    bucklingOk: buckling.safetyFactor >= A.bucklingSafetyFactor.value,
  };
}
