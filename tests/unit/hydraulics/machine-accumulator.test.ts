/**
 * A machine's accumulator (engine 2.12): where a short flow peak would size the pump, a pump near
 * the cycle's mean flow charges a bladder accumulator that carries the peaks. Check values from the
 * shared sources' accumulator section (§11.6), worked by hand; each step names its source.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { sizeMachine, type MachineDesign } from "~/hydraulics";
import { ACCUMULATOR_SIZES_L, accumulatorGasVolumeL, accumulatorOilAtL } from "~/hydraulics/accumulator";

describe("the gas law, p·Vⁿ = const with absolute pressures (ideal gas; a maker's accumulator page)", () => {
  it("gives the sources' check values: 1.0 L between 100 and 200 bar, precharge 90 bar", () => {
    // V0 = ΔV / [(p0/p1)^(1/n) − (p0/p2)^(1/n)], 91/101/201 bar absolute: 2.231 L isothermal, 2.774 L adiabatic (§11.6 [D])
    expect(accumulatorGasVolumeL(1.0, 90, 100, 200, 1)).toBeCloseTo(2.231, 3);
    expect(accumulatorGasVolumeL(1.0, 90, 100, 200, 1.4)).toBeCloseTo(2.774, 3);
  });

  it("sizes the flow-peak example: 2.83 L between 100 and 140 bar needs 11.1 L (n = 1) or 14.4 L (n = 1.4)", () => {
    // 3.142 L in 2 s at ≥ 100 bar once every 20 s: Q_p ≥ 9.42 L/min, ΔV = 3.142 − 9.42·2/60 = 2.83 L (§11.6 [D])
    const usable = 3.142 - (9.42 * 2) / 60;
    expect(usable).toBeCloseTo(2.83, 2);
    expect(accumulatorGasVolumeL(usable, 90, 100, 140, 1)).toBeCloseTo(11.1, 1);
    expect(accumulatorGasVolumeL(usable, 90, 100, 140, 1.4)).toBeCloseTo(14.4, 1);
  });

  it("gives the holding example back: 4 L at 90/110/120 bar holds 0.271 L between p2 and p1", () => {
    // isothermal: ΔV = V0·(p0/p1 − p0/p2) = 4·(91/111 − 91/121) = 0.271 L (§11.6 [D])
    expect(accumulatorGasVolumeL(0.271, 90, 110, 120, 1)).toBeCloseTo(4, 1);
    // oil it holds at p2, at rest: V0·(1 − p0/p2) = 4·(1 − 91/121) = 0.992 L [D]
    expect(accumulatorOilAtL(4, 90, 120)).toBeCloseTo(0.992, 3);
  });
});

// A heavy feed that runs out fast and a clamp, one after the other, 60 cycles an hour: the feed's
// peak sizes the pump, but the axes move for about 7 s of the 60 s cycle (invented demo machine).
// Without an accumulator it gets a 20 cm³/rev compensated pump and a 4 kW motor (peak 4.73 kW).
const CLAMP = {
  name: "Clamp",
  orientation: "horizontal",
  massKg: 50,
  processForceN: 40_000,
  strokeMm: 50,
  extendSpeedMmS: 50,
  retractSpeedMmS: 100,
  mounting: "fixed-pinned",
} as const;
const FEED = {
  name: "Feed",
  orientation: "horizontal",
  massKg: 1500,
  processForceN: 0,
  strokeMm: 1000,
  extendSpeedMmS: 400,
  retractSpeedMmS: 400,
  mounting: "fixed-pinned",
} as const;
const duty = (cyclesPerHour: number) => ({ cyclesPerHour, hoursPerDay: 16, supplyHz: 50 as const });

describe("worked example: a heavy fast feed and a clamp at 60 cycles an hour", () => {
  const m = sizeMachine({ axes: [CLAMP, FEED], ...duty(60) });
  const acc = m.accumulator!;
  const moving = m.cycle.filter((p) => p.step !== null);

  it("fits an accumulator and a pump near the mean flow instead of the peak", () => {
    expect(acc).not.toBeNull();
    // the same machine with its pump asked for: no accumulator, the peak sizes the pump and motor
    const without = sizeMachine({ axes: [CLAMP, FEED], ...duty(60), pumpType: "compensated" });
    expect(without.accumulator).toBeNull();
    expect([without.pump.displacementCcRev, without.motor.ratedKw]).toEqual([20, 4]);
    expect(without.motor.peakKw).toBeCloseTo(4.73, 2);
    expect(acc.withoutDisplacementCcRev).toBe(20);
    // the motor's peak comes down by at least 3 kW (our convention)
    expect(without.motor.peakKw - m.motor.peakKw).toBeGreaterThanOrEqual(3);
    // oil a cycle: Σ Q·t / 60 over the motions (continuity [D]); mean over T = 3600 / 60 = 60 s
    const cycleOil = moving.reduce((s, p) => s + (p.demandLpm * p.durationS) / 60, 0);
    const mean = (60 * cycleOil) / 60;
    // pump for 1.25 × the mean (our convention): V = 1000·Q / (n·η_v) = 1000·1.25·mean / (1450·0.95), next ISO 3662 size [M]
    const needCc = (1000 * 1.25 * mean) / (1450 * 0.95);
    expect(m.pump.requiredDisplacementCcRev).toBeCloseTo(needCc, 9);
    expect(m.pump.displacementCcRev).toBe([1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8, 10].find((s) => s >= needCc - 1e-9));
    expect(m.pump.type).toBe("fixed");
    // without it the feed's peak would need a pump at least two sizes larger (our convention)
    expect(acc.withoutDisplacementCcRev).toBeGreaterThanOrEqual(4 * m.pump.displacementCcRev);
    expect(m.pump.reason).toMatch(/accumulator carries the flow peaks/);
  });

  it("sets p1 10 bar above the highest need, p2 = 1.2 × p1 and p0 = 0.9 × p1 (makers' pages; common practice)", () => {
    const up5 = (x: number) => Math.ceil(x / 5 - 1e-9) * 5;
    expect(acc.minBar).toBe(up5(acc.highestNeedBar + 10));
    expect(acc.maxBar).toBe(up5(1.2 * acc.minBar));
    expect(acc.prechargeBar).toBeCloseTo(0.9 * acc.minBar, 9);
    // relief 10 % above p2, rounded up to 5 bar (ISO 4413 pressure-limiting valve; common practice)
    expect(m.pressuresBar.reliefSetting).toBe(up5(1.1 * acc.maxBar));
    // bladder limits: p1 ≥ 1.1·p0 and p2 ≤ 4·p0 (makers' pages [CP])
    expect(acc.minBar).toBeGreaterThanOrEqual(1.1 * acc.prechargeBar - 1e-9);
    expect(acc.maxBar).toBeLessThanOrEqual(4 * acc.prechargeBar);
  });

  it("gives the deepest drawdown of the cycle from a full accumulator, and sizes its gas volume for it", () => {
    // ΔV = max over the motions of the running Σ(Q_axes − Q_p)·t/60, never below full (§11.6, flow-peak support [D])
    let deficit = 0;
    let deepest = 0;
    for (const p of moving) {
      deficit = Math.max(0, deficit + ((p.demandLpm - m.flowsLpm.pump) * p.durationS) / 60);
      deepest = Math.max(deepest, deficit);
    }
    expect(acc.usableL).toBeCloseTo(deepest, 9);
    expect(acc.gasVolumeL).toBeCloseTo(accumulatorGasVolumeL(deepest, acc.prechargeBar, acc.minBar, acc.maxBar, 1.4), 9);
    expect(acc.nominalL).toBe(ACCUMULATOR_SIZES_L.find((s) => s >= acc.gasVolumeL));
    // the pump refills what is left after the motions before the next cycle
    const recharge = m.cycle.find((p) => p.phase === "recharge");
    expect(recharge!.durationS).toBeCloseTo((60 * deficit) / m.flowsLpm.pump, 9);
    expect(m.cycle.reduce((s, p) => s + p.durationS, 0)).toBeCloseTo(60, 9);
    // the tank takes back what the accumulator holds when vented: V0·(1 − p0/p2), absolute [D]
    expect(acc.oilAtMaxL).toBeCloseTo(accumulatorOilAtL(acc.nominalL, acc.prechargeBar, acc.maxBar), 9);
  });

  it("runs the pump at p2 while it charges and unloads it once full; the motor covers p2·Q_p", () => {
    for (const p of moving) expect(p).toMatchObject({ pressureBar: acc.maxBar, pumpFlowLpm: m.flowsLpm.pump });
    const idle = m.cycle.find((p) => p.phase === "neutral")!;
    // unloaded through the charging valve at Δp_u = 5 bar (common practice)
    expect(idle.pressureBar).toBe(5);
    expect(m.motor.peakKw).toBeCloseTo((acc.maxBar * m.flowsLpm.pump) / 600 / 0.85, 9);
    // the relief is not vented: the accumulator must keep its pressure in neutral
    expect(m.reliefVent).toBeNull();
  });

  it("bills, draws and warns what ISO 4413 asks: automatic venting on shut-down", () => {
    const keys = m.bom.map((l) => l.key);
    expect(keys).toEqual(expect.arrayContaining(["accumulator", "accumulator-safety-block", "accumulator-charging-valve", "accumulator-check-valve"]));
    expect(m.bom.find((l) => l.key === "accumulator-safety-block")!.specification).toMatch(/normally open .*switched off.*ISO 4413/);
    expect(m.warnings.map((w) => w.code)).toContain("ACCUMULATOR_STORED_ENERGY");
    // the pump gives less than the peaks by design: no "flow short" warning
    expect(m.warnings.map((w) => w.code)).not.toContain("MACHINE_FLOW_SHORT");
    // every axis's meter-in control holds its speed as the accumulator pressure falls
    for (const a of m.axes) expect(a.speedControl?.reason).toMatch(/accumulator/);
    const ends = new Set(m.circuit.connections.flatMap((c) => [`${c.from}>${c.to}`]));
    for (const c of [
      "pump.outlet>pump-check.inlet",
      "pump.outlet>charging-valve.1",
      "charging-valve.2>tank.return",
      "pump-check.outlet>charging-valve.X",
      "pump-check.outlet>accumulator-block.P",
      "accumulator-block.A>accumulator.P",
      "accumulator-block.T>tank.return",
    ])
      expect(ends.has(c), c).toBe(true);
    // every valve takes its P from past the check, where the accumulator stands
    for (const dcv of m.circuit.components.filter((c) => c.kind === "dcv")) {
      const into = m.circuit.connections.filter((c) => c.to === `${dcv.id}.P`).map((c) => c.from);
      expect(into.length).toBe(1);
    }
    expect(m.trail.map((t) => t.quantity)).toEqual(expect.arrayContaining(["accumulator gas volume", "oil the accumulator gives", "accumulator pressures"]));
  });
});

describe("where an accumulator does not pay", () => {
  const has = (m: MachineDesign) => m.accumulator !== null;
  it("not without a cycle time, with the pump asked for, or for one axis (which sizes as the axis alone)", () => {
    expect(has(sizeMachine({ axes: [CLAMP, FEED], ...duty(0) }))).toBe(false);
    expect(has(sizeMachine({ axes: [CLAMP, FEED], ...duty(60), pumpType: "fixed" }))).toBe(false);
    expect(has(sizeMachine({ axes: [FEED], ...duty(60) }))).toBe(false);
  });

  it("not where the motions fill most of the cycle, so the pump could not shrink two sizes", () => {
    // 900 cycles an hour: 4 s a cycle, shorter than the motions
    expect(has(sizeMachine({ axes: [CLAMP, FEED], ...duty(900) }))).toBe(false);
  });

  it("not with a pressing stroke: a press keeps its own pump choice", () => {
    const press = { ...FEED, name: "Press", processForceN: 50_000, pressStrokeMm: 20, pressSpeedMmS: 10, extendSpeedMmS: 200 };
    expect(has(sizeMachine({ axes: [CLAMP, press], ...duty(60) }))).toBe(false);
  });
});

describe("properties over random cycle rates", () => {
  it("with an accumulator, pump and accumulator together feed every motion and the pump refills it within the cycle", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 900 }), fc.double({ min: 0.3, max: 3, noNaN: true }), (cph, k) => {
        const m = sizeMachine({ axes: [CLAMP, { ...FEED, extendSpeedMmS: FEED.extendSpeedMmS * k }], ...duty(cph) });
        if (!m.accumulator) return;
        const acc = m.accumulator;
        let deficit = 0;
        for (const p of m.cycle.filter((ph) => ph.step !== null)) {
          deficit = Math.max(0, deficit + ((p.demandLpm - p.pumpFlowLpm) * p.durationS) / 60);
          expect(deficit).toBeLessThanOrEqual(acc.usableL + 1e-9);
        }
        const total = m.cycle.reduce((s, p) => s + p.durationS, 0);
        expect(total).toBeLessThanOrEqual(3600 / cph + 1e-6);
        // what the pump delivers in the cycle covers what the axes draw (continuity [D])
        const pumped = m.cycle.filter((p) => p.phase !== "neutral").reduce((s, p) => s + (p.pumpFlowLpm * p.durationS) / 60, 0);
        const drawn = m.cycle.reduce((s, p) => s + (p.demandLpm * p.durationS) / 60, 0);
        expect(pumped).toBeGreaterThanOrEqual(drawn - 1e-9);
        expect(acc.gasVolumeL).toBeLessThanOrEqual(acc.nominalL);
      }),
      { numRuns: 120 },
    );
  });
});
