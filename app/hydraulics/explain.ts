/**
 * The calculation trail: each number of the Design with its formula, inputs and source.
 * Inputs are always a record of name → { value, unit }.
 */
import { A } from "./assumptions";
import { EFFECTIVE_LENGTH_FORMULA, EULER_CASES } from "./buckling";
import type { Design, LineSizing } from "./design";
import type { Evaluation, SizingContext } from "./evaluate";
import type { DutyShares } from "./reservoir-heat";
import { pressSpeedTrail } from "./press-speed";
import { compensatorLeakLpm } from "./pump-choice";
import { Trail, v, type TrailEntry } from "./trail";

const TEXTBOOK_CYL = "textbook cylinder relation (Esposito, Fluid Power with Applications) [M]; units identity [D]";
const DW = "Darcy–Weisbach, fluid-mechanics texts (White; Munson) [M]";
const CONTINUITY = "continuity, Q = A·v [D]";

const LINE_SIZE_SOURCE = `${CONTINUITY}; velocity limits common practice [CP]; SAE J517 dash = ID in 1/16 in [S]`;
const LINE_LOSS_SOURCE = `${DW}; f = 64/Re laminar, Blasius 0.3164·Re^−0.25 above Re 2000 (Engineering Fluid Mechanics [S]; Matthies/Renius [S]); ν, ρ for ISO 3448 VG 46 at 40 °C [S]/[M]`;

const VENT_FORMULA =
  "P is blocked in neutral, so the pilot-operated relief is vented: a normally open 2/2 solenoid valve opens its vent port X to tank, de-energised in neutral (the main stage opens at about p_vent) and energised with solenoid a or b (the relief then works at its setting)";
const VENT_SOURCE = `solenoid-vented relief, common practice [CP]; p_vent ${A.ventPressureBar.value} bar chosen within the 3–7 bar of makers' curves [CP]; unloading a fixed pump behind a float centre, common practice [CP]; Cundiff & Kocher, Fluid Power Circuits and Controls, pressure controls [M]`;
const MOTOR_AT_RELIEF = "relief setting: the pump runs over relief in neutral";
const MOTOR_AT_RELIEF_FORCE =
  "relief setting: pressing at the end of the stroke or dwelling stalls the cylinder with the valve shifted, so the fixed pump delivers its whole flow over the relief at its setting";
const MOTOR_AT_WORKING = "highest working pressure (the pump unloads P→T in neutral)";
const MOTOR_AT_WORKING_VENTED = "highest working pressure (the vented relief unloads the pump in neutral)";
const NEUTRAL_VENTED = "P = p_vent·Q_p / (600·η): the vented relief lets the pump circulate to tank";
const NEUTRAL_VENTED_SOURCE = "P = p·Q/600 [D]; vent pressure common practice [CP]";
const NEUTRAL_ON_RELIEF = "P = p_relief·Q_p / (600·η): the pump runs over relief";
const NEUTRAL_UNLOADED = "P = p_unload·Q_p / (600·η): the pump unloads P→T";
const NEUTRAL_STANDBY =
  "P = p_c·Q_leak / 600, Q_leak ≈ (1 − η_v)·Q_max: P is blocked, so the compensated pump holds its setting and delivers only its leakage (standby); the destroked pump's friction is not counted";
const STANDBY_SOURCE = "compensated-pump standby, trade magazine on pressure-compensated pumps [S]; leakage estimate from memory [M]; P = p·Q/600 [D]";

const REGEN_SOURCE = "textbook regenerative-circuit relations: the same pressure on both sides of the piston leaves the rod area effective [S]; continuity [D]";
const REGEN_CHOICE_SOURCE =
  "regeneration for a fast, low-force approach with the force then built on the full area, and its switch-over by a pressure switch: trade-press and training texts on regenerative circuits [S]; when it pays, common practice [CP]";

/** Whether the extension regenerates and why; where it does, its speed, force, internal flows and switch-over. */
function regenerationTrail(t: Trail, d: Design, reason: string, vQp: { value: number | string; unit: string }): void {
  const c = d.cylinder;
  const rg = d.regeneration ?? null;
  const r = d.requirements;
  t.add(
    "regenerative extension",
    rg ? "yes" : "no",
    "-",
    `${rg ? "regenerative approach" : "full-area extension"}: ${reason}`,
    {
      A_rod: v(c.capAreaMm2 - c.annulusAreaMm2, "mm²"),
      A3: v(c.annulusAreaMm2, "mm²"),
      pumpType: v(r.pumpType ?? "not given", "-"),
      overrunningStroke: v(d.loads.overrunningStroke ?? "none", "-"),
      holding: v(d.holding?.side ?? "none", "-"),
    },
    REGEN_CHOICE_SOURCE,
  );
  if (!rg) return;
  const vRod = v(rg.rodAreaMm2, "mm²");
  t.add(
    "regenerative approach speed",
    rg.speedMmS,
    "mm/s",
    "v = Q_p / (A_rod·0.06): the pump flow fills only the rod's displacement",
    { Q_p: vQp, A_rod: vRod, v_full_area: v((d.flowsLpm.pump * 1000) / (c.capAreaMm2 * 0.06), "mm/s") },
    REGEN_SOURCE,
  );
  t.add(
    "regenerative approach force at working pressure",
    rg.forceAtWorkingN,
    "N",
    "F = η·p·A_rod / 10: the same pressure on both sides of the piston leaves the rod area as net area (full area: η·p·A1/10)",
    { η: v(c.mechanicalEfficiency, "-"), p: v(c.workingPressureBar, "bar"), A_rod: vRod, F_full_area: v(c.extendForceN, "N") },
    REGEN_SOURCE,
  );
  t.add(
    "cap inflow while regenerating",
    rg.capInflowLpm,
    "L/min",
    "Q_cap = Q_p·A1 / A_rod: the cap port, the cap line and the valve stack carry this, not Q_p",
    { Q_p: vQp, A1: v(c.capAreaMm2, "mm²"), A_rod: vRod },
    "continuity [D]; textbook regenerative-circuit relations [S]",
  );
  t.add(
    "rod outflow joining the pump flow",
    rg.rodOutflowLpm,
    "L/min",
    "Q_rod = Q_p·A3 / A_rod",
    { Q_p: vQp, A3: v(c.annulusAreaMm2, "mm²"), A_rod: vRod },
    "continuity [D]",
  );
  t.add(
    "regenerative approach speed over return speed",
    rg.speedRatioToRetract,
    "-",
    "v_regen / v_retract = A3 / A_rod on the same pump flow (equal at φ = 2)",
    { A3: v(c.annulusAreaMm2, "mm²"), A_rod: vRod },
    REGEN_SOURCE,
  );
  if (rg.endsBy === "limit-switch") {
    t.add(
      "regeneration switched off",
      "at the start of the pressing stroke",
      "-",
      "the limit switch where the pressing stroke starts de-energises the regeneration valve, so the pressing force is built on the full area (and the pressing speed is set on it)",
      { pressStrokeMm: v(r.pressStrokeMm, "mm") },
      "switch-over of a regenerative approach to full area before the work stroke: training texts on regenerative circuits [S]; a position switch, common practice [CP]",
    );
  }
  if (rg.switchBar !== null) {
    t.add(
      "regeneration pressure switch setting",
      rg.switchBar,
      "bar",
      "p_s = max(1.15·p_approach, p_approach + 10 bar), rounded up to 5 bar, at most 0.8 × the pressing pressure: the switch de-energises the regeneration valve when the tool meets the work, and the control latches it until the return, since the pressure drops once the full area takes the force",
      { p_approach: v(d.pressuresBar.extendMoving, "bar"), p_press: v(d.pressuresBar.extendPress, "bar") },
      "switch-over of a regenerative approach by a pressure switch: training texts on regenerative circuits [S]; margins common practice [CP]",
    );
  }
}

