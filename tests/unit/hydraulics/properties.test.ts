/**
 * Physical-consistency properties over random axes (fast-check). Each names the rule it
 * holds the engine to: continuity Q = A·v [D], textbook F = η·p·A, the sizing contract's
 * overrunning-load rule, and the trade facts about valve ports (common practice).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Design, RequirementsInput } from "~/hydraulics";
import { portNets } from "~/hydraulics/port-nets";
import { forEveryDesign, sizedOrNull } from "../../support/hydraulics";
import { pressAxisArb, requirementsArb } from "./arbitraries";

const RUNS = { numRuns: 300 };

/** For properties of every design: axes nothing can size are left out by fast-check. */
function sizeCircuit(req: RequirementsInput): Design {
  const d = sizedOrNull(req);
  fc.pre(d !== null);
  return d!;
}
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1e-9, Math.abs(b));

describe("monotonic sizing", () => {
  it("a heavier load never gets a smaller bore", () => {
    fc.assert(
      fc.property(requirementsArb, fc.double({ min: 1, max: 3, noNaN: true }), (req, factor) => {
        const light = sizedOrNull(req);
        const heavy = sizedOrNull({ ...req, massKg: Math.min(500000, req.massKg * factor + 1) });
        if (!light) {
          expect(heavy).toBeNull();
          return;
        }
        if (!heavy) return;
        // A heavier overrunning load really does need less pump pressure to lower it; where that
        // lowering stroke sets the working pressure (a nearly massless axis), the relief and with it
        // the stall thrust that decides buckling can fall a step. Every other axis is monotone.
        const overrun = heavy.loads.overrunningStroke;
        const lowering = overrun === "extend" ? heavy.pressuresBar.extend : overrun === "retract" ? heavy.pressuresBar.retract : -1;
        fc.pre(lowering < Math.max(heavy.pressuresBar.extend, heavy.pressuresBar.retract));
        expect(heavy.cylinder.boreMm).toBeGreaterThanOrEqual(light.cylinder.boreMm);
      }),
      RUNS,
    );
  });

  it("a faster stroke never gets less flow on that stroke unless it gets a thicker rod (continuity [D])", () => {
    // Q = A·v. The bore itself is not monotone in speed: the search judges each pair with the
    // actual losses of the hoses its flow needs, and a faster axis stepping up a hose size can
    // lose less in it and so pass a buckling or pressure check its slower twin just fails.
    fc.assert(
      fc.property(requirementsArb, fc.double({ min: 1, max: 3, noNaN: true }), fc.boolean(), (req, factor, extend) => {
        const key = extend ? "extendSpeedMmS" : "retractSpeedMmS";
        const slow = sizedOrNull(req);
        const fast = sizedOrNull({ ...req, [key]: Math.min(2000, req[key] * factor) });
        if (!slow || !fast) return;
        if (extend && fast.cylinder.boreMm >= slow.cylinder.boreMm) {
          expect(fast.flowsLpm.extend).toBeGreaterThanOrEqual(slow.flowsLpm.extend * (1 - 1e-12));
        } else if (!extend && fast.cylinder.boreMm >= slow.cylinder.boreMm && fast.flowsLpm.retract < slow.flowsLpm.retract * (1 - 1e-12)) {
          expect(fast.cylinder.rodMm).toBeGreaterThan(slow.cylinder.rodMm);
        }
      }),
      RUNS,
    );
  });
});

describe("monotonic sizing the sizing contract names", () => {
  it("a higher allowed pressure never gives a larger bore (both series searched together)", () => {
    fc.assert(
      fc.property(fc.oneof(requirementsArb, pressAxisArb), fc.double({ min: 1, max: 3, noNaN: true }), (req, factor) => {
        const low = sizedOrNull(req);
        const high = sizedOrNull({ ...req, maxPressureBar: Math.min(250, (req.maxPressureBar ?? 160) * factor) });
        if (!high) {
          expect(low).toBeNull();
          return;
        }
        if (low) expect(high.cylinder.boreMm).toBeLessThanOrEqual(low.cylinder.boreMm);
      }),
      RUNS,
    );
  });
});

