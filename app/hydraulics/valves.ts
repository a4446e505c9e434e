import { A } from "./assumptions";
import { num } from "./format";
import { ISO4401_SIZES, type Iso4401Size } from "./series";

// ---- Relief -------------------------------------------------------------------------------

/** Relief about 10 % above the highest working pressure, rounded up to 5 bar [CP]. */
export function reliefSettingBar(workingBar: number): number {
  const step = A.reliefRoundingBar.value;
  return Math.ceil((workingBar * (1 + A.reliefMargin.value)) / step - 1e-9) * step;
}

// ---- Counterbalance -----------------------------------------------------------------------

export type CbvSide = "rod" | "cap";

/**
 * Setting ≈ 1.3 × the load-induced pressure at the CBV port [CP], and never below a minimum
 * [CP]: a light load must still be held against pressure surges and the few bar of back-pressure
 * the return line puts on the valve, and makers' adjustable springs start at about that.
 */
export const cbvSettingBar = (loadPressureBar: number): number => Math.max(A.cbvSettingFactor.value * loadPressureBar, A.cbvMinSettingBar.value);

/**
 * Highest load-induced pressure at the CBV port while lowering and braking: stopping the load
 * from speed v in t_dec adds m·v/t_dec to its weight along the axis, F = m·(g·sin θ + v/t_dec)
 * (friction, which helps braking, neglected): p = 10·F / A [D]. Set from this, the valve does
 * not relieve while the load is stopped and the load does not run on.
 */
export const brakingLoadPressureBar = (weightAlongAxisN: number, massKg: number, speedMmS: number, decelTimeS: number, areaMm2: number): number =>
  (10 * (weightAlongAxisN + (massKg * speedMmS) / 1000 / decelTimeS)) / areaMm2;

export interface PilotRatioChoice {
  ratio: number;
  loadClass: "variable or high-inertia" | "general" | "stable";
  reason: string;
}

/**
 * Pilot ratio for the kind of load (classes are common practice): 3:1 when the load varies
 * during the lowering stroke or its inertia is high, 8:1 when it is slow and steady, else 4.5:1.
 * The inertia ratio m·v/t ÷ m·g·sin θ does not depend on the mass.
 */
export function choosePilotRatio(inertiaRatio: number, processForceOnLoweringStroke: boolean): PilotRatioChoice {
  if (processForceOnLoweringStroke || inertiaRatio >= A.highInertiaRatio.value) {
    return {
      ratio: 3,
      loadClass: "variable or high-inertia",
      reason: processForceOnLoweringStroke
        ? "a process force acts on the lowering stroke, so the load varies: 3:1 for stability"
        : `acceleration force is ${num(inertiaRatio * 100, 0)} % of the weight component (≥ ${A.highInertiaRatio.value * 100} %): 3:1 for damping`,
    };
  }
  if (inertiaRatio < A.stableInertiaRatio.value) {
    return {
      ratio: 8,
      loadClass: "stable",
      reason: `acceleration force is ${num(inertiaRatio * 100, 1)} % of the weight component (< ${A.stableInertiaRatio.value * 100} %), no process force: 8:1 for a steady load`,
    };
  }
  return { ratio: 4.5, loadClass: "general", reason: "ordinary load: 4.5:1, the general-purpose ratio" };
}

/**
 * Pilot pressure that opens the CBV, full balance with a vented spring chamber (sources §6):
 * rod side p₁ = (p_set − p_L)/(R + φ); cap side p₃ = (p_set − p_L)/(R + 1/φ).
 * areaTerm is φ for a rod-side valve and 1/φ for a cap-side valve.
 */
export const pilotOpeningBar = (settingBar: number, loadPressureBar: number, ratio: number, areaTerm: number): number =>
  Math.max(0, (settingBar - loadPressureBar) / (ratio + areaTerm));

// ---- Cylinder inlet pressure ---------------------------------------------------------------

/**
 * Hydraulic force the cylinder must produce for a required load force: seal friction adds
 * to a force the oil drives (F/η) and takes from a load that drives the oil (F·η).
 */
export const hydraulicForceN = (requiredN: number, efficiency: number): number => (requiredN >= 0 ? requiredN / efficiency : requiredN * efficiency);

