/**
 * Standard-series membership. Series tables are from memory [M] (shared sources note);
 * the checks hold the engine's choices to those tables and to independent facts about them.
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit } from "~/hydraulics";
import {
  IEC60072_MOTOR_KW,
  ISO3320_BORES_MM,
  ISO3320_SECONDARY_BORES_MM,
  ISO3320_RODS_MM,
  ISO3448_GRADES,
  ISO3662_DISPLACEMENTS_CC,
  ISO4401_SIZES,
  ISO6020_2,
  ISO6022,
  SAE_J517_HOSES,
} from "~/hydraulics/series";
import { AXIS_MIX } from "../../support/hydraulics";

describe("series tables", () => {
  it("ISO 6020-2 and ISO 6022 pairings use ISO 3320 bores and rods [M]", () => {
    for (const series of [ISO6020_2, ISO6022]) {
      for (const [bore, thin, thick] of series.pairs) {
        expect([...ISO3320_BORES_MM, ...ISO3320_SECONDARY_BORES_MM]).toContain(bore);
        expect(ISO3320_RODS_MM).toContain(thin);
        expect(ISO3320_RODS_MM).toContain(thick);
      }
    }
  });

  it("the pairings' area ratios fall near their nominal classes (ISO 3320 cl. 6 classes; sources §1.2 [D])", () => {
    const phi = (D: number, d: number) => (D * D) / (D * D - d * d);
    for (const [D, thin, thick] of ISO6020_2.pairs) {
      expect(Math.abs(phi(D, thin) - 1.25)).toBeLessThan(0.06);
      expect(Math.abs(phi(D, thick) - 2)).toBeLessThan(0.11);
    }
    for (const [D, thin, thick] of ISO6022.pairs) {
      expect(Math.abs(phi(D, thin) - 1.6)).toBeLessThan(0.11);
      expect(Math.abs(phi(D, thick) - 2)).toBeLessThan(0.11);
    }
  });

  it("ISO 3662 displacements follow the R10 preferred numbers (ISO 3 R10, ratio 10^0.1, values rounded by up to about 1.2 % [M])", () => {
    for (const vg of ISO3662_DISPLACEMENTS_CC) {
      const step = Math.log10(vg) * 10;
      expect(Math.abs(step - Math.round(step))).toBeLessThan(0.055);
    }
  });

  it("SAE J517 dash number is the nominal ID in sixteenths of an inch [S]", () => {
    for (const hose of SAE_J517_HOSES) expect(hose.nominalIdMm).toBeCloseTo((hose.dash / 16) * 25.4, 1);
  });

  it("ISO 3448 VG grades are the grade number ±10 % at 40 °C [S]", () => {
    for (const [name, g] of Object.entries(ISO3448_GRADES)) {
      const grade = Number(name.slice(2));
      expect(g.mid).toBe(grade);
      expect(g.min).toBeCloseTo(grade * 0.9, 6);
      expect(g.max).toBeCloseTo(grade * 1.1, 6);
    }
  });
});

describe("every design picks from the standard series", () => {
  for (const axis of AXIS_MIX) {
    const d = sizeCircuit(axis);
    const name = `${axis.orientation} ${axis.rodDirection ?? ""}`;
    it(`${name}: bore and rod in ISO 3320 [M]`, () => {
      expect([...ISO3320_BORES_MM, ...ISO3320_SECONDARY_BORES_MM]).toContain(d.cylinder.boreMm);
      expect(ISO3320_RODS_MM).toContain(d.cylinder.rodMm);
      expect(d.cylinder.rodMm).toBeLessThan(d.cylinder.boreMm);
    });
    it(`${name}: motor rating in IEC 60072-1 and not below the power needed [M]`, () => {
      expect(IEC60072_MOTOR_KW).toContain(d.motor.ratedKw);
      expect(d.motor.ratedKw).toBeGreaterThanOrEqual(d.motor.requiredKw);
    });
    it(`${name}: displacement in the ISO 3662 series [M]`, () => {
      expect(ISO3662_DISPLACEMENTS_CC).toContain(d.pump.displacementCcRev);
      expect(d.pump.displacementCcRev).toBeGreaterThanOrEqual(d.pump.requiredDisplacementCcRev);
    });
    it(`${name}: hoses are SAE J517 dash sizes, the smallest with nominal ID ≥ required [S]`, () => {
      for (const line of Object.values(d.lines)) {
        const hose = SAE_J517_HOSES.find((h) => h.nominalIdMm === line.innerDiameterMm);
        expect(hose).toBeDefined();
        expect(line.innerDiameterMm).toBeGreaterThanOrEqual(line.requiredDiameterMm);
        const smaller = SAE_J517_HOSES.filter((h) => h.nominalIdMm < line.innerDiameterMm);
        for (const s of smaller) expect(s.nominalIdMm).toBeLessThan(line.requiredDiameterMm);
      }
    });
    it(`${name}: ISO 4401 size is one of 03/05/07/08/10 and used at ≤ 80 % [S] sizes, [CP] rule`, () => {
      const size = ISO4401_SIZES.find((s) => s.size === d.directionalValve.iso4401Size);
      expect(size).toBeDefined();
      expect(d.directionalValve.maxPathFlowLpm).toBeLessThanOrEqual(0.8 * size!.typicalMaxLpm);
    });
  }
});