const EULER_K: Readonly<Record<number, number>> = Object.fromEntries(Object.values(EULER_CASES).map((c) => [c.eulerCase, c.k]));

/** "reason; neutral flow", joined once per pair of texts (the engine has two centres). */
let lastCentre: { reason: string; flow: string; text: string } | undefined;
function centreFormula(reason: string, flow: string): string {
  if (lastCentre?.reason !== reason || lastCentre.flow !== flow) lastCentre = { reason, flow, text: `${reason}; ${flow}` };
  return lastCentre.text;
}

function lineTrail(t: Trail, name: string, l: LineSizing, fluid: { viscosityMm2S: number; densityKgM3: number }): void {
  t.add(
    `${name} line inner diameter`,
    l.innerDiameterMm,
    "mm",
    "d_required = 4.607·√(Q / v_max); smallest SAE J517 dash size with nominal ID ≥ d_required",
    { Q: v(l.flowLpm, "L/min"), v_max: v(l.velocityLimitMS, "m/s"), d_required: v(l.requiredDiameterMm, "mm"), dash: v(l.dashSize, "-") },
    LINE_SIZE_SOURCE,
  );
  t.add(`${name} line velocity`, l.velocityMS, "m/s", "v = 21.22·Q / d²", { Q: v(l.flowLpm, "L/min"), d: v(l.innerDiameterMm, "mm") }, CONTINUITY);
  t.add(
    `${name} line pressure loss`,
    l.pressureLossBarPerM,
    "bar/m",
    "Re = 1000·v·d/ν; Δp/L = f·(1/d)·ρ·v²/2",
    { Re: v(l.reynolds, "-"), f: v(l.frictionFactor, "-"), ν: v(fluid.viscosityMm2S, "mm²/s"), ρ: v(fluid.densityKgM3, "kg/m³"), L: v(l.lengthM, "m") },
    LINE_LOSS_SOURCE,
  );
}

