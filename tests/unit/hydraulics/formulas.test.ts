/** Formulas against textbook values and the check values in the shared sources note. */
import { describe, expect, it } from "vitest";
import { bucklingColumn, checkBuckling, eulerLoadN, rodInertiaMm4 } from "~/hydraulics/buckling";
import { circleAreaMm2, cylinderForceN } from "~/hydraulics/cylinder";
import { frictionFactor, lineDiameterMm, lineVelocityMS, pressureLossBarPerM, reynoldsNumber, selectHose } from "~/hydraulics/lines";
import { hydraulicPowerKw, pumpDeliveryLpm, requiredDisplacementCc, synchronousSpeedRpm } from "~/hydraulics/pump-motor";
import { tankSurfaceM2 } from "~/hydraulics/reservoir-heat";
import { pilotOpeningBar, reliefSettingBar } from "~/hydraulics/valves";

describe("Darcy–Weisbach check values (sources §8.3 [D]; 64/Re and Blasius, S7/S8 [S])", () => {
  it("laminar: Q = 20 L/min, d = 10 mm, ν = 46 → v 4.24, Re 923, f 0.0694, Δp 0.544 bar/m", () => {
    const fluid = { viscosityMm2S: 46, densityKgM3: 870 };
    const v = lineVelocityMS(20, 10);
    const re = reynoldsNumber(v, 10, 46);
    expect(v).toBeCloseTo(4.24, 2);
    expect(re).toBeCloseTo(923, 0);
    expect(frictionFactor(re)).toBeCloseTo(0.0694, 4);
    expect(pressureLossBarPerM(20, 10, fluid)).toBeCloseTo(0.544, 3);
  });
  it("turbulent: Q = 100 L/min, d = 16 mm, ν = 20 → v 8.29, Re 6630, f 0.0351, Δp 0.655 bar/m", () => {
    const fluid = { viscosityMm2S: 20, densityKgM3: 870 };
    const v = lineVelocityMS(100, 16);
    const re = reynoldsNumber(v, 16, 20);
    expect(v).toBeCloseTo(8.29, 2);
    expect(re).toBeGreaterThan(6620);
    expect(re).toBeLessThan(6640);
    expect(frictionFactor(re)).toBeCloseTo(0.0351, 4);
    expect(pressureLossBarPerM(100, 16, fluid)).toBeCloseTo(0.655, 3);
  });
});

describe("line diameter d = 4.607·√(Q/v) (continuity, sources §8.1 [D])", () => {
  it("matches the handy identity", () => {
    for (const [q, v] of [
      [20, 5],
      [100, 3],
      [35, 1],
      [250, 5],
    ]) {
      expect(lineDiameterMm(q, v)).toBeCloseTo(4.607 * Math.sqrt(q / v), 2);
    }
  });
  it("40 L/min at 5 m/s needs 13.03 mm → SAE J517 -10 (15.9 mm), since -8 is 12.7 mm", () => {
    expect(lineDiameterMm(40, 5)).toBeCloseTo(13.03, 2);
    expect(selectHose(lineDiameterMm(40, 5)).hose.dash).toBe(10);
  });
});

