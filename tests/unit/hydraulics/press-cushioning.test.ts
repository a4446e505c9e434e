/**
 * A press reaches the end of its extension at the pressing speed, so the cushion check at the
 * extended end (cushion above about 0.1 m/s, makers' pages, common practice [CP]) reads that
 * speed, not the approach speed. Found auditing issue 12 against the engine: engine 2.12.0
 * cushioned the issue's 2 t press at the extended end as though it arrived at 202 mm/s.
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit, type RequirementsInput } from "~/hydraulics";
import { HANGING_PRESS } from "../../support/hydraulics";

/** The press (pump-choice.test.ts): the hanging 2 t platen, 150 kN over the last 30 mm of 500 mm at 10 mm/s. */
const PRESS = { ...HANGING_PRESS, strokeMm: 500, pressStrokeMm: 30, dwellS: 0, mounting: "fixed-fixed" } as const satisfies RequirementsInput;

const cylinderLine = (d: ReturnType<typeof sizeCircuit>) => d.bom.find((l) => l.key === "cylinder")!.specification;

describe("the extended end of a press is reached at the pressing speed (two-speed extension, sources on presses [D])", () => {
  it("behind a flow control, at the control's 10 mm/s: no cushion there, one at the retracted end (253 mm/s)", () => {
    const d = sizeCircuit(PRESS);
    expect(d.pressSpeedControl).not.toBeNull();
    expect(d.cylinder.cushioning.extend.speedMmS).toBeCloseTo(10, 9);
    // E = ½·m·v² = ½ · 2000 · 0.01² = 0.1 J (kinetic energy [D])
    expect(d.cylinder.cushioning.extend.energyJ).toBeCloseTo(0.1, 9);
    expect(d.cylinder.cushioning.extend.cushioned).toBe(false);
    // the return lifts at 148.77 L/min / (9 808.8 mm² · 0.06) = 252.8 mm/s (continuity [D]), above 0.1 m/s [CP]
    expect(d.cylinder.cushioning.retract.speedMmS).toBeCloseTo(252.78, 1);
    expect(d.cylinder.cushioning.retract.cushioned).toBe(true);
    expect(cylinderLine(d)).toMatch(/cushioned at the retracted end$/);
  });

  it("without a control, at what the double pump's small section gives: 8 cm³/rev → 11.02 L/min → 14.97 mm/s", () => {
    // 14 mm/s asked: 10.31 L/min; the 8 cm³/rev section gives 8 · 1450 · 0.95 / 1000 = 11.02 L/min, within 10 %
    // (speed tolerance, our convention), so it presses by itself at 11.02 / (12 271.8 mm² · 0.06) = 14.97 mm/s
    const d = sizeCircuit({ ...PRESS, pressSpeedMmS: 14 });
    expect(d.pump.displacementsCcRev).toEqual([100, 8]);
    expect(d.pressSpeedControl).toBeNull();
    expect(d.cylinder.cushioning.extend.speedMmS).toBeCloseTo(14.97, 2);
    expect(d.cylinder.cushioning.extend.cushioned).toBe(false);
  });

  it("without a pressing stroke the rod still arrives at the approach speed and is cushioned there", () => {
    const d = sizeCircuit({ ...PRESS, pressStrokeMm: 0, pressSpeedMmS: undefined });
    expect(d.cylinder.cushioning.extend.speedMmS).toBeCloseTo(d.speedsMmS.extendActual, 9);
    expect(d.cylinder.cushioning.extend.cushioned).toBe(true);
    expect(cylinderLine(d)).toMatch(/cushioned at both ends$/);
  });
});
