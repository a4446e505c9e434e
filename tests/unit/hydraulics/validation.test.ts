/** Requirements validation: every kind of bad input names its field, all at once. */
import { describe, expect, it } from "vitest";
import {
  FORM_ERROR_KEY, RequirementsError, parseRequirements, requirementsSchema, sizeCircuit, type RequirementsInput,
} from "~/hydraulics";

const GOOD: RequirementsInput = {
  orientation: "horizontal", massKg: 500, strokeMm: 400, extendSpeedMmS: 100, retractSpeedMmS: 150,
  mounting: "fixed-pinned", cyclesPerHour: 60, hoursPerDay: 8, supplyHz: 50,
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
