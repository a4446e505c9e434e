/** The machine schema: paths of bad fields, the default cycle, and the axis's own limits inside a machine. */
import { describe, expect, it } from "vitest";
import { parseMachine, REQUIREMENT_LIMITS, RequirementsError, sizeCircuit, sizeMachine } from "~/hydraulics";

const AXIS = { orientation: "horizontal", massKg: 200, strokeMm: 300, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "fixed-pinned" };
const DUTY = { cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50 };
const LIFT_AND_TILT = [
  { ...AXIS, name: "Lift" },
  { ...AXIS, name: "Tilt" },
];

function errorsOf(input: unknown): Record<string, string[]> {
  try {
    parseMachine(input);
  } catch (error) {
    if (error instanceof RequirementsError) return error.fieldErrors;
    throw error;
  }
  throw new Error("expected a RequirementsError");
}

describe("parseMachine", () => {
  it("fills the default cycle: each axis in order extends, then retracts, one at a time", () => {
    const m = parseMachine({
      axes: LIFT_AND_TILT,
      ...DUTY,
    });
    expect(m.defaultSequence).toBe(true);
    expect(m.sequence).toEqual([
      [{ axis: "Lift", motion: "extend" }],
      [{ axis: "Lift", motion: "retract" }],
      [{ axis: "Tilt", motion: "extend" }],
      [{ axis: "Tilt", motion: "retract" }],
    ]);
    // Each axis carries the machine's duty and the axis defaults (sizing contract).
    expect(m.axes[1]).toMatchObject({ name: "Tilt", cyclesPerHour: 60, maxPressureBar: 160, ambientC: 25, frictionCoefficient: 0.1 });
  });

  it("names every bad field by its path, all at once", () => {
    const errors = errorsOf({
      axes: [{ ...AXIS, name: "Lift" }, { ...AXIS, name: "Lift", strokeMm: -5, hoursPerDay: 3 }, "tilt"],
      sequence: [
        [
          { axis: "Lift", motion: "extend" },
          { axis: "Ram", motion: "extend" },
        ],
        [{ axis: "Lift", motion: "jump" }],
      ],
      ...DUTY,
      supplyHz: 55,
    });
    expect(Object.keys(errors).sort()).toEqual([
      "axes.1.hoursPerDay",
      "axes.1.name",
      "axes.1.strokeMm",
      "axes.2",
      "sequence.0.1.axis",
      "sequence.1.0.motion",
      "supplyHz",
    ]);
  });

  it("holds an axis in a machine to the axis's own limits (one source of limits)", () => {
    const over = REQUIREMENT_LIMITS.strokeMm.max + 1;
    expect(Object.keys(errorsOf({ axes: [{ ...AXIS, name: "Lift", strokeMm: over }], ...DUTY }))).toEqual(["axes.0.strokeMm"]);
    expect(Object.keys(errorsOf({ axes: [{ ...AXIS, name: "Lift" }], ...DUTY, hoursPerDay: REQUIREMENT_LIMITS.hoursPerDay.max + 1 }))).toEqual(["hoursPerDay"]);
  });

  it("asks every axis to move in the cycle, and each at most once per step", () => {
    const errors = errorsOf({
      axes: LIFT_AND_TILT,
      ...DUTY,
      sequence: [
        [
          { axis: "Lift", motion: "extend" },
          { axis: "Lift", motion: "retract" },
        ],
      ],
    });
    expect(Object.keys(errors).sort()).toEqual(["axes.1.name", "sequence.0.1.axis"]);
  });

  it("takes one to eight axes", () => {
    expect(Object.keys(errorsOf({ axes: [], ...DUTY }))).toEqual(["axes"]);
    const nine = Array.from({ length: 9 }, (_, i) => ({ ...AXIS, name: `Axis ${i}` }));
    expect(Object.keys(errorsOf({ axes: nine, ...DUTY }))).toEqual(["axes"]);
    expect(() => parseMachine({ axes: nine.slice(0, 8), ...DUTY })).not.toThrow();
  });

  it("reports an axis that cannot be sized at its own path, naming it", () => {
    // A 3 MN press force within 20 bar: nothing in the ISO 3320 series reaches it.
    try {
      sizeMachine({
        axes: [
          { ...AXIS, name: "Lift" },
          { ...AXIS, name: "Ram", processForceN: 3_000_000 },
        ],
        ...DUTY,
        maxPressureBar: 20,
      });
      throw new Error("expected a RequirementsError");
    } catch (error) {
      expect(error).toBeInstanceOf(RequirementsError);
      const errors = (error as RequirementsError).fieldErrors;
      expect(Object.keys(errors)).toEqual(["maxPressureBar"]);
      expect(errors.maxPressureBar[0]).toMatch(/^Ram: /);
    }
  });

  it("sizes an axis inside a machine exactly as the same axis with the machine's duty", () => {
    const m = sizeMachine({
      axes: [
        { ...AXIS, name: "Lift" },
        { ...AXIS, name: "Tilt", massKg: 50, strokeMm: 100 },
      ],
      ...DUTY,
    });
    const alone = sizeCircuit({ ...AXIS, name: "Lift", ...DUTY });
    expect(m.axes[0].cylinder).toEqual(alone.cylinder);
    expect(m.axes[0].pressuresBar).toEqual(alone.pressuresBar);
  });
});