/**
 * Inlet pressure at the cylinder from the piston force balance
 * p_in·A_in − p_out·A_out = 10·F_h (p in bar, A in mm², F in N).
 * With a CBV on the outlet, p_out = p_set − R·p_in while it throttles, so
 * p_in = (10·F_h + p_set·A_out) / (A_in + R·A_out); once it is wide open the downstream
 * back-pressure rules instead — the larger of the two is the one that occurs.
 */
export function cylinderInletBar(
  hydraulicN: number,
  inletAreaMm2: number,
  outletAreaMm2: number,
  backPressureBar: number,
  outletCbv?: { settingBar: number; ratio: number },
): number {
  return outletCbv
    ? cylinderInletBarCbv(hydraulicN, inletAreaMm2, outletAreaMm2, backPressureBar, outletCbv.settingBar, outletCbv.ratio)
    : Math.max(0, (10 * hydraulicN + backPressureBar * outletAreaMm2) / inletAreaMm2);
}

/** cylinderInletBar with a CBV on the outlet, its setting and pilot ratio given as numbers. */
export function cylinderInletBarCbv(
  hydraulicN: number,
  inletAreaMm2: number,
  outletAreaMm2: number,
  backPressureBar: number,
  settingBar: number,
  ratio: number,
): number {
  const free = (10 * hydraulicN + backPressureBar * outletAreaMm2) / inletAreaMm2;
  const throttling = (10 * hydraulicN + settingBar * outletAreaMm2) / (inletAreaMm2 + ratio * outletAreaMm2);
  return Math.max(0, free, throttling);
}

// ---- Directional valve ---------------------------------------------------------------------

export type DcvCenter = "float" | "closed" | "tandem" | "open";
export type PortPair = [string, string];

export interface DcvPositions {
  /** solenoid a: P→A, B→T — the cylinder extends (A feeds the cap end) */
  left: PortPair[];
  /** spring-centred neutral */
  center: PortPair[];
  /** solenoid b: P→B, A→T — the cylinder retracts */
  right: PortPair[];
}

export interface DcvCenterChoice {
  center: DcvCenter;
  reason: string;
  /** what the pump's flow does while the valve is in neutral */
  neutralPumpFlow: string;
  /** the centre blocks P, so a fixed pump would run over relief in neutral unless it is unloaded */
  pBlockedInNeutral: boolean;
  /** the relief is solenoid-vented, so the pump circulates to tank at the vent pressure in neutral */
  ventedRelief: boolean;
  /** the pump runs over the relief at its setting in neutral (P blocked and nothing unloads it) */
  pumpOnReliefInNeutral: boolean;
}

const FLOAT_REASON =
  "float centre (P blocked, A and B to T): the counterbalance pilot line vents in neutral, so the valve closes fully and holds the load on its poppet; a closed or tandem centre could trap pilot pressure and let the load creep";
/**
 * What a solenoid-vented relief does in neutral [CP]: a pilot-operated relief whose vent port X
 * is opened to tank by a small normally open 2/2 solenoid valve, de-energised in neutral and
 * energised with either directional-valve solenoid.
 */
export const VENTED_NEUTRAL_FLOW = `P is blocked, so the relief is vented instead: its normally open 2/2 vent valve is de-energised in neutral and opens the relief's vent port X to tank, so the pump's flow circulates to tank at about ${A.ventPressureBar.value} bar; the vent valve is energised with solenoid a or b, and the relief then works at its setting`;
const TANDEM_REASON =
  "tandem centre (P to T, A and B blocked): with no overrunning load the blocked work ports hold the axis, and the fixed pump unloads to tank at low pressure";
const TANDEM_NEUTRAL_FLOW = "P is joined to T, so the pump's flow returns to tank at low pressure in neutral";

const FLOAT_CHOICE: Readonly<DcvCenterChoice> = Object.freeze({
  center: "float",
  reason: FLOAT_REASON,
  neutralPumpFlow: VENTED_NEUTRAL_FLOW,
  pBlockedInNeutral: true,
  ventedRelief: true,
  pumpOnReliefInNeutral: false,
});
const TANDEM_CHOICE: Readonly<DcvCenterChoice> = Object.freeze({
  center: "tandem",
  reason: TANDEM_REASON,
  neutralPumpFlow: TANDEM_NEUTRAL_FLOW,
  pBlockedInNeutral: false,
  ventedRelief: false,
  pumpOnReliefInNeutral: false,
});

const FLOAT_CHOICE_POCV: Readonly<DcvCenterChoice> = Object.freeze({
  ...FLOAT_CHOICE,
  reason:
    "float centre (P blocked, A and B to T): the pilot-operated checks' pilot lines vent in neutral, so their poppets seat fully and hold the load without drift; a closed or tandem centre could trap pilot pressure and keep them open",
});

