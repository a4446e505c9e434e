/**
 * How the rod comes down to the pressing speed. A fixed or a compensated pump delivers the
 * approach flow, so a meter-in flow control in the cap line sets the pressing speed, bypassed by
 * a 2/2 solenoid valve during the approach and switched at the start of the pressing stroke by a
 * limit switch (common practice). A double pump gives the pressing speed itself, since only its
 * small section delivers above the unloading setting, unless that section is more than the speed
 * tolerance faster than asked. Never meter-out on the rod side: see METER_OUT_INTENSIFICATION.
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import type { PumpType } from "./pump-choice";
import { v, type Trail } from "./trail";

export interface PressSpeedControl {
  /** flow the control passes to the cap end while pressing, L/min */
  settingLpm: number;
  /** the valve that bypasses the control during the approach, in words */
  bypass: string;
  // additions
  /** what the pump offers while pressing: the whole delivery, or a double pump's small section */
  pumpOffersLpm: number;
  /** the bypass carries the approach flow; the control's free-flow check carries the return from the cap end */
  bypassFlowLpm: number;
  returnFlowLpm: number;
  /** drop across the bypass valve in the approach, counted in the approach pressure */
  bypassDropBar: number;
  /** pump-side pressure while pressing (relief or compensator setting) less the pressing pressure */
  availableDropBar: number;
  /** drop the control's compensator needs to regulate */
  minDropBar: number;
  /** flow a fixed or double pump sends over the relief while pressing (0 for a compensated pump, which destrokes) */
  overReliefLpm: number;
  reason: string;
}

/** A normally closed bypass fails slow: a lost signal or coil leaves the rod at pressing speed. */
export const PRESS_BYPASS_VALVE =
  "2/2 solenoid valve, normally closed, poppet type, across the flow control: energised for the approach, de-energised by a limit switch where the pressing stroke starts";

/**
 * Drop across the bypass valve in the approach. A 2/2 poppet valve sized for the flow it passes
 * gets the same allowance as a directional-valve path at its sized flow [CP]; through the same
 * orifice the drop goes with the square of the flow (orifice equation, Δp ∝ Q²) [D]. The bypass
 * is sized for the approach flow, so here Q = Q_sized and the whole allowance counts.
 */
export function pressBypassDropBar(approachLpm: number, sizedLpm = approachLpm): number {
  if (!(sizedLpm > 0)) throw new Error(`pressBypassDropBar: sized flow must be positive, got ${sizedLpm}`);
  return A.dcvPathDropBar.value * (approachLpm / sizedLpm) ** 2;
}

/** The pump alone would press more than the speed tolerance faster than asked. */
export const pressNeedsControl = (pumpOffersLpm: number, pressFlowLpm: number): boolean => pumpOffersLpm > pressFlowLpm * (1 + A.speedTolerance.value) + 1e-9;

export interface PressSpeedInputs {
  pumpType: PumpType;
  /** cylinder flow at the pressing speed; null without a pressing stroke */
  pressFlowLpm: number | null;
  /** delivery of the whole pump, and of a double pump's small section */
  pumpFlowLpm: number;
  smallSectionLpm: number | null;
  areaRatio: number;
  /** pump pressure while pressing through a control: the relief (fixed, double) or the compensator setting */
  pumpSideBar: number;
  pressBar: number;
  /** drop across the bypass in the approach, as the approach pressure counted it (evaluate.ts) */
  bypassDropBar: number;
}

/** The meter-in control where the pump cannot give the pressing speed itself, else null. */
export function pressSpeedControlFor(i: PressSpeedInputs): PressSpeedControl | null {
  if (i.pressFlowLpm === null) return null;
  const offers = i.pumpType === "double" && i.smallSectionLpm !== null ? i.smallSectionLpm : i.pumpFlowLpm;
  if (!pressNeedsControl(offers, i.pressFlowLpm)) return null;
  // The approach pressure must have been worked out through this bypass: one decision, two places.
  if (!(i.bypassDropBar > 0)) throw new Error("pressSpeedControlFor: a control is fitted, but the approach pressure left out its bypass valve");
  const reason =
    i.pumpType === "double"
      ? `the small pump section delivers ${offers.toFixed(1)} L/min, more than ${Math.round(A.speedTolerance.value * 100)} % above the ${i.pressFlowLpm.toFixed(1)} L/min pressing flow`
      : i.pumpType === "compensated"
        ? "the compensated pump delivers its full flow until the compensator setting is reached, so it would press at approach speed; with the control it destrokes to the pressing flow"
        : "the fixed pump delivers the approach flow all the time; the control passes the pressing flow and the rest crosses the relief";
  return {
    settingLpm: i.pressFlowLpm,
    bypass: PRESS_BYPASS_VALVE,
    pumpOffersLpm: offers,
    bypassFlowLpm: i.pumpFlowLpm,
    returnFlowLpm: i.pumpFlowLpm * i.areaRatio,
    bypassDropBar: i.bypassDropBar,
    availableDropBar: i.pumpSideBar - i.pressBar,
    minDropBar: A.flowControlMinDropBar.value,
    overReliefLpm: i.pumpType === "compensated" ? 0 : Math.max(0, offers - i.pressFlowLpm),
    reason,
  };
}

