/**
 * How the machine's numbers were reached: each axis's own working (its cylinder, valves and
 * pressures, named with the axis), then the power unit over the machine cycle.
 */
import type { Design } from "./design";
import type { MachineDesign } from "./machine-design";
import type { MachinePump } from "./machine-pump";
import { v, type TrailEntry } from "./trail";

/** Axis trail entries about its own pump, motor, tank and heat: the machine works these out once. */
const POWER_UNIT_QUANTITY =
  /^(pump|motor|large pump|small pump|power limiter|compensator|unloading|drive speed|relief|reservoir|tank|cooler|average heat|heat |gauge|largest return|suction|pressure line|return line|highest hydraulic power|daily)/i;

const r1 = (x: number) => Math.round(x * 10) / 10;

export function machineTrail(m: MachineDesign, designs: Design[], mp: MachinePump): TrailEntry[] {
  const trail: TrailEntry[] = [];
  designs.forEach((d, i) => {
    const name = m.axes[i].name;
    for (const e of d.trail) if (!POWER_UNIT_QUANTITY.test(e.quantity)) trail.push({ ...e, quantity: `${name}: ${e.quantity}` });
  });
  const moving = m.cycle.filter((p) => p.kind !== "neutral");
  const top = moving.reduce((a, b) => (b.demandLpm > a.demandLpm ? b : a));
  trail.push(
    {
      quantity: "machine cycle",
      value: m.requirements.defaultSequence ? "each axis in turn" : `${m.sequence.length} steps`,
      unit: "-",
      formula: m.sequence.map((step, k) => `step ${k + 1}: ${step.map((s) => `${s.axis} ${s.motion}s`).join(" with ")}`).join("; "),
      inputs: { phases: v(moving.length, "-"), "time the axes move": v(m.heat.busyS, "s"), "cycle time": v(m.heat.cycleS ?? "no cycles", "s") },
      source:
        "the buyer's sequence, or each axis in order extending then retracting; axes moving together run at their asked speeds under meter-in flow controls, an axis moving alone as it would on its own pump [CP]",
    },
    {
      quantity: "pump flow needed",
      value: mp.requiredLpm,
      unit: "L/min",
      formula:
        "Q_p ≥ max over the phases of ΣQ_i, the cylinder flows at the asked speeds of the axes moving together (in a pure sequence the largest single axis)",
      inputs: Object.fromEntries(moving.slice(0, 16).map((p, i) => [`phase ${i + 1} (${p.axes.join(" + ") || "none moving"})`, v(r1(p.demandLpm), "L/min")])),
      source: `continuity Q = A·v summed over the actuators on one pump, fluid-power textbooks [D]; largest in step ${(top.step ?? 0) + 1}`,
    },
    {
      quantity: "pump displacement",
      value: m.pump.displacementCcRev,
      unit: "cm³/rev",
      formula: "V_g = 1000·Q_p / (n·η_v), next in the ISO 3662 series",
      inputs: {
        Q_p: v(m.accumulator ? (mp.demand.pumpFlowLpm * m.pump.requiredDisplacementCcRev) / m.pump.displacementCcRev : mp.requiredLpm, "L/min"),
        n: v(m.pump.speedRpm, "rpm"),
        η_v: v(m.pump.volumetricEfficiency, "-"),
        needed: v(m.pump.requiredDisplacementCcRev, "cm³/rev"),
      },
      source: "ISO 3662 displacement series; pump delivery formula, fluid-power textbooks [D]",
    },
    {
      quantity: "pump type",
      value: m.pump.type,
      unit: "-",
      formula: m.pump.reason,
      inputs: {
        asked: v(m.requirements.pumpType ?? "not given", "-"),
        "highest working pressure": v(mp.demand.workingBar, "bar"),
        "pressing flow": v(mp.demand.press?.flowLpm ?? "no pressing", "L/min"),
      },
      source: "high-low and pressure-compensated pump practice, trade press-circuit texts [CP]",
    },
    {
      quantity: "relief setting",
      value: m.pressuresBar.reliefSetting,
      unit: "bar",
      formula:
        "one relief for the machine, set from the highest working pressure any axis needs (its own rule: about 10 % above it, or above the compensator); a lower-rated axis gets a reducing valve, never a second relief",
      inputs: { "highest working pressure": v(mp.demand.workingBar, "bar"), "from axis": v(mp.governingAxis, "-") },
      source: "ISO 4413 (every circuit protected by a pressure-limiting valve); reducing valves for branches at lower pressure, fluid-power textbooks [S]",
    },
    {
      quantity: "motor power needed",
      value: m.motor.requiredKw,
      unit: "kW",
      formula:
        m.motor.rmsKw !== null
          ? "max(P_rms = √(ΣP_i²·t_i / T), P_peak / 1.5, any phase longer than the short-overload time)"
          : "P_peak: the cycle is too long for an RMS rating",
      inputs: {
        P_peak: v(m.motor.peakKw, "kW"),
        P_rms: v(m.motor.rmsKw ?? "not used", "kW"),
        "at pressure": v(m.motor.sizingPressureBar, "bar"),
        rated: v(m.motor.ratedKw, "kW"),
      },
      source:
        "RMS loading for short duty cycles, motor-selection practice; IEC 60072-1 rated outputs; peak limit from IEC 60034-1 overload torque (from memory) [M]",
    },
    {
      quantity: "reservoir volume",
      value: m.reservoir.volumeL,
      unit: "L",
      formula: "V = 4 × Q_p (per minute) + ΣA_rod,i·s_i (every cylinder extended at once), rounded up to 5 L",
      inputs: {
        Q_p: v(m.flowsLpm.pump, "L/min"),
        "oil the cylinders draw": v(m.reservoir.cylinderDrawL, "L"),
        ...(m.accumulator ? { "oil the accumulator returns when vented": v(m.accumulator.oilAtMaxL, "L") } : {}),
      },
      source: "3–5 × pump flow per minute, common practice [CP]; level drop from the rod volumes [D]",
    },
    {
      quantity: "average heat loss",
      value: m.heat.averageLossKw,
      unit: "kW",
      formula: "Φ = Σ(P_shaft,i − F·v) · t_i / T over the machine's phases, neutral included",
      inputs: { "tank sheds": v(m.heat.tankDissipationKw, "kW"), cooler: v(m.cooler?.kw ?? 0, "kW"), "in neutral": v(m.heat.neutralLossKw, "kW") },
      source: "energy balance of the duty cycle, fluid-power textbooks [D]; tank heat transfer, common practice [CP]",
    },
  );
  if (m.accumulator) trail.push(...accumulatorTrail(m));
  const peak = moving.reduce((a, b) => (b.hydraulicKw > a.hydraulicKw ? b : a));
  trail.push({
    quantity: "highest hydraulic power in the cycle",
    value: peak.hydraulicKw,
    unit: "kW",
    formula: "P = p·Q_pump / 600 in each phase",
    inputs: { p: v(peak.pressureBar, "bar"), Q_pump: v(peak.pumpFlowLpm, "L/min"), axes: v(peak.axes.join(", ") || "none moving", "-") },
    source: "hydraulic power p·Q, fluid-power textbooks [D]",
  });
  return trail;
}

