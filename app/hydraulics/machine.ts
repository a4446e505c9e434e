/**
 * Sizes a machine: each axis as it would be sized alone (size.ts) with the machine's duty, then
 * one power unit over the machine cycle (machine-timeline.ts, machine-pump.ts, machine-power.ts).
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import { machineBom } from "./machine-bom";
import { machineCircuit } from "./machine-circuit";
import type { MachineAxis, MachineCyclePhase, MachineDesign } from "./machine-design";
import { machineLines, machineMotor, machineReservoir, neutralPhase } from "./machine-power";
import { chooseMachinePump, pumpInPhase, type MachinePump } from "./machine-pump";
import { planAccumulator, type AccumulatorPlan } from "./accumulator";
import { choosePump, designPump } from "./pump-choice";
import { hydraulicPowerKw, selectDisplacementCc } from "./pump-motor";
import type { MachineRequirements } from "./machine-requirements";
import { machineTimeline, type TimelinePhase } from "./machine-timeline";
import { machineTrail } from "./machine-trail";
import { machineWarnings } from "./machine-warnings";
import { NotSizableError } from "./not-sizable";
import { RequirementsError } from "./requirements";
import { ENGINE_VERSION, sizeCircuitParsed } from "./size";
import { FOUR_POLE_FRAMES } from "./series";
import type { DcvCenter } from "./valves";

/**
 * The axis alone, with the machine's duty; what the axis cannot meet is reported at its own path.
 * One of several axes is sized on a pump of one section of its own size: the machine keeps the
 * speeds that gives it, and a double pump's sections are chosen for the machine, not per axis.
 */
function sizeAxis(m: MachineRequirements, i: number): Design {
  try {
    return sizeCircuitParsed(m.axes[i], { singleSectionPump: m.axes.length > 1 });
  } catch (error) {
    if (!(error instanceof RequirementsError)) throw error;
    // The pressure limit is the machine's field; everything else belongs to the axis.
    const keyed = Object.fromEntries(
      Object.entries(error.fieldErrors).map(([k, msgs]) => [k === "maxPressureBar" ? k : `axes.${i}.${k}`, msgs.map((msg) => `${m.axes[i].name}: ${msg}`)]),
    );
    if (error instanceof NotSizableError) throw new NotSizableError(Object.keys(keyed)[0], { ...error.warning, message: keyed[Object.keys(keyed)[0]][0] });
    throw new RequirementsError(keyed);
  }
}

/**
 * Several valves in parallel on one pump must all block P in neutral, or the pump escapes
 * through any one of them: a tandem centre becomes closed (A and B still blocked, so the load
 * stays held) and an open centre becomes float (A and B still to tank) [CP; several-actuator practice].
 */
const parallelCentre = (c: DcvCenter): DcvCenter => (c === "tandem" ? "closed" : c === "open" ? "float" : c);

/** The phase's heat: an axis alone on a pump of its own size loses what its own heat balance says; otherwise shaft power less the work on the loads. */
function phaseHeatKw(ph: TimelinePhase, shaftKw: number, ownPump: (axis: string) => boolean): number {
  if (ph.segments.length === 1 && ownPump(ph.segments[0].axis)) return ph.segments[0].aloneLossKw;
  return Math.max(0, shaftKw - ph.segments.reduce((s, seg) => s + seg.usefulKw, 0));
}

