/**
 * The rest of the power unit over the machine cycle: the motor (highest phase power, RMS where
 * the cycle is short), the pump at rest, the reservoir, the heat balance and the lines. The
 * rules are the axis's (size.ts, reservoir-heat.ts), applied to the machine's phases.
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import type { MachineCyclePhase } from "./machine-design";
import type { MachinePump } from "./machine-pump";
import { DEFAULT_FLUID, sizeLine, type LineSizing } from "./lines";
import { compensatorLeakLpm, pumpPhaseInNeutral, type PumpPhase } from "./pump-choice";
import { hydraulicPowerKw, selectMotorKw } from "./pump-motor";
import { cylinderDrawL, reservoirVolumeL, tankDissipationKw, tankSurfaceM2 } from "./reservoir-heat";

/**
 * The pump while every valve is in neutral. One valve: its own centre decides, as for the axis
 * alone (a tandem centre may unload the pump through it). Several valves in parallel must all
 * block P, since the pump would escape through any one in neutral; a fixed or double pump then
 * unloads through the solenoid-vented relief [CP; several-actuator practice in trade texts].
 */
export function neutralPhase(designs: Design[], mp: MachinePump): PumpPhase & { shaftKw: number } {
  const { choice, qpLpm: qp, speedRpm } = mp;
  const centreBar = designs.length === 1 ? designs[0].heat.neutralPressureBar : A.ventPressureBar.value;
  const p =
    choice.type === "compensated"
      ? { bar: choice.compensatorBar!, lpm: compensatorLeakLpm(qp), kw: hydraulicPowerKw(choice.compensatorBar!, compensatorLeakLpm(qp)) }
      : pumpPhaseInNeutral(choice, qp, speedRpm, centreBar);
  // A destroked compensated pump's standby loss has no efficiency to divide by at zero delivery.
  return { ...p, shaftKw: choice.type === "compensated" ? p.kw : p.kw / A.overallEfficiency.value };
}

export interface MotorChoice {
  requiredKw: number;
  ratedKw: number;
  inSeries: boolean;
  peakKw: number;
  sizingPressureBar: number;
  rmsKw: number | null;
  sizedAtRelief: boolean;
}

/**
 * The motor: the peak it must pull, and for a cycle short enough (IEC 60034-1 overload practice)
 * the RMS shaft power that heats it, the peak then carried up to 1.5 × its rating; a phase
 * longer than the short-overload time is carried at the rating. The peak candidates are every
 * phase's pump power and the pump's own extremes the phases do not show: a high-low pump just
 * before unloading, a compensated pump's corner without a limiter, a fixed pump stalled at the
 * relief at the end of a stroke against a force, and the pump at rest.
 */
export function machineMotor(
  cycle: MachineCyclePhase[],
  pumpKw: number[],
  mp: MachinePump,
  designs: Design[],
  neutral: PumpPhase,
  cyclesPerHour: number,
  /** charging an accumulator the pump unloads at p2 and never stalls against the relief */
  charging = false,
): MotorChoice {
  const etaO = A.overallEfficiency.value;
  const ph = mp.choice.phases;
  const atForce = !charging && designs.some((d) => d.requirements.processForceN > 0 || d.requirements.dwellS > 0);
  const endForceBar =
    mp.choice.type === "fixed" && !charging ? (atForce ? mp.choice.reliefBar : Math.max(...designs.map((d) => d.pressuresBar.extendPress))) : 0;
  const candidates = [
    ...cycle.filter((p) => p.kind !== "neutral").map((p, i) => ({ kw: pumpKw[i], bar: p.pressureBar })),
    { kw: ph.unloadingPeak?.kw ?? 0, bar: ph.unloadingPeak?.bar ?? 0 },
    { kw: hydraulicPowerKw(endForceBar, mp.qpLpm), bar: endForceBar },
    { kw: neutral.kw, bar: neutral.bar },
  ];
  const governing = candidates.reduce((a, b) => (b.kw > a.kw ? b : a));
  const peakKw = governing.kw / etaO;
  const cycleS = cyclesPerHour > 0 ? 3600 / cyclesPerHour : Number.POSITIVE_INFINITY;
  const rmsValid = cycleS <= A.rmsCycleLimitS.value;
  const busyS = cycle.filter((p) => p.kind !== "neutral").reduce((s, p) => s + p.durationS, 0);
  const periodS = Math.max(cycleS, busyS);
  const rmsKw = Math.sqrt(cycle.reduce((s, p) => s + p.shaftKw ** 2 * (p.durationS / periodS), 0));
  // Neutral counts as long whenever there is any: the motor sits there until the next cycle.
  const longKw = Math.max(0, ...cycle.filter((p) => p.durationS > 0 && (p.kind === "neutral" || p.durationS > A.motorPeakSeconds.value)).map((p) => p.shaftKw));
  const requiredKw = rmsValid ? Math.max(rmsKw, peakKw / A.motorPeakRatio.value, longKw) : peakKw;
  const motor = selectMotorKw(requiredKw);
  return {
    requiredKw,
    ratedKw: motor.ratedKw,
    inSeries: motor.inSeries,
    peakKw,
    sizingPressureBar: governing.bar,
    rmsKw: rmsValid ? rmsKw : null,
    sizedAtRelief: mp.choice.type === "fixed" && atForce,
  };
}

/** Usable volume: the pump rule plus the oil every cylinder keeps out of the tank when all are extended at once. */
export function machineReservoir(designs: Design[], qp: number, ambientC: number, accumulatorOilL = 0): Design["reservoir"] {
  const drawL = designs.reduce((s, d) => s + cylinderDrawL(d.cylinder.capAreaMm2, d.cylinder.annulusAreaMm2, d.cylinder.strokeMm), 0);
  const volumeL = reservoirVolumeL(qp, drawL + accumulatorOilL);
  const surfaceM2 = tankSurfaceM2(volumeL);
  return { volumeL, surfaceM2, dissipationKw: tankDissipationKw(surfaceM2, ambientC), cylinderDrawL: drawL };
}

/**
 * Power-unit lines: pressure and suction at the pump's delivery, return at the largest flow the
 * valves send back together. An axis that has the machine's own pump flow already chose its
 * hoses with its losses in mind (size.ts); the machine keeps the larger of that and the plain size.
 */
export function machineLines(
  designs: Design[],
  qp: number,
  returnMaxLpm: number,
  pressureLpm = qp,
): { pressure: LineSizing; return: LineSizing; suction: LineSizing } {
  const near = (a: number, b: number) => Math.abs(a - b) < 1e-9;
  const widest = (own: LineSizing[], plain: LineSizing) => own.reduce((a, b) => (b.innerDiameterMm > a.innerDiameterMm ? b : a), plain);
  return {
    pressure: widest(
      designs.filter((d) => near(d.flowsLpm.pump, pressureLpm)).map((d) => d.lines.pressure),
      sizeLine(pressureLpm, A.pressureVelocityLimit.value, A.pressureLineLengthM.value, DEFAULT_FLUID),
    ),
    return: widest(
      designs.filter((d) => near(d.flowsLpm.returnMax, returnMaxLpm)).map((d) => d.lines.return),
      sizeLine(returnMaxLpm, A.returnVelocityLimit.value, A.returnLineLengthM.value, DEFAULT_FLUID),
    ),
    suction: sizeLine(qp, A.suctionVelocityLimit.value, A.suctionLineLengthM.value, DEFAULT_FLUID),
  };
}
