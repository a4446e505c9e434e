/**
 * The sizing search and the assembly of a Design from the chosen candidate.
 */
import { A } from "./assumptions";
import { buildBom } from "./bom";
import { buildCircuit } from "./circuit";
import { cylinderCandidates, cylinderForceN, workingLimitBar } from "./cylinder";
import type { Design } from "./design";
import {
  evaluateCandidate,
  evaluateWithRegenerationChoice,
  sizingContext,
  valveStackFlowLpm,
  type Evaluation,
  type SizingContext,
  type SizingOptions,
} from "./evaluate";
import { cushioningFor } from "./cushioning";
import { cycleOf, cycleTrail } from "./cycle";
import { decompressionFor } from "./decompression";
import { holdingFor } from "./holding";
import { NotSizableError } from "./not-sizable";
import { explain } from "./explain";
import { DEFAULT_FLUID, lineLossBar, sizeLine } from "./lines";
import { phaseFlowLpm } from "./phases";
import { designPump, pumpPhaseInNeutral } from "./pump-choice";
import { pressSpeedControlFor } from "./press-speed";
import { hydraulicPowerKw, pumpDeliveryLpm, selectMotorKw } from "./pump-motor";
import type { Requirements } from "./requirements";
import { cylinderDrawL, dutyShares, reservoirVolumeL, strokeHeatKw, tankDissipationKw, tankSurfaceM2 } from "./reservoir-heat";
import { FOUR_POLE_FRAMES, GAUGE_RANGES_BAR, nextInSeries } from "./series";
import { chooseDcvCenter, dcvPositions, selectIso4401 } from "./valves";
import { Warnings } from "./warnings";
import { num } from "./format";

export const ENGINE_VERSION = "2.12.1";

const COIL_VOLTAGE = `${A.coilVoltage.value} V DC`;
const VENT_VALVE = "2/2 solenoid valve, normally open, on the relief valve's vent port X to tank";
const VENT_ENERGISED_WHEN = "with solenoid a or b of the directional valve; de-energised in neutral";

/**
 * Tries bore/rod pairs from the smallest up (both series in one list, see cylinderCandidates)
 * and keeps the first that meets every limit, judged with the same actual losses the design
 * reports. When the pressures fit but no rod passes buckling, it keeps the pair with the best
 * buckling margin and a warning says so. When no pair meets the pressures, nothing is sized:
 * NotSizableError says why.
 */
export function chooseCylinder(ctx: SizingContext): Evaluation {
  let pressureFit: Evaluation | undefined;
  for (const cyl of cylinderCandidates()) {
    const limit = workingLimitBar(ctx.req.maxPressureBar, cyl.ratedPressureBar, A.reliefMargin.value);
    // Cannot reach the forces even with no losses: skip without working it out.
    if ((10 * ctx.minExtendHydraulicN) / cyl.capAreaMm2 > limit + 1e-6 || (10 * ctx.minRetractHydraulicN) / cyl.annulusAreaMm2 > limit + 1e-6) continue;
    // A hose a size or two larger is far cheaper than the next cylinder, pump and motor [CP].
    let fit: Evaluation | undefined;
    let best: Evaluation | undefined;
    let maxUpsize = A.hoseUpsizeSteps.value;
    for (let upsize = 0; upsize <= maxUpsize; upsize++) {
      const ev = evaluateWithRegenerationChoice(ctx, cyl, upsize);
      if (upsize === 0) maxUpsize = hoseUpsizeLimit(cyl, ev.lines);
      if (!ev.pressureOk || !ev.cbvOk) continue;
      // Of the hoses that pass, the smallest that gives the smallest pump: a larger hose costs
      // less than a pump and motor step, and a regenerative approach may fit only with it.
      if (ev.bucklingOk) {
        if (!best || ev.displacementCc < best.displacementCc) best = ev;
        continue;
      }
      fit ??= ev;
    }
    if (best) return best;
    // No rod passes buckling yet: keep the largest pair that meets the pressures (thickest rod),
    // and the BUCKLING_MARGIN warning says so.
    if (fit) pressureFit = fit;
  }
  if (pressureFit) return pressureFit;
  throw notSizable(ctx);
}

/**
 * How many dash sizes above the velocity-limit size the search may take the hoses: two [CP], or
 * until the smallest line reaches the size this cylinder's largest line (its return, φ·Q at the
 * return-line limit) needs with the piston at the seal-speed limit (about 0.5 m/s [M]), whichever
 * is more. That bound belongs to the cylinder, not to the flow asked: counted only from the
 * velocity-limit size, a slower axis got smaller hoses with larger losses (Δp ∝ v/d² in laminar
 * flow), so a higher relief and stall thrust, and where that decided buckling (or ruled out a
 * regenerative approach) a larger cylinder or pump than its faster twin, which had the hoses.
 */
