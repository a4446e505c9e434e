/**
 * Properties of a machine over random axes (fast-check): the one power unit feeds every phase,
 * the motor covers every phase, a larger machine never gets less pump, a machine of one axis is
 * that axis, and the circuit joins every valve to the pump and tank and to its own cylinder only.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ASSUMPTIONS, MACHINE_DUTY_FIELDS, RequirementsError, sizeCircuit, sizeMachine, type MachineDesign, type RequirementsInput } from "~/hydraulics";
import { pressAxisArb, requirementsArb } from "./arbitraries";

type Axis = Record<string, unknown>;
const RUNS = { numRuns: Number(process.env.MACHINE_RUNS ?? 25) };

/** An axis and the duty it came with, split the way a machine asks them. */
function split(r: RequirementsInput, name: string): { axis: Axis; duty: Axis } {
  const axis: Axis = { ...r, name };
  const duty: Axis = {};
  for (const f of MACHINE_DUTY_FIELDS) {
    if (f in axis) duty[f] = axis[f];
    delete axis[f];
  }
  return { axis, duty };
}

/** Sizes, or null where the requirements are valid but nothing in the series meets them (both engines say so alike). */
function attempt<T>(f: () => T): T | null {
  try {
    return f();
  } catch (error) {
    if (error instanceof RequirementsError) return null;
    throw error;
  }
}

const anyAxis = fc.oneof(requirementsArb, pressAxisArb);
const machineArb = fc.tuple(fc.array(anyAxis, { minLength: 1, maxLength: 3 }), fc.boolean()).map(([list, together]) => {
  const parts = list.map((r, i) => split(r, `Axis ${i + 1}`));
  const names = parts.map((_, i) => `Axis ${i + 1}`);
  // Either the default (one axis at a time) or every axis out together, then every axis back together.
  const sequence = together ? [names.map((axis) => ({ axis, motion: "extend" })), names.map((axis) => ({ axis, motion: "retract" }))] : undefined;
  return { axes: parts.map((p) => p.axis), ...parts[0].duty, ...(sequence ? { sequence } : {}) };
});

/** A property over random machines: `check` holds for every machine the series can size; one it cannot is passed over. */
function forEveryMachine(check: (m: MachineDesign) => void) {
  fc.assert(
    fc.property(machineArb, (input) => {
      const m = attempt(() => sizeMachine(input));
      if (m) check(m);
    }),
    RUNS,
  );
}

const A = { motorPeakRatio: ASSUMPTIONS.motorPeakRatio.value, motorPeakSeconds: ASSUMPTIONS.motorPeakSeconds.value };

describe("a machine of one axis sizes exactly like that axis alone", () => {
  it("same cylinder, pump, motor, relief, reservoir and cycle", () => {
    fc.assert(
      fc.property(anyAxis, (r) => {
        const { axis, duty } = split(r, "Only");
        const alone = attempt(() => sizeCircuit({ ...r, name: "Only" }));
        const machine = attempt(() => sizeMachine({ axes: [axis], ...duty }));
        expect(machine === null).toBe(alone === null);
        if (!alone || !machine) return;
        expect(machine.axes[0].cylinder).toEqual(alone.cylinder);
        expect(machine.pump).toEqual(alone.pump);
        expect(machine.motor.ratedKw).toBe(alone.motor.ratedKw);
        expect(machine.motor.requiredKw).toBeCloseTo(alone.motor.requiredKw, 9);
        expect(machine.pressuresBar.reliefSetting).toBe(alone.pressuresBar.reliefSetting);
        expect(machine.reservoir).toEqual(alone.reservoir);
        expect(machine.flowsLpm.pump).toBe(alone.flowsLpm.pump);
        expect(machine.flowsLpm.returnMax).toBeCloseTo(alone.flowsLpm.returnMax, 9);
        expect(machine.axes[0].directionalValve).toEqual(alone.directionalValve);
        expect(machine.axes[0].counterbalance).toEqual(alone.counterbalance);
        const pick = (c: { durationS: number; demandLpm: number; pressureBar: number; pumpFlowLpm: number }) =>
          [c.durationS, c.demandLpm, c.pressureBar, c.pumpFlowLpm].map((x) => Math.round(x * 1e6) / 1e6);
        expect(machine.cycle.map(pick)).toEqual((alone.cycle ?? []).map(pick));
        expect(machine.heat.averageLossKw).toBeCloseTo(alone.heat.averageLossKw, 9);
        expect(machine.cooler === null).toBe(alone.cooler === null);
      }),
      RUNS,
    );
  });
});