describe("a slower approach never a larger pump (sizing contract)", () => {
  // Found by fast-check (engine 2.10.0): a near-massless 680 mm rod-up axis, rear flange, whose
  // buckling is decided by the stall thrust at the relief. At 36 mm/s it got 50/36 with 3.15 cm³/rev
  // and hoses two sizes above the velocity-limit size (relief 20 bar); at 15 mm/s the velocity-limit
  // hoses were a size smaller, two sizes above them were not enough (laminar Δp ∝ v/d² [D]), the
  // relief rose to 25 bar, the rod failed buckling and the search went to 63/45 with 4 cm³/rev.
  // The hoses the search may try now reach the size the cylinder's own lines need at the seal-speed
  // limit, a bound of the cylinder, not of the flow, so the slower axis keeps the hoses and 50/36.
  // Engine 2.11 sets a compensated pump's relief at max(1.1·p_c, p_c + 10 bar) (a maker's page; common
  // practice): 30 bar over the 20 bar compensator here, where it was 20 or 25, so the compensated axis
  // the case was found with now takes 63/45 at both speeds. The case is kept with a fixed pump, whose
  // relief (1.1 × the working pressure, 20 bar) and hoses are those of the case as found.
  const BUCKLING_LIMITED: RequirementsInput = {
    orientation: "vertical",
    rodDirection: "up",
    massKg: 0,
    processForceN: 0,
    frictionCoefficient: 0,
    strokeMm: 680.83,
    extendSpeedMmS: 35.888,
    retractSpeedMmS: 70.14,
    accelTimeS: 0.0611,
    mounting: "fixed-free",
    mountingStyle: "rear-flange",
    cyclesPerHour: 0,
    hoursPerDay: 0,
    ambientC: 0,
    supplyHz: 60,
    maxPressureBar: 127.69,
    dwellS: 0,
    decelTimeS: 0.0722,
    pressStrokeMm: 6.81,
    pressSpeedMmS: 1.035,
    pumpType: "fixed",
  };
  const slowerBy = (req: RequirementsInput, k: number): RequirementsInput => ({
    ...req,
    extendSpeedMmS: req.extendSpeedMmS * k,
    ...(req.pressSpeedMmS !== undefined ? { pressSpeedMmS: Math.min(req.pressSpeedMmS, req.extendSpeedMmS * k) } : {}),
  });

  it("keeps the faster axis's cylinder in the buckling-limited case fast-check found", () => {
    const fast = sizeCircuit(BUCKLING_LIMITED);
    const slow = sizeCircuit(slowerBy(BUCKLING_LIMITED, 0.428));
    expect([fast.cylinder.boreMm, fast.cylinder.rodMm]).toEqual([50, 36]);
    expect([slow.cylinder.boreMm, slow.cylinder.rodMm]).toEqual([50, 36]);
    expect(slow.pump.displacementCcRev).toBeLessThanOrEqual(fast.pump.displacementCcRev);
    // the compensated pump the case was found with: its 30 bar relief's stall thrust fails the 50/36 rod, at both speeds
    const compensated = { ...BUCKLING_LIMITED, pumpType: "compensated" } as const;
    const [fastC, slowC] = [sizeCircuit(compensated), sizeCircuit(slowerBy(compensated, 0.428))];
    expect(fastC.pressuresBar.reliefSetting).toBe(30);
    expect([fastC.cylinder.boreMm, fastC.cylinder.rodMm]).toEqual([63, 45]);
    expect([slowC.cylinder.boreMm, slowC.cylinder.rodMm]).toEqual([63, 45]);
    expect(slowC.pump.displacementCcRev).toBeLessThanOrEqual(fastC.pump.displacementCcRev);
  });

  it("keeps a regenerative approach that needs a larger cap hose when the approach is slower", () => {
    // Found by fast-check: 25/18, 2.36 m stroke, massless, regenerative at 362 mm/s on 4 cm³/rev with the cap hose
    // three sizes above its velocity-limit size at 242 mm/s; the bound once counted from the pressure line alone
    // refused it, and the slower axis went full-area on 5 cm³/rev.
    const REGEN: RequirementsInput = {
      orientation: "horizontal",
      massKg: 0,
      processForceN: 0,
      frictionCoefficient: 0,
      strokeMm: 2363.07,
      extendSpeedMmS: 362.38,
      retractSpeedMmS: 207.23,
      accelTimeS: 1.147,
      mounting: "fixed-pinned",
      mountingStyle: "front-flange",
      cyclesPerHour: 0,
      hoursPerDay: 0,
      ambientC: 0,
      supplyHz: 60,
      maxPressureBar: 58.02,
      dwellS: 30,
      decelTimeS: 0.0863,
    };
    const fast = sizeCircuit(REGEN);
    const slow = sizeCircuit(slowerBy(REGEN, 0.667));
    expect(fast.regenerative && slow.regenerative).toBe(true);
    expect(slow.pump.displacementCcRev).toBeLessThanOrEqual(fast.pump.displacementCcRev);
  });

  it("over random axes, with and without a pressing stroke, whatever bore each gets (continuity Q = A·v [D])", () => {
    fc.assert(
      fc.property(fc.oneof(requirementsArb, pressAxisArb), fc.double({ min: 0.2, max: 1, noNaN: true }), (req, k) => {
        const a = sizedOrNull(req);
        const b = sizedOrNull(slowerBy(req, k));
        if (!a || !b) return;
        // Left out: the slower axis taking the thinner rod of the same bore, which the faster one failed (buckling
        // under a higher relief). The search takes the lighter cylinder before the smaller pump (its stated order:
        // smallest pair first, the thicker rod only where the thinner fails), and the thinner rod can need more
        // flow: a larger annulus on the return, or an approach too strong for a regenerative circuit on the small
        // rod area, so full-area flow. That is the order of preference, not a lost size step.
        fc.pre(!(b.cylinder.boreMm === a.cylinder.boreMm && b.cylinder.rodMm < a.cylinder.rodMm));
        // Also left out: the two speeds choosing different kinds of pump. A slower approach against a fast return
        // raises the fast-to-pressing flow ratio, so a fixed pump can become a compensated one, whose relief at
        // p_c + 10 bar (common practice) raises the stall thrust the rod is checked at; found by fast-check on a
        // massless 570 mm axis (50/36 fixed at 5 mm/s, 63/45 compensated at 1 mm/s). Whether buckling should be
        // checked at the compensator rather than the relief for such a pump is an open decision (see DEVELOPERS.md).
        fc.pre(a.pump.type === b.pump.type);
        // Also left out: the slower axis fitting a smaller bore that the faster one could only run regeneratively on a
        // larger cylinder. Found by fast-check: a massless 1.65 m inclined axis, 40 bar allowed, took 140/100 running
        // regeneratively on 31.5 cm³/rev at 80 mm/s, and 125/90 at full area on 40 cm³/rev at 59 mm/s. The search
        // takes the lighter cylinder before the smaller pump (its stated order), as in the exclusion above.
        fc.pre(!(a.regenerative && !b.regenerative && b.cylinder.boreMm < a.cylinder.boreMm));
        // Also left out: two double pumps whose pressing sections differ. Each section is a catalogue size, the small
        // one from its pressing flow's fit up to two sizes where a flow control is fitted anyway (engine 2.12), so a
        // slower pressing stroke with a smaller fit has a lower window of small sections. Found by fast-check: a
        // massless 125/56 press with 2.3 mm/s pressing took 5 + 2 = 7 cm³/rev, and at 1 mm/s 6.3 + 1 = 7.3 cm³/rev.
        fc.pre(!(a.pump.type === "double" && a.pump.displacementsCcRev[1] !== b.pump.displacementsCcRev[1]));
        expect(b.pump.displacementCcRev).toBeLessThanOrEqual(a.pump.displacementCcRev + 1e-9);
      }),
      { numRuns: 400 },
    );
  });
});

