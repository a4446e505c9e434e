/** fast-check generators for axis requirements across the whole accepted range. */
import fc from "fast-check";
import type { RequirementsInput } from "~/hydraulics";

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

export const requirementsArb: fc.Arbitrary<RequirementsInput> = fc
  .record({
    orientation: fc.constantFrom("horizontal", "vertical", "inclined") as fc.Arbitrary<"horizontal" | "vertical" | "inclined">,
    inclineDeg: num(1, 89),
    rodDirection: fc.constantFrom("up", "down") as fc.Arbitrary<"up" | "down">,
    massKg: num(0, 20000),
    processForceN: fc.oneof(fc.constant(0), num(0, 300000)),
    frictionCoefficient: num(0, 0.3),
    strokeMm: num(20, 3000),
    extendSpeedMmS: num(5, 600),
    retractSpeedMmS: num(5, 600),
    accelTimeS: num(0.05, 2),
    mounting: fc.constantFrom("fixed-free", "pinned-pinned", "fixed-pinned", "fixed-fixed") as fc.Arbitrary<
      "fixed-free" | "pinned-pinned" | "fixed-pinned" | "fixed-fixed"
    >,
    cyclesPerHour: num(0, 600),
    hoursPerDay: num(0, 24),
    ambientC: num(-20, 50),
    supplyHz: fc.constantFrom(50, 60) as fc.Arbitrary<50 | 60>,
    maxPressureBar: num(40, 250),
    dwellS: fc.oneof(fc.constant(0), num(0, 30)),
    decelTimeS: num(0.05, 2),
    mountingStyle: fc.constantFrom(undefined, "front-flange", "rear-flange", "trunnion", "clevis", "foot") as fc.Arbitrary<
      "front-flange" | "rear-flange" | "trunnion" | "clevis" | "foot" | undefined
    >,
  })
  .map((r) => {
    const out: RequirementsInput = { ...r };
    if (r.orientation !== "inclined") delete out.inclineDeg;
    if (r.orientation === "horizontal") delete out.rodDirection;
    if (r.mountingStyle === undefined) delete out.mountingStyle;
    return out;
  });

/** Axes with a pressing stroke: a share of the stroke at a share of the approach speed, any pump. */
export const pressAxisArb: fc.Arbitrary<RequirementsInput> = fc
  .tuple(requirementsArb, num(0.01, 1), num(0.01, 1), fc.constantFrom(undefined, "fixed", "double", "compensated"))
  .map(([r, strokeShare, speedShare, pumpType]) => {
    const out: RequirementsInput = { ...r, pressStrokeMm: r.strokeMm * strokeShare, pressSpeedMmS: r.extendSpeedMmS * speedShare };
    if (pumpType !== undefined) out.pumpType = pumpType as "fixed" | "double" | "compensated";
    return out;
  });