describe("Euler buckling (Timoshenko & Gere [M]; E = 210 000 N/mm², EN 1993-1-1 [M])", () => {
  it("a 40 mm rod over L_K = 1500 mm: I = 125 664 mm⁴, F_K = π²·E·I/L_K² = 115 758 N", () => {
    // I = π·40⁴/64 = 125 663.7 mm⁴; F_K = 9.8696·210 000·125 663.7/1500² = 115 758 N
    expect(rodInertiaMm4(40)).toBeCloseTo(125663.7, 0);
    expect(eulerLoadN(210000, rodInertiaMm4(40), 1500)).toBeCloseTo((Math.PI ** 2 * 210000 * 125663.706) / 1500 ** 2, 0);
    expect(eulerLoadN(210000, rodInertiaMm4(40), 1500)).toBeGreaterThan(115700);
    expect(eulerLoadN(210000, rodInertiaMm4(40), 1500)).toBeLessThan(115800);
  });
  it("Euler case 1 (K = 2) carries a quarter of case 2 (K = 1) — the n = 0.25/1 form, S18 [S]", () => {
    const case2 = checkBuckling(40, 1000, 1, 10000);
    const case1 = checkBuckling(40, 1000, 2, 10000);
    expect(case1.regime).toBe("Euler");
    expect(case1.criticalLoadN / case2.criticalLoadN).toBeCloseTo(0.25, 6);
  });
  it("below λ₀ = 89 Tetmajer σ_K = 335 − 0.62·λ applies (Roloff/Matek [M])", () => {
    // d = 50, L_K = 500 → λ = 4·500/50 = 40; σ_K = 335 − 24.8 = 310.2; F_K = 310.2·1963.5 = 609 078 N
    const r = checkBuckling(50, 500, 1, 100000);
    expect(r.slenderness).toBeCloseTo(40, 9);
    expect(r.regime).toBe("Tetmajer");
    expect(r.criticalLoadN).toBeCloseTo(310.2 * circleAreaMm2(50), 0);
    expect(r.safetyFactor).toBeCloseTo(6.09, 2);
  });
});

describe("pump and motor relations (textbook, Esposito [M]; electrical machines [D])", () => {
  it("synchronous speed 120·f/p: 4-pole 1500 rpm at 50 Hz, 1800 rpm at 60 Hz", () => {
    expect(synchronousSpeedRpm(50, 4)).toBe(1500);
    expect(synchronousSpeedRpm(60, 4)).toBe(1800);
    expect(synchronousSpeedRpm(50, 2)).toBe(3000);
  });
  it("P = p·Q/600: 100 bar at 60 L/min is 10 kW; 1 bar·L/min = 1.667 W", () => {
    expect(hydraulicPowerKw(100, 60)).toBeCloseTo(10, 9);
    expect(hydraulicPowerKw(1, 1) * 1000).toBeCloseTo(1.667, 3);
  });
  it("Q = V·n·η_v/1000 and its inverse: 20 cm³/rev at 1450 rpm, η_v 0.95 → 27.55 L/min", () => {
    expect(pumpDeliveryLpm(20, 1450, 0.95)).toBeCloseTo(27.55, 9);
    expect(requiredDisplacementCc(27.55, 1450, 0.95)).toBeCloseTo(20, 9);
  });
});

describe("cylinder, valves, tank (textbook; sources §2, §5, §6, §9)", () => {
  it("F = p·A/10·η: 100 bar on a 63 mm bore, η 0.95 → 29 614 N", () => {
    // A = π·63²/4 = 3117.25 mm²; 100·3117.25/10·0.95 = 29 613.9 N
    expect(cylinderForceN(100, circleAreaMm2(63), 0.95)).toBeCloseTo(29613.9, 0);
  });
  it("relief about 10 % above working pressure, rounded up to 5 bar [CP]", () => {
    expect(reliefSettingBar(100)).toBe(110);
    expect(reliefSettingBar(131.63)).toBe(145);
  });
  it("rod-side CBV opening, sources §6 full balance: p₁ = (p_set − p_L)/(R + φ)", () => {
    // p_set 130, p_L 100, R 4.5, φ 2 → 30/6.5 = 4.615 bar
    expect(pilotOpeningBar(130, 100, 4.5, 2)).toBeCloseTo(4.615, 3);
    // cap side: 1/φ term, φ = 2 → 30/5 = 6 bar
    expect(pilotOpeningBar(130, 100, 4.5, 0.5)).toBeCloseTo(6, 9);
  });
  it("cube-like tank: A ≈ 6·V^(2/3); a 1 m³ tank has 6 m² [D]", () => {
    expect(tankSurfaceM2(1000)).toBeCloseTo(6, 9);
    expect(tankSurfaceM2(125)).toBeCloseTo(1.5, 9);
  });
});