describe("the motor covers every phase (IEC 60034-1 short overload, from memory [M]; RMS loading, trade-magazine article [S])", () => {
  it("each phase's shaft power within the rating, or 1.5 × the rating for a phase of at most 15 s where the RMS rule is used", () => {
    forEveryDesign(fc.oneof(requirementsArb, pressAxisArb), (d) => {
      fc.pre(!d.warnings.some((w) => w.code === "MOTOR_BEYOND_SERIES"));
      const m = d.motor;
      // motor.phases lists a dwell or pressing phase of 0 s too (one that never happens); neutral is
      // not in it, and all of its shaft power becomes heat, so heat.neutralLossKw is that power
      const phases = [...m.phases.filter((ph) => ph.durationS > 0), { name: "neutral", kw: d.heat.neutralLossKw, durationS: Number.POSITIVE_INFINITY }];
      for (const ph of phases) {
        const short = m.rmsKw !== null && ph.durationS <= 15;
        expect(ph.kw, ph.name).toBeLessThanOrEqual((short ? 1.5 : 1) * m.ratedKw + 1e-9);
        expect(ph.kw, ph.name).toBeLessThanOrEqual(m.peakKw + 1e-9);
      }
    });
  });
});

describe("pressing speed and standby over random pressing axes", () => {
  it("a flow control exactly where the pump offers more than 1.1 × the pressing flow, with its bill lines (common practice)", () => {
    forEveryDesign(pressAxisArb, (d) => {
      const q = d.flowsLpm.press!;
      // what the pump offers while pressing: its whole delivery, or a double pump's small section (Q = V·n·η_v [M])
      const offers = d.pump.type === "double" ? (d.pump.displacementsCcRev[1] * d.pump.speedRpm * 0.95) / 1000 : d.flowsLpm.pump;
      const pc = d.pressSpeedControl;
      expect(pc !== null).toBe(offers > 1.1 * q + 1e-9);
      for (const key of ["press-flow-control", "press-bypass-valve", "press-limit-switch"]) expect(d.bom.some((l) => l.key === key)).toBe(pc !== null);
      if (!pc) return;
      expect(pc.settingLpm).toBe(q);
      // continuity [D]: what the pump offers less what the control passes crosses the relief, unless the pump destrokes
      expect(pc.overReliefLpm).toBeCloseTo(d.pump.type === "compensated" ? 0 : offers - q, 9);
      expect(d.warnings.some((w) => w.code === "PRESS_CONTROL_DROP_LOW")).toBe(pc.availableDropBar < pc.minDropBar - 1e-9);
    });
  });

  it("a compensated pump keeps P blocked at rest, without a vent valve, at p_c delivering only its leakage (shared sources' standby estimate [M])", () => {
    forEveryDesign(
      pressAxisArb.map((r) => ({ ...r, pumpType: "compensated" as const })),
      (d) => {
        fc.pre(d.pump.type === "compensated");
        expect(["closed", "float"]).toContain(d.directionalValve.center);
        expect(d.reliefVent).toBeNull();
        expect(d.circuit.components.some((c) => c.kind === "vent")).toBe(false);
        expect(d.heat.neutralPressureBar).toBe(d.pump.compensatorBar);
        // P = p_c·Q_leak/600 with Q_leak = 0.05·Q_max [D]
        expect(d.heat.neutralLossKw).toBeCloseTo((d.pump.compensatorBar! * 0.05 * d.flowsLpm.pump) / 600, 9);
        // the relief sits above the compensator so it never opens in normal work: max(1.1·p_c, p_c + 10 bar)
        // rounded up to 5 bar (10 % on a maker's page; p_c + 10…20 bar common practice), within the cylinder
        // rating; where the rating caps it, the compensator came down, not the gap (engine 2.11)
        const pc = d.pump.compensatorBar!;
        expect(d.pressuresBar.reliefSetting).toBeGreaterThanOrEqual(Math.max(1.1 * pc, pc + 10) - 1e-9);
        expect(d.pressuresBar.reliefSetting).toBeLessThanOrEqual(d.cylinder.ratedPressureBar);
        expect(d.pressuresBar.reliefSetting % 5).toBe(0);
      },
    );
  });
});