export function explain(
  d: Design,
  ctx: SizingContext,
  ev: Evaluation,
  extra: { pumpOnRelief: boolean; gaugeRangeBar: number; duty: DutyShares },
): TrailEntry[] {
  const t = new Trail();
  const r = d.requirements;
  const L = d.loads;
  const c = d.cylinder;
  const eta = c.mechanicalEfficiency;
  const g = A.gravity.value;
  const qp = d.flowsLpm.pump;
  const phi = c.areaRatio;
  // Inputs that recur across entries are one object each within this design's trail.
  const vQp = v(qp, "L/min");
  const vA1 = v(c.capAreaMm2, "mm²");
  const vA3 = v(c.annulusAreaMm2, "mm²");
  const vPhi = v(phi, "-");
  const vEta = v(eta, "-");
  const vRelief = v(d.pressuresBar.reliefSetting, "bar");
  const rg = d.regeneration ?? null;

  // ---- Loads
  t.add("axis angle", L.angleDeg, "°", "0° horizontal, 90° vertical, inclineDeg when inclined", { orientation: v(r.orientation, "-") }, "requirements");
  t.add(
    "weight component along the axis",
    L.gravityAlongAxisN,
    "N",
    "G = m·g·sin θ",
    { m: v(r.massKg, "kg"), g: v(g, "m/s²"), θ: v(L.angleDeg, "°") },
    "statics [D]",
  );
  t.add(
    "guide friction",
    L.frictionN,
    "N",
    "F_f = μ·m·g·cos θ",
    { μ: v(r.frictionCoefficient, "-"), m: v(r.massKg, "kg"), θ: v(L.angleDeg, "°") },
    "Coulomb friction on the guides [D]; μ = 0.1 default is common practice [CP]",
  );
  t.add(
    "acceleration force, extend",
    L.accelExtendN,
    "N",
    "F_a = m·v/t at the actual extend speed",
    { m: v(r.massKg, "kg"), v: v(d.speedsMmS.extendActual, "mm/s"), t: v(r.accelTimeS, "s") },
    "Newton's second law [D]",
  );
  t.add(
    "acceleration force, retract",
    L.accelRetractN,
    "N",
    "F_a = m·v/t at the actual retract speed",
    { m: v(r.massKg, "kg"), v: v(d.speedsMmS.retractActual, "mm/s"), t: v(r.accelTimeS, "s") },
    "Newton's second law [D]",
  );
  const gSign = ctx.loads.extendGravitySign;
  t.add(
    "extend force needed while accelerating",
    L.extendMovingN,
    "N",
    gSign > 0 ? "F = F_f + G + F_a (rod up: the load is lifted)" : gSign < 0 ? "F = F_f − G + F_a (rod down: the load pulls)" : "F = F_f + F_a",
    { F_f: v(L.frictionN, "N"), G: v(L.gravityAlongAxisN, "N"), F_a: v(L.accelExtendN, "N") },
    "force balance along the axis [D]",
  );
  t.add(
    "extend force needed while pressing",
    L.extendPressN,
    "N",
    "F = F_process + F_f + G if the weight resists (a weight that helps is not counted); acts at the end of the stroke, after acceleration",
    { F_process: v(L.processForceN, "N"), F_f: v(L.frictionN, "N"), G: v(L.gravityAlongAxisN, "N") },
    "force balance along the axis [D]",
  );
  t.add(
    "retract force needed while accelerating",
    L.retractMovingN,
    "N",
    gSign < 0 ? "F = F_f + G + F_a (rod down: retracting lifts the load)" : gSign > 0 ? "F = F_f − G + F_a (rod up: the load pulls)" : "F = F_f + F_a",
    { F_f: v(L.frictionN, "N"), G: v(L.gravityAlongAxisN, "N"), F_a: v(L.accelRetractN, "N") },
    "force balance along the axis [D]",
  );
  t.add(
    "overrunning stroke",
    L.overrunningStroke ?? "none",
    "-",
    "the stroke on which the load moves down (rod down: extend; rod up: retract), where its weight along the axis G exceeds the guide friction F_f; otherwise the load stays put on its own and needs no counterbalance valve",
    { orientation: v(r.orientation, "-"), rodDirection: v(r.rodDirection ?? "-", "-"), G: v(L.gravityAlongAxisN, "N"), F_f: v(L.frictionN, "N") },
    "sizing contract; ISO 4413 load holding [M]; statics [D]",
  );

  // ---- Cylinder choice
  t.add(
    "cylinder series",
    `${c.series} (${c.ratedPressureBar} bar)`,
    "-",
    "both series in one search, bore ascending: at each bore the 160 bar medium series (ISO 6020-2, φ ≈ 1.25 / 2) before the 250 bar heavy series (ISO 6022, φ ≈ 1.6 / 2), thinner rod first; so the series follows the pressure the axis needs, not the highest the buyer allows",
    { maxPressureBar: v(r.maxPressureBar, "bar"), p_working: v(c.workingPressureBar, "bar") },
    "ISO 3320 sizes; ISO 6020-2 and ISO 6022 preferred bore/rod pairings, from memory [M]",
  );
  t.add(
    "working pressure limit",
    d.pressuresBar.workingLimit,
    "bar",
    "p_max = min(maxPressureBar, p_rated / (1 + relief margin))",
    { maxPressureBar: v(r.maxPressureBar, "bar"), p_rated: v(c.ratedPressureBar, "bar"), margin: v(A.reliefMargin.value, "-") },
    "keeps the relief setting within the cylinder rating; relief margin common practice [CP]",
  );
  t.add(
    "bore",
    c.boreMm,
    "mm",
    "smallest pair whose pump pressures ≤ p_max, counterbalance setting ≤ rating and buckling SF ≥ 3.5, with valve, filter, counterbalance and actual line losses and back-pressure included (each line at the flow it carries, in the hose sized for its largest flow)",
    { p_max: v(d.pressuresBar.workingLimit, "bar"), A1_min_no_losses: v((10 * ctx.minExtendHydraulicN) / d.pressuresBar.workingLimit, "mm²") },
    "ISO 3320 series [M]",
  );
  t.add(
    "rod",
    c.rodMm,
    "mm",
    "rod of the chosen pair; the thicker rod is taken when the thinner one fails a limit",
    { bore: v(c.boreMm, "mm") },
    "ISO 3320 series [M]",
  );
  t.add("cap area", c.capAreaMm2, "mm²", "A1 = π·D²/4", { D: v(c.boreMm, "mm") }, "geometry [D]");
  t.add("annulus area", c.annulusAreaMm2, "mm²", "A3 = π·(D² − d²)/4", { D: v(c.boreMm, "mm"), d: v(c.rodMm, "mm") }, "geometry [D]");
  t.add("area ratio", phi, "-", "φ = A1 / A3", { A1: vA1, A3: vA3 }, "ISO 3320 cl. 6 definition [M]");

  // ---- Flows and pump
  t.add("extend flow", d.flowsLpm.extend, "L/min", "Q = A1·v·0.06 / 1000", { A1: vA1, v: v(r.extendSpeedMmS, "mm/s") }, CONTINUITY);
  t.add("retract flow", d.flowsLpm.retract, "L/min", "Q = A3·v·0.06 / 1000", { A3: vA3, v: v(r.retractSpeedMmS, "mm/s") }, CONTINUITY);
  t.add(
    "drive speed",
    d.pump.speedRpm,
    "rpm",
    "4-pole motor: n_s = 120·f/p less slip",
    { f: v(r.supplyHz, "Hz"), p: v(A.motorPoles.value, "poles"), n_s: v((120 * r.supplyHz) / A.motorPoles.value, "rpm") },
    "synchronous speed, electrical-machines textbooks [D]; 1450/1750 rpm nominal common practice [CP]",
  );
  t.add(
    "pump type",
    d.pump.type,
    "-",
    d.pump.reason,
    { pumpType: v(r.pumpType ?? "not given", "-"), Q_p: vQp, Q_press: v(d.flowsLpm.press ?? "no pressing stroke", "L/min") },
    "high-low pumps for a fast approach and slow feed, unloading valves and pressure-compensated pumps: trade-press hydraulics texts [S]; the choice rule is common practice [CP]",
  );
  if (d.pump.type === "double" && d.pump.unloadingBar !== undefined) {
    const [large, small] = d.pump.displacementsCcRev;
    t.add(
      "small pump section",
      small,
      "cm³/rev",
      "at least the size for the pressing flow, V_S ≥ 1000·Q_press/(n·η_v); of the pairs of sizes that give the fast flow, the smallest total",
      { Q_press: v(d.flowsLpm.press ?? 0, "L/min"), n: v(d.pump.speedRpm, "rpm") },
      "Q_S ≥ Q_press, continuity [D]; ISO 3662 R10 series [M]",
    );
    t.add(
      "large pump section",
      large,
      "cm³/rev",
      "next size for the rest of the fast flow: V_L ≥ V_required − V_S; the pump is V_L + V_S",
      { V_required: v(d.pump.requiredDisplacementCcRev, "cm³/rev"), V_S: v(small, "cm³/rev") },
      "Q_L + Q_S ≥ Q_fast, continuity [D]; each section a size of the ISO 3662 R10 series [M]",
    );
    t.add(
      "unloading valve setting",
      d.pump.unloadingBar,
      "bar",
      "p_u = max(1.15 × p_fast, p_fast + 10 bar), rounded up to 5 bar, and at most 0.8 × the pressing pressure",
      {
        p_approach: v(d.pressuresBar.approach ?? d.pressuresBar.extendMoving, "bar"),
        p_retract: v(d.pressuresBar.retract, "bar"),
        p_press: v(d.pressuresBar.press ?? 0, "bar"),
      },
      "unloading valve above the fast-motion pressure and clearly below the pressing pressure, common practice [CP]",
    );
  }
  if (d.pump.type === "compensated" && d.pump.compensatorBar !== undefined) {
    t.add(
      "compensator setting",
      d.pump.compensatorBar,
      "bar",
      d.pressSpeedControl
        ? "p_c = max(p_working, p_press + Δp_control), rounded up to 5 bar: the pressing-speed flow control needs its regulating drop above the pressing pressure" +
            (ev.pump.compensatorNote ? `; ${ev.pump.compensatorNote}` : "")
        : "p_c ≥ the highest working pressure with line losses, rounded up to 5 bar" + (ev.pump.compensatorNote ? `; ${ev.pump.compensatorNote}` : ""),
      {
        p_working: v(d.cylinder.workingPressureBar, "bar"),
        p_relief: vRelief,
        ...(d.pressSpeedControl ? { p_press: v(d.pressuresBar.press ?? 0, "bar"), Δp_control: v(d.pressSpeedControl.minDropBar, "bar") } : {}),
      },
      "compensator somewhat above the heaviest load's pressure: trade-press pump article [S]; relief 10 % or 10–20 bar above the compensator on a maker's page [CP]; flow-control regulating drop from memory [M]",
    );
    if (d.pump.powerLimitKw !== undefined) {
      t.add(
        "power limiter setting",
        d.pump.powerLimitKw,
        "kW",
        "the highest shaft power any phase draws: high flow and high pressure never meet, so the limiter keeps the pump off its corner p_c·Q_max",
        { p_c: v(d.pump.compensatorBar, "bar"), Q_max: vQp },
        "horsepower- and torque-limiting pumps: trade-press pump chapters [S]",
      );
    }
  }
  t.add(
    "pump displacement needed",
    d.pump.requiredDisplacementCcRev,
    "cm³/rev",
    rg
      ? "V = 1000·max(A_rod·v_approach, Q_ret, Q_press) / (n·η_v): the regenerative approach draws only the rod's displacement from the pump"
      : "V = 1000·max(Q_ext, Q_ret) / (n·η_v)",
    { Q: v(ev.pumpRequiredLpm, "L/min"), n: v(d.pump.speedRpm, "rpm"), η_v: v(d.pump.volumetricEfficiency, "-") },
    "pump flow relation (Esposito) [M]; fixed pump serves the larger stroke flow",
  );
  t.add(
    "pump displacement",
    d.pump.displacementCcRev,
    "cm³/rev",
    "next size in the series",
    { V_needed: v(d.pump.requiredDisplacementCcRev, "cm³/rev") },
    "ISO 3662 R10 series [M]",
  );
  t.add(
    "pump delivery",
    qp,
    "L/min",
    "Q_p = V·n·η_v / 1000",
    { V: v(d.pump.displacementCcRev, "cm³/rev"), n: v(d.pump.speedRpm, "rpm"), η_v: v(d.pump.volumetricEfficiency, "-") },
    "pump flow relation (Esposito) [M]",
  );
  t.add(
    "actual extend speed",
    d.speedsMmS.extendActual,
    "mm/s",
    rg ? "v = Q_p / A_rod (regenerative approach)" : "v = Q_p / A1",
    rg ? { Q_p: vQp, A_rod: v(rg.rodAreaMm2, "mm²") } : { Q_p: vQp, A1: vA1 },
    rg ? REGEN_SOURCE : CONTINUITY,
  );
  t.add("actual retract speed", d.speedsMmS.retractActual, "mm/s", "v = Q_p / A3", { Q_p: vQp, A3: vA3 }, CONTINUITY);
  regenerationTrail(t, d, ev.regenReason, vQp);
  t.add(
    "largest return flow",
    d.flowsLpm.returnMax,
    "L/min",
    "Q_return = φ·Q_p (retracting empties the cap end)",
    { φ: vPhi, Q_p: vQp },
    "continuity: return-flow amplification by the area ratio [D]",
  );

  // ---- Lines
  const fluid = ctx.fluid;
  lineTrail(t, "pressure", d.lines.pressure, fluid);
  lineTrail(t, "cap work", d.lines.capWork, fluid);
  lineTrail(t, "rod work", d.lines.rodWork, fluid);
  lineTrail(t, "return", d.lines.return, fluid);
  lineTrail(t, "suction", d.lines.suction, fluid);

  const dcv = A.dcvPathDropBar.value;
  const vDcv = v(dcv, "bar");
  const filter = A.returnFilterDropBar.value;
  t.add(
    "extend supply losses",
    ev.extendSupplyLossBar,
    "bar",
    (rg
      ? "Δp = pressure line + valve P→A at Q_p + cap line at the cap inflow (+ CBV check if cap side)"
      : "Δp = pressure line + valve P→A + cap line (+ CBV check if cap side)") +
      (ev.pressBypassDropBar > 0 ? " + the pressing-speed control's bypass valve" : ""),
    {
      dcv_path: vDcv,
      check: v(ctx.cbvSide === "cap" ? A.cbvCheckDropBar.value : 0, "bar"),
      Q: vQp,
      ...(ev.pressBypassDropBar > 0 ? { bypass: v(ev.pressBypassDropBar, "bar") } : {}),
    },
    `${DW}; valve allowances common practice [CP]`,
  );
  if (rg) {
    t.add(
      "rod side above the cap side while regenerating",
      ev.extendBackBar,
      "bar",
      `Δp = rod line and regeneration valve at the rod outflow + cap line at the cap inflow${ev.pressBypassDropBar > 0 ? " (with the pressing-speed control's bypass in it)" : ""}: the rod end's oil flows into the cap end, so the rod side stands this far above it`,
      { dcv_path: vDcv, Q_rod: v(rg.rodOutflowLpm, "L/min"), Q_cap: v(rg.capInflowLpm, "L/min") },
      `${DW}; valve allowance common practice [CP]`,
    );
  } else {
    t.add(
      "extend back-pressure",
      ev.extendBackBar,
      "bar",
      "Δp = rod line + valve B→T + return line + filter, at Q_p/φ",
      { dcv_path: vDcv, filter: v(filter, "bar"), Q: v(qp / phi, "L/min") },
      `${DW}; valve and filter allowances common practice [CP]`,
    );
  }
  t.add(
    "retract supply losses",
    ev.retractSupplyLossBar,
    "bar",
    "Δp = pressure line + valve P→B + rod line (+ CBV check if rod side)",
    { dcv_path: vDcv, check: v(ctx.cbvSide === "rod" ? A.cbvCheckDropBar.value : 0, "bar"), Q: vQp },
    `${DW}; valve allowances common practice [CP]`,
  );
  t.add(
    "retract back-pressure",
    ev.retractBackBar,
    "bar",
    "Δp = cap line + valve A→T + return line + filter, at φ·Q_p",
    { dcv_path: vDcv, filter: v(filter, "bar"), Q: v(qp * phi, "L/min") },
    `${DW}; valve and filter allowances common practice [CP]`,
  );

  // ---- Counterbalance
  const cb = d.counterbalance;
  if (cb) {
    const outletArea = cb.side === "rod" ? c.annulusAreaMm2 : c.capAreaMm2;
    t.add(
      "counterbalance side",
      cb.side,
      "-",
      "on the side the load pressurises: rod down → rod side; rod up → cap side",
      { overrunningStroke: v(cb.stroke, "-") },
      "sizing contract; ISO 4413 load holding [M]",
    );
    t.add(
      "counterbalance load pressure",
      cb.loadPressureBar,
      "bar",
      "p_L = 10·G / A at the valve port (load at rest)",
      { G: v(L.gravityAlongAxisN, "N"), A: v(outletArea, "mm²") },
      "force balance [D]",
    );
    t.add(
      "counterbalance load pressure while braking",
      cb.brakingPressureBar,
      "bar",
      "p_L,max = 10·(G + m·v/t_dec) / A: the load lowered at v and stopped in t_dec (friction, which helps braking, neglected)",
      { G: v(L.gravityAlongAxisN, "N"), m: v(r.massKg, "kg"), v: v(cb.loweringSpeedMmS, "mm/s"), t_dec: v(r.decelTimeS, "s"), A: v(outletArea, "mm²") },
      "Newton's second law and force balance [D]",
    );
    t.add(
      "counterbalance setting",
      cb.settingBar,
      "bar",
      "p_set = max(1.3·p_L,max, p_min): the valve must not relieve while it brakes the load, and a light load still gets a setting that holds it against surges and return back-pressure",
      { p_L_max: v(cb.brakingPressureBar, "bar"), factor: v(A.cbvSettingFactor.value, "-"), p_min: v(A.cbvMinSettingBar.value, "bar") },
      "valve makers' application notes, common practice [CP]; minimum setting common practice [CP]",
    );
    t.add(
      "pilot ratio",
      cb.pilotRatio,
      ":1",
      `3:1 variable or high-inertia, 4.5:1 general, 8:1 stable — ${cb.pilotRatioReason}`,
      { inertia_ratio: v(ctx.inertiaRatio, "-"), processForce: v(r.processForceN, "N") },
      "ratio classes common practice [CP]; class thresholds our rule",
    );
    t.add(
      "pilot opening pressure",
      cb.pilotOpeningBar,
      "bar",
      cb.side === "rod"
        ? "p_pilot = (p_set − p_L) / (R + φ) — full balance, vented spring chamber"
        : "p_pilot = (p_set − p_L) / (R + 1/φ) — full balance, vented spring chamber",
      { p_set: v(cb.settingBar, "bar"), p_L: v(cb.loadPressureBar, "bar"), R: v(cb.pilotRatio, "-"), φ: vPhi },
      "poppet force balance of a counterbalance valve with a vented spring chamber [D]; ignores back-pressure at port 2",
    );
    t.add(
      "counterbalance heat while lowering",
      cb.loweringHeatKw,
      "kW",
      "P = Δp_CBV·Q / 600, Δp_CBV = p_set − R·p_pilot − p_back",
      { Δp_CBV: v(ev.cbv!.loweringDropBar, "bar"), Q: v(cb.flowLpm, "L/min") },
      "hydraulic power P = p·Q/600 [D]",
    );
  }

  // ---- Decompression
  const dc = d.decompression;
  t.add(
    "oil released by decompression",
    dc.releaseCm3,
    "cm³",
    "ΔV = V·Δp / K_eff, V = cap end at full stroke + cap line",
    {
      V: v(dc.compressedVolumeL, "L"),
      Δp: v(dc.pressureBar, "bar"),
      K_eff: v(A.effectiveBulkModulusBar.value, "bar"),
      threshold: v(A.decompressionThresholdCm3.value, "cm³"),
    },
    "definition of the bulk modulus [D]; 1 % per 1000 psi design value and the 10 in³ rule from a hydraulic-maintenance article on decompression [S]",
  );

  // ---- Holding
  const hold = d.holding;
  t.add(
    "leak-tight holding",
    hold ? `pilot-operated check, ${hold.side}` : "none",
    "-",
    hold
      ? `held at rest longer than ${A.leakTightHoldMinutes.value} min: ${hold.reason}`
      : `held at rest no longer than ${A.leakTightHoldMinutes.value} min: no leak-tight holding asked`,
    { holdMinutes: v(r.holdMinutes, "min"), threshold: v(A.leakTightHoldMinutes.value, "min") },
    "spool valves leak internally under pressure, poppet valves do not (trade-journal articles on counterbalance valves; university course notes on unloading and counterbalance valves) [S]; threshold common practice [CP]",
  );
  if (hold && hold.side !== "both") {
    t.add(
      "holding valve pilot opening pressure",
      hold.pilotOpeningBar,
      "bar",
      hold.side === "rod" ? "p1 = (F/A3) / (R − φ): the pilot must overcome the load, helped by nothing (needs R > φ)" : "p3 = (F/A1) / (R − 1/φ)",
      {
        F: v(hold.side === "rod" || ctx.loads.overrunningStroke === "retract" ? L.gravityAlongAxisN : r.processForceN, "N"),
        R: v(hold.pilotRatio, "-"),
        φ: vPhi,
        A1: vA1,
        A3: vA3,
      },
      "pilot-operated check force balance with the outlet at tank pressure [D]; pilot ratio from a trade text on pilot ratios [S] and makers' offered ratios [CP]",
    );
  }

  // ---- Pressures
  const rodCbv = cb?.side === "rod";
  const capCbv = cb?.side === "cap";
  t.add(
    "extend pressure at the cylinder",
    ev.extendInletBar,
    "bar",
    rodCbv
      ? "p1 = max((10·F_h + p_back·A3)/A1, (10·F_h + p_set·A3)/(A1 + R·A3)), F_h = F·η or F/η"
      : rg
        ? "p1 = (10·F/η + Δp·A3) / A_rod: p1·A1 − (p1 + Δp)·A3 = 10·F/η, both sides joined (regenerative approach)"
        : "p1 = (10·F/η + p_back·A3) / A1",
    { F: v(L.extendMovingN, "N"), η: vEta, A1: vA1, A3: vA3, p_back: v(ev.extendBackBar, "bar"), ...(rg ? { A_rod: v(rg.rodAreaMm2, "mm²") } : {}) },
    rodCbv ? "piston force balance with the CBV balance p2 = p_set − R·p1 [D]" : rg ? `${REGEN_SOURCE}; piston force balance [D]` : TEXTBOOK_CYL,
  );
  t.add(
    "extend pump pressure while moving",
    ev.extendMovingBar,
    "bar",
    "p = p1 + supply losses",
    { p1: v(ev.extendInletBar, "bar"), losses: v(ev.extendSupplyLossBar, "bar") },
    "[D]",
  );
  t.add(
    "extend pump pressure while pressing",
    ev.extendPressBar,
    "bar",
    ev.flowPressLpm !== null ? "p = 10·F_press/(η·A1) + losses at the pressing flow" : "p = 10·F_press/(η·A1) at standstill (no flow losses)",
    { F_press: v(L.extendPressN, "N"), η: vEta, A1: vA1 },
    TEXTBOOK_CYL,
  );
  t.add(
    "extend pump pressure",
    d.pressuresBar.extend,
    "bar",
    "larger of moving and pressing",
    { moving: v(ev.extendMovingBar, "bar"), pressing: v(ev.extendPressBar, "bar") },
    "[D]",
  );
  t.add(
    "retract pressure at the cylinder",
    ev.retractInletBar,
    "bar",
    capCbv ? "p3 = max((10·F_h + p_back·A1)/A3, (10·F_h + p_set·A1)/(A3 + R·A1)), F_h = F·η or F/η" : "p3 = (10·F/η + p_back·A1) / A3",
    { F: v(L.retractMovingN, "N"), η: vEta, A1: vA1, A3: vA3, p_back: v(ev.retractBackBar, "bar") },
    capCbv ? "piston force balance with the CBV balance p1 = p_set − R·p3 [D]" : TEXTBOOK_CYL,
  );
  t.add(
    "retract pump pressure",
    d.pressuresBar.retract,
    "bar",
    "p = p3 + supply losses",
    { p3: v(ev.retractInletBar, "bar"), losses: v(ev.retractSupplyLossBar, "bar") },
    "[D]",
  );
  if (d.pump.type === "compensated") {
    t.add(
      "relief setting",
      d.pressuresBar.reliefSetting,
      "bar",
      "p_relief = max(1.1·p_c, p_c + 10 bar), rounded up to 5 bar: above the compensator so it never opens in normal work, and within the cylinder rating",
      { p_c: v(d.pump.compensatorBar ?? 0, "bar"), rating: v(c.ratedPressureBar, "bar") },
      "a relief is still fitted on a compensated pump, trade-press relief-valve chapter [S]; 10 % above the compensator on a maker's page, or 10–20 bar, common practice [CP]",
    );
  } else {
    t.add(
      "relief setting",
      d.pressuresBar.reliefSetting,
      "bar",
      "p_relief = 1.1·max(p_extend, p_retract), rounded up to 5 bar",
      { p_extend: v(d.pressuresBar.extend, "bar"), p_retract: v(d.pressuresBar.retract, "bar") },
      "about 10 % above working pressure, common practice [CP]",
    );
  }
  t.add(
    "rod-side peak pressure",
    d.pressuresBar.rodSidePeak,
    "bar",
    rodCbv ? "max(retract inlet, CBV setting — the valve caps the annulus)" : "max(retract inlet, extend back-pressure)",
    { rating: v(c.ratedPressureBar, "bar"), φ: vPhi },
    "rod-side intensification p2 = φ·p1 + F/A3, force balance [D]",
  );
  t.add(
    "rod-side pressure if the B line were blocked",
    phi * d.pressuresBar.reliefSetting,
    "bar",
    "p2 = φ·p_relief (fault case, not normal work)",
    { φ: vPhi, p_relief: vRelief },
    "rod-side intensification, force balance [D]",
  );
  t.add("extend force at working pressure", c.extendForceN, "N", "F = η·p·A1 / 10", { η: vEta, p: v(c.workingPressureBar, "bar"), A1: vA1 }, TEXTBOOK_CYL);
  t.add("retract force at working pressure", c.retractForceN, "N", "F = η·p·A3 / 10", { η: vEta, p: v(c.workingPressureBar, "bar"), A3: vA3 }, TEXTBOOK_CYL);

  // ---- Stroke ends
  for (const [name, e, area] of [
    ["extended", c.cushioning.extend, vA3],
    ["retracted", c.cushioning.retract, vA1],
  ] as const) {
    t.add(
      `cushion pressure at the ${name} end`,
      e.cushioned ? e.peakBar : 0,
      "bar",
      e.cushioned
        ? "E = ½·m·v²; F_c = E/s_c (+ weight moving down); p = 10·F_c/A + the pressure still driven in (rod side: φ·p1)"
        : `not cushioned: the piston arrives at ${Math.round(e.speedMmS)} mm/s, at most ${A.cushionSpeedMmS.value} mm/s`,
      { m: v(r.massKg, "kg"), v: v(e.speedMmS, "mm/s"), E: v(e.energyJ, "J"), s_c: v(c.cushioning.cushionLengthMm, "mm"), A: area },
      "kinetic energy and force balance [D]; cushion above about 0.1 m/s and the 25 mm length common practice [CP]; ISO 4413 asks for stroke-end cushioning to be considered [M]",
    );
  }

  // ---- Buckling
  const b = c.buckling;
  t.add(
    "buckling length",
    b.lengthMm,
    "mm",
    b.lengthRule,
    { stroke: v(r.strokeMm, "mm") },
    "simplified, rod stiffness over the whole length; common practice [CP]",
  );
  t.add(
    "effective buckling length",
    b.effectiveLengthMm,
    "mm",
    b.k === EULER_K[b.eulerCase] ? EFFECTIVE_LENGTH_FORMULA[b.eulerCase] : `L_K = K·L, Euler case ${b.eulerCase} (K = ${b.k})`,
    { K: v(b.k, "-"), L: v(b.lengthMm, "mm") },
    "Euler cases, Timoshenko & Gere [M]",
  );
  t.add("rod slenderness", b.slenderness, "-", "λ = 4·L_K / d", { L_K: v(b.effectiveLengthMm, "mm"), d: v(c.rodMm, "mm") }, "solid round rod, i = d/4 [D]");
  t.add(
    "buckling compressive force",
    b.compressiveForceN,
    "N",
    "max(extend load, pressing load, p_relief·A1/10 stall thrust)",
    { p_relief: vRelief, A1: vA1 },
    "common practice [CP]; ISO 4413 buckling in any position [M]",
  );
  t.add(
    "rod critical load",
    b.criticalLoadN,
    "N",
    b.regime === "Euler" ? "F_K = π²·E·I / L_K², I = π·d⁴/64 (λ ≥ λ₀)" : "F_K = (335 − 0.62·λ)·π·d²/4, Tetmajer (λ < λ₀)",
    { E: v(A.elasticModulus.value, "N/mm²"), d: v(c.rodMm, "mm"), L_K: v(b.effectiveLengthMm, "mm"), λ: v(b.slenderness, "-"), λ0: v(b.limitSlenderness, "-") },
    b.regime === "Euler" ? "Euler, Timoshenko & Gere [M]; E from EN 1993-1-1 [M]" : "Tetmajer for E295/E335, Roloff/Matek, Dubbel [M]",
  );
  t.add(
    "buckling safety factor",
    c.bucklingSafetyFactor,
    "-",
    "S = F_K / F",
    { F_K: v(b.criticalLoadN, "N"), F: v(b.compressiveForceN, "N"), S_required: v(b.requiredSafetyFactor, "-") },
    "3.5 required, common practice [CP]; ISO/TS 13725 leaves the factor to the designer [S]",
  );

  // ---- Directional valve and relief venting
  const dv = d.directionalValve;
  const h = d.heat;
  const vent = d.reliefVent;
  t.add(
    "directional valve centre",
    dv.center,
    "-",
    centreFormula(dv.centerReason, dv.neutralPumpFlow),
    { counterbalance: v(cb ? "yes" : "no", "-") },
    "common practice [CP]; Cundiff & Kocher, Fluid Power Circuits and Controls [M]",
  );
  t.add(
    "largest valve path flow",
    dv.maxPathFlowLpm,
    "L/min",
    rg
      ? "max(Q_p, φ·Q_p, Q_p/φ, Q_p·A1/A_rod, Q_p·A3/A_rod): the regeneration valve shares the stack's ISO 4401 interface and carries the cap inflow and rod outflow"
      : "max(Q_p, φ·Q_p, Q_p/φ) over P→A/B and A/B→T",
    { Q_p: vQp, φ: vPhi, ...(rg ? { Q_cap: v(rg.capInflowLpm, "L/min"), Q_rod: v(rg.rodOutflowLpm, "L/min") } : {}) },
    "continuity [D]",
  );
  t.add(
    "ISO 4401 size",
    dv.iso4401Size,
    "-",
    "smallest size with path flow ≤ 80 % of its typical maximum",
    { Q: v(dv.maxPathFlowLpm, "L/min"), typical_max: v(dv.typicalMaxFlowLpm, "L/min") },
    "ISO 4401 interface sizes [S]; flow ratings and 80 % rule common practice [CP]",
  );

  if (vent) {
    t.add(
      "relief vent pressure",
      vent.ventPressureBar,
      "bar",
      VENT_FORMULA,
      { center: v(dv.center, "-"), p_relief: vRelief, coil: v(vent.coilVoltage, "-") },
      VENT_SOURCE,
    );
  }

  // ---- Motor
  const m = d.motor;
  const onRelief = extra.pumpOnRelief;
  t.add(
    "motor sizing pressure",
    m.sizingPressureBar,
    "bar",
    d.pump.type === "double"
      ? "pressure of the phase that draws most: both sections just before the large one unloads (p_u), or the small one over the relief while pressing"
      : d.pump.type === "compensated"
        ? "pressure of the phase that draws most power from the compensated pump"
        : m.sizedAtRelief
          ? MOTOR_AT_RELIEF_FORCE
          : onRelief
            ? MOTOR_AT_RELIEF
            : vent
              ? MOTOR_AT_WORKING_VENTED
              : MOTOR_AT_WORKING,
    {
      p_working: v(c.workingPressureBar, "bar"),
      p_relief: vRelief,
      p_neutral: v(h.neutralPressureBar, "bar"),
      F_process: v(r.processForceN, "N"),
      dwell: v(r.dwellS, "s"),
    },
    "a fixed pump delivers its flow at whatever pressure the circuit reaches, up to the relief setting: textbook pump-circuit behaviour (Esposito) [M]; trade-press pump articles [S]",
  );
  t.add(
    "motor peak power",
    m.peakKw,
    "kW",
    "P_peak = highest phase power the chosen pump draws, p·Q / (600·η_overall)",
    {
      ...Object.fromEntries(m.phases.map((ph) => [`P_${ph.name}`, v(ph.kw, "kW")])),
      p: v(m.sizingPressureBar, "bar"),
      Q_p: vQp,
      η_overall: v(d.pump.overallEfficiency, "-"),
    },
    "hydraulic power (Esposito) [M]; P = p·Q/600 [D]",
  );
  t.add(
    "motor power needed",
    m.requiredKw,
    "kW",
    m.rmsKw !== null
      ? "P = max(P_rms, P_peak / 1.5, every phase longer than 15 s), P_rms = √(Σ P_i²·t_i / T) over extend, retract, dwell and neutral: a cycle under 5 min"
      : "P = P_peak: the cycle is longer than 5 min (or there are no cycles), so the motor carries the peak continuously",
    {
      P_peak: v(m.peakKw, "kW"),
      P_rms: v(m.rmsKw ?? "not used", "kW"),
      T: v(r.cyclesPerHour > 0 ? 3600 / r.cyclesPerHour : "no cycles", "s"),
      dwell: v(r.dwellS, "s"),
    },
    "RMS loading for fluctuating loads, valid under about 5 min (trade-magazine article on motor sizing for peak loads) [S]; 60 % excess torque for 15 s, IEC 60034-1 [M]",
  );
  t.add("motor rating", m.ratedKw, "kW", "next rated output", { P_needed: v(m.requiredKw, "kW") }, "IEC 60072-1 output series [M]");

  // ---- Reservoir, filter, heat
  t.add(
    "oil the cylinder draws from the tank",
    d.reservoir.cylinderDrawL,
    "L",
    "V_draw = (A1 − A3)·s: the cap end takes A1·s, the rod end gives back A3·s",
    { A1: vA1, A3: vA3, s: v(r.strokeMm, "mm") },
    "continuity [D]; the level change is added to the volume rule (tank level with double-acting cylinders) [D]",
  );
  t.add(
    "reservoir volume",
    d.reservoir.volumeL,
    "L",
    "V = 4·Q_p + V_draw, rounded up to 5 L",
    { Q_p: vQp, V_draw: v(d.reservoir.cylinderDrawL, "L") },
    "3–5 × pump flow per minute, common practice [CP]; the 3 × rule in trade-press reservoir fundamentals (NFPA/T3.16.2 for design features) [S]",
  );
  t.add(
    "return filter rating",
    d.returnFilter.ratedFlowLpm,
    "L/min",
    "rated for the largest return flow φ·Q_p",
    { Q_return: v(d.flowsLpm.returnMax, "L/min") },
    "return-flow amplification by the area ratio, continuity [D]; filter sizing common practice [CP]",
  );
  t.add("tank surface", d.reservoir.surfaceM2, "m²", "A ≈ 6·V^(2/3)", { V: v(d.reservoir.volumeL, "L") }, "cube-like tank [D]/[CP]");
  t.add(
    "tank heat shed",
    d.reservoir.dissipationKw,
    "kW",
    "Φ = k·A·(60 °C − ambient)",
    { k: v(A.tankHeatTransfer.value, "W/(m²·K)"), A: v(d.reservoir.surfaceM2, "m²"), ambient: v(r.ambientC, "°C") },
    "k for a tank in free air, Matthies/Renius Tafel 8.7 [S]; 60 °C oil limit, ISO 4413 as paraphrased in University of Minnesota hydraulics course notes [S]",
  );
  t.add(
    "share of time extending",
    h.extendShare,
    "-",
    "cycles/h · (stroke − pressing stroke) / v_actual / 3600",
    { cycles: v(r.cyclesPerHour, "1/h"), t_stroke: v(extra.duty.extendS, "s") },
    "[D]",
  );
  if (d.flowsLpm.press !== undefined && d.pressuresBar.approach !== undefined && d.pressuresBar.press !== undefined) {
    const vPress = v(r.pressSpeedMmS ?? 0, "mm/s");
    t.add(
      "approach pressure",
      d.pressuresBar.approach,
      "bar",
      "p = (F_friction ± G + m·a)/(η·A1) + line and valve losses: no process force before the tool meets the work",
      { F: v(L.extendMovingN, "N"), A1: vA1, v: v(d.speedsMmS.extendActual, "mm/s") },
      "force balance on the piston (Esposito) [M]; losses by Darcy–Weisbach [D]",
    );
    t.add("flow while pressing", d.flowsLpm.press, "L/min", "Q = A1·v_press·0.06/1000", { A1: vA1, v_press: vPress }, "continuity [D]");
    t.add(
      "pressing pressure",
      d.pressuresBar.press,
      "bar",
      "p = (F_process + F_friction + G)/(η·A1) + losses at the pressing flow",
      { F: v(L.extendPressN, "N"), A1: vA1, Q: v(d.flowsLpm.press, "L/min") },
      "force balance on the piston (Esposito) [M]; losses by Darcy–Weisbach [D]",
    );
    pressSpeedTrail(t, d);
    t.add(
      "share of time pressing",
      h.pressShare,
      "-",
      "cycles/h · pressing stroke / v_press / 3600",
      { cycles: v(r.cyclesPerHour, "1/h"), t_press: v(extra.duty.pressS, "s"), pressing_stroke: v(r.pressStrokeMm, "mm") },
      "[D]",
    );
    t.add(
      "heat while pressing",
      h.pressLossKw,
      "kW",
      d.pump.type === "fixed"
        ? "P = p_relief·Q_p/(600·η) − F_press·v_press: a fixed pump sits at the relief; the flow control passes the pressing flow (dropping p_relief − p_press) and the surplus crosses the relief"
        : "P = the chosen pump's power while pressing / η − F_press·v_press",
      { p_relief: vRelief, Q_p: vQp, F_press: v(L.extendPressN, "N"), v_press: vPress },
      "energy balance [D]; fixed-pump behaviour, trade-press pump articles [S]",
    );
  }
  t.add(
    "share of time retracting",
    h.retractShare,
    "-",
    "cycles/h · stroke / v_actual / 3600",
    { cycles: v(r.cyclesPerHour, "1/h"), t_stroke: v(extra.duty.retractS, "s") },
    "[D]",
  );
  t.add(
    "heat while extending",
    h.extendLossKw,
    "kW",
    "P_shaft − F_steady·v (pump losses, lines, valves, CBV)",
    { p: v(ev.extendSteadyBar, "bar"), Q_p: vQp, F_steady: v(L.extendSteadyN, "N"), v: v(d.speedsMmS.extendActual, "mm/s") },
    "energy balance [D]",
  );
  t.add(
    "heat while retracting",
    h.retractLossKw,
    "kW",
    "P_shaft − F_steady·v (pump losses, lines, valves, CBV)",
    { p: v(ev.retractSteadyBar, "bar"), Q_p: vQp, F_steady: v(L.retractSteadyN, "N"), v: v(d.speedsMmS.retractActual, "mm/s") },
    "energy balance [D]",
  );
  if (d.pump.type === "compensated") {
    t.add(
      "heat in neutral",
      h.neutralLossKw,
      "kW",
      NEUTRAL_STANDBY,
      { p_c: v(h.neutralPressureBar, "bar"), Q_leak: v(compensatorLeakLpm(qp), "L/min"), Q_max: vQp, η_v: v(d.pump.volumetricEfficiency, "-") },
      STANDBY_SOURCE,
    );
  } else {
    t.add(
      "heat in neutral",
      h.neutralLossKw,
      "kW",
      vent ? NEUTRAL_VENTED : onRelief ? NEUTRAL_ON_RELIEF : NEUTRAL_UNLOADED,
      { p: v(h.neutralPressureBar, "bar"), Q_p: vQp, η: v(d.pump.overallEfficiency, "-") },
      vent ? NEUTRAL_VENTED_SOURCE : "P = p·Q/600 [D]",
    );
  }
  t.add("share of time dwelling at force", h.dwellShare, "-", "cycles/h · dwell / 3600", { cycles: v(r.cyclesPerHour, "1/h"), dwell: v(r.dwellS, "s") }, "[D]");
  t.add(
    "heat while dwelling",
    h.dwellLossKw,
    "kW",
    d.pump.type === "double"
      ? "P = (p_relief·Q_S + Δp_u·Q_L) / (600·η): the small section crosses the relief, the large one is unloaded; the rod does no work"
      : d.pump.type === "compensated"
        ? NEUTRAL_STANDBY
        : "P = p_relief·Q_p / (600·η): the rod does no work, the whole flow crosses the relief and all input power becomes heat",
    d.pump.type === "compensated"
      ? { p_c: v(d.pump.compensatorBar ?? 0, "bar"), Q_leak: v(compensatorLeakLpm(qp), "L/min"), Q_max: vQp }
      : { p_relief: vRelief, Q_p: vQp, η: v(d.pump.overallEfficiency, "-") },
    d.pump.type === "compensated" ? STANDBY_SOURCE : "energy balance [D]; P = p·Q/600 [D]",
  );
  t.add(
    "average heat loss",
    h.averageLossKw,
    "kW",
    "Σ share·heat over approach, pressing, retract, dwell and neutral",
    {
      extend: v(h.extendLossKw, "kW"),
      retract: v(h.retractLossKw, "kW"),
      dwell: v(h.dwellLossKw, "kW"),
      neutral: v(h.neutralLossKw, "kW"),
      dwell_share: v(h.dwellShare, "-"),
      neutral_share: v(h.neutralShare, "-"),
    },
    "duty-cycle average [D]",
  );
  t.add(
    "cooler duty",
    h.coolerKw,
    "kW",
    "max(0, average heat − tank heat shed)",
    { average: v(h.averageLossKw, "kW"), shed: v(h.tankDissipationKw, "kW") },
    "[D]",
  );
  t.add("gauge range", extra.gaugeRangeBar, "bar", "next range ≥ 1.5 × relief setting", { p_relief: vRelief }, "common practice [CP]; ranges EN 837-1 [M]");
  return t.entries;
}
