/** Requirements validation: every kind of bad input names its field, all at once. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FORM_ERROR_KEY,
  REQUIREMENT_DEFAULTS,
  REQUIREMENT_LIMITS,
  REQUIREMENT_MESSAGES,
  RequirementsError,
  parseRequirements,
  requirementsSchema,
  sizeCircuit,
  type RequirementsInput,
} from "~/hydraulics";
import { requirementsArb } from "./arbitraries";

const GOOD: RequirementsInput = {
  orientation: "horizontal",
  massKg: 500,
  strokeMm: 400,
  extendSpeedMmS: 100,
  retractSpeedMmS: 150,
  mounting: "fixed-pinned",
  cyclesPerHour: 60,
  hoursPerDay: 8,
  supplyHz: 50,
};

function errorsFor(input: unknown): Record<string, string[]> {
  try {
    sizeCircuit(input);
  } catch (e) {
    expect(e).toBeInstanceOf(RequirementsError);
    return (e as RequirementsError).fieldErrors;
  }
  throw new Error("expected a RequirementsError");
}

describe("requirements schema", () => {
  it("fills the contract defaults (sizing contract)", () => {
    const r = parseRequirements(GOOD);
    expect(r.processForceN).toBe(0);
    expect(r.frictionCoefficient).toBe(0.1);
    expect(r.accelTimeS).toBe(0.2);
    expect(r.ambientC).toBe(25);
    expect(r.maxPressureBar).toBe(160);
  });

  it("is the one exported zod schema", () => {
    expect(requirementsSchema.safeParse(GOOD).success).toBe(true);
  });

  it.each([
    ["missing field", { ...GOOD, strokeMm: undefined }, "strokeMm"],
    ["wrong type", { ...GOOD, massKg: "heavy" }, "massKg"],
    ["out of range (negative mass)", { ...GOOD, massKg: -1 }, "massKg"],
    ["out of range (zero stroke)", { ...GOOD, strokeMm: 0 }, "strokeMm"],
    ["out of range (hours > 24)", { ...GOOD, hoursPerDay: 25 }, "hoursPerDay"],
    ["out of range (pressure)", { ...GOOD, maxPressureBar: 400 }, "maxPressureBar"],
    ["unknown enum (orientation)", { ...GOOD, orientation: "diagonal" }, "orientation"],
    ["unknown enum (mounting)", { ...GOOD, mounting: "glued" }, "mounting"],
    ["unknown supply frequency", { ...GOOD, supplyHz: 55 }, "supplyHz"],
    ["not a number (NaN)", { ...GOOD, extendSpeedMmS: Number.NaN }, "extendSpeedMmS"],
    ["inclined without inclineDeg", { ...GOOD, orientation: "inclined", rodDirection: "up" }, "inclineDeg"],
    ["inclined at 90°", { ...GOOD, orientation: "inclined", inclineDeg: 90, rodDirection: "up" }, "inclineDeg"],
    ["vertical without rodDirection", { ...GOOD, orientation: "vertical" }, "rodDirection"],
    ["unknown rodDirection", { ...GOOD, orientation: "vertical", rodDirection: "sideways" }, "rodDirection"],
  ])("%s throws RequirementsError naming the field", (_name, input, field) => {
    const errors = errorsFor(input);
    expect(Object.keys(errors)).toContain(field);
    expect(errors[field][0].length).toBeGreaterThan(10);
  });

  it("uses plain messages", () => {
    expect(errorsFor({ ...GOOD, strokeMm: -5 }).strokeMm).toEqual(["Enter the stroke in millimetres, more than 0 (up to 10 000)"]);
  });

  it("reports every invalid field at once, cross-field rules included", () => {
    const errors = errorsFor({ ...GOOD, orientation: "inclined", massKg: "x", strokeMm: -1, supplyHz: 40 });
    expect(Object.keys(errors).sort()).toEqual(["inclineDeg", "massKg", "rodDirection", "strokeMm", "supplyHz"].sort());
  });

  it("rejects a request that is not an object under the form key", () => {
    expect(Object.keys(errorsFor("not an axis"))).toEqual([FORM_ERROR_KEY]);
    expect(Object.keys(errorsFor(null))).toEqual([FORM_ERROR_KEY]);
  });
});

describe("contract version 2 fields (sizing contract, axis requirements)", () => {
  it("are all optional or defaulted, so a version-1 request parses as before", () => {
    const r = parseRequirements(GOOD);
    expect(r.pressStrokeMm).toBe(0);
    expect(r.pressSpeedMmS).toBeUndefined();
    expect(r.dwellS).toBe(0);
    expect(r.holdMinutes).toBe(0);
    expect(r.mountingStyle).toBeUndefined();
    expect(r.pumpType).toBeUndefined();
    expect(r.name).toBeUndefined();
  });

  it("take the time to stop from the time to reach speed unless given", () => {
    expect(parseRequirements({ ...GOOD, accelTimeS: 0.4 }).decelTimeS).toBe(0.4);
    expect(parseRequirements({ ...GOOD, accelTimeS: 0.4, decelTimeS: 0.1 }).decelTimeS).toBe(0.1);
  });

  it("ask for the pressing speed when there is a pressing stroke, no faster than the approach", () => {
    expect(errorsFor({ ...GOOD, pressStrokeMm: 20 }).pressSpeedMmS).toEqual([REQUIREMENT_MESSAGES.pressSpeedNeeded]);
    expect(errorsFor({ ...GOOD, pressStrokeMm: 20, pressSpeedMmS: 101 }).pressSpeedMmS).toEqual([REQUIREMENT_MESSAGES.pressSpeedAboveApproach]);
    expect(errorsFor({ ...GOOD, pressStrokeMm: 401, pressSpeedMmS: 10 }).pressStrokeMm).toEqual([REQUIREMENT_MESSAGES.pressStrokeLongerThanStroke]);
    // equal speeds: a single-speed extension with the force over its last part
    expect(parseRequirements({ ...GOOD, pressStrokeMm: 20, pressSpeedMmS: 100 }).pressSpeedMmS).toBe(100);
    // no pressing stroke: a pressing speed sent by a form is harmless
    expect(() => parseRequirements({ ...GOOD, pressSpeedMmS: 500 })).not.toThrow();
  });

  it.each([
    ["negative dwell", { dwellS: -1 }, "dwellS"],
    ["hold longer than a week", { holdMinutes: 10_081 }, "holdMinutes"],
    ["zero time to stop", { decelTimeS: 0 }, "decelTimeS"],
    ["unknown mounting style", { mountingStyle: "glued" }, "mountingStyle"],
    ["unknown pump type", { pumpType: "piston" }, "pumpType"],
    ["blank name", { name: "   " }, "name"],
    ["name too long", { name: "x".repeat(81) }, "name"],
  ])("%s is refused, naming the field", (_name, change, field) => {
    expect(Object.keys(errorsFor({ ...GOOD, ...change }))).toEqual([field]);
  });
});

describe("one source of limits and defaults", () => {
  // The form reads REQUIREMENT_LIMITS and REQUIREMENT_DEFAULTS; these checks hold the schema to them,
  // so a changed limit can no longer drift from what the form and the engine use.
  const defaultedKeys = Object.keys(REQUIREMENT_DEFAULTS) as (keyof typeof REQUIREMENT_DEFAULTS)[];
  it("the schema fills exactly the exported defaults", () => {
    const r = parseRequirements(GOOD);
    for (const key of defaultedKeys) expect(r[key], key).toBe(REQUIREMENT_DEFAULTS[key]);
  });

  it.each(Object.entries(REQUIREMENT_LIMITS))("%s: accepted at its limits, refused just beyond them", (key, limit) => {
    const l = limit as { min: number; max: number; minExclusive?: boolean; maxExclusive?: boolean };
    const base = { ...GOOD, orientation: "inclined", inclineDeg: 30, rodDirection: "up", strokeMm: 10_000, extendSpeedMmS: 2000, pressSpeedMmS: 1 } as Record<
      string,
      unknown
    >;
    const accepts = (x: number) => requirementsSchema.safeParse({ ...base, [key]: x }).success;
    const step = Math.max(1e-6, (l.max - l.min) * 1e-9);
    expect(accepts(l.min), "at min").toBe(!l.minExclusive);
    expect(accepts(l.min + step), "just above min").toBe(true);
    expect(accepts(l.min - step), "below min").toBe(false);
    expect(accepts(l.max), "at max").toBe(!l.maxExclusive);
    expect(accepts(l.max - step), "just below max").toBe(true);
    expect(accepts(l.max + step), "above max").toBe(false);
  });
});

describe("random accepted axes", () => {
  it("parse, keep every given value and fill the defaults", () => {
    fc.assert(
      fc.property(requirementsArb, (input) => {
        const r = parseRequirements(input);
        for (const [key, value] of Object.entries(input)) expect(r[key as keyof typeof r]).toBe(value);
        for (const key of Object.keys(REQUIREMENT_DEFAULTS) as (keyof typeof REQUIREMENT_DEFAULTS)[]) {
          if (!(key in input)) expect(r[key]).toBe(REQUIREMENT_DEFAULTS[key]);
        }
      }),
      { numRuns: 300 },
    );
  });
});