function hoseUpsizeLimit(
  cyl: { capAreaMm2: number; areaRatio: number },
  lines: Record<"pressure" | "capWork" | "rodWork" | "return", { hoseIndex: number }>,
): number {
  const atSealLimitLpm = phaseFlowLpm(cyl.capAreaMm2, A.pistonSpeedLimitMmS.value) * Math.max(1, cyl.areaRatio);
  const largest = sizeLine(atSealLimitLpm, A.returnVelocityLimit.value, A.returnLineLengthM.value, DEFAULT_FLUID).hoseIndex;
  const smallest = Math.min(lines.pressure.hoseIndex, lines.capWork.hoseIndex, lines.rodWork.hoseIndex, lines.return.hoseIndex);
  return Math.max(A.hoseUpsizeSteps.value, largest - smallest);
}

/** Why no pair fits, with the pressure the best pair needs, so the buyer knows what to change. */
function notSizable(ctx: SizingContext): NotSizableError {
  const r = ctx.req;
  let best: Evaluation | undefined;
  let cbvBest: Evaluation | undefined;
  for (const cyl of cylinderCandidates()) {
    const ev = evaluateCandidate(ctx, cyl);
    if (ev.cbvOk && (!best || ev.workingBar < best.workingBar)) best = ev;
    if (ev.cbv && (!cbvBest || ev.cbv.settingBar - cyl.ratedPressureBar < cbvBest.cbv!.settingBar - cbvBest.cyl.ratedPressureBar)) cbvBest = ev;
  }
  if (!best) {
    const cb = cbvBest!.cbv!;
    return new NotSizableError("massKg", {
      code: "NO_CYLINDER_MEETS_PRESSURE",
      message: `Nothing in the cylinder series can hold this load: even a ${cbvBest!.cyl.boreMm}/${cbvBest!.cyl.rodMm} mm cylinder needs its counterbalance valve set at ${f1(cb.settingBar)} bar, above its ${cbvBest!.cyl.ratedPressureBar} bar rating. Lower the moving mass or share it between several cylinders.`,
    });
  }
  const c = best.cyl;
  const needed = Math.ceil(best.workingBar - 1e-9);
  const withinRating = best.workingBar <= workingLimitBar(Number.POSITIVE_INFINITY, c.ratedPressureBar, A.reliefMargin.value) + 1e-9;
  return new NotSizableError("maxPressureBar", {
    code: "NO_CYLINDER_MEETS_PRESSURE",
    message: withinRating
      ? `Nothing in the cylinder series works within ${f1(r.maxPressureBar)} bar for this axis: the lowest pressure any cylinder needs is ${f1(best.workingBar)} bar (a ${c.boreMm}/${c.rodMm} mm cylinder, ${c.series}). Allow at least ${needed} bar, or lower the forces or speeds.`
      : `Nothing in the cylinder series can move this axis: even a ${c.boreMm}/${c.rodMm} mm cylinder needs ${f1(best.workingBar)} bar, more than any cylinder in the series is rated to work at. Lower the forces or speeds, or share the load between several cylinders.`,
  });
}