const CONTROL_SOURCE =
  "meter-in flow control with a solenoid bypass and a limit switch for fast approach and slow pressing, common practice [CP]; pressure-compensated flow controls need about 5–10 bar to regulate, from memory [M]; never meter-out on the rod side (rod-side intensification p2 = φ·p1 + F/A3, force balance [D])";

/** The trail of how the pressing speed is set: by a meter-in control, or by a double pump's small section. */
export function pressSpeedTrail(t: Trail, d: Design): void {
  const q = d.flowsLpm.press;
  if (q === undefined) return;
  const pc = d.pressSpeedControl;
  const tolerance = v(A.speedTolerance.value, "-");
  if (!pc) {
    const small = d.pump.displacementsCcRev[1] ?? d.pump.displacementCcRev;
    t.add(
      "pressing-speed control",
      "none: the small pump section gives the pressing speed",
      "-",
      "Q_S = V_S·n·η_v ≤ (1 + tolerance)·Q_press: only the small section delivers above the unloading setting, and it presses close enough to the speed asked",
      { Q_press: v(q, "L/min"), V_S: v(small, "cm³/rev"), n: v(d.pump.speedRpm, "rpm"), η_v: v(d.pump.volumetricEfficiency, "-"), tolerance },
      "high-low pump circuits, trade-press texts on unloading valves [S]; continuity [D]; 10 % speed tolerance our convention",
    );
    return;
  }
  t.add(
    "pressing-speed flow control setting",
    pc.settingLpm,
    "L/min",
    `Q_set = A1·v_press·0.06/1000, meter-in in the cap line, bypassed by a normally closed 2/2 solenoid valve during the approach and switched by a limit switch where the pressing stroke starts: ${pc.reason}`,
    {
      Q_pump: v(pc.pumpOffersLpm, "L/min"),
      Q_press: v(q, "L/min"),
      tolerance,
      A1: v(d.cylinder.capAreaMm2, "mm²"),
      v_press: v(d.requirements.pressSpeedMmS ?? 0, "mm/s"),
    },
    `continuity [D]; ${CONTROL_SOURCE}`,
  );
  t.add(
    "drop across the flow control's bypass in the approach",
    pc.bypassDropBar,
    "bar",
    "Δp = Δp_valve·(Q/Q_sized)²: the bypass valve, sized for the approach flow it passes, adds its allowance to the approach pressure",
    { Δp_valve: v(A.dcvPathDropBar.value, "bar"), Q: v(pc.bypassFlowLpm, "L/min"), Q_sized: v(pc.bypassFlowLpm, "L/min") },
    "valve pressure-drop allowance at its sized flow, common practice [CP]; orifice equation Δp ∝ Q² [D]",
  );
  t.add(
    "pressure left across the flow control",
    pc.availableDropBar,
    "bar",
    d.pump.type === "compensated"
      ? "Δp = p_c − p_press: the compensated pump holds its setting and destrokes to the set flow"
      : "Δp = p_relief − p_press: the pump sits at the relief while the control passes the set flow",
    { p_side: v(pc.availableDropBar + (d.pressuresBar.press ?? 0), "bar"), p_press: v(d.pressuresBar.press ?? 0, "bar"), Δp_min: v(pc.minDropBar, "bar") },
    CONTROL_SOURCE,
  );
  if (pc.overReliefLpm > 0) {
    t.add(
      "flow over the relief while pressing",
      pc.overReliefLpm,
      "L/min",
      "Q = Q_pump − Q_set: the surplus of a fixed pump (or a double pump's small section) crosses the relief as heat",
      { Q_pump: v(pc.pumpOffersLpm, "L/min"), Q_set: v(pc.settingLpm, "L/min"), p_relief: v(d.pressuresBar.reliefSetting, "bar") },
      "continuity [D]; fixed-pump behaviour, trade-press pump articles [S]",
    );
  }
}