describe("counterbalance setting with braking (shared sources' check value [D]; 1.3 factor common practice [CP])", () => {
  it("2000 kg, vertical, lowered at 1.0 m/s and stopped in 0.2 s on 100/70's annulus: 48.98 → 73.95 bar, set 96.1 bar", async () => {
    const { brakingLoadPressureBar, cbvSettingBar } = await import("~/hydraulics/valves");
    const a3 = circleAreaMm2(100) - circleAreaMm2(70); // 4005.5 mm² (the sources round to 4006)
    const weight = 2000 * 9.80665;
    expect((10 * weight) / a3).toBeCloseTo(48.96, 1);
    const braking = brakingLoadPressureBar(weight, 2000, 1000, 0.2, a3);
    expect(braking).toBeCloseTo(73.93, 1); // sources: 73.95 with A3 = 4006
    expect(cbvSettingBar(braking)).toBeCloseTo(96.1, 1);
    // without braking it would be 63.7 bar: the valve would relieve while stopping the load
    expect(cbvSettingBar((10 * weight) / a3)).toBeCloseTo(63.7, 1);
  });
});

describe("buckling length by mounting style (shared sources' check values [D]; L₀ = 300 mm, e = 150 mm assumed [CP])", () => {
  // s = 1000 mm. Front mountings L = s + e = 1150 mm; rear ones L = L₀ + 2·s = 2300 mm.
  const lk = (mounting: Parameters<typeof bucklingColumn>[0], style: Parameters<typeof bucklingColumn>[1]) => {
    const c = bucklingColumn(mounting, style, 1000);
    return c.k * c.lengthMm;
  };
  it("front flange: rod free 2300, pinned and guided 805, fixed and guided 575 mm", () => {
    expect(lk("fixed-free", "front-flange")).toBeCloseTo(2300, 6);
    expect(lk("fixed-pinned", "front-flange")).toBeCloseTo(805, 6);
    expect(lk("fixed-fixed", "front-flange")).toBeCloseTo(575, 6);
  });
  it("rear flange: rod free 4600, pinned and guided 1610, fixed and guided 1150 mm", () => {
    expect(lk("fixed-free", "rear-flange")).toBeCloseTo(4600, 6);
    expect(lk("fixed-pinned", "rear-flange")).toBeCloseTo(1610, 6);
    expect(lk("fixed-fixed", "rear-flange")).toBeCloseTo(1150, 6);
  });
  it("rear clevis or trunnion with a rod eye: 2300 mm (case 2, K = 1)", () => {
    expect(lk("pinned-pinned", "clevis")).toBeCloseTo(2300, 6);
    expect(lk("pinned-pinned", "trunnion")).toBeCloseTo(2300, 6);
  });
  it("no style given: the longest length the end conditions allow (rear flange, or rear pivot), said in the rule", () => {
    const c = bucklingColumn("fixed-free", undefined, 1000);
    expect(c.k * c.lengthMm).toBeCloseTo(4600, 6);
    expect(c.styleAssumed).toBe(true);
    expect(c.rule).toContain("longest free length");
    expect(lk("pinned-pinned", undefined)).toBeCloseTo(2300, 6);
  });
  it("Euler forces for a 70 mm rod: 2300 → 461.8 kN, 4600 → 115.4 kN, 1610 → 942.4 kN (λ 131, 263, 92)", () => {
    const i = rodInertiaMm4(70);
    expect(eulerLoadN(210000, i, 2300) / 1000).toBeCloseTo(461.8, 1);
    expect(eulerLoadN(210000, i, 4600) / 1000).toBeCloseTo(115.4, 1);
    expect(eulerLoadN(210000, i, 1610) / 1000).toBeCloseTo(942.4, 1);
    expect(checkBuckling(70, 1610, 1, 1).slenderness).toBeCloseTo(92, 0);
  });
  it("the audit's 2 m pusher, fixed–free: front flange 4300 mm, rear flange 8600 mm, a factor 4.0 in Euler force", () => {
    const front = bucklingColumn("fixed-free", "front-flange", 2000);
    const rear = bucklingColumn("fixed-free", "rear-flange", 2000);
    expect(front.k * front.lengthMm).toBeCloseTo(4300, 6);
    expect(rear.k * rear.lengthMm).toBeCloseTo(8600, 6);
    expect(eulerLoadN(210000, rodInertiaMm4(50), 4300) / eulerLoadN(210000, rodInertiaMm4(50), 8600)).toBeCloseTo(4.0, 9);
  });
  it("a pivoted body with a free rod end is flagged unstable (a mechanism, not a column)", () => {
    expect(bucklingColumn("fixed-free", "clevis", 500).unstable).toBe(true);
    expect(bucklingColumn("pinned-pinned", "clevis", 500).unstable).toBe(false);
  });
});