/** Sizes a circuit from requirements that have already passed the schema. */
export function sizeCircuitParsed(req: Requirements, options: SizingOptions = {}): Design {
  const ctx = sizingContext(req, options);
  const ev = chooseCylinder(ctx);
  const warnings = new Warnings();
  const eta = A.cylinderEfficiency.value;
  const etaO = A.overallEfficiency.value;
  const { cyl, cbv } = ev;
  const qp = ev.pumpFlowLpm;
  const suction = sizeLine(qp, A.suctionVelocityLimit.value, A.suctionLineLengthM.value, ctx.fluid);
  const lines = { pressure: ev.lines.pressure, capWork: ev.lines.capWork, rodWork: ev.lines.rodWork, return: ev.lines.return, suction };

  // Directional valve
  const regen = ev.regen;
  const holding = holdingFor(req, ctx.loads, cyl, qp, regen?.capInflowLpm);
  // A regeneration valve sits in the valve stack on the same ISO 4401 interface, and its cap and
  // rod channels carry the cap inflow and rod outflow of the regenerative approach.
  const maxPathFlowLpm = valveStackFlowLpm(ev);
  const valve = selectIso4401(maxPathFlowLpm);

  // Pressing at the end of the stroke, and any dwell, stall the cylinder with the valve shifted:
  // a fixed pump then delivers its whole flow over the relief, at the relief setting.
  const pumpOnReliefAtForce = req.processForceN > 0 || req.dwellS > 0;
  // The pump the search evaluated this pair with: its phases are the one source of the pump's
  // pressure and delivery in each phase, and it set the relief.
  const pump = ev.pump;
  const pk = pump.hydraulicKw;
  const compensated = pump.type === "compensated";
  // The pressing speed: a meter-in flow control where the pump alone would press too fast; the
  // pump side of it is the pump choice's pressing pressure (relief, or compensator setting).
  const smallSectionLpm = pump.type === "double" ? pumpDeliveryLpm(pump.displacementsCcRev[1], ctx.speedRpm, A.volumetricEfficiency.value) : null;
  const pressSpeedControl = pressSpeedControlFor({
    pumpType: pump.type,
    pressFlowLpm: ev.flowPressLpm,
    pumpFlowLpm: qp,
    smallSectionLpm,
    areaRatio: cyl.areaRatio,
    pumpSideBar: pump.phases.press?.bar ?? ev.reliefBar,
    pressBar: ev.extendPressBar,
    bypassDropBar: ev.pressBypassDropBar,
  });
  // A regenerative approach joins the rod end's oil at the valve stack, upstream of the control in
  // the cap line, so the bypass carries the cap inflow, not Q_p (continuity).
  if (pressSpeedControl && regen) pressSpeedControl.bypassFlowLpm = Math.max(pressSpeedControl.bypassFlowLpm, regen.capInflowLpm);
  // With a pressing stroke the rod reaches the extended end at the pressing speed (the control's
  // setting, or what the pump alone offers within the speed tolerance), not the approach speed.
  const pressOffersLpm = pressSpeedControl ? ev.flowPressLpm! : (smallSectionLpm ?? qp);
  const extendArrivalMmS = ev.flowPressLpm === null ? ev.extendActualMmS : Math.min(ev.extendActualMmS, (pressOffersLpm * 1000) / (cyl.capAreaMm2 * 0.06));
  const cushioning = cushioningFor(req.massKg, ctx.loads, cyl, extendArrivalMmS, ev.retractActualMmS, ev.extendInletBar, ev.retractInletBar);

  // The cap end at full stroke holds the highest extend pressure: where the pump stalls there,
  // the relief, or for a compensated pump its compensator setting (the pump choice's dwell pressure).
  const capOilL = (cyl.capAreaMm2 * req.strokeMm) / 1e6 + (((Math.PI * lines.capWork.innerDiameterMm ** 2) / 4) * lines.capWork.lengthM) / 1000;
  const decompression = decompressionFor(capOilL, pumpOnReliefAtForce ? pump.phases.dwell!.bar : ev.extendBar);
  const centre = chooseDcvCenter(cbv !== null, holding !== null, compensated);

  // Neutral: over relief if P is blocked and nothing unloads it; through the vented relief at
  // its vent pressure [CP]; or P→T through a tandem centre, the valve path, return line and filter.
  // A compensated pump behind a centre that blocks P sits at p_c delivering only its leakage
  // (standby): P ≈ p_c·Q_leak/600 with Q_leak ≈ (1 − η_v)·Q_max, the destroked pump's friction
  // not counted (shared sources' compensated-pump estimate, from memory [M]).
  const centreBar = centre.pumpOnReliefInNeutral
    ? ev.reliefBar
    : centre.ventedRelief
      ? A.ventPressureBar.value
      : A.dcvPathDropBar.value + lineLossBar(lines.return, qp, ctx.fluid) + A.returnFilterDropBar.value;
  const neutral = pumpPhaseInNeutral(pump, qp, ctx.speedRpm, centreBar);
  const neutralBar = neutral.bar;
  // Shaft power in neutral and in the dwell: the standby loss is what a destroked compensated pump
  // takes (no efficiency to divide by at zero delivery); other pumps p·Q/(600·η).
  const neutralShaftKw = neutral.kw / (compensated ? 1 : etaO);
  const dwellShaftKw = compensated ? pk.dwell : pk.dwell / etaO;
  // The highest power the chosen pump draws, with the pressure it draws it at. A fixed pump
  // reaching the end-of-stroke force sits at the relief (version-1 behaviour kept).
  const endForceBar = pump.type === "fixed" ? (pumpOnReliefAtForce ? ev.reliefBar : ev.extendPressBar) : 0;
  const ph = pump.phases;
  const peakCandidates: { kw: number; bar: number }[] = [
    { kw: ph.approach!.kw, bar: ph.approach!.bar },
    { kw: ph.retract!.kw, bar: ph.retract!.bar },
    { kw: ph.press?.kw ?? 0, bar: ph.press?.bar ?? 0 },
    { kw: req.dwellS > 0 ? ph.dwell!.kw : 0, bar: ph.dwell!.bar },
    { kw: ph.unloadingPeak?.kw ?? 0, bar: ph.unloadingPeak?.bar ?? 0 },
    { kw: hydraulicPowerKw(endForceBar, qp), bar: endForceBar },
    { kw: neutral.kw, bar: neutral.bar },
  ];
  const governing = peakCandidates.reduce((a, b) => (b.kw > a.kw ? b : a));
  const motorSizingBar = governing.bar;
  const peakKw = governing.kw / etaO;

  // Reservoir and heat
  const drawL = cylinderDrawL(cyl.capAreaMm2, cyl.annulusAreaMm2, req.strokeMm);
  const volumeL = reservoirVolumeL(qp, drawL);
  const surfaceM2 = tankSurfaceM2(volumeL);
  const dissipationKw = tankDissipationKw(surfaceM2, req.ambientC);
  const press = ev.flowPressLpm !== null ? { strokeMm: req.pressStrokeMm, speedMmS: req.pressSpeedMmS! } : undefined;
  const duty = dutyShares(req.strokeMm, ev.extendActualMmS, ev.retractActualMmS, req.cyclesPerHour, req.dwellS, press);
  const extendLossKw = strokeHeatKw(hydraulicPowerKw(ev.extendSteadyBar, qp) / etaO, ev.extend.steadyN, ev.extendActualMmS);
  const retractLossKw = strokeHeatKw(hydraulicPowerKw(ev.retractSteadyBar, qp) / etaO, ev.retract.steadyN, ev.retractActualMmS);
  // Dwell: the rod does no work, so all the power the pump takes is heat: a fixed pump's whole flow
  // crosses the relief, a double pump's small section does, a compensated pump is at standby.
  const dwellLossKw = dwellShaftKw;
  // Pressing: the heat is what the chosen pump draws less the work on the process force. With a
  // flow control and a fixed or double pump that sits at the relief, the surplus crosses the relief
  // and the control drops the rest (p_relief − p_press at the set flow); both are in this difference.
  const pressLossKw = press ? strokeHeatKw(pk.press / etaO, ev.pressN, press.speedMmS) : 0;
  const neutralLossKw = neutralShaftKw;
  const averageLossKw =
    duty.extendShare * extendLossKw +
    duty.pressShare * pressLossKw +
    duty.retractShare * retractLossKw +
    duty.dwellShare * dwellLossKw +
    duty.neutralShare * neutralLossKw;
  const coolerKw = Math.max(0, averageLossKw - dissipationKw);

  // Motor: the peak it must pull (pull-out torque) and, for cycles short enough, the RMS power
  // that heats it (the motor then carries a short peak up to 1.5 × its rating).
  const cycleS = req.cyclesPerHour > 0 ? 3600 / req.cyclesPerHour : Number.POSITIVE_INFINITY;
  const rmsValid = cycleS <= A.rmsCycleLimitS.value;
  const phases = [
    { name: "approach", kw: pk.approach / etaO, share: duty.extendShare, s: duty.extendS },
    { name: "pressing", kw: pk.press / etaO, share: duty.pressShare, s: duty.pressS },
    { name: "retract", kw: pk.retract / etaO, share: duty.retractShare, s: duty.retractS },
    { name: "dwell", kw: dwellShaftKw, share: duty.dwellShare, s: req.dwellS },
    { name: "neutral", kw: neutralShaftKw, share: duty.neutralShare, s: Number.POSITIVE_INFINITY },
  ];
  const rmsKw = Math.sqrt(phases.reduce((sum, ph) => sum + ph.share * ph.kw * ph.kw, 0));
  // A phase longer than the motor's short-overload time must be carried at its rating.
  const longKw = Math.max(...phases.filter((ph) => ph.share > 0 && ph.s > A.motorPeakSeconds.value).map((ph) => ph.kw), 0);
  const motorRequiredKw = rmsValid ? Math.max(rmsKw, peakKw / A.motorPeakRatio.value, longKw) : peakKw;
  const motor = selectMotorKw(motorRequiredKw);
  const loweringHeatKw = cbv ? hydraulicPowerKw(cbv.loweringDropBar, cbv.flowLpm) : 0;

  const gaugeRangeBar = nextInSeries(GAUGE_RANGES_BAR, ev.reliefBar * A.gaugeRangeFactor.value) ?? GAUGE_RANGES_BAR[GAUGE_RANGES_BAR.length - 1];
  const workingPressureBar = ev.workingBar;
  const frame = FOUR_POLE_FRAMES.get(motor.ratedKw) ?? null;

  const design: Design = {
    engineVersion: ENGINE_VERSION,
    requirements: req,
    loads: {
      angleDeg: ctx.loads.angleDeg,
      gravityAlongAxisN: ctx.loads.gravityAlongAxisN,
      frictionN: ctx.loads.frictionN,
      processForceN: ctx.loads.processForceN,
      accelExtendN: ev.accelExtendN,
      accelRetractN: ev.accelRetractN,
      extendSteadyN: ev.extend.steadyN,
      extendMovingN: ev.extend.movingN,
      extendPressN: ev.pressN,
      retractSteadyN: ev.retract.steadyN,
      retractMovingN: ev.retract.movingN,
      overrunningStroke: ctx.loads.overrunningStroke,
    },
    cylinder: {
      boreMm: cyl.boreMm,
      rodMm: cyl.rodMm,
      strokeMm: req.strokeMm,
      extendForceN: cylinderForceN(workingPressureBar, cyl.capAreaMm2, eta),
      retractForceN: cylinderForceN(workingPressureBar, cyl.annulusAreaMm2, eta),
      bucklingSafetyFactor: ev.buckling.safetyFactor,
      series: cyl.series,
      outOfSeries: cyl.outOfSeries,
      ratedPressureBar: cyl.ratedPressureBar,
      capAreaMm2: cyl.capAreaMm2,
      annulusAreaMm2: cyl.annulusAreaMm2,
      areaRatio: cyl.areaRatio,
      mechanicalEfficiency: eta,
      workingPressureBar,
      cushioning,
      buckling: {
        eulerCase: ctx.buckling.eulerCase,
        k: ctx.buckling.k,
        lengthMm: ctx.buckling.lengthMm,
        lengthRule: ctx.buckling.rule,
        effectiveLengthMm: ev.buckling.effectiveLengthMm,
        slenderness: ev.buckling.slenderness,
        limitSlenderness: A.limitSlenderness.value,
        regime: ev.buckling.regime,
        criticalLoadN: ev.buckling.criticalLoadN,
        compressiveForceN: ev.compressiveN,
        requiredSafetyFactor: A.bucklingSafetyFactor.value,
      },
    },
    pressuresBar: {
      extend: ev.extendBar,
      retract: ev.retractBar,
      reliefSetting: ev.reliefBar,
      workingLimit: ev.workingLimitBar,
      extendMoving: ev.extendMovingBar,
      extendPress: ev.extendPressBar,
      ...(press ? { approach: ev.extendMovingBar, press: ev.extendPressBar } : {}),
      rodSidePeak: ev.rodSidePeakBar,
    },
    flowsLpm: {
      extend: ev.flowExtendLpm,
      retract: ev.flowRetractLpm,
      pump: qp,
      returnMax: qp * cyl.areaRatio,
      ...(ev.flowPressLpm !== null ? { press: ev.flowPressLpm } : {}),
    },
    speedsMmS: {
      extendRequested: req.extendSpeedMmS,
      retractRequested: req.retractSpeedMmS,
      extendActual: ev.extendActualMmS,
      retractActual: ev.retractActualMmS,
    },
    pump: designPump(pump, { displacementCcRev: ev.displacementCc, speedRpm: ctx.speedRpm, requiredDisplacementCcRev: ev.requiredDisplacementCc }),
    motor: {
      requiredKw: motorRequiredKw,
      ratedKw: motor.ratedKw,
      poles: A.motorPoles.value,
      frame,
      sizingPressureBar: motorSizingBar,
      sizedAtRelief: pumpOnReliefAtForce,
      peakKw,
      rmsKw: rmsValid ? rmsKw : null,
      // Only the phases the cycle has: no dwell without a dwell time (its power would be a phase that never runs).
      phases: phases
        .filter((ph) => ph.name !== "neutral" && (ph.name !== "dwell" || req.dwellS > 0))
        .map((ph) => ({ name: ph.name, kw: ph.kw, durationS: ph.s })),
    },
    regenerative: regen !== null,
    regeneration: regen
      ? {
          rodAreaMm2: regen.rodAreaMm2,
          speedMmS: ev.extendActualMmS,
          forceAtWorkingN: cylinderForceN(workingPressureBar, regen.rodAreaMm2, eta),
          capInflowLpm: regen.capInflowLpm,
          rodOutflowLpm: regen.rodOutflowLpm,
          speedRatioToRetract: regen.speedRatioToRetract,
          endsBy: regen.endsBy,
          switchBar: regen.switchBar,
          reason: ev.regenReason,
        }
      : null,
    pressSpeedControl,
    counterbalance:
      cbv && ctx.pilot
        ? {
            side: cbv.side,
            settingBar: cbv.settingBar,
            pilotRatio: cbv.ratio,
            pilotOpeningBar: cbv.pilotOpeningBar,
            stroke: cbv.side === "rod" ? "extend" : "retract",
            loadPressureBar: cbv.loadPressureBar,
            brakingPressureBar: cbv.brakingPressureBar,
            loweringSpeedMmS: cbv.loweringSpeedMmS,
            loadClass: ctx.pilot.loadClass,
            pilotRatioReason: ctx.pilot.reason,
            loweringHeatKw,
            flowLpm: cbv.flowLpm,
          }
        : null,
    holding,
    decompression,
    reliefVent: centre.ventedRelief
      ? { ventPressureBar: A.ventPressureBar.value, valve: VENT_VALVE, coilVoltage: COIL_VOLTAGE, energisedWhen: VENT_ENERGISED_WHEN }
      : null,
    directionalValve: {
      center: centre.center,
      iso4401Size: valve.size,
      nominalSize: valve.nominal,
      maxPathFlowLpm,
      typicalMaxFlowLpm: valve.typicalMaxLpm,
      coilVoltage: COIL_VOLTAGE,
      centerReason: centre.reason,
      neutralPumpFlow: centre.neutralPumpFlow,
    },
    lines: { pressure: lines.pressure, return: lines.return, suction: lines.suction, capWork: lines.capWork, rodWork: lines.rodWork },
    reservoir: { volumeL, surfaceM2, dissipationKw, cylinderDrawL: drawL },
    cooler: coolerKw > 0 ? { kw: coolerKw } : null,
    returnFilter: { ratedFlowLpm: qp * cyl.areaRatio },
    heat: {
      averageLossKw,
      extendLossKw,
      retractLossKw,
      neutralLossKw,
      dwellLossKw,
      dwellShare: duty.dwellShare,
      pressLossKw,
      pressShare: duty.pressShare,
      neutralPressureBar: neutralBar,
      extendShare: duty.extendShare,
      retractShare: duty.retractShare,
      neutralShare: duty.neutralShare,
      tankDissipationKw: dissipationKw,
      coolerKw,
      dailyEnergyKwh: averageLossKw * req.hoursPerDay,
    },
    warnings: warnings.list,
    bom: [],
    trail: [],
    circuit: { components: [], connections: [], dcvPositions: dcvPositions(centre.center) },
  };

  addWarnings(design, ctx, ev, warnings, {
    duty,
    motorInSeries: motor.inSeries,
    valveWithinLimit: valve.withinLimit,
    pumpOnRelief: centre.pumpOnReliefInNeutral,
  });
  design.bom = buildBom(design, gaugeRangeBar);
  design.circuit = buildCircuit(design, gaugeRangeBar, design.circuit.dcvPositions);
  design.trail = explain(design, ctx, ev, { pumpOnRelief: centre.pumpOnReliefInNeutral, gaugeRangeBar, duty });
  design.cycle = cycleOf(design, { approach: ph.approach, press: ph.press, dwell: ph.dwell, retract: ph.retract, neutral });
  design.trail.push(cycleTrail(design.cycle, req.cyclesPerHour));
  return design;
}