describe("the power unit over the machine cycle", () => {
  it("delivers in every phase what the moving axes draw, or the design warns", () => {
    forEveryMachine((m) => {
      // Short only with the warning that says so (or a pump beyond the series, which has its own).
      const short = m.warnings.some((w) => w.code === "MACHINE_FLOW_SHORT" || w.code === "PUMP_BEYOND_SERIES");
      if (m.accumulator) {
        // The pump and the accumulator together: it is never drawn below p1 (sources' flow-peak support, ΔV [D]).
        let deficit = 0;
        for (const p of m.cycle) {
          deficit = Math.max(0, deficit + ((p.demandLpm - p.pumpFlowLpm) * p.durationS) / 60);
          expect(deficit).toBeLessThanOrEqual(m.accumulator.usableL + 1e-9);
        }
        return;
      }
      for (const p of m.cycle) if (!short) expect(p.pumpFlowLpm).toBeGreaterThanOrEqual(p.demandLpm * (1 - 1e-6));
      // The pump is sized for the largest sum of flows the axes draw together at their asked speeds.
      if (!short) for (const p of m.cycle) expect(m.flowsLpm.pump).toBeGreaterThanOrEqual(Math.min(p.demandLpm, m.flowsLpm.requiredMax) * (1 - 1e-6));
    });
  });

  it("runs the pump in every phase at no less than the highest pressure any axis taking part needs", () => {
    forEveryMachine((m) => {
      const axes = new Map(m.axes.map((a) => [a.name, a]));
      for (const p of m.cycle) {
        for (const { axis, phase } of p.motions) {
          const bar = axes.get(axis)!.pressuresBar;
          const need = phase === "retract" ? bar.retract : phase === "approach" || phase === "extend" ? bar.extendMoving : bar.extendPress;
          expect(p.pressureBar).toBeGreaterThanOrEqual(need - 1e-9);
        }
      }
    });
  });

  it("has a motor that covers every phase: short peaks within 1.5 × its rating, long phases within it", () => {
    forEveryMachine((m) => {
      if (m.warnings.some((w) => w.code === "MOTOR_BEYOND_SERIES")) return;
      const rated = m.motor.ratedKw * (1 + 1e-9);
      expect(m.motor.ratedKw).toBeGreaterThanOrEqual(m.motor.requiredKw * (1 - 1e-9));
      for (const p of m.cycle) {
        expect(p.shaftKw).toBeLessThanOrEqual(rated * A.motorPeakRatio);
        if (m.motor.rmsKw === null || p.kind === "neutral" || p.durationS > A.motorPeakSeconds) expect(p.shaftKw).toBeLessThanOrEqual(rated);
      }
      expect(m.motor.peakKw).toBeLessThanOrEqual(rated * A.motorPeakRatio);
    });
  });

  it("never lowers the pump flow when an axis that moves alone is added", () => {
    fc.assert(
      fc.property(machineArb, anyAxis, (input, extra) => {
        const before = attempt(() => sizeMachine(input));
        const { axis } = split(extra, "Added");
        const sequence = input.sequence ? [...input.sequence, [{ axis: "Added", motion: "extend" }], [{ axis: "Added", motion: "retract" }]] : undefined;
        const after = attempt(() => sizeMachine({ ...input, axes: [...input.axes, axis], ...(sequence ? { sequence } : {}) }));
        if (!before || !after) return;
        // An accumulator the larger machine gets (or the smaller one had) carries the peaks, and the pump is sized
        // near the mean flow by design: tests/unit/hydraulics/machine-accumulator.test.ts holds what it must feed.
        if (before.accumulator || after.accumulator) return;
        expect(after.flowsLpm.pump).toBeGreaterThanOrEqual(before.flowsLpm.pump);
        expect(after.reservoir.volumeL).toBeGreaterThanOrEqual(before.reservoir.volumeL);
      }),
      RUNS,
    );
  });
});

const componentOf = (end: string) => end.slice(0, end.lastIndexOf("."));
const portOf = (end: string) => end.slice(end.lastIndexOf(".") + 1);

/** Components reachable from a port, passing through components (all their ports) but never into one `stop` refuses. */
function reach(m: MachineDesign, start: string, stop: (id: string) => boolean): Set<string> {
  const seen = new Set<string>();
  const queue = [start];
  while (queue.length > 0) {
    const end = queue.shift()!;
    for (const c of m.circuit.connections) {
      const other = c.from === end ? c.to : c.to === end ? c.from : null;
      if (!other) continue;
      const id = componentOf(other);
      if (seen.has(id)) continue;
      seen.add(id);
      if (stop(id)) continue;
      const comp = m.circuit.components.find((k) => k.id === id)!;
      for (const port of comp.ports) queue.push(`${id}.${port}`);
    }
  }
  return seen;
}