describe("holding (sizing contract)", () => {
  it("a longer hold never drops leak-tight holding, and holding always has its bill line and a venting centre", () => {
    fc.assert(
      fc.property(requirementsArb, fc.double({ min: 0, max: 600, noNaN: true }), fc.double({ min: 1, max: 10, noNaN: true }), (req, minutes, factor) => {
        const short = sizeCircuit({ ...req, holdMinutes: minutes });
        const long = sizeCircuit({ ...req, holdMinutes: Math.min(10_080, minutes * factor) });
        if (short.holding) expect(long.holding).not.toBeNull();
        for (const d of [short, long]) {
          expect(d.bom.some((l) => l.key === "holding-valve")).toBe(d.holding !== null);
          if (d.holding) expect(d.directionalValve.center).toBe("float");
        }
      }),
      RUNS,
    );
  });
});

describe("consistency of every design", () => {
  it("flows equal area × speed (continuity [D])", () => {
    forEveryDesign(requirementsArb, (d) => {
      const c = d.cylinder;
      expect(rel(d.flowsLpm.extend, (c.capAreaMm2 * d.speedsMmS.extendRequested * 0.06) / 1000)).toBeLessThan(1e-9);
      expect(rel(d.flowsLpm.retract, (c.annulusAreaMm2 * d.speedsMmS.retractRequested * 0.06) / 1000)).toBeLessThan(1e-9);
      // the fixed pump serves the larger stroke flow (unless the series runs out); both strokes get all of it.
      // A regenerative approach takes only A_rod·v from the pump (textbook regenerative circuit, v = Q_p / A_rod).
      const approachArea = d.regenerative ? c.capAreaMm2 - c.annulusAreaMm2 : c.capAreaMm2;
      const approachDraw = (approachArea * d.speedsMmS.extendRequested * 0.06) / 1000;
      if (!d.warnings.some((w) => w.code === "PUMP_BEYOND_SERIES")) {
        expect(d.flowsLpm.pump).toBeGreaterThanOrEqual(Math.max(approachDraw, d.flowsLpm.retract) * (1 - 1e-9));
      }
      expect(rel(d.flowsLpm.pump, (approachArea * d.speedsMmS.extendActual * 0.06) / 1000)).toBeLessThan(1e-9);
      expect(rel(d.flowsLpm.pump, (c.annulusAreaMm2 * d.speedsMmS.retractActual * 0.06) / 1000)).toBeLessThan(1e-9);
      expect(rel(d.flowsLpm.returnMax, d.flowsLpm.pump * c.areaRatio)).toBeLessThan(1e-9);
      // pump: Q = V·n·η_v/1000 (Esposito [M])
      expect(rel(d.flowsLpm.pump, (d.pump.displacementCcRev * d.pump.speedRpm * 0.95) / 1000)).toBeLessThan(1e-9);
    });
  });

  it("forces equal pressure × area × efficiency (textbook F = η·p·A)", () => {
    forEveryDesign(requirementsArb, ({ cylinder: c }) => {
      const D = c.boreMm,
        dr = c.rodMm;
      expect(rel(c.capAreaMm2, (Math.PI * D * D) / 4)).toBeLessThan(1e-12);
      expect(rel(c.annulusAreaMm2, (Math.PI * (D * D - dr * dr)) / 4)).toBeLessThan(1e-12);
      expect(rel(c.extendForceN, (c.workingPressureBar * c.capAreaMm2 * 0.95) / 10)).toBeLessThan(1e-9);
      expect(rel(c.retractForceN, (c.workingPressureBar * c.annulusAreaMm2 * 0.95) / 10)).toBeLessThan(1e-9);
    });
  });

  it("limits hold unless a warning says otherwise (relief +10 % [CP]; buckling SF 3.5 [CP])", () => {
    forEveryDesign(requirementsArb, (d) => {
      const codes = new Set(d.warnings.map((w) => w.code));
      const working = Math.max(d.pressuresBar.extend, d.pressuresBar.retract);
      if (!codes.has("PRESSURE_LIMIT_EXCEEDED")) {
        expect(working).toBeLessThanOrEqual(d.pressuresBar.workingLimit + 1e-9);
        expect(working).toBeLessThanOrEqual(d.requirements.maxPressureBar + 1e-9);
        expect(d.pressuresBar.reliefSetting).toBeLessThanOrEqual(d.cylinder.ratedPressureBar);
      }
      if (!codes.has("BUCKLING_MARGIN")) expect(d.cylinder.bucklingSafetyFactor).toBeGreaterThanOrEqual(3.5);
      expect(d.pressuresBar.reliefSetting).toBeGreaterThanOrEqual(1.1 * working - 1e-6);
      expect(d.pressuresBar.reliefSetting).toBeLessThan(1.1 * working + 5 + 1e-9);
      if (!codes.has("MOTOR_BEYOND_SERIES")) expect(d.motor.ratedKw).toBeGreaterThanOrEqual(d.motor.requiredKw);
      // hoses at or below their velocity limit, pressure ≤ 5, return ≤ 3, suction ≤ 1 m/s [CP]
      if (d.lines.pressure.inRange) expect(d.lines.pressure.velocityMS).toBeLessThanOrEqual(5 + 1e-9);
      if (d.lines.return.inRange) expect(d.lines.return.velocityMS).toBeLessThanOrEqual(3 + 1e-9);
      if (d.lines.suction.inRange) expect(d.lines.suction.velocityMS).toBeLessThanOrEqual(1 + 1e-9);
    });
  });

  it("every overrunning case has a counterbalance on the side the load pressurises and a float centre (sizing contract)", () => {
    forEveryDesign(requirementsArb, (d, req) => {
      // No overrun where the weight along the axis does not beat the guide friction (statics [D]).
      if (req.orientation === "horizontal" || d.loads.gravityAlongAxisN <= d.loads.frictionN) {
        expect(d.counterbalance).toBeNull();
        expect(d.directionalValve.center).not.toBe("float");
        return;
      }
      expect(d.counterbalance).not.toBeNull();
      expect(d.counterbalance!.side).toBe(req.rodDirection === "down" ? "rod" : "cap");
      expect(d.directionalValve.center).toBe("float");
      expect(d.bom.some((l) => l.key === "counterbalance-valve")).toBe(true);
      // setting 1.3 × load-induced pressure at its port, and at least 20 bar [CP]
      expect(d.counterbalance!.settingBar).toBeGreaterThanOrEqual(1.3 * d.counterbalance!.loadPressureBar - 1e-9);
      expect(d.counterbalance!.settingBar).toBeGreaterThanOrEqual(20);
      // and it covers the load braked from its actual lowering speed in decelTimeS (Newton [D])
      const cb = d.counterbalance!;
      expect(cb.brakingPressureBar).toBeGreaterThanOrEqual(cb.loadPressureBar);
      expect(cb.settingBar).toBeGreaterThanOrEqual(1.3 * cb.brakingPressureBar - 1e-9);
    });
  });

  it("the tank holds the oil the cylinder draws, and a cooler is designed and billed exactly when the heat asks for one", () => {
    forEveryDesign(requirementsArb, (d) => {
      const c = d.cylinder;
      // cap-end volume in minus rod-end volume back (continuity [D])
      expect(d.reservoir.volumeL).toBeGreaterThanOrEqual(((c.capAreaMm2 - c.annulusAreaMm2) * c.strokeMm) / 1e6);
      const warned = d.warnings.some((w) => w.code === "HEAT_COOLER_NEEDED");
      expect(d.cooler !== null).toBe(warned);
      expect(d.bom.some((l) => l.key === "cooler")).toBe(warned);
      // the same for the decompression valve and the holding valve
      expect(d.bom.some((l) => l.key === "decompression-valve")).toBe(d.warnings.some((w) => w.code === "DECOMPRESSION_NEEDED"));
      expect(d.bom.some((l) => l.key === "holding-valve")).toBe(d.holding !== null);
      if (d.counterbalance) expect(d.counterbalance.flowLpm).toBeGreaterThanOrEqual(d.flowsLpm.pump * (1 - 1e-12));
      // a fixed pump that can stall at force sits at the relief: the motor covers p_relief·Q_p/(600·η)
      if (d.motor.sizedAtRelief) expect(d.motor.peakKw).toBeGreaterThanOrEqual((d.pressuresBar.reliefSetting * d.flowsLpm.pump) / 600 / 0.85 - 1e-9);
      // the motor covers every phase: its rating carries the RMS and any long phase, 1.5 × its rating the peak (IEC 60034-1 [M])
      if (!d.warnings.some((w) => w.code === "MOTOR_BEYOND_SERIES")) {
        expect(1.5 * d.motor.ratedKw).toBeGreaterThanOrEqual(d.motor.peakKw - 1e-9);
        if (d.motor.rmsKw !== null) expect(d.motor.ratedKw).toBeGreaterThanOrEqual(d.motor.rmsKw - 1e-9);
        else expect(d.motor.ratedKw).toBeGreaterThanOrEqual(d.motor.peakKw - 1e-9);
      }
      // meter-out intensification is warned whenever φ × relief exceeds the rating and no rod-side CBV caps it
      const intensifies = d.counterbalance?.side !== "rod" && c.areaRatio * d.pressuresBar.reliefSetting > c.ratedPressureBar + 1e-9;
      expect(d.warnings.some((w) => w.code === "METER_OUT_INTENSIFICATION")).toBe(intensifies);
    });
  });

  it("every contract number is finite and every field is filled", () => {
    forEveryDesign(requirementsArb, (d) => {
      const numbers = [
        d.cylinder.boreMm,
        d.cylinder.rodMm,
        d.cylinder.strokeMm,
        d.cylinder.extendForceN,
        d.cylinder.retractForceN,
        d.pressuresBar.extend,
        d.pressuresBar.retract,
        d.pressuresBar.reliefSetting,
        d.flowsLpm.extend,
        d.flowsLpm.retract,
        d.flowsLpm.pump,
        d.flowsLpm.returnMax,
        d.pump.displacementCcRev,
        d.pump.speedRpm,
        d.motor.requiredKw,
        d.motor.ratedKw,
        d.lines.pressure.innerDiameterMm,
        d.lines.pressure.velocityMS,
        d.lines.return.innerDiameterMm,
        d.lines.return.velocityMS,
        d.lines.suction.innerDiameterMm,
        d.lines.suction.velocityMS,
        d.reservoir.volumeL,
        d.heat.averageLossKw,
      ];
      for (const n of numbers) expect(Number.isFinite(n)).toBe(true);
      expect(d.cylinder.bucklingSafetyFactor).toBeGreaterThan(0);
      if (d.counterbalance) {
        for (const n of [d.counterbalance.settingBar, d.counterbalance.pilotRatio, d.counterbalance.pilotOpeningBar]) {
          expect(Number.isFinite(n)).toBe(true);
        }
      }
      for (const t of d.trail) {
        expect(t.quantity.length).toBeGreaterThan(0);
        expect(t.formula.length).toBeGreaterThan(0);
        expect(t.source.length).toBeGreaterThan(0);
        if (typeof t.value === "number") expect(Number.isFinite(t.value) || t.value === Infinity).toBe(true);
      }
      expect(new Set(d.bom.map((l) => l.key)).size).toBe(d.bom.length);
    });
  });
});