describe("stroke-end cushioning (shared sources' check value [D]; 25 mm cushion common practice [CP])", () => {
  it("2000 kg at 0.5 m/s into a 25 mm cushion on 100/70's annulus: 250 J, 10.0 kN, 25.0 bar; with the weight 29.6 kN, 73.9 bar", async () => {
    const { cushioningFor } = await import("~/hydraulics/cushioning");
    const { cylinderCandidates } = await import("~/hydraulics/cylinder");
    const cyl = cylinderCandidates().find((c) => c.boreMm === 100 && c.rodMm === 70 && c.series === "ISO 6020-2")!;
    const flat = { angleDeg: 0, gravityAlongAxisN: 0, normalForceN: 0, frictionN: 0, processForceN: 0, extendGravitySign: 0, overrunningStroke: null } as const;
    const e = cushioningFor(2000, flat, cyl, 500, 0, 0, 0).extend;
    expect(e.energyJ).toBeCloseTo(250, 9);
    expect(e.cushionBar).toBeCloseTo(25.0, 1); // 10 000 N on 4005.5 mm²
    const down = { ...flat, angleDeg: 90, gravityAlongAxisN: 2000 * 9.80665, extendGravitySign: -1, overrunningStroke: "extend" } as const;
    expect(cushioningFor(2000, down, cyl, 500, 0, 0, 0).extend.cushionBar).toBeCloseTo(73.9, 1); // 29 613 N
    expect(e.cushioned).toBe(true);
    expect(cushioningFor(2000, flat, cyl, 100, 0, 0, 0).extend.cushioned).toBe(false); // not above 0.1 m/s
  });
});

describe("decompression (shared sources' check values [D]; 1 %/1000 psi and the 10 in³ rule, trade article [S])", () => {
  it("reference axis: 3.142 L at 127.3 bar releases 58.0 cm³, below 160 cm³; a 250 × 1000 mm press at 250 bar releases 1.78 L", async () => {
    const { decompressionFor } = await import("~/hydraulics/decompression");
    const small = decompressionFor(3.142, 127.3);
    expect(small.releaseCm3).toBeCloseTo(58.0, 1);
    expect(small.needed).toBe(false);
    const big = decompressionFor(49.09, 250);
    expect(big.releaseCm3 / 1000).toBeCloseTo(1.78, 2);
    expect(big.needed).toBe(true);
  });
});

describe("motor by RMS with a short peak (shared sources' duty-cycle check value [D]; method from a trade-magazine article [S]; IEC 60034-1 [M])", () => {
  it("20 kW for 5 s, 5 kW for 10 s, 1 kW for 15 s: P_rms 8.69 kW, P_mean 5.50 kW; the 20 kW peak rules out 11 kW and asks for 15 kW", async () => {
    const { selectMotorKw } = await import("~/hydraulics/pump-motor");
    const phases = [
      [20, 5],
      [5, 10],
      [1, 15],
    ] as const;
    const T = 30;
    const rms = Math.sqrt(phases.reduce((s, [p, t]) => s + p * p * t, 0) / T);
    const mean = phases.reduce((s, [p, t]) => s + p * t, 0) / T;
    expect(rms).toBeCloseTo(8.69, 2);
    expect(mean).toBeCloseTo(5.5, 9);
    // the engine's rule: rating ≥ max(P_rms, P_peak / 1.5)
    expect(selectMotorKw(Math.max(rms, 20 / 1.5)).ratedKw).toBe(15);
    expect(selectMotorKw(rms).ratedKw).toBe(11);
  });
});