describe("the machine's circuit", () => {
  it("joins every valve's P to the pump and T to the tank, and each valve only to its own cylinder", () => {
    forEveryMachine((m) => {
      const byId = new Map(m.circuit.components.map((c) => [c.id, c]));
      const dcvs = m.circuit.components.filter((c) => c.kind === "dcv");
      expect(dcvs.map((d) => d.axis)).toEqual(m.axes.map((a) => a.name));
      // One power unit: its pump (both sections of a double pump) belongs to no axis.
      expect(m.circuit.components.filter((c) => c.id === "pump")).toHaveLength(1);
      for (const c of m.circuit.components.filter((k) => k.kind === "pump")) expect(c.axis).toBeUndefined();
      for (const dcv of dcvs) {
        expect(dcv.dcvPositions).toBeDefined();
        // P from the pump line (common P gallery), directly or through the axis's own P-line parts only.
        const supply = reach(m, `${dcv.id}.P`, (id) => byId.get(id)?.axis === undefined || id === dcv.id);
        // (with an accumulator, from past the pump's check valve, where the accumulator stands)
        expect(supply.has(m.accumulator ? "pump-check" : "pump")).toBe(true);
        for (const id of supply) if (byId.get(id)?.axis !== undefined) expect(byId.get(id)!.axis).toBe(dcv.axis);
        // T through the power unit's return path to the tank, never through another axis.
        const back = reach(m, `${dcv.id}.T`, (id) => id === "tank" || byId.get(id)?.axis !== undefined);
        expect(back.has("tank")).toBe(true);
        // A and B reach this axis's parts and its cylinder only; the power unit (tank, pump) ends the walk.
        const work = [`${dcv.id}.A`, `${dcv.id}.B`].flatMap((start) => [...reach(m, start, (id) => byId.get(id)?.axis === undefined || id === dcv.id)]);
        const axisParts = work.filter((id) => byId.get(id)?.axis !== undefined);
        for (const id of axisParts) expect(byId.get(id)!.axis).toBe(dcv.axis);
        expect(axisParts.filter((id) => byId.get(id)!.kind === "cylinder")).toEqual(expect.arrayContaining([expect.any(String)]));
        expect(new Set(axisParts.filter((id) => byId.get(id)!.kind === "cylinder")).size).toBe(1);
      }
      // Every connection names a component that exists, and a port it has.
      for (const c of m.circuit.connections) {
        for (const end of [c.from, c.to]) expect(byId.get(componentOf(end))?.ports).toContain(portOf(end));
      }
    });
  });

  it("says how the pump rests in neutral as the design does it: a vented relief only where there is one", () => {
    forEveryMachine((m) => {
      for (const a of m.axes) {
        const said = `${a.directionalValve.centerReason} ${a.directionalValve.neutralPumpFlow}`;
        if (/vented relief|relief is vented/.test(said)) expect(m.reliefVent).not.toBeNull();
        if (m.accumulator && /shares the pump/.test(said)) expect(said).toMatch(/charging valve/);
      }
    });
  });

  it("bills the power unit once and every axis's own parts under its name", () => {
    forEveryMachine((m) => {
      const keys = m.bom.map((l) => l.key);
      expect(new Set(keys).size).toBe(keys.length);
      for (const unit of ["pump", "motor", "reservoir", "relief-valve", "return-filter"]) expect(keys.filter((k) => k === unit)).toHaveLength(1);
      for (const a of m.axes) {
        expect(keys).toContain(`cylinder:${a.name}`);
        expect(keys).toContain(`directional-valve:${a.name}`);
      }
      for (const w of m.warnings.filter(
        (x) =>
          ![
            "MACHINE_FLOW_SHORT",
            "PUMP_BEYOND_SERIES",
            "MOTOR_BEYOND_SERIES",
            "DUTY_CYCLE_OVERLOAD",
            "HEAT_COOLER_NEEDED",
            "PUMP_TYPE_NOT_SUITED",
            "RELIEF_VENTED_IN_NEUTRAL",
            "PUMP_ON_RELIEF_IN_NEUTRAL",
            "ACCUMULATOR_STORED_ENERGY",
          ].includes(x.code),
      )) {
        expect(m.axes.some((a) => w.message.startsWith(`${a.name}: `))).toBe(true);
      }
    });
  });
});