describe("the circuit as data (trade facts, common practice)", () => {
  /** Joins ports that are connected, directly or through a chain, into nets. */
  function nets(d: Design) {
    const lines = d.circuit.connections.filter((c) => c.line !== "pilot").map((c) => [c.from, c.to] as const);
    // A solenoid valve in a work line (the regeneration valve) passes oil through its
    // de-energised position in normal work: 1 ↔ 2 joins the rod port to valve port B.
    const through = d.circuit.components.flatMap((comp) => (comp.positions?.normal ?? []).map(([a, b]) => [`${comp.id}.${a}`, `${comp.id}.${b}`] as const));
    return portNets([...lines, ...through]);
  }

  it("connections reference existing components and ports", () => {
    forEveryDesign(requirementsArb, (d) => {
      const ports = new Map(d.circuit.components.map((c) => [c.id, new Set(c.ports)]));
      const used = new Set<string>();
      for (const conn of d.circuit.connections) {
        for (const end of [conn.from, conn.to]) {
          const [id, port] = end.split(".");
          expect(ports.has(id), end).toBe(true);
          expect(ports.get(id)!.has(port), end).toBe(true);
          used.add(end);
        }
      }
      // every port of every component is connected
      for (const c of d.circuit.components) for (const p of c.ports) expect(used.has(`${c.id}.${p}`), `${c.id}.${p}`).toBe(true);
      const kinds = d.circuit.components.map((c) => c.kind);
      for (const k of ["pump", "motor", "relief", "dcv", "cylinder", "tank", "filter", "gauge"]) expect(kinds).toContain(k);
      expect(kinds.includes("cbv")).toBe(d.counterbalance !== null);
    });
  });

  it("A feeds the cap end, B the rod end, and the CBV pilot (3) joins the opposite work line", () => {
    forEveryDesign(requirementsArb, (d) => {
      const find = nets(d);
      const cb = d.counterbalance;
      // with no CBV in a line, the valve port and cylinder port share a net
      if (cb?.side !== "rod") expect(find("dcv.B")).toBe(find("cylinder.rod"));
      if (cb?.side !== "cap") expect(find("dcv.A")).toBe(find("cylinder.cap"));
      if (cb) {
        const guarded = cb.side === "rod" ? "cylinder.rod" : "cylinder.cap";
        const valvePort = cb.side === "rod" ? "dcv.B" : "dcv.A";
        const opposite = cb.side === "rod" ? "cylinder.cap" : "cylinder.rod";
        expect(find("cbv.1")).toBe(find(guarded)); // 1 to the actuator
        expect(find("cbv.2")).toBe(find(valvePort)); // 2 to the valve
        expect(find("cbv.1")).not.toBe(find("cbv.2")); // the valve itself separates them
        const pilot = d.circuit.connections.find((c) => c.from === "cbv.3" || c.to === "cbv.3")!;
        const other = pilot.from === "cbv.3" ? pilot.to : pilot.from;
        expect(find(other)).toBe(find(opposite));
      }
      expect(find("pump.outlet")).toBe(find("dcv.P"));
      expect(find("pump.outlet")).toBe(find("relief.1"));
      expect(find("relief.2")).toBe(find("tank.return"));
      // a centre that blocks P: the relief's vent port X is piloted to the vent valve, which returns to tank [CP]
      const blocksP = !d.circuit.dcvPositions.center.some((pair) => pair.includes("P"));
      const vent = d.circuit.components.find((c) => c.kind === "vent");
      expect(vent !== undefined).toBe(blocksP);
      if (vent) {
        expect(d.circuit.connections).toContainEqual({ from: "relief.X", to: "vent.P", line: "pilot" });
        expect(find("vent.T")).toBe(find("tank.return"));
        expect(d.heat.neutralPressureBar).toBeLessThan(d.pressuresBar.reliefSetting);
        expect(d.warnings.some((w) => w.code === "PUMP_ON_RELIEF_IN_NEUTRAL")).toBe(false);
      }
    });
  });

  it("valve positions match the centre: float blocks P and joins A, B to T; tandem joins P to T", () => {
    forEveryDesign(requirementsArb, (d) => {
      const key = (pairs: [string, string][]) => pairs.map((p) => [...p].sort().join("-")).sort();
      const pos = d.circuit.dcvPositions;
      expect(key(pos.left)).toEqual(["A-P", "B-T"]); // extend: P→A, B→T
      expect(key(pos.right)).toEqual(["A-T", "B-P"]); // retract: P→B, A→T
      const centre = key(pos.center);
      if (d.directionalValve.center === "float") {
        expect(centre).toEqual(["A-T", "B-T"]);
        expect(centre.some((p) => p.includes("P"))).toBe(false);
      } else if (d.directionalValve.center === "tandem") {
        expect(centre).toEqual(["P-T"]);
      }
    });
  });
});