/** Sizes a machine whose requirements have passed the schema. */
export function sizeMachineParsed(m: MachineRequirements): MachineDesign {
  const designs = m.axes.map((_, i) => sizeAxis(m, i));
  const byName = new Map(designs.map((d) => [d.requirements.name!, d]));
  const timeline = machineTimeline(m.sequence, byName);
  const several = designs.length > 1;
  const normal = chooseMachinePump(designs, timeline, m.pumpType);
  // Unasked, a machine whose short flow peaks size the pump gets an accumulator where it pays (accumulator.ts).
  const plan =
    several && m.pumpType === undefined
      ? planAccumulator({
          timeline,
          cyclesPerHour: m.cyclesPerHour,
          speedRpm: normal.speedRpm,
          withoutCc: selectDisplacementCc(normal.requiredDisplacementCc).displacementCc,
          withoutPeakKw: Math.max(...timeline.map((ph) => pumpInPhase(ph, normal).shaftKw)),
          maxPressureBar: m.maxPressureBar,
          ratedBar: Math.min(...designs.map((d) => d.cylinder.ratedPressureBar)),
        })
      : null;
  const mp = plan ? accumulatorPump(normal, plan) : normal;
  const qp = mp.qpLpm;
  const choice = mp.choice;
  const ownPump = (axis: string) => {
    const p = byName.get(axis)!.pump;
    return (
      p.type === choice.type &&
      p.displacementsCcRev.join() === choice.displacementsCcRev.join() &&
      byName.get(axis)!.pressuresBar.reliefSetting === choice.reliefBar
    );
  };

  // The cycle: each phase with what the pump does then, and the neutral rest of the cycle.
  const pumpPhases = timeline.map((ph) => (plan ? chargingPhase(plan) : pumpInPhase(ph, mp)));
  const cycle: MachineCyclePhase[] = timeline.map((ph, i) => ({
    step: ph.step,
    phase: ph.phase,
    kind: ph.kind,
    axes: ph.axes,
    motions: ph.segments.map((s) => ({ axis: s.axis, phase: s.phase })),
    durationS: ph.durationS,
    shownS: ph.durationS,
    demandLpm: ph.demandLpm,
    pressureBar: pumpPhases[i].bar,
    pumpFlowLpm: pumpPhases[i].lpm,
    hydraulicKw: (pumpPhases[i].bar * pumpPhases[i].lpm) / 600,
    shaftKw: pumpPhases[i].shaftKw,
    heatKw: plan ? accumulatorPhaseHeatKw(ph, pumpPhases[i], plan) : phaseHeatKw(ph, pumpPhases[i].shaftKw, ownPump),
  }));
  const busyS = cycle.reduce((s, p) => s + p.durationS, 0);
  // With an accumulator the pump goes on charging after the motions until it is full again.
  if (plan && plan.rechargeS > 0) {
    const p = chargingPhase(plan);
    cycle.push({
      ...{ step: null, phase: "recharge", kind: "neutral", axes: [], motions: [], durationS: plan.rechargeS, shownS: plan.rechargeS, demandLpm: 0 },
      ...{ pressureBar: p.bar, pumpFlowLpm: p.lpm, hydraulicKw: p.kw, shaftKw: p.shaftKw, heatKw: p.shaftKw - p.kw },
    });
  }
  const chargingS = plan?.rechargeS ?? 0;
  // No cycles per hour (or so few the time overflows): no cycle time, so no neutral phase (as cycle.ts).
  const cycleS = Number.isFinite(3600 / m.cyclesPerHour) ? 3600 / m.cyclesPerHour : null;
  const neutral = plan ? unloadedPhase(qp) : neutralPhase(designs, mp);
  if (cycleS !== null && cycleS - busyS - chargingS > 0) {
    cycle.push({
      step: null,
      phase: "neutral",
      kind: "neutral",
      axes: [],
      motions: [],
      durationS: cycleS - busyS - chargingS,
      shownS: Math.min(cycleS - busyS - chargingS, busyS),
      demandLpm: 0,
      pressureBar: neutral.bar,
      pumpFlowLpm: neutral.lpm,
      hydraulicKw: (neutral.bar * neutral.lpm) / 600,
      shaftKw: neutral.shaftKw,
      heatKw: neutral.shaftKw,
    });
  }

  const motor = machineMotor(
    cycle,
    [...pumpPhases, ...(chargingS > 0 ? [chargingPhase(plan!)] : [])].map((p) => p.kw),
    mp,
    designs,
    neutral,
    m.cyclesPerHour,
    plan !== null,
  );
  // The tank takes back the oil the accumulator holds when it is vented at shut-down.
  const reservoir = machineReservoir(designs, qp, m.ambientC, plan?.oilAtMaxL ?? 0);
  const returnMaxLpm = Math.max(...timeline.map((p) => p.returnLpm));
  // From the accumulator the pressure line carries the peak the axes draw, not the pump's delivery.
  const lines = machineLines(designs, qp, returnMaxLpm, plan ? Math.max(qp, ...timeline.map((p) => p.demandLpm)) : qp);
  // Heat: each phase's loss over the cycle; without cycles the pump sits in neutral. Weighted by
  // each phase's share of the period (as the axis's duty shares), since kW × s overflows when the
  // cycle is near the largest finite time (a tiny cycles-per-hour).
  const periodS = cycleS === null ? null : Math.max(cycleS, busyS);
  const averageLossKw = periodS === null ? neutral.shaftKw : cycle.reduce((s, p) => s + p.heatKw * (p.durationS / periodS), 0);
  const coolerKw = Math.max(0, averageLossKw - reservoir.dissipationKw);

  // One relief vent for a fixed or double pump behind several P-blocking valves; one valve keeps its own arrangement.
  // An accumulator must keep its pressure in neutral: its charging valve unloads the pump instead.
  const reliefVent = several
    ? choice.type === "compensated" || plan
      ? null
      : {
          ventPressureBar: A.ventPressureBar.value,
          valve: "2/2 solenoid valve, normally open, on the relief valve's vent port X to tank",
          coilVoltage: `${A.coilVoltage.value} V DC`,
          energisedWhen: "with any solenoid of any axis's directional valve; de-energised when every valve is in neutral",
        }
    : designs[0].reliefVent;

  // How the pump rests while every valve blocks P: said on each valve whose centre the machine changed.
  const neutralUnloading = plan
    ? { reason: "the accumulator's charging valve unloads the pump once it is full", flow: "the pump unloads through the accumulator's charging valve" }
    : choice.type === "compensated"
      ? { reason: "the pump destrokes to its standby at the compensator", flow: "the compensated pump destrokes to its leakage" }
      : { reason: "the relief is vented to unload the pump", flow: "the pump unloads through the vented relief" };
  const axes: MachineAxis[] = designs.map((d) => {
    const center = several ? parallelCentre(d.directionalValve.center) : d.directionalValve.center;
    const ownFlow = Math.max(...timeline.flatMap((p) => p.segments.filter((s) => s.axis === d.requirements.name && s.moving).map((s) => s.drawLpm)));
    return {
      name: d.requirements.name!,
      requirements: d.requirements,
      loads: d.loads,
      cylinder: d.cylinder,
      pressuresBar: d.pressuresBar,
      flowsLpm: { extend: d.flowsLpm.extend, retract: d.flowsLpm.retract, ...(d.flowsLpm.press !== undefined ? { press: d.flowsLpm.press } : {}) },
      speedsMmS: d.speedsMmS,
      regenerative: d.regenerative,
      regeneration: d.regeneration ?? null,
      pressSpeedControl: d.pressSpeedControl,
      counterbalance: d.counterbalance,
      holding: d.holding,
      decompression: d.decompression,
      directionalValve:
        center === d.directionalValve.center
          ? // On a shared pump the pump rests as the machine's does, not as the axis's own pump would.
            several
            ? { ...d.directionalValve, neutralPumpFlow: `blocked at every valve; ${neutralUnloading.flow}` }
            : d.directionalValve
          : {
              ...d.directionalValve,
              center,
              centerReason: `${center} centre: this valve shares the pump with the other axes' valves, so it blocks P in neutral (a ${d.directionalValve.center} centre would let the pump escape through it); ${neutralUnloading.reason}`,
              neutralPumpFlow: `blocked at every valve; ${neutralUnloading.flow}`,
            },
      lines: { capWork: d.lines.capWork, rodWork: d.lines.rodWork },
      speedControl: plan
        ? {
            flowLpm: ownFlow,
            reason: `fed from the accumulator, whose pressure falls from ${plan.maxBar} to ${plan.minBar} bar as it gives oil, so a pressure-compensated meter-in control holds this axis's speed`,
          }
        : ownFlow < qp * (1 - A.speedTolerance.value)
          ? {
              flowLpm: ownFlow,
              reason: `the pump delivers ${Math.round(qp * 10) / 10} L/min and this axis draws at most ${Math.round(ownFlow * 10) / 10} L/min, so a meter-in flow control holds its speed`,
            }
          : null,
    };
  });

  const frame = FOUR_POLE_FRAMES.get(motor.ratedKw) ?? null;
  const design: MachineDesign = {
    engineVersion: ENGINE_VERSION,
    requirements: m,
    sequence: m.sequence,
    axes,
    cycle,
    pump: designPump(choice, {
      displacementCcRev: choice.displacementsCcRev.reduce((a, b) => a + b, 0),
      speedRpm: mp.speedRpm,
      requiredDisplacementCcRev: mp.requiredDisplacementCc,
    }),
    motor: {
      requiredKw: motor.requiredKw,
      ratedKw: motor.ratedKw,
      poles: A.motorPoles.value,
      frame,
      sizingPressureBar: motor.sizingPressureBar,
      sizedAtRelief: motor.sizedAtRelief,
      peakKw: motor.peakKw,
      rmsKw: motor.rmsKw,
      phases: cycle.filter((p) => p.kind !== "neutral").map((p) => ({ name: p.phase, kw: p.shaftKw, durationS: p.durationS })),
    },
    flowsLpm: { pump: qp, returnMax: returnMaxLpm, requiredMax: mp.requiredLpm },
    pressuresBar: { reliefSetting: choice.reliefBar, workingMax: mp.demand.workingBar },
    reservoir,
    cooler: coolerKw > 0 ? { kw: coolerKw } : null,
    returnFilter: { ratedFlowLpm: returnMaxLpm },
    lines,
    reliefVent,
    accumulator: plan
      ? {
          reason: plan.reason,
          gasVolumeL: plan.gasVolumeL,
          highestNeedBar: plan.highestNeedBar,
          nominalL: plan.nominalL,
          prechargeBar: plan.prechargeBar,
          minBar: plan.minBar,
          maxBar: plan.maxBar,
          usableL: plan.usableL,
          oilAtMaxL: plan.oilAtMaxL,
          exponent: A.accumulatorExponent.value,
          withoutDisplacementCcRev: selectDisplacementCc(normal.requiredDisplacementCc).displacementCc,
        }
      : null,
    heat: {
      averageLossKw,
      neutralLossKw: neutral.shaftKw,
      neutralPressureBar: neutral.bar,
      tankDissipationKw: reservoir.dissipationKw,
      coolerKw,
      dailyEnergyKwh: averageLossKw * m.hoursPerDay,
      busyS,
      cycleS,
    },
    warnings: [],
    bom: [],
    trail: [],
    circuit: { components: [], connections: [] },
  };
  design.warnings = machineWarnings(design, designs, mp, motor.inSeries);
  design.bom = machineBom(design, designs);
  design.circuit = machineCircuit(design, designs);
  design.trail = machineTrail(design, designs, mp);
  return design;
}

