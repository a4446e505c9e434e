/** Requirements validation: every kind of bad input names its field, all at once. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FORM_ERROR_KEY, RequirementsError, parseRequirements, requirementsSchema, sizeCircuit, type RequirementsInput,
} from "~/hydraulics";
import { requirementsArb } from "./arbitraries";

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

describe("parseRequirements gives exactly the schema's answer (its fast path for accepted input)", () => {
  // Values near and across every limit, wrong types, explicit undefined, extra keys.
  const value = fc.oneof(
    fc.constantFrom(undefined, null, "", "5", true, NaN, Infinity, -Infinity, -0, 0, 0.1, 1, 10, 20, 24, 50, 60, 89.9, 90, 160, 250, 2000, 3600, 10_000, 500_000, 10_000_000, -1, -30, 55, 1e12),
    fc.double({ min: -100, max: 3000, noNaN: true }),
    fc.constantFrom("horizontal", "vertical", "inclined", "up", "down", "fixed-free", "pinned-pinned", "fixed-pinned", "fixed-fixed", "sideways"),
  );
  const keys = [...Object.keys(requirementsSchema.shape), "extra"];
  const perturbed = fc.tuple(requirementsArb, fc.array(fc.tuple(fc.constantFrom(...keys), value, fc.boolean()), { maxLength: 3 })).map(([base, edits]) => {
    const out: Record<string, unknown> = { ...base };
    for (const [key, v, remove] of edits) {
      if (remove) delete out[key];
      else out[key] = v;
    }
    return out;
  });
  it("accepts and fills in the same way, keys in the same order, and rejects the same inputs", () => {
    fc.assert(
      fc.property(fc.oneof(requirementsArb, perturbed), (input) => {
        const expected = requirementsSchema.safeParse(input);
        let got: unknown;
        try {
          got = parseRequirements(input);
        } catch (e) {
          expect(e).toBeInstanceOf(RequirementsError);
          expect(expected.success).toBe(false);
          return;
        }
        expect(expected.success).toBe(true);
        expect(got).toStrictEqual(expected.data);
        expect(Object.keys(got as object)).toEqual(Object.keys(expected.data!));
      }),
      { numRuns: 3000 },
    );
  });

  it("leaves odd objects to the schema", () => {
    const good = { ...GOOD, extra: 1 };
    expect(parseRequirements(good)).toStrictEqual(requirementsSchema.parse(good));
    expect(() => parseRequirements(Object.assign(Object.create({ massKg: 5 }), { ...GOOD, massKg: undefined }))).toThrow(RequirementsError);
    expect(() => parseRequirements([GOOD])).toThrow(RequirementsError);
    expect(() => parseRequirements({ ...GOOD, orientation: "inclined", rodDirection: "up", inclineDeg: undefined })).toThrow(RequirementsError);
  });
});