const f1 = (x: number): string => num(x);
const VENTED_NOTE = `P is blocked in neutral, so the relief is solenoid-vented: the control must energise its normally open vent valve whenever solenoid a or b is on, or the axis cannot build pressure. De-energised (neutral, or a control fault) the pump circulates at about ${A.ventPressureBar.value} bar.`;
const VENTED_NOTE_CBV = `${VENTED_NOTE} The counterbalance valve still holds the load then.`;
const LINE_NAMES = ["pressure", "return", "suction", "capWork", "rodWork"] as const;

function addWarnings(
  d: Design,
  ctx: SizingContext,
  ev: Evaluation,
  w: Warnings,
  extra: { duty: { overloaded: boolean }; motorInSeries: boolean; valveWithinLimit: boolean; pumpOnRelief: boolean },
): void {
  const c = d.cylinder;
  // A design whose pressures do not fit is never returned (NotSizableError), so only the reserve is judged.
  if (ev.workingBar > A.pressureNearLimit.value * ev.workingLimitBar) {
    w.add(
      "PRESSURE_NEAR_LIMIT",
      `The working pressure of ${f1(ev.workingBar)} bar is within 5 % of the ${f1(ev.workingLimitBar)} bar limit; there is little reserve for losses this estimate leaves out.`,
    );
  }
  if (c.outOfSeries) {
    w.add(
      "BORE_OUT_OF_SERIES",
      `The ${c.boreMm}/${c.rodMm} mm cylinder is beyond the ${ev.cyl.table} pairing table; it is an ISO 3320 size, so check that a maker offers it.`,
    );
  }
  if (!ev.bucklingOk) {
    w.add(
      "BUCKLING_MARGIN",
      `The ${c.rodMm} mm rod has a buckling safety factor of ${num(ev.buckling.safetyFactor, 2)} at full extension, below the ${A.bucklingSafetyFactor.value} required. Guide the load, shorten the stroke or choose a stronger mounting.`,
    );
  }
  if (ev.rodSidePeakBar > c.ratedPressureBar + 1e-9) {
    w.add("ROD_SIDE_INTENSIFICATION", `The rod side can reach ${f1(ev.rodSidePeakBar)} bar, above the cylinder's ${c.ratedPressureBar} bar rating.`);
  }
  const tol = 1 + A.speedTolerance.value;
  if (d.speedsMmS.extendActual > tol * d.speedsMmS.extendRequested || d.speedsMmS.retractActual > tol * d.speedsMmS.retractRequested) {
    w.add(
      "PUMP_SPEED_MISMATCH",
      `${d.pump.type === "fixed" ? "A fixed pump" : "At full delivery the pump"} gives both strokes the same ${f1(d.flowsLpm.pump)} L/min, so the cylinder extends at ${Math.round(d.speedsMmS.extendActual)} mm/s (asked ${d.speedsMmS.extendRequested}) and retracts at ${Math.round(d.speedsMmS.retractActual)} mm/s (asked ${d.speedsMmS.retractRequested}). If an asked speed is a limit, a meter-in flow control on that stroke would hold it; its surplus flow would then cross the relief as heat, and neither is in this design.`,
    );
  }
  // Meter-out intensification (force balance p2 = φ·p1 + F/A3): any restriction in the rod-end line
  // while extending, a meter-out throttle or a blocked B line, drives the rod side towards φ × relief.
  // A rod-side counterbalance valve caps it near its own setting instead.
  const meterOutBar = c.areaRatio * d.pressuresBar.reliefSetting;
  if (d.counterbalance?.side !== "rod" && meterOutBar > c.ratedPressureBar + 1e-9) {
    w.add(
      "METER_OUT_INTENSIFICATION",
      `A restriction in the rod-end line while extending (a meter-out flow control, or a blocked B line) would raise the rod side to φ × relief = ${num(c.areaRatio, 2)} × ${d.pressuresBar.reliefSetting} = ${f1(meterOutBar)} bar, above the cylinder's ${c.ratedPressureBar} bar rating. Control this axis's speed meter-in only, and never throttle the rod-end line.`,
    );
  }
  const psc = d.pressSpeedControl;
  if (psc && psc.availableDropBar < psc.minDropBar - 1e-9) {
    w.add(
      "PRESS_CONTROL_DROP_LOW",
      `The flow control that sets the pressing speed has only ${f1(psc.availableDropBar)} bar across it (the ${d.pump.type === "compensated" ? "compensator" : "relief"} setting less the ${f1(d.pressuresBar.extendPress)} bar pressing pressure); it needs about ${f1(psc.minDropBar)} bar to regulate, so the pressing speed may sag. Allow a higher ${d.pump.type === "compensated" ? "compensator and relief settings" : "relief setting"} within the cylinder's ${c.ratedPressureBar} bar rating.`,
    );
  }
  if (!ev.pumpInSeries) {
    w.add(
      "PUMP_BEYOND_SERIES",
      `The flow needs more than the largest displacement in the series (${ev.displacementCc} cm³/rev); use several pumps or a larger unit.`,
    );
  }
  if (!extra.motorInSeries) {
    w.add("MOTOR_BEYOND_SERIES", `The drive needs ${f1(d.motor.requiredKw)} kW, more than the largest motor listed.`);
  }
  if (!extra.valveWithinLimit) {
    w.add(
      "VALVE_NEAR_LIMIT",
      `The largest path flow of ${f1(d.directionalValve.maxPathFlowLpm)} L/min is above 80 % of what an ISO 4401-10 valve typically passes; use a cartridge or logic-element valve block.`,
    );
  }
  for (const name of LINE_NAMES) {
    const line = d.lines[name];
    if (!line.inRange) {
      w.add(
        "LINE_SIZE_BEYOND_RANGE",
        `The ${name} line needs ${f1(line.requiredDiameterMm)} mm, larger than the largest hose listed; use tube or parallel lines.`,
      );
    }
  }
  if (extra.pumpOnRelief) {
    w.add(
      "PUMP_ON_RELIEF_IN_NEUTRAL",
      `With a ${d.directionalValve.center} centre P is blocked, so the pump runs over the ${d.pressuresBar.reliefSetting} bar relief whenever the valve is in neutral (${Math.round(d.heat.neutralShare * 100)} % of the time). A solenoid-vented relief or unloading valve would save that heat and power.`,
    );
  }
  if (d.reliefVent) {
    w.add("RELIEF_VENTED_IN_NEUTRAL", d.counterbalance ? VENTED_NOTE_CBV : VENTED_NOTE);
  }
  if (extra.duty.overloaded) {
    w.add(
      "DUTY_CYCLE_OVERLOAD",
      `At the actual speeds the cycles asked for need more than an hour of movement per hour; the heat is worked out for continuous movement.`,
    );
  }
  const top = Math.max(d.speedsMmS.extendActual, d.speedsMmS.retractActual);
  if (top > A.pistonSpeedLimitMmS.value) {
    w.add(
      "PISTON_SPEED_HIGH",
      `The piston reaches ${Math.round(top)} mm/s, above the about ${A.pistonSpeedLimitMmS.value} mm/s standard seals are made for; ask the cylinder maker for low-friction seals and ports sized for the flow.`,
    );
  }
  for (const [stroke, e, side] of [
    ["extended", c.cushioning.extend, "rod"],
    ["retracted", c.cushioning.retract, "cap"],
  ] as const) {
    if (e.cushioned && e.peakBar > c.ratedPressureBar + 1e-9) {
      w.add(
        "CUSHION_PRESSURE_HIGH",
        `Braking ${f1(d.requirements.massKg)} kg from ${Math.round(e.speedMmS)} mm/s in a ${c.cushioning.cushionLengthMm} mm cushion at the ${stroke} end puts about ${f1(e.peakBar)} bar on the ${side} side, above the cylinder's ${c.ratedPressureBar} bar rating; slow the stroke end down outside the cylinder or ask for a longer cushion.`,
      );
    }
  }
  if (d.decompression.needed) {
    w.add(
      "DECOMPRESSION_NEEDED",
      `About ${Math.round(d.decompression.releaseCm3)} cm³ of oil compressed in the cap end at ${f1(d.decompression.pressureBar)} bar springs back when the valve shifts to return; released at once it hammers hoses and seals. The bill has a decompression valve to let it out first.`,
    );
  }
  const hold = d.holding;
  if (hold && hold.side === "rod" && hold.openingLoadSideBar > c.ratedPressureBar + 1e-9) {
    w.add(
      "ROD_SIDE_INTENSIFICATION",
      `Opening the rod-end pilot-operated check intensifies the rod side to ${f1(hold.openingLoadSideBar)} bar (p2 = F/A3 + φ·p_pilot), above the cylinder's ${c.ratedPressureBar} bar rating; choose a higher pilot ratio.`,
    );
  }
  if (ctx.buckling.unstable) {
    w.add(
      "PIVOTED_BODY_FREE_ROD",
      `A cylinder held by a ${d.requirements.mountingStyle} pivot with a free, unguided rod end is a mechanism, not a column: it folds at the pivot under any push. Guide the rod end, or hold the body by a flange or feet.`,
    );
  }
  if (d.requirements.pumpType !== undefined && d.requirements.pumpType !== d.pump.type) {
    w.add("PUMP_TYPE_NOT_SUITED", `The pump asked for is not sized: ${d.pump.reason}.`);
  }
  const rg = d.regeneration;
  if (rg) {
    const weak = `While regenerating the rod gives only ${f1(rg.forceAtWorkingN / 1000)} kN at ${f1(c.workingPressureBar)} bar, against ${f1(c.extendForceN / 1000)} kN on the full area.`;
    w.add(
      "REGENERATIVE_APPROACH",
      rg.endsBy === "pressure-switch"
        ? `The approach runs regeneratively (rod end joined to the cap end): the controls energise the regeneration valve with solenoid a, and its pressure switch ends it at ${f1(rg.switchBar ?? 0)} bar and must be latched until the return, or the axis would fall back to regenerating as the pressure drops on the full area. ${weak}`
        : rg.endsBy === "limit-switch"
          ? `The approach runs regeneratively (rod end joined to the cap end): the controls energise the regeneration valve with solenoid a and de-energise it at the limit switch where the pressing stroke starts, so the pressing is done on the full area. ${weak}`
          : `The whole extension runs regeneratively (rod end joined to the cap end): the controls energise the regeneration valve with solenoid a. The rod then pushes with only ${f1(rg.forceAtWorkingN / 1000)} kN at ${f1(c.workingPressureBar)} bar, against ${f1(c.extendForceN / 1000)} kN on the full area; enough for this axis, which asks for no force at the end of the stroke.`,
    );
  }
  if (d.heat.coolerKw > 0) {
    w.add(
      "HEAT_COOLER_NEEDED",
      `On average ${f1(d.heat.averageLossKw)} kW becomes heat, but a ${d.reservoir.volumeL} L tank sheds only about ${num(d.heat.tankDissipationKw, 2)} kW at ${d.requirements.ambientC} °C ambient with oil at 60 °C. The bill has a cooler for at least ${f1(d.heat.coolerKw)} kW.`,
    );
  }
}