/** The fixed pump that charges the accumulator, and its relief above the charging band. */
function accumulatorPump(normal: MachinePump, plan: AccumulatorPlan): MachinePump {
  const demand = {
    ...normal.demand,
    press: null,
    reliefBar: plan.reliefBar,
    workingBar: plan.maxBar,
    requiredDisplacementCc: plan.requiredDisplacementCc,
    displacementCc: plan.displacementCc,
    pumpFlowLpm: plan.qpLpm,
  };
  const choice = { ...choosePump(demand, "fixed"), reason: `a fixed pump with ${plan.reason}` };
  return { ...normal, choice, demand, requiredDisplacementCc: plan.requiredDisplacementCc, inSeries: true, qpLpm: plan.qpLpm, smallLpm: null };
}

/**
 * The pump while the axes move and while it refills the accumulator: Q_p at up to p2, counted at
 * p2 throughout the motions, which sizes the motor on the worst case [D].
 */
function chargingPhase(plan: AccumulatorPlan) {
  const kw = hydraulicPowerKw(plan.maxBar, plan.qpLpm);
  return { bar: plan.maxBar, lpm: plan.qpLpm, kw, shaftKw: kw / A.overallEfficiency.value };
}

/** Full accumulator, every valve in neutral: the charging valve dumps the pump at Δp_u. */
function unloadedPhase(qp: number) {
  const kw = hydraulicPowerKw(A.unloadedDropBar.value, qp);
  return { bar: A.unloadedDropBar.value, lpm: qp, kw, shaftKw: kw / A.overallEfficiency.value };
}

/**
 * A phase fed from the accumulator: the pump's own losses, and the axes' meter-in controls
 * throttling the accumulator's p2 down to what each needs (Σ(p2·Q_i)/600 − F·v); the energy the
 * pump stores while recharging comes out here [D].
 */
function accumulatorPhaseHeatKw(ph: TimelinePhase, pump: { kw: number; shaftKw: number }, plan: AccumulatorPlan): number {
  const delivered = hydraulicPowerKw(plan.maxBar, ph.demandLpm);
  return pump.shaftKw - pump.kw + Math.max(0, delivered - ph.segments.reduce((s, seg) => s + seg.usefulKw, 0));
}
