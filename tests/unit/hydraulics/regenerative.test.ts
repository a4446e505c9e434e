/**
 * Regenerative extension (engine 2.10): during the approach the rod end's outflow joins the pump
 * flow into the cap end, so only the rod area is effective. Checked against the textbook
 * regenerative-circuit relations and the shared sources' check values for a 100/70 cylinder, a
 * regenerative axis worked by hand through sizeCircuit, and the axes where regeneration must not
 * be used. Each step names its source: [S] seen in a public source, [M] from memory,
 * [CP] common practice, [D] derived (units or algebra).
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit, type Design } from "~/hydraulics";
import {
  capInflowLpm,
  regenerationVerdict,
  regenerativeForceN,
  regenerativeSpeedMS,
  regenSwitchSettingBar,
  regenToRetractSpeedRatio,
  rodAreaMm2,
  rodOutflowLpm,
} from "~/hydraulics/regeneration";
import { LONG_FEED } from "../../support/hydraulics";

// 100/70 cylinder: A1 = π·100²/4 = 7853.98 mm², A_rod = π·70²/4 = 3848.45 mm², A3 = 4005.53 mm² (geometry [D])
const CYL_100_70 = { capAreaMm2: (Math.PI * 100 ** 2) / 4, annulusAreaMm2: (Math.PI * 100 ** 2) / 4 - (Math.PI * 70 ** 2) / 4 };
const A_ROD = rodAreaMm2(CYL_100_70);

describe("the textbook regenerative-circuit relations, with the shared sources' 100/70 check values (Q_p = 60 L/min, 100 bar)", () => {
  it("leaves the rod area effective: A_rod = A1 − A3 = 3848.45 mm² (geometry [D])", () => {
    expect(A_ROD).toBeCloseTo(3848.45, 2);
  });

  it("extends at v = Q_p / (A_rod·0.06) = 0.260 m/s against 0.127 m/s at full area (regenerative-circuit course note: extending speed = pump flow ÷ rod area [S])", () => {
    expect(regenerativeSpeedMS(60, A_ROD)).toBeCloseTo(0.26, 3);
    // full area, v = Q_p / (A1·0.06) = 0.127 m/s (continuity [D]); the ratio is A1/A_rod = 2.04 (shared check value)
    expect(regenerativeSpeedMS(60, CYL_100_70.capAreaMm2)).toBeCloseTo(0.127, 3);
    expect(regenerativeSpeedMS(60, A_ROD) / regenerativeSpeedMS(60, CYL_100_70.capAreaMm2)).toBeCloseTo(2.04, 2);
  });

  it("pushes F = p·A_rod/10 = 38.5 kN against 78.5 kN at full area (training page: F = p·(A1 − A3) = p·A_rod [S])", () => {
    expect(regenerativeForceN(100, A_ROD) / 1000).toBeCloseTo(38.5, 1);
    expect(regenerativeForceN(100, CYL_100_70.capAreaMm2) / 1000).toBeCloseTo(78.5, 1);
  });

  it("takes 122.4 L/min into the cap end, 62.4 L/min of it from the rod end (continuity [D], shared check values)", () => {
    // Q_cap = Q_p·A1/A_rod = 60·2.0408 = 122.45; Q_rod = Q_p·A3/A_rod = 60·1.0408 = 62.45; Q_cap = Q_p + Q_rod
    expect(Math.abs(capInflowLpm(60, CYL_100_70.capAreaMm2, A_ROD) - 122.4)).toBeLessThan(0.1);
    expect(Math.abs(rodOutflowLpm(60, CYL_100_70.annulusAreaMm2, A_ROD) - 62.4)).toBeLessThan(0.1);
    expect(capInflowLpm(60, CYL_100_70.capAreaMm2, A_ROD)).toBeCloseTo(60 + rodOutflowLpm(60, CYL_100_70.annulusAreaMm2, A_ROD), 9);
  });

  it("runs v_regen / v_ret = A3 / A_rod = 1.041 × the return on the same flow (course note [S]; shared check value)", () => {
    expect(regenToRetractSpeedRatio(CYL_100_70.annulusAreaMm2, A_ROD)).toBeCloseTo(1.041, 3);
  });

  it("sets the switch-over pressure switch 15 % and at least 10 bar above the approach, rounded up to 5 bar (common practice)", () => {
    // 14.37 bar: max(16.5, 24.37) → 25 bar; 100 bar: max(115, 110) → 115 bar
    expect(regenSwitchSettingBar(14.37)).toBe(25);
    expect(regenSwitchSettingBar(100)).toBe(115);
  });
});

describe("when regeneration pays (common practice) — the rule on its own", () => {
  const regen = {
    displacementCc: 40,
    speedRatioToRetract: 1.04,
    approachBar: 14.4,
    limitBar: 145.5,
    passes: true,
    endsBy: "pressure-switch" as const,
    switchOver: { switchBar: 25, pressBar: 67.7 },
  };
  it("is used where the force fits on the rod area and the pump is at least one size step smaller", () => {
    expect(regenerationVerdict({ ruledOut: null, normal: { displacementCc: 80, pumpType: "fixed" }, regen }).use).toBe(true);
  });
  it("is not used where it saves no pump size, where the rod is thin (A3/A_rod above 1.5) or where the switch cannot sit below the pressing pressure", () => {
    expect(regenerationVerdict({ ruledOut: null, normal: { displacementCc: 40, pumpType: "fixed" }, regen }).use).toBe(false);
    const thin = regenerationVerdict({ ruledOut: null, normal: { displacementCc: 80, pumpType: "fixed" }, regen: { ...regen, speedRatioToRetract: 4.1 } });
    expect(thin).toMatchObject({ use: false, reason: expect.stringMatching(/rod is thin/) });
    // 0.8 × 30 bar = 24 bar < 25 bar switch (our convention: at most 80 % of the pressing pressure)
    const noRoom = regenerationVerdict({
      ruledOut: null,
      normal: { displacementCc: 80, pumpType: "fixed" },
      regen: { ...regen, switchOver: { switchBar: 25, pressBar: 30 } },
    });
    expect(noRoom).toMatchObject({ use: false, reason: expect.stringMatching(/pressure switch/) });
  });
  it("leaves a double pump the engine would give in place: it also cuts the pressing power", () => {
    expect(regenerationVerdict({ ruledOut: null, normal: { displacementCc: 80, pumpType: "double" }, regen })).toMatchObject({
      use: false,
      reason: expect.stringMatching(/double/),
    });
  });
});

describe("worked example — a long horizontal feed with 50 kN at the end of a 1.6 m stroke, regenerative approach", () => {
  // Horizontal, m = 500 kg, μ = 0.1 (default), 50 kN process force at the end of the stroke (no
  // pressing stroke), stroke 1600 mm, 200 mm/s both ways, t_acc = 0.2 s, fixed-pinned with a rear
  // flange, 60 cycles/h, 50 Hz, maxPressureBar 160 → working limit 160/1.1 = 145.45 bar [CP].
  const axis = LONG_FEED;
  const d: Design = sizeCircuit(axis);

  it("chooses 100/70: buckling over the long stroke asks for the thick rod (Euler, Timoshenko & Gere [M])", () => {
    // Pressing F = 50 000 + 0.1·500·9.80665 = 50 490.3 N, /η 0.95 = 53 147.7 N (statics [D]; η [CP]).
    // Ø63 needs 170.5 bar > 145.45. Ø80 needs 105.7 bar → relief 120 bar; buckling length
    // L₀ + 2·s = 300 + 3200 = 3500 mm, K 0.7 → L_K 2450 mm [CP]; stall 120·5026.5/10 = 60.3 kN;
    // 80/56: F_K = π²·210 000·(π·56⁴/64)/2450² = 166.7 kN → SF 2.76 < 3.5 [CP]; 100/45: relief
    // 75 bar, stall 58.9 kN, F_K 69.5 kN → SF 1.18; 100/70: F_K 407.0 kN → SF 6.91 (Euler, λ = 140 > 89).
    expect(`${d.cylinder.boreMm}/${d.cylinder.rodMm}`).toBe("100/70");
    expect(d.cylinder.bucklingSafetyFactor).toBeCloseTo(6.91, 2);
  });

  it("sizes the pump for the rod's displacement: 40 cm³/rev where full area needs 80 (continuity [D]; ISO 3662 [M])", () => {
    // Full area: Q = A1·v = 7853.98·200·0.06/1000 = 94.25 L/min → V = 94.25/(1450·0.95)·1000 = 68.4 → 80 cm³/rev.
    // Regenerating: A_rod·v = 46.18 L/min; the return A3·v = 48.07 L/min is now the larger:
    // V = 48.07/1.3775 = 34.89 → 40 cm³/rev, Q_p = 40·1450·0.95/1000 = 55.1 L/min (pump flow relation, Esposito [M]).
    expect(d.regenerative).toBe(true);
    expect(d.pump.type).toBe("fixed");
    expect(d.pump.displacementCcRev).toBe(40);
    expect(d.flowsLpm.pump).toBeCloseTo(55.1, 6);
    // the contract's flows stay cylinder flows: the cap end still takes A1·v = 94.25 L/min at the asked speed
    expect(d.flowsLpm.extend).toBeCloseTo(94.25, 2);
    expect(d.flowsLpm.retract).toBeCloseTo(48.07, 2);
  });

  it("extends at Q_p/A_rod and retracts at Q_p/A3 (regenerative-circuit course note [S]; continuity [D])", () => {
    // v_regen = 55.1·1000/(3848.45·0.06) = 238.62 mm/s; v_ret = 55.1·1000/(4005.53·0.06) = 229.27 mm/s; ratio 1.0408
    expect(d.speedsMmS.extendActual).toBeCloseTo(238.62, 2);
    expect(d.speedsMmS.retractActual).toBeCloseTo(229.27, 2);
    expect(d.regeneration!.speedMmS).toBe(d.speedsMmS.extendActual);
    expect(d.regeneration!.speedRatioToRetract).toBeCloseTo(1.0408, 4);
  });

  it("sizes the cap line and the valve stack for the cap inflow, not Q_p (continuity [D]; SAE J517 [S]; ISO 4401 [S])", () => {
    // Q_cap = 55.1·7853.98/3848.45 = 112.45 L/min; Q_rod = 55.1·4005.53/3848.45 = 57.35 L/min
    expect(d.regeneration!.capInflowLpm).toBeCloseTo(112.45, 2);
    expect(d.regeneration!.rodOutflowLpm).toBeCloseTo(57.35, 2);
    // cap line: max(φ·Q_p = 108.04, 112.45) at 5 m/s → d = 4.607·√(112.45/5) = 21.85 mm → -16 (25.4 mm) [CP]/[S]
    expect(d.lines.capWork.flowLpm).toBeCloseTo(112.45, 2);
    expect(d.lines.capWork.dashSize).toBe(16);
    // rod line: max(Q_p, 57.35) → d = 15.60 mm → -10 (15.9 mm)
    expect(d.lines.rodWork.dashSize).toBe(10);
    // largest path flow 112.45 L/min > 0.8·100 of size 05 → ISO 4401-07 (80 % rule [CP])
    expect(d.directionalValve.maxPathFlowLpm).toBeCloseTo(112.45, 2);
    expect(d.directionalValve.iso4401Size).toBe("07");
  });

  it("needs 14.37 bar for the approach on the rod area (piston force balance [D]; Darcy–Weisbach [M]; allowances [CP])", () => {
    // F = F_f + m·v/t = 490.33 + 500·0.23862/0.2 = 1086.89 N; F/η = 1144.10 N (Newton [D]).
    // Supply: pressure line 55.1 L/min in 15.9 mm: v 4.625 m/s, Re 1599, f = 64/Re, 0.234 bar;
    //   valve P→A 5 bar [CP]; cap line 112.45 L/min in 25.4 mm: Re 2042, Blasius f 0.0471, 2 m → 0.221 bar: 5.455 bar.
    // Rod side above cap side: rod line 57.35 L/min in 15.9 mm, 2 m → 0.488 bar + regeneration valve 5 bar [CP]
    //   + cap line 0.221 bar = 5.708 bar.
    // p_cap·A1 − (p_cap + 5.708)·A3 = 10·1144.10 → p_cap = (11 441.0 + 5.708·4005.53)/3848.45 = 8.914 bar;
    // pump: 8.914 + 5.455 = 14.37 bar.
    expect(d.pressuresBar.extendMoving).toBeCloseTo(14.37, 2);
    // the force at the end on the full area, at standstill: 10·53 147.7/7853.98 = 67.67 bar (textbook F = η·p·A)
    expect(d.pressuresBar.extendPress).toBeCloseTo(67.67, 2);
    expect(d.pressuresBar.reliefSetting).toBe(75);
  });

  it("ends the approach by a pressure switch at 25 bar, well below the 67.67 bar of the force (common practice)", () => {
    // max(1.15·14.37, 14.37 + 10) = 24.37 → 25 bar; 25 ≤ 0.8·67.67 = 54.1 (our convention)
    expect(d.regeneration!.switchBar).toBe(25);
    // rod-area force at the 67.67 bar working pressure: 0.95·67.67·3848.45/10 = 24 740 N against 50 490 N on A1 [S]/[D]
    expect(d.regeneration!.forceAtWorkingN).toBeCloseTo(24_740.3, 0);
    expect(d.cylinder.extendForceN).toBeCloseTo(50_490.3, 0);
  });

  it("prices the regeneration valve and the pressure switch, and puts the valve in the rod line, its third port on the cap line", () => {
    const valve = d.bom.find((b) => b.key === "regeneration-valve")!;
    expect(valve.item).toMatch(/3\/2 solenoid/);
    expect(valve.specification).toContain("energised joins it to the cap line with port B closed");
    expect(valve.specification).toContain("112.4 L/min enter the cap end");
    expect(valve.specification).toContain("ISO 4401-07");
    const sw = d.bom.find((b) => b.key === "regeneration-pressure-switch")!;
    expect(sw.rating).toEqual({ value: 25, unit: "bar", label: "setting" });
    expect(sw.specification).toMatch(/latches it until the return/);
    const regen = d.circuit.components.find((c) => c.id === "regen")!;
    // 3/2 in the rod line: 1 the rod port, 2 valve port B, 3 the cap line; energised 1–3 with B blocked
    expect(regen).toMatchObject({ kind: "regen", ports: ["1", "2", "3"], positions: { normal: [["1", "2"]], energised: [["1", "3"]] } });
    expect(d.circuit.connections).toContainEqual({ from: "dcv.B", to: "regen.2", line: "work" });
    expect(d.circuit.connections).toContainEqual({ from: "regen.1", to: "cylinder.rod", line: "work" });
    expect(d.circuit.connections).toContainEqual({ from: "regen.3", to: "dcv.A", line: "work" });
    expect(d.circuit.components.find((c) => c.id === "regeneration-pressure-switch")).toMatchObject({ kind: "pressure-switch", values: { settingBar: 25 } });
    expect(d.warnings.map((w) => w.code)).toContain("REGENERATIVE_APPROACH");
  });

  it("says in the trail why, with its speed, force and flows and their sources in words", () => {
    const entry = (q: string) => d.trail.find((t) => t.quantity === q)!;
    expect(entry("regenerative extension").value).toBe("yes");
    expect(entry("regenerative extension").formula).toMatch(/40 cm³\/rev pump gives the asked speed where full-area extension needs 80 cm³\/rev/);
    expect(entry("regenerative extension").source).toMatch(/common practice/);
    expect(entry("regenerative approach speed").source).toMatch(/textbook regenerative-circuit/);
    expect(entry("regenerative approach force at working pressure").value).toBeCloseTo(24_740.3, 0);
    expect(entry("cap inflow while regenerating").source).toMatch(/continuity/);
    expect(entry("regeneration pressure switch setting").value).toBe(25);
  });

  it("gives the same axis a full-area extension and an 80 cm³/rev pump where a double pump is asked for", () => {
    // No pressing stroke, so the double pump falls back to a fixed one (PUMP_TYPE_NOT_SUITED) at full area.
    const full = sizeCircuit({ ...axis, pumpType: "double" });
    expect(full.regenerative).toBe(false);
    expect(full.regeneration).toBeNull();
    expect(full.pump.displacementCcRev).toBe(80);
    expect(full.motor.ratedKw).toBeGreaterThan(d.motor.ratedKw);
    expect(full.bom.some((b) => b.key.startsWith("regeneration"))).toBe(false);
    expect(full.circuit.components.some((c) => c.kind === "regen")).toBe(false);
  });

  it("with a 20 mm pressing stroke and a fixed pump, the limit switch that starts the pressing stroke ends it (common practice)", () => {
    const d2 = sizeCircuit({ ...axis, pressStrokeMm: 20, pressSpeedMmS: 10, pumpType: "fixed" });
    expect(d2.regenerative).toBe(true);
    expect(d2.regeneration).toMatchObject({ endsBy: "limit-switch", switchBar: null });
    // the pressing itself runs at full area: Q_press = A1·v_press = 7853.98·10·0.06/1000 = 4.71 L/min (continuity [D])
    expect(d2.flowsLpm.press).toBeCloseTo(4.71, 2);
    // the meter-in control's bypass sits in the cap line past the join, so it carries the 112.45 L/min cap inflow
    expect(d2.pressSpeedControl!.bypassFlowLpm).toBeCloseTo(112.45, 2);
    expect(d2.bom.some((b) => b.key === "regeneration-pressure-switch")).toBe(false);
    expect(d2.bom.find((b) => b.key === "regeneration-valve")!.specification).toMatch(/limit switch where the pressing stroke starts/);
    expect(d2.trail.find((t) => t.quantity === "regeneration switched off")!.value).toBe("at the start of the pressing stroke");
  });

  it("a clamp held at its force keeps regeneration: the cap-end check passes the cap inflow", () => {
    const held = sizeCircuit({ ...axis, holdMinutes: 30 });
    expect(held.regenerative).toBe(true);
    expect(held.holding!.side).toBe("cap");
    expect(held.holding!.flowLpm).toBeCloseTo(112.45, 2);
  });
});

describe("where regeneration must not be used", () => {
  const long = LONG_FEED;
  const reason = (d: Design) => d.trail.find((t) => t.quantity === "regenerative extension")!.formula;

  it("an overrunning extension (rod down): the rod-side counterbalance valve meters the rod end's outflow (common practice)", () => {
    const d = sizeCircuit({ ...long, orientation: "vertical", rodDirection: "down" });
    expect(d.counterbalance!.side).toBe("rod");
    expect(d.regenerative).toBe(false);
    expect(reason(d)).toMatch(/overruns on extension/);
  });

  it("a lift whose force does not fit on the rod area: 6 t needs 188.9 bar there, above the 145.45 bar limit", () => {
    // Rod up, 6000 kg, 100 mm/s: G = 58 840 N; on A_rod the approach needs (G + F_a)/(η·A_rod) + losses ≈ 189 bar (force balance [D])
    const d = sizeCircuit({ ...long, orientation: "vertical", rodDirection: "up", massKg: 6000, processForceN: 0, extendSpeedMmS: 100, retractSpeedMmS: 100 });
    expect(d.regenerative).toBe(false);
    expect(reason(d)).toMatch(/rod area alone would need 1\d\d\.\d bar, above the 145\.5 bar working limit/);
  });

  it("a thin rod: the pump the return needs would overdrive the regenerative approach", () => {
    // 80/36 on a short stroke: A3/A_rod = (5026.55 − 1017.88)/1017.88 = 3.94 > 1.5 (geometry [D]; our convention)
    const d = sizeCircuit({ ...long, strokeMm: 400, mounting: "fixed-fixed", mountingStyle: "front-flange" });
    expect(`${d.cylinder.boreMm}/${d.cylinder.rodMm}`).toBe("80/36");
    expect(d.cylinder.annulusAreaMm2 / (d.cylinder.capAreaMm2 - d.cylinder.annulusAreaMm2)).toBeCloseTo(3.94, 2);
    expect(d.regenerative).toBe(false);
    expect(reason(d)).toMatch(/rod is thin/);
  });

  it("leak-tight holding on the rod end (an axis held in position both ways)", () => {
    const d = sizeCircuit({ ...long, processForceN: 0, holdMinutes: 30 });
    expect(d.holding!.side).toBe("both");
    expect(d.regenerative).toBe(false);
    expect(reason(d)).toMatch(/pilot-operated check closes the rod end/);
  });

  it("a two-speed press the engine gives a double pump: the high-low pump serves the approach", () => {
    const d = sizeCircuit({ ...long, pressStrokeMm: 20, pressSpeedMmS: 10 });
    expect(d.pump.type).toBe("double");
    expect(d.regenerative).toBe(false);
    expect(reason(d)).toMatch(/double \(high-low\) pump already gives the fast approach/);
  });
});
