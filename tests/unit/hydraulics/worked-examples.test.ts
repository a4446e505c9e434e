/**
 * Three axes worked out by hand, step by step, following the method in the shared sources
 * note. Every step names its source: [S] seen in a public source, [M] from memory,
 * [CP] common practice, [D] derived (units or algebra). Numbers were worked on a calculator;
 * the engine must arrive at the same values.
 *
 * Constants used throughout (app/hydraulics/assumptions.ts):
 *   g = 9.80665 m/s²; η_cyl = 0.95 [CP]; η_v = 0.95 and η_overall = 0.85 (Esposito [M]);
 *   4-pole speed 1450 rpm at 50 Hz, 1750 rpm at 60 Hz [CP];
 *   velocity limits: pressure/work 5 m/s, return 3 m/s, suction 1 m/s [CP];
 *   line lengths: pressure 1 m, each work line 2 m, return 1 m, suction 0.5 m (assumed);
 *   ISO VG 46: ν = 46 mm²/s (ISO 3448 [S]), ρ = 870 kg/m³ [M];
 *   valve allowances: 5 bar per directional-valve path, 3 bar CBV check, 0.5 bar filter [CP];
 *   relief = 1.1 × highest working pressure, rounded up to 5 bar [CP];
 *   working-pressure limit = min(160, 160 bar cylinder rating / 1.1) = 145.45 bar.
 *   Unit identities [D]: F[N] = p[bar]·A[mm²]/10; Q[L/min] = A[mm²]·v[mm/s]·0.06/1000;
 *   d[mm] = 4.607·√(Q/v); Re = 1000·v·d/ν; Δp/L = f·(1/d)·ρ·v²/2; P[kW] = p·Q/600.
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit } from "~/hydraulics";
import { CLAMP_FEED, ROD_DOWN_PRESS } from "../../support/hydraulics";

describe("worked example 1 — horizontal clamp feed, no counterbalance", () => {
  // Requirements: horizontal, m = 1000 kg, process force 38 kN at the end of the stroke,
  // μ = 0.1 (default), stroke 300 mm, extend 100 mm/s, retract 150 mm/s, t_acc = 0.2 s,
  // fixed-fixed rod end with a front flange (mountingStyle, since engine 2.3 an absent style
  // means the longest free length, a rear flange), 60 cycles/h, 50 Hz, maxPressureBar 160.
  const d = sizeCircuit({ ...CLAMP_FEED, mountingStyle: "front-flange" });

  it("sizes the bore on the pressing force (textbook F = η·p·A; ISO 3320 / ISO 6020-2 pairing)", () => {
    // Loads (statics [D]): G = 0 (horizontal); F_f = μ·m·g = 0.1·1000·9.80665 = 980.67 N.
    // Pressing: F = 38 000 + 980.67 = 38 980.67 N; F/η = 41 032.3 N.
    // A1 needed without losses = 10·41 032.3 / 145.45 = 2821 mm² → Ø50 (1963 mm²) fails:
    //   p = 10·41 032.3/1963.5 = 209.0 bar > 145.45. Ø63 (3117.25 mm²) with the thinner rod 28.
    expect(d.cylinder.boreMm).toBe(63);
    expect(d.cylinder.rodMm).toBe(28);
    expect(d.counterbalance).toBeNull();
  });

  it("flows are area × speed and the pump is the next ISO 3662 size (continuity [D]; Esposito [M])", () => {
    // A1 = π·63²/4 = 3117.25 mm²; A3 = 3117.25 − π·28²/4 = 2501.49 mm²; φ = 1.2462.
    // Q_ext = 3117.25·100·0.06/1000 = 18.70 L/min; Q_ret = 2501.49·150·0.06/1000 = 22.51 L/min.
    // V = 1000·22.51/(1450·0.95) = 16.34 cm³/rev → 20 cm³/rev (ISO 3662 [M]).
    // Q_p = 20·1450·0.95/1000 = 27.55 L/min; return max = φ·Q_p = 34.33 L/min.
    expect(d.flowsLpm.extend).toBeCloseTo(18.7, 2);
    expect(d.flowsLpm.retract).toBeCloseTo(22.51, 2);
    expect(d.pump.displacementCcRev).toBe(20);
    expect(d.pump.speedRpm).toBe(1450);
    expect(d.flowsLpm.pump).toBeCloseTo(27.55, 2);
    expect(d.flowsLpm.returnMax).toBeCloseTo(34.33, 2);
    // Actual speeds with the whole pump flow: 27.55·1000/(3117.25·0.06) = 147.3 mm/s extend,
    // 27.55·1000/(2501.49·0.06) = 183.6 mm/s retract → more than 10 % over what was asked.
    expect(d.speedsMmS.extendActual).toBeCloseTo(147.3, 1);
    expect(d.speedsMmS.retractActual).toBeCloseTo(183.6, 1);
    expect(d.warnings.map((w) => w.code)).toContain("PUMP_SPEED_MISMATCH");
  });

  it("lines map to SAE J517 dash sizes with Darcy–Weisbach losses (continuity; 64/Re laminar)", () => {
    // Pressure line, Q_p = 27.55: d = 4.607·√(27.55/5) = 10.81 mm → -8 (12.7 mm); v = 3.625 m/s;
    //   Re = 1000·3.625·12.7/46 = 1001 (laminar), f = 64/1001 = 0.0640, Δp = 0.288 bar over 1 m.
    // Cap line, φ·Q_p = 34.33: d = 12.07 → -8 (12.7), v = 4.517 m/s.
    // Return line, 34.33 at 3 m/s: d = 15.58 → -10 (15.9), v = 2.882 m/s.
    // Suction, 27.55 at 1 m/s: d = 24.18 → -16 (25.4), v = 0.906 m/s.
    expect(d.lines.pressure.innerDiameterMm).toBe(12.7);
    expect(d.lines.pressure.velocityMS).toBeCloseTo(3.625, 3);
    expect(d.lines.pressure.pressureLossBar).toBeCloseTo(0.288, 3);
    expect(d.lines.capWork.innerDiameterMm).toBe(12.7);
    expect(d.lines.capWork.velocityMS).toBeCloseTo(4.517, 3);
    expect(d.lines.return.innerDiameterMm).toBe(15.9);
    expect(d.lines.return.velocityMS).toBeCloseTo(2.882, 3);
    expect(d.lines.suction.innerDiameterMm).toBe(25.4);
    expect(d.lines.suction.velocityMS).toBeCloseTo(0.906, 3);
  });

  it("pressures, relief, motor and valve (force balance [D]; relief +10 % [CP]; IEC 60072-1 [M]; ISO 4401 [CP])", () => {
    // Extend, moving: F = 980.67 + m·v/t = 980.67 + 1000·0.1473/0.2 = 1717.16 N.
    //   back-pressure = rod line at Q_p/φ (0.462) + 5 + return at Q_p/φ (0.094) + 0.5 = 6.056 bar;
    //   p1 = (10·1717.16/0.95 + 6.056·2501.49)/3117.25 = 10.66 bar; supply losses
    //   0.288 + 5 + cap line at Q_p (0.576) = 5.863 → 16.52 bar.
    // Extend, pressing (standstill, no losses): p = 10·41 032.3/3117.25 = 131.63 bar → governs.
    // Retract: F = 980.67 + 1000·0.18356/0.2 = 1898.45 N; back = 0.717 + 5 + 0.146 + 0.5 = 6.363;
    //   p3 = (10·1898.45/0.95 + 6.363·3117.25)/2501.49 = 15.92; + 5.863 = 21.78 bar.
    expect(d.pressuresBar.extend).toBeCloseTo(131.63, 1);
    expect(d.pressuresBar.extendMoving).toBeCloseTo(16.52, 1);
    expect(d.pressuresBar.retract).toBeCloseTo(21.78, 1);
    // Relief = 1.1·131.63 = 144.8 → 145 bar.
    expect(d.pressuresBar.reliefSetting).toBe(145);
    // Tandem centre (no overrunning load): pump unloads P→T in neutral. But the 38 kN press at
    // the end of the stroke stalls the cylinder with the valve shifted, so the fixed pump puts
    // its whole flow over the relief at its setting (a fixed pump delivers its flow at whatever
    // pressure the circuit reaches, up to the relief: Esposito [M]; the shared sources' two-speed
    // press note [S]). Peak at the relief: P = 145·27.55/600/0.85 = 7.833 kW.
    // The cycle (60 s) is under 5 min, so the motor is checked by RMS (trade-magazine article on
    // motor sizing for peak loads [S]): extend 16.52 bar → 0.892 kW for 2.04 s, retract 21.78 bar
    // → 1.177 kW for 1.63 s, neutral through the tandem centre ≈ 5.6 bar → 0.30 kW for 56.3 s:
    // P_rms = √((0.892²·2.04 + 1.177²·1.63 + 0.30²·56.3)/60) = 0.39 kW. The momentary press peak
    // must stay within 1.5 × the rating (IEC 60034-1, 60 % for 15 s [M]): 7.833/1.5 = 5.222 kW → 5.5 kW.
    // (Engine 1: 7.11 kW at working pressure → 7.5 kW, with no check of the relief peak.)
    expect(d.directionalValve.center).toBe("tandem");
    expect(d.reliefVent).toBeNull();
    expect(d.motor.sizingPressureBar).toBe(145);
    expect(d.motor.sizedAtRelief).toBe(true);
    expect(d.motor.peakKw).toBeCloseTo(7.833, 2);
    expect(d.motor.rmsKw).toBeCloseTo(0.39, 1);
    expect(d.motor.requiredKw).toBeCloseTo(5.222, 2);
    expect(d.motor.ratedKw).toBe(5.5);
    // Largest path flow φ·Q_p = 34.33 L/min ≤ 0.8·60 → ISO 4401-03.
    expect(d.directionalValve.iso4401Size).toBe("03");
    // Reservoir 4 × 27.55 = 110.2 → 115 L [CP].
    expect(d.reservoir.volumeL).toBe(115);
  });

  it("rod buckling by Tetmajer below λ₀ (Roloff/Matek [M]; stall thrust [CP])", () => {
    // Front flange: L = 300 + 150 = 450 mm; case 4, K = 0.5 → L_K = 225 mm; λ = 4·225/28 = 32.1 < 89.
    // σ_K = 335 − 0.62·32.14 = 315.1 N/mm²; F_K = 315.1·π·28²/4 = 194 006 N.
    // Stall thrust 145·3117.25/10 = 45 200 N; S = 194 006/45 200 = 4.29 ≥ 3.5.
    expect(d.cylinder.buckling.regime).toBe("Tetmajer");
    expect(d.cylinder.buckling.compressiveForceN).toBeCloseTo(45200, -1);
    expect(d.cylinder.bucklingSafetyFactor).toBeCloseTo(4.29, 2);
  });
});

describe("worked example 2 — vertical press, rod down, counterbalance on the rod side", () => {
  // Requirements: vertical, rod down, m = 1500 kg, process force 60 kN, stroke 400 mm,
  // extend 80 mm/s, retract 120 mm/s, fixed-pinned rod end with a front flange, 30 cycles/h, 50 Hz.
  const d = sizeCircuit({ ...ROD_DOWN_PRESS, mountingStyle: "front-flange" });

  it("holds the load with a rod-side CBV and a float centre (sizing contract; sources §6 [CP])", () => {
    // Rod down: the load moves down while extending, so extension overruns; the load hangs
    // on the annulus, so the CBV sits on the rod port.
    expect(d.loads.overrunningStroke).toBe("extend");
    expect(d.counterbalance?.side).toBe("rod");
    expect(d.directionalValve.center).toBe("float");
  });

  it("sizes the bore on the pressing force (textbook F = η·p·A)", () => {
    // G = 1500·9.80665 = 14 709.97 N, friction 0 (vertical guides carry no weight).
    // Pressing: the ram's weight would help, but it is not counted (the CBV may hold it back),
    // so F = 60 000 N; F/η = 63 157.9 N.
    // Ø63: 10·63 157.9/3117.25 = 202.6 bar > 145.45 → rejected. Ø80/36: A1 = 5026.55 mm².
    // With the CBV the press pressure is the larger of the wide-open value 10·63 157.9/5026.55 =
    // 125.65 bar and the throttling value (631 579 + 50.48·4008.67)/(5026.55 + 3·4008.67) = 48.90.
    expect(d.cylinder.boreMm).toBe(80);
    expect(d.cylinder.rodMm).toBe(36);
    expect(d.pressuresBar.extend).toBeCloseTo(125.65, 1);
  });

  it("counterbalance setting, pilot ratio and pilot opening by the full balance (sources §6)", () => {
    // A3 = 5026.55 − π·36²/4 = 4008.67 mm²; φ = 1.2539.
    // p_L = 10·14 709.97/4008.67 = 36.70 bar at rest.
    // Braking (shared sources' counterbalance setting with braking [D]): lowered at the actual
    // 114.19 mm/s and stopped in t_dec = t_acc = 0.2 s, a = 0.5709 m/s²; F = 14 709.97 + 1500·0.5709
    // = 15 566.4 N → p_L,max = 10·15 566.4/4008.67 = 38.83 bar; p_set = 1.3·38.83 = 50.48 bar [CP].
    // (Engine 1 set it from the load at rest, 47.70 bar: the valve could relieve while braking.)
    // Pilot ratio: a process force acts on the lowering stroke → 3:1 [CP].
    // p_pilot = (p_set − p_L)/(R + φ) = (50.48 − 36.70)/(3 + 1.2539) = 3.241 bar [D].
    expect(d.counterbalance?.loadPressureBar).toBeCloseTo(36.7, 2);
    expect(d.counterbalance?.brakingPressureBar).toBeCloseTo(38.83, 2);
    expect(d.counterbalance?.settingBar).toBeCloseTo(50.48, 2);
    expect(d.counterbalance?.pilotRatio).toBe(3);
    expect(d.counterbalance?.pilotOpeningBar).toBeCloseTo(3.241, 3);
  });

  it("flows, pump, lines (continuity [D]; ISO 3662 [M]; SAE J517)", () => {
    // Q_ext = 5026.55·80·0.06/1000 = 24.13; Q_ret = 4008.67·120·0.06/1000 = 28.86 L/min.
    // V = 1000·28.86/(1450·0.95) = 20.95 → 25 cm³/rev; Q_p = 25·1450·0.95/1000 = 34.44 L/min.
    // Return max φ·Q_p = 43.18 L/min.
    expect(d.flowsLpm.extend).toBeCloseTo(24.13, 2);
    expect(d.flowsLpm.retract).toBeCloseTo(28.86, 2);
    expect(d.pump.displacementCcRev).toBe(25);
    expect(d.flowsLpm.pump).toBeCloseTo(34.44, 2);
    expect(d.flowsLpm.returnMax).toBeCloseTo(43.18, 2);
    // Pressure line 34.44 L/min: d = 4.607·√(34.44/5) = 12.09 → -8 (12.7), v = 4.531 m/s.
    // Cap line 43.18: d = 13.54 → -10 (15.9), v = 3.625. Return 43.18 at 3 m/s: 17.48 → -12 (19.05).
    // Suction 34.44 at 1 m/s: 27.04 → -20 (31.75).
    expect(d.lines.pressure.innerDiameterMm).toBe(12.7);
    expect(d.lines.pressure.velocityMS).toBeCloseTo(4.531, 3);
    expect(d.lines.capWork.innerDiameterMm).toBe(15.9);
    expect(d.lines.return.innerDiameterMm).toBe(19.05);
    expect(d.lines.suction.innerDiameterMm).toBe(31.75);
  });

  it("pressures on both strokes, relief, motor and valve", () => {
    // Lowering (extend): actual speed 34.44·1000/(5026.55·0.06) = 114.19 mm/s;
    //   F = −14 709.97 + 1500·0.11419/0.2 = −13 853.6 N (the load pulls); F·η = −13 160.9 N.
    //   Throttling CBV: p1 = (10·(−13 160.9) + 50.48·4008.67)/(5026.55 + 3·4008.67) = 4.149 bar;
    //   supply losses 0.360 + 5 + cap line at Q_p (0.293) = 5.653 → 9.80 bar.
    // Lifting (retract): v = 143.18 mm/s; F = 14 709.97 + 1500·0.14318/0.2 = 15 783.8 N;
    //   back = cap line at φ·Q_p 0.367 + 5 + return 0.089 + 0.5 = 5.956 bar;
    //   p3 = (10·15 783.8/0.95 + 5.956·5026.55)/4008.67 = 48.92 bar;
    //   supply = 0.360 + 5 + rod line 0.720 + 3 (CBV check, free flow 2→1) = 9.079 → 57.99 bar.
    expect(d.pressuresBar.extendMoving).toBeCloseTo(9.8, 1);
    expect(d.pressuresBar.retract).toBeCloseTo(57.99, 1);
    // Relief = 1.1·125.65 = 138.2 → 140 bar [CP].
    expect(d.pressuresBar.reliefSetting).toBe(140);
    // Float centre: P blocked, so the relief is solenoid-vented [CP]: in neutral the pump
    // circulates to tank at the 5 bar vent pressure [CP]. While pressing the stalled cylinder
    // sends the whole pump flow over the relief (fixed pump, Esposito [M]), so the motor is sized
    // at the relief setting, not at the 125.65 bar pressing pressure (engine 1: 8.484 kW):
    //   P_peak = 140·34.4375/600/0.85 = 4821.25/600/0.85 = 8.0354/0.85 = 9.453 kW.
    // 120 s cycle: RMS over lift 57.99 bar (3.92 kW, 2.79 s), lowering 9.80 bar (0.66 kW, 3.5 s) and
    // neutral 5 bar (0.34 kW, 113.7 s) is 0.69 kW; the short press peak within 1.5 × the rating:
    // 9.453/1.5 = 6.302 kW → 7.5 kW (IEC 60072-1 [M]; engine 1: 11 kW).
    expect(d.motor.peakKw).toBeCloseTo(9.453, 2);
    expect(d.motor.rmsKw).toBeCloseTo(0.69, 1);
    expect(d.motor.requiredKw).toBeCloseTo(6.302, 2);
    expect(d.motor.ratedKw).toBe(7.5);
    // Neutral heat at the vent pressure: P = 5·34.4375/600/0.85 = 172.19/600/0.85 = 0.3376 kW
    // (over the 140 bar relief it would be 140·34.4375/600/0.85 = 9.453 kW).
    expect(d.reliefVent?.ventPressureBar).toBe(5);
    expect(d.heat.neutralPressureBar).toBe(5);
    expect(d.heat.neutralLossKw).toBeCloseTo(0.3376, 3);
    const codes = d.warnings.map((w) => w.code);
    expect(codes).not.toContain("PUMP_ON_RELIEF_IN_NEUTRAL");
    expect(codes).toContain("RELIEF_VENTED_IN_NEUTRAL");
    // Largest path flow 43.18 ≤ 48 → ISO 4401-03.
    expect(d.directionalValve.iso4401Size).toBe("03");
    // Buckling: L = 400 + 150 = 550, K = 0.7, L_K = 385, λ = 4·385/36 = 42.8 → Tetmajer,
    // F_K = (335 − 0.62·42.78)·π·36²/4 = 313 992 N; stall 140·5026.55/10 = 70 372 N; S = 4.46.
    expect(d.cylinder.bucklingSafetyFactor).toBeCloseTo(4.46, 2);
  });
});

describe("worked example 3 — inclined lift, rod up, counterbalance on the cap side", () => {
  // Requirements: inclined 30°, rod up, m = 2000 kg, μ = 0.1, stroke 400 mm, 100 mm/s both ways,
  // pinned-pinned (rear clevis and rod eye), 20 cycles/h, 60 Hz.
  const d = sizeCircuit({
    orientation: "inclined",
    inclineDeg: 30,
    rodDirection: "up",
    massKg: 2000,
    strokeMm: 400,
    extendSpeedMmS: 100,
    retractSpeedMmS: 100,
    mounting: "pinned-pinned",
    cyclesPerHour: 20,
    hoursPerDay: 8,
    supplyHz: 60,
  });

  it("loads along the incline (statics [D])", () => {
    // G = 2000·9.80665·sin 30° = 9806.65 N; F_f = 0.1·2000·9.80665·cos 30° = 1698.56 N.
    expect(d.loads.gravityAlongAxisN).toBeCloseTo(9806.65, 1);
    expect(d.loads.frictionN).toBeCloseTo(1698.56, 1);
    expect(d.loads.overrunningStroke).toBe("retract");
  });

  it("the rod grows until buckling passes (Euler, Timoshenko & Gere [M]; SF 3.5 [CP])", () => {
    // L = L₀ + 2·s = 300 + 800 = 1100 mm (assumed L₀ [CP]); case 2, K = 1.
    // Ø40/18: pressures fit (122.5 bar) but λ = 244, F_K = 8 827 N vs stall 135·1256.6/10 = 16 965 N → S = 0.52.
    // Ø40/28: F_K = π²·210 000·(π·28⁴/64)/1100² = 51 682 N; S = 3.05 < 3.5.
    // Ø50/22: relief 95 bar, stall 18 653 N, F_K = 19 697 N → S = 1.06.
    // Ø50/36: relief 90 bar, stall 90·1963.5/10 = 17 671 N; F_K = 141 226 N → S = 7.99 ✓.
    expect(d.cylinder.boreMm).toBe(50);
    expect(d.cylinder.rodMm).toBe(36);
    expect(d.cylinder.buckling.regime).toBe("Euler");
    expect(d.cylinder.bucklingSafetyFactor).toBeCloseTo(7.99, 2);
  });

  it("cap-side counterbalance by the full balance (sources §6)", () => {
    // A1 = 1963.50, A3 = 1963.50 − π·36²/4 = 945.62 mm², φ = 2.0764.
    // p_L = 10·9806.65/1963.50 = 49.94 bar at rest.
    // Braking (shared sources, counterbalance setting with braking [D]): lowered on retraction at
    // the actual 234.41 mm/s, stopped in 0.2 s, a = 1.1721 m/s²; F = 9806.65 + 2000·1.1721 = 12 150.8 N
    // → p_L,max = 10·12 150.8/1963.50 = 61.88 bar; p_set = 1.3·61.88 = 80.45 bar [CP] (engine 1: 64.93).
    // Inertia ratio v/(t·g·sin θ) = 0.1/(0.2·9.80665·0.5) = 0.102 → general, 4.5:1 [CP].
    // p_pilot = (80.45 − 49.94)/(4.5 + 1/2.0764) = 6.123 bar [D].
    expect(d.counterbalance?.side).toBe("cap");
    expect(d.counterbalance?.brakingPressureBar).toBeCloseTo(61.88, 2);
    expect(d.counterbalance?.settingBar).toBeCloseTo(80.45, 2);
    expect(d.counterbalance?.pilotRatio).toBe(4.5);
    expect(d.counterbalance?.pilotOpeningBar).toBeCloseTo(6.123, 3);
    expect(d.directionalValve.center).toBe("float");
  });

  it("flows, pump, pressures, relief, motor, valve and lines", () => {
    // Q_ext = 1963.50·100·0.06/1000 = 11.78; Q_ret = 945.62·100·0.06/1000 = 5.674 L/min.
    // V = 1000·11.78/(1750·0.95) = 7.086 → 8 cm³/rev; Q_p = 8·1750·0.95/1000 = 13.30 L/min.
    expect(d.flowsLpm.extend).toBeCloseTo(11.78, 2);
    expect(d.flowsLpm.retract).toBeCloseTo(5.674, 3);
    expect(d.pump.displacementCcRev).toBe(8);
    expect(d.pump.speedRpm).toBe(1750);
    expect(d.flowsLpm.pump).toBeCloseTo(13.3, 3);
    // Lifting (extend): v = 13.3·1000/(1963.5·0.06) = 112.89 mm/s, F = 1698.56 + 9806.65 +
    //   2000·0.11289/0.2 = 12 634.15 N; back = rod line at Q_p/φ 0.876 + 5 + return 0.027 + 0.5 = 6.403;
    //   p1 = (10·12 634.15/0.95 + 6.403·945.62)/1963.5 = 70.82; supply = pressure line 0.909 + 5 +
    //   cap line at Q_p 0.278 + 3 (CBV check) = 9.187 → 80.00 bar.
    // Lowering (retract): v = 234.41 mm/s; F = 1698.56 − 9806.65 + 2344.14 = −5763.95 N; F·η = −5475.75 N;
    //   CBV throttling: p3 = (10·(−5475.75) + 80.45·1963.5)/(945.62 + 4.5·1963.5) = 10.55 bar;
    //   supply = 0.909 + 5 + rod line 1.819 = 7.728 → 18.28 bar.
    expect(d.pressuresBar.extend).toBeCloseTo(80.0, 1);
    expect(d.pressuresBar.retract).toBeCloseTo(18.28, 1);
    // Relief 1.1·80.00 = 88.0 → 90 bar. Float centre with a solenoid-vented relief [CP]: the pump
    // unloads at 5 bar in neutral, so the motor is sized on the working pressure 80.00 bar:
    //   P_peak = 80.00·13.3/600/0.85 = 1064/510 = 2.086 kW for the 3.5 s lift. The 180 s cycle is
    //   under 5 min and the lift under 15 s, so 2.086/1.5 = 1.391 kW → 1.5 kW (IEC 60072-1 [M];
    //   RMS and 1.5 × peak rule as in example 1; engine 1: 2.2 kW).
    expect(d.pressuresBar.reliefSetting).toBe(90);
    expect(d.motor.peakKw).toBeCloseTo(2.086, 2);
    expect(d.motor.requiredKw).toBeCloseTo(1.391, 2);
    expect(d.motor.ratedKw).toBe(1.5);
    // Neutral heat: 5·13.3/600/0.85 = 66.5/510 = 0.1304 kW (over relief: 90·13.3/510 = 2.347 kW).
    expect(d.heat.neutralLossKw).toBeCloseTo(0.1304, 3);
    // Path flow φ·Q_p = 27.62 L/min → ISO 4401-03.
    expect(d.flowsLpm.returnMax).toBeCloseTo(27.62, 2);
    expect(d.directionalValve.iso4401Size).toBe("03");
    // Lines: pressure 13.3 → d = 7.51 → -5 (7.94), v = 4.477; cap 27.62 → 10.83 → -8 (12.7);
    // return 27.62 at 3 m/s → 13.98 → -10 (15.9); suction 13.3 at 1 m/s → 16.80 → -12 (19.05).
    expect(d.lines.pressure.innerDiameterMm).toBe(7.94);
    expect(d.lines.pressure.velocityMS).toBeCloseTo(4.477, 3);
    expect(d.lines.capWork.innerDiameterMm).toBe(12.7);
    expect(d.lines.return.innerDiameterMm).toBe(15.9);
    expect(d.lines.suction.innerDiameterMm).toBe(19.05);
  });
});