/**
 * A pressure-compensated pump behind a centre that blocks P destrokes to its leakage at the
 * compensator setting and waits there, ready for the next stroke (standby; trade-magazine article
 * on compensated pumps [S]): no vent valve is needed, and P is blocked rather than joined to T.
 */
const COMPENSATED_STANDBY_FLOW =
  "P is blocked, so the pressure-compensated pump destrokes in neutral and delivers only its leakage at the compensator setting (standby); no vent or unloading valve is needed";
const CLOSED_CHOICE_COMPENSATED: Readonly<DcvCenterChoice> = Object.freeze({
  center: "closed",
  reason:
    "closed centre (P, A, B and T blocked): no overrunning load, so the blocked work ports hold the axis, and the compensated pump holds its setting at P ready for the next stroke",
  neutralPumpFlow: COMPENSATED_STANDBY_FLOW,
  pBlockedInNeutral: true,
  ventedRelief: false,
  pumpOnReliefInNeutral: false,
});
const FLOAT_CHOICE_COMPENSATED: Readonly<DcvCenterChoice> = Object.freeze({ ...FLOAT_CHOICE, neutralPumpFlow: COMPENSATED_STANDBY_FLOW, ventedRelief: false });
const FLOAT_CHOICE_POCV_COMPENSATED: Readonly<DcvCenterChoice> = Object.freeze({
  ...FLOAT_CHOICE_POCV,
  neutralPumpFlow: COMPENSATED_STANDBY_FLOW,
  ventedRelief: false,
});

/**
 * Float centre where a counterbalance valve or pilot-operated checks need their pilots vented,
 * else tandem. A centre that blocks P gets a solenoid-vented relief, so the fixed pump does not
 * run over relief in neutral ("unless it is unloaded by a vent or unloading valve", common
 * practice) [CP]. A compensated pump unloads itself: P stays blocked (closed centre where no
 * pilot must vent) and the relief is not vented.
 */
export function chooseDcvCenter(hasCbv: boolean, hasHolding = false, compensatedPump = false): Readonly<DcvCenterChoice> {
  if (compensatedPump) return hasCbv ? FLOAT_CHOICE_COMPENSATED : hasHolding ? FLOAT_CHOICE_POCV_COMPENSATED : CLOSED_CHOICE_COMPENSATED;
  return hasCbv ? FLOAT_CHOICE : hasHolding ? FLOAT_CHOICE_POCV : TANDEM_CHOICE;
}

const CENTER_PAIRS: Record<DcvCenter, PortPair[]> = {
  float: [
    ["A", "T"],
    ["B", "T"],
  ],
  closed: [],
  tandem: [["P", "T"]],
  open: [
    ["P", "T"],
    ["A", "T"],
    ["B", "T"],
  ],
};

/** True when the centre joins P to nothing, so the pump cannot unload through the valve. */
export const centreBlocksP = (center: DcvCenter): boolean => !CENTER_PAIRS[center].some((pair) => pair[0] === "P" || pair[1] === "P");

function copyPairs(pairs: readonly PortPair[]): PortPair[] {
  const out: PortPair[] = [];
  for (const p of pairs) out.push([p[0], p[1]]);
  return out;
}

export function dcvPositions(center: DcvCenter): DcvPositions {
  return {
    left: [
      ["P", "A"],
      ["B", "T"],
    ],
    center: copyPairs(CENTER_PAIRS[center]),
    right: [
      ["P", "B"],
      ["A", "T"],
    ],
  };
}

/** Smallest ISO 4401 size whose use stays ≤ 80 % of its typical max flow [CP]. */
export function selectIso4401(maxPathFlowLpm: number): { size: Iso4401Size; nominal: string; typicalMaxLpm: number; withinLimit: boolean } {
  const use = A.valveFlowUse.value;
  for (const s of ISO4401_SIZES) {
    if (maxPathFlowLpm <= use * s.typicalMaxLpm) {
      return { size: s.size, nominal: s.nominal, typicalMaxLpm: s.typicalMaxLpm, withinLimit: true };
    }
  }
  const last = ISO4401_SIZES[ISO4401_SIZES.length - 1];
  return { size: last.size, nominal: last.nominal, typicalMaxLpm: last.typicalMaxLpm, withinLimit: false };
}
