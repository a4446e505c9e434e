/**
 * An axis whose cylinder is rated below the machine's relief gets a pressure-reducing valve in
 * its P line: in the bill (machine-bom.ts) and, as the same part, in the machine's circuit, joined
 * between the pump line (or its P-line flow control) and its valve's P, drained to tank.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { RequirementsError, sizeMachine, type MachineDesign } from "~/hydraulics";
import { requirementsArb } from "./arbitraries";

const H = { orientation: "horizontal", mounting: "fixed-pinned", frictionCoefficient: 0.1 } as const;
/** A light clamp: a 160 bar cylinder series is enough for it. */
const CLAMP = { ...H, name: "Clamp", massKg: 100, processForceN: 10_000, strokeMm: 50, extendSpeedMmS: 50, retractSpeedMmS: 100 };
const FEED = { ...H, name: "Feed", massKg: 300, strokeMm: 500, extendSpeedMmS: 200, retractSpeedMmS: 200 };
/** A 300 kN press: it takes a 250 bar cylinder and a relief above 160 bar. */
const PRESS = {
  ...H,
  name: "Press",
  massKg: 500,
  processForceN: 300_000,
  strokeMm: 200,
  extendSpeedMmS: 100,
  pressStrokeMm: 20,
  pressSpeedMmS: 10,
  retractSpeedMmS: 150,
};
const DUTY = { cyclesPerHour: 120, hoursPerDay: 16, supplyHz: 50, maxPressureBar: 160 } as const;

const has = (m: MachineDesign, from: string, to: string) => m.circuit.connections.some((c) => c.from === from && c.to === to);
const into = (m: MachineDesign, end: string) => m.circuit.connections.flatMap((c) => (c.to === end ? [c.from] : c.from === end ? [c.to] : []));

/** Each axis's reducing valve in the circuit agrees with its bill line, and every drop of its valve's P passes it. */
function expectReducingValvesAsBilled(m: MachineDesign) {
  m.axes.forEach((axis, i) => {
    const line = m.bom.find((l) => l.key === `reducing-valve:${axis.name}`);
    const valve = m.circuit.components.find((c) => c.kind === "reducing" && c.axis === axis.name);
    expect(valve === undefined, axis.name).toBe(line === undefined);
    // needed exactly where the cylinder is rated below the relief
    expect(line !== undefined, axis.name).toBe(axis.cylinder.ratedPressureBar < m.pressuresBar.reliefSetting);
    if (!valve || !line) return;
    const id = `a${i + 1}:reducing`;
    expect(valve).toMatchObject({ id, ports: ["P", "A", "Y"] });
    expect(valve.values?.settingBar).toBe(line.rating?.value);
    expect(Number(valve.values?.settingBar)).toBeLessThanOrEqual(axis.cylinder.ratedPressureBar);
    // its outlet is the only way into the valve's P; its inlet is fed by the pump line or the axis's flow control
    expect(into(m, `a${i + 1}:dcv.P`)).toEqual([`${id}.A`]);
    const feed = into(m, `${id}.P`);
    expect(feed).toEqual(axis.speedControl ? [`a${i + 1}:speed-control.1`] : expect.arrayContaining(["pump.outlet"]));
    if (axis.speedControl) expect(into(m, `a${i + 1}:speed-control.2`)).toContain("pump.outlet");
    // externally drained to tank
    expect(m.circuit.connections).toContainEqual({ from: `${id}.Y`, to: "tank.return", line: "return" });
  });
}

describe("an axis's pressure-reducing valve in the machine's circuit", () => {
  it("a light clamp beside a 300 kN press: the clamp's 160 bar cylinder gets one, set as its bill line, between its flow control and its valve", () => {
    const m = sizeMachine({ axes: [CLAMP, PRESS], ...DUTY });
    expect(m.axes.map((a) => a.cylinder.ratedPressureBar)).toEqual([160, 250]);
    expect(m.pressuresBar.reliefSetting).toBeGreaterThan(160);
    const valve = m.circuit.components.find((c) => c.kind === "reducing")!;
    expect(valve).toMatchObject({ id: "a1:reducing", kind: "reducing", axis: "Clamp" });
    const line = m.bom.find((l) => l.key === "reducing-valve:Clamp")!;
    expect(valve.values).toEqual({ settingBar: line.rating!.value, cylinderRatedBar: 160, reliefBar: m.pressuresBar.reliefSetting });
    // pump → flow control 2 → 1 → reducing P → A → the clamp's valve P; Y → tank
    expect(has(m, "pump.outlet", "a1:speed-control.2")).toBe(true);
    expect(has(m, "a1:speed-control.1", "a1:reducing.P")).toBe(true);
    expect(has(m, "a1:reducing.A", "a1:dcv.P")).toBe(true);
    expect(has(m, "a1:speed-control.1", "a1:dcv.P")).toBe(false);
    expect(has(m, "a1:reducing.Y", "tank.return")).toBe(true);
    // the press's 250 bar cylinder takes the relief as it is
    expect(m.circuit.components.filter((c) => c.kind === "reducing")).toHaveLength(1);
    expect(has(m, "pump.outlet", "a2:dcv.P")).toBe(true);
    expectReducingValvesAsBilled(m);
  });

  it("two light axes beside the press: each its own, in its own P line", () => {
    const m = sizeMachine({ axes: [CLAMP, FEED, PRESS], ...DUTY });
    expect(m.circuit.components.filter((c) => c.kind === "reducing").map((c) => c.id)).toEqual(["a1:reducing", "a2:reducing"]);
    expectReducingValvesAsBilled(m);
  });

  it("any axes beside the press: the circuit has a reducing valve exactly where the bill has one, joined and set alike", () => {
    let sized = 0;
    let reduced = 0;
    fc.assert(
      fc.property(fc.array(requirementsArb, { minLength: 1, maxLength: 2 }), (list) => {
        const axes = list.map((r, i) => {
          const axis: Record<string, unknown> = { ...r, name: `Axis ${i + 1}` };
          for (const f of ["cyclesPerHour", "hoursPerDay", "ambientC", "supplyHz", "maxPressureBar", "pumpType"]) delete axis[f];
          return axis;
        });
        let m: MachineDesign;
        try {
          m = sizeMachine({ axes: [...axes, PRESS], ...DUTY });
        } catch (error) {
          if (error instanceof RequirementsError) return;
          throw error;
        }
        expectReducingValvesAsBilled(m);
        sized += 1;
        if (m.circuit.components.some((c) => c.kind === "reducing")) reduced += 1;
      }),
      { numRuns: 40 },
    );
    // not a property of nothing: machines were sized, and some got reducing valves
    expect(sized).toBeGreaterThan(4);
    expect(reduced).toBeGreaterThan(0);
  });
});