/** How the accumulator was sized (sources §11.6). */
function accumulatorTrail(m: MachineDesign): TrailEntry[] {
  const acc = m.accumulator!;
  const moving = m.cycle.filter((p) => p.step !== null);
  const cycleOilL = moving.reduce((s, p) => s + (p.demandLpm * p.durationS) / 60, 0);
  const cycleS = m.heat.cycleS ?? 0;
  return [
    {
      quantity: "accumulator: why",
      value: `${acc.withoutDisplacementCcRev} → ${m.pump.displacementCcRev} cm³/rev`,
      unit: "-",
      formula: acc.reason,
      inputs: { "oil a cycle": v(cycleOilL, "L"), "cycle time": v(cycleS, "s"), "mean flow": v(cycleS > 0 ? (60 * cycleOilL) / cycleS : 0, "L/min") },
      source:
        "flow-peak support: the pump sized for the mean flow, Q_p ≥ V_cycle / T (1.25 × it, our convention), the accumulator for the peaks, fluid-power textbooks [D]; proposed where the pump gets two sizes smaller [CP]",
    },
    {
      quantity: "accumulator pressures",
      value: `${acc.prechargeBar} / ${acc.minBar} / ${acc.maxBar}`,
      unit: "bar",
      formula: "p1 = highest pressure an axis needs + 10 bar, rounded up to 5; p2 = 1.2 × p1, rounded up to 5; p0 = 0.9 × p1",
      inputs: { "highest pressure an axis needs": v(acc.highestNeedBar, "bar") },
      source:
        "precharge 0.9 × p1 for energy storage, bladder p2 ≤ 4 × p0 (accumulator makers' pages) [CP]; the control's regulating margin, common practice [CP]",
    },
    {
      quantity: "oil the accumulator gives",
      value: acc.usableL,
      unit: "L",
      formula: "ΔV = the deepest the cycle draws it down: Σ(Q_axes − Q_p)·t / 60 over the motions, the pump delivering throughout, full at the start",
      inputs: { Q_p: v(m.flowsLpm.pump, "L/min"), "largest flow drawn": v(Math.max(...moving.map((p) => p.demandLpm)), "L/min") },
      source: "ΔV = V_move − Q_p·t_move / 60 (flow-peak support), fluid-power textbooks [D]",
    },
    {
      quantity: "accumulator gas volume",
      value: acc.gasVolumeL,
      unit: "L",
      formula: "V0 = ΔV / [(p0/p1)^(1/n) − (p0/p2)^(1/n)], absolute pressures (gauge + 1 bar), n = 1.4; next bladder size",
      inputs: { ΔV: v(acc.usableL, "L"), p0: v(acc.prechargeBar, "bar"), p1: v(acc.minBar, "bar"), p2: v(acc.maxBar, "bar"), chosen: v(acc.nominalL, "L") },
      source: "ideal gas p·Vⁿ = const (the same form on a maker's accumulator page) [D]; n = 1.4 for a discharge within seconds [CP]; sizes from memory [M]",
    },
  ];
}
