// The app's conversions (js-quantities) checked against a second, independent general-purpose
// library (mathjs) and against the exact definitions of the customary units.
import { unit as mathUnit } from "mathjs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { UNITS, formatQuantity, fromDisplay, toDisplay, type Quantity } from "~/units";

// mathjs unit names for the same pairs.
const MATHJS: Record<Quantity, [string, string]> = {
  length: ["mm", "inch"],
  diameter: ["mm", "inch"],
  mass: ["kg", "lbm"],
  force: ["N", "lbf"],
  speed: ["mm/s", "inch/s"],
  velocity: ["m/s", "ft/s"],
  pressure: ["bar", "psi"],
  flow: ["L/min", "gal/min"],
  power: ["kW", "hp"],
  temperature: ["degC", "degF"],
  volume: ["L", "gal"],
  displacement: ["cm^3", "inch^3"],
};

// js-quantities rounds some factors to 7 significant digits (1 lbf = 4.448222 N), so values
// agree to within one part per million: far finer than any engineering display needs.
const closeTo = (actual: number, expected: number, relative = 1e-6) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relative * Math.max(1, Math.abs(expected)));

describe("conversions agree with mathjs", () => {
  it.each(Object.keys(UNITS) as Quantity[])("%s", (quantity) => {
    const [from, to] = MATHJS[quantity];
    for (const value of [0.5, 1, 37, 160, 2500]) {
      const expected = mathUnit(value, from).toNumber(to);
      closeTo(toDisplay(quantity, value, "us"), expected);
      expect(toDisplay(quantity, value, "metric")).toBe(value);
    }
  });
});

describe("exact definitions", () => {
  // International yard and pound agreement (1959): 1 in = 25.4 mm, 1 lb = 0.45359237 kg exactly.
  it("1 in = 25.4 mm", () => closeTo(fromDisplay("length", 1, "us"), 25.4));
  it("1 lb = 0.45359237 kg", () => closeTo(fromDisplay("mass", 1, "us"), 0.45359237));
  // 1 lbf = 0.45359237 kg × 9.80665 m/s² (standard gravity, CGPM 1901) = 4.4482216152605 N.
  it("1 lbf = 4.4482216152605 N", () => closeTo(fromDisplay("force", 1, "us"), 4.4482216152605));
  // 1 psi = 1 lbf / in² = 4.4482216152605 N / 645.16 mm² = 6894.757 Pa = 0.06894757 bar.
  it("1 psi = 0.06894757 bar", () => closeTo(fromDisplay("pressure", 1, "us"), 0.06894757));
  // 1 US gallon = 231 in³ = 3.785411784 L exactly.
  it("1 US gal/min = 3.785411784 L/min", () => closeTo(fromDisplay("flow", 1, "us"), 3.785411784));
  // Mechanical horsepower: 550 ft·lbf/s = 745.69987 W.
  it("1 hp = 0.74569987 kW", () => closeTo(fromDisplay("power", 1, "us"), 0.74569987));
  it("100 °C = 212 °F and -40 °C = -40 °F", () => {
    expect(toDisplay("temperature", 100, "us")).toBeCloseTo(212, 9);
    expect(toDisplay("temperature", -40, "us")).toBeCloseTo(-40, 9);
  });
});

describe("round trips", () => {
  // From -100 (above absolute zero for temperatures) to a million.
  it("fromDisplay undoes toDisplay for every quantity", () => {
    fc.assert(
      fc.property(fc.constantFrom(...(Object.keys(UNITS) as Quantity[])), fc.double({ min: -100, max: 1e6, noNaN: true }), (q, v) => {
        closeTo(fromDisplay(q, toDisplay(q, v, "us"), "us"), v, 1e-9);
      }),
    );
  });
});

describe("formatting", () => {
  it("shows the unit of the chosen system", () => {
    expect(formatQuantity("pressure", 160, "metric")).toBe("160 bar");
    expect(formatQuantity("pressure", 160, "us")).toBe("2,321 psi");
    expect(formatQuantity("length", 500, "us")).toBe("19.69 in");
    expect(formatQuantity("flow", 20, "us")).toBe("5.3 US gpm");
  });
  it("keeps small values visible", () => {
    expect(formatQuantity("power", 0.004, "metric")).toBe("0.004 kW");
  });
});

describe("numbers typed with their own unit", () => {
  it("reads a force with a prefix, a length in inches and a mass in tonnes into the app's units (js-quantities)", async () => {
    const { parseWithUnit } = await import("~/units");
    expect(parseWithUnit("force", "150 kN")).toBe(150_000);
    expect(parseWithUnit("force", "1,5kN")).toBe(1500);
    closeTo(parseWithUnit("length", "6 in")!, 152.4); // 1 in = 25.4 mm exactly
    expect(parseWithUnit("mass", "2 t")).toBe(2000); // tonne
    expect(parseWithUnit("force", "150 bar")).toBeNull(); // not a force
    expect(parseWithUnit("force", "kN")).toBeNull();
    expect(parseWithUnit("temperature", "25 degC")).toBeNull(); // temperatures as plain numbers only
  });
});

describe("typed answers across unit switches", () => {
  it("sizes what was typed, and shows it unchanged after metric → US → metric", async () => {
    const { shownValues, typedAnswers, typedToRequirementsInput } = await import("~/content/requirement-fields");
    const typed = typedAnswers({ orientation: "horizontal", processForceN: "150000", strokeMm: "400" }, "metric");
    const us = shownValues(typed, "us");
    expect(us.processForceN).toBe("33721"); // 150 000 N / 4.4482216 N/lbf, rounded to whole lbf
    expect(shownValues(typed, "metric").processForceN).toBe("150000");
    expect(typedToRequirementsInput(typed).processForceN).toBe(150_000);
    // A value typed in US units while viewing US units is sized from its own system.
    const edited = { ...typed, strokeMm: { text: "10", system: "us" as const } };
    closeTo(typedToRequirementsInput(edited).strokeMm as number, 254);
    expect(shownValues(edited, "metric").strokeMm).toBe("254");
  });

  it("takes a force typed with a prefix in either system, and shows it as typed", async () => {
    const { answerInWords, shownValues, typedToRequirementsInput } = await import("~/content/requirement-fields");
    const typed = { processForceN: { text: "150 kN", system: "us" as const } };
    expect(typedToRequirementsInput(typed).processForceN).toBe(150_000);
    expect(shownValues(typed, "us").processForceN).toBe("150 kN");
    expect(shownValues(typed, "metric").processForceN).toBe("150000");
    expect(answerInWords("processForceN", "150 kN", "metric")).toBe("150 kN");
    expect(answerInWords("processForceN", "150000", "metric")).toBe("150000 N");
  });
});
