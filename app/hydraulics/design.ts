/**
 * The Design the engine returns. Field names from the sizing contract are fixed; the others
 * are additions for the design page, exports and reviewers.
 */
import type { Cushioning } from "./cushioning";
import type { CyclePhase } from "./cycle";
import type { Decompression } from "./decompression";
import type { PressSpeedControl } from "./press-speed";
import type { PumpType } from "./pump-choice";
import type { HoldingDesign } from "./holding";
import type { LineSizing } from "./lines";
import type { Requirements } from "./requirements";
import type { Iso4401Size } from "./series";
import type { TrailEntry } from "./trail";
import type { CbvSide, DcvCenter, DcvPositions, PortPair } from "./valves";
import type { Warning } from "./warnings";

export type { DcvPositions, PortPair, DcvCenter, CbvSide, LineSizing, TrailEntry, Warning, HoldingDesign, CyclePhase };

export interface LoadsBreakdown {
  angleDeg: number;
  gravityAlongAxisN: number;
  frictionN: number;
  processForceN: number;
  accelExtendN: number;
  accelRetractN: number;
  /** force the cylinder must exert in the direction of motion; negative when the load pulls */
  extendSteadyN: number;
  extendMovingN: number;
  extendPressN: number;
  retractSteadyN: number;
  retractMovingN: number;
  overrunningStroke: "extend" | "retract" | null;
}

export interface BucklingDetails {
  eulerCase: 1 | 2 | 3 | 4;
  k: number;
  lengthMm: number;
  lengthRule: string;
  effectiveLengthMm: number;
  slenderness: number;
  limitSlenderness: number;
  regime: "Euler" | "Tetmajer";
  criticalLoadN: number;
  compressiveForceN: number;
  requiredSafetyFactor: number;
}

export interface CylinderDesign {
  boreMm: number;
  rodMm: number;
  strokeMm: number;
  extendForceN: number;
  retractForceN: number;
  bucklingSafetyFactor: number;
  // additions
  series: string;
  outOfSeries: boolean;
  ratedPressureBar: number;
  capAreaMm2: number;
  annulusAreaMm2: number;
  areaRatio: number;
  mechanicalEfficiency: number;
  /** pressure the forces above are given at: the highest pump working pressure */
  workingPressureBar: number;
  /** stroke-end cushions where the piston arrives fast, with the pressure the cushion makes */
  cushioning: Cushioning;
  buckling: BucklingDetails;
}

export interface Counterbalance {
  side: CbvSide;
  settingBar: number;
  pilotRatio: number;
  pilotOpeningBar: number;
  // additions
  stroke: "extend" | "retract";
  /** load-induced pressure at the valve port with the load at rest */
  loadPressureBar: number;
  /** load-induced pressure while the lowering load is braked to a stop in decelTimeS; the setting covers it */
  brakingPressureBar: number;
  loweringSpeedMmS: number;
  loadClass: string;
  pilotRatioReason: string;
  /** heat made by throttling the load while lowering at constant speed */
  loweringHeatKw: number;
  flowLpm: number;
}

export interface HoseLine extends LineSizing {
  innerDiameterMm: number;
  velocityMS: number;
}

/**
 * A regenerative approach (textbook regenerative circuit): a solenoid valve at the valve stack
 * leads the rod end's outflow into the cap line, so the rod area alone is effective.
 */
export interface RegenerationDesign {
  rodAreaMm2: number;
  /** approach speed on the pump flow, v = Q_p / A_rod */
  speedMmS: number;
  /** force the rod area gives at the working pressure, F = η·p·A_rod/10 */
  forceAtWorkingN: number;
  /** flow into the cap end (Q_p·A1/A_rod) and out of the rod end (Q_p·A3/A_rod) during the approach */
  capInflowLpm: number;
  rodOutflowLpm: number;
  /** v_regen / v_retract = A3 / A_rod */
  speedRatioToRetract: number;
  /** what ends it: the limit switch where a pressing stroke starts, a pressure switch before a force at the end of the stroke, or the end of the extension */
  endsBy: "limit-switch" | "pressure-switch" | "end-of-extension";
  /** the pressure switch's setting where one ends it, else null */
  switchBar: number | null;
  /** why regeneration pays here, in words */
  reason: string;
}

export interface CircuitComponent {
  id: string;
  kind:
    | "pump"
    | "motor"
    | "relief"
    | "vent"
    | "dcv"
    | "cbv"
    | "cylinder"
    | "tank"
    | "filter"
    | "gauge"
    | "strainer"
    | "regen"
    | "poc"
    | "cooler"
    | "decompression"
    | "unloading"
    | "check"
    | "flow-control"
    /** a machine axis's pressure-reducing valve in its P line (machine-circuit.ts) */
    | "reducing"
    /** a machine's accumulator and its safety and shut-off block (machine-circuit.ts) */
    | "accumulator"
    | "accumulator-block"
    | "bypass"
    | "pressure-switch"
    | "limit-switch";
  /** a limit switch has none: it is worked by the rod, not by the oil */
  ports: string[];
  label?: string;
  values?: Record<string, number | string>;
  /** a two-position solenoid valve's port pairs in each position, as dcvPositions for the 4/3 valve */
  positions?: SolenoidValvePositions;
}

/**
 * Port pairs a spring-return solenoid valve joins in each of its two positions; ports not
 * listed are blocked. normal = de-energised (spring-held), energised = solenoid on.
 */
export interface SolenoidValvePositions {
  normal: PortPair[];
  energised: PortPair[];
}

export interface CircuitConnection {
  /** "componentId.port" */
  from: string;
  to: string;
  /** what the connection carries, for line styles in the diagram */
  line: "suction" | "pressure" | "work" | "return" | "pilot" | "shaft";
}

export interface Circuit {
  components: CircuitComponent[];
  connections: CircuitConnection[];
  /**
   * Port pairs joined in each position of the 4/3 valve; ports not listed are blocked.
   * left = solenoid a (extend), right = solenoid b (retract), center = spring-centred neutral.
   */
  dcvPositions: DcvPositions;
}

/**
 * Solenoid venting of the relief valve [CP]: a pilot-operated relief whose vent port X a small
 * normally open 2/2 solenoid valve opens to tank, so a fixed pump behind a centre that blocks P
 * circulates at low pressure in neutral instead of running over relief.
 */
export interface ReliefVent {
  /** pump pressure in neutral with the vent open */
  ventPressureBar: number;
  valve: string;
  coilVoltage: string;
  /** when the vent valve is energised (closed), so that the relief works at its setting */
  energisedWhen: string;
}

export interface BomRating {
  value: number;
  unit: string;
  label: string;
}

export interface BomLine {
  key: string;
  item: string;
  quantity: number;
  specification: string;
  rating: BomRating;
}

export interface Design {
  engineVersion: string;
  requirements: Requirements;
  loads: LoadsBreakdown;
  cylinder: CylinderDesign;
  pressuresBar: {
    extend: number;
    retract: number;
    reliefSetting: number;
    // additions
    /** highest working pressure allowed at the pump: min(maxPressureBar, rating / 1.1) */
    workingLimit: number;
    extendMoving: number;
    extendPress: number;
    /** with a pressing stroke: pump pressure in the approach (no process force) and while pressing */
    approach?: number;
    press?: number;
    /** highest pressure the rod side can see in normal work */
    rodSidePeak: number;
  };
  /** with a pressing stroke, extend is the approach flow and press the pressing flow */
  flowsLpm: { extend: number; retract: number; pump: number; returnMax: number; press?: number };
  speedsMmS: { extendRequested: number; retractRequested: number; extendActual: number; retractActual: number };
  pump: {
    type: PumpType;
    /** double pump: pressure at which the large section unloads, and the drop across it then */
    unloadingBar?: number;
    unloadedDropBar?: number;
    /** compensated pump: compensator setting, and the power limiter's setting where fitted */
    compensatorBar?: number;
    powerLimitKw?: number;
    /** why this pump, in words */
    reason: string;
    displacementCcRev: number;
    /** each section's displacement, the large section first for a double pump */
    displacementsCcRev: number[];
    speedRpm: number;
    requiredDisplacementCcRev: number;
    volumetricEfficiency: number;
    overallEfficiency: number;
  };
  motor: {
    requiredKw: number;
    ratedKw: number;
    poles: number;
    frame: string | null;
    sizingPressureBar: number;
    /** true where pressing or a dwell holds the fixed pump at the relief setting, so the motor is sized there */
    sizedAtRelief: boolean;
    /** shaft power at the sizing pressure: the highest the motor must pull */
    peakKw: number;
    /** RMS shaft power over the cycle where the cycle is short enough for it (≤ 5 min, peaks ≤ 15 s); else null and the motor covers the peak */
    rmsKw: number | null;
    /** shaft power the chosen pump draws in each phase of the cycle, with its duration */
    phases: { name: string; kw: number; durationS: number }[];
  };
  /** true where the extension (its approach, with a pressing stroke) runs regeneratively: rod end joined to the cap end */
  regenerative: boolean;
  /** the regenerative approach where regenerative is true, else null (absent in designs of engines before 2.10) */
  regeneration?: RegenerationDesign | null;
  /**
   * With a pressing stroke and a pump that delivers more than the pressing flow (fixed or
   * compensated, or a double pump whose small section is more than the speed tolerance too fast):
   * the meter-in flow control in the cap line that sets the pressing speed, bypassed by a
   * solenoid valve during the approach (press-speed.ts). null where the pump itself gives the
   * pressing speed.
   */
  pressSpeedControl: PressSpeedControl | null;
  counterbalance: Counterbalance | null;
  /** leak-tight holding where the load is held at rest longer than a few minutes */
  holding: HoldingDesign | null;
  /** oil compressed in the cap end that springs back before the return stroke */
  decompression: Decompression;
  /** null when the centre unloads the pump itself (tandem) */
  reliefVent: ReliefVent | null;
  directionalValve: {
    center: DcvCenter;
    iso4401Size: Iso4401Size;
    nominalSize: string;
    maxPathFlowLpm: number;
    typicalMaxFlowLpm: number;
    coilVoltage: string;
    centerReason: string;
    neutralPumpFlow: string;
  };
  lines: { pressure: HoseLine; return: HoseLine; suction: HoseLine; capWork: HoseLine; rodWork: HoseLine };
  reservoir: {
    volumeL: number;
    surfaceM2: number;
    dissipationKw: number;
    /** oil the extended cylinder keeps out of the tank, A_rod·s */
    cylinderDrawL: number;
  };
  /** a cooler where the tank cannot shed the average heat; it is a line of the bill */
  cooler: { kw: number } | null;
  returnFilter: { ratedFlowLpm: number };
  heat: {
    averageLossKw: number;
    extendLossKw: number;
    retractLossKw: number;
    neutralLossKw: number;
    /** heat while dwelling at force: the whole pump flow over the relief */
    dwellLossKw: number;
    dwellShare: number;
    /** heat while pressing (0 without a pressing stroke): a fixed pump's surplus crosses the relief */
    pressLossKw: number;
    pressShare: number;
    /** pump pressure while the valve is in neutral: vent pressure, unloading pressure or relief */
    neutralPressureBar: number;
    extendShare: number;
    retractShare: number;
    neutralShare: number;
    tankDissipationKw: number;
    coolerKw: number;
    dailyEnergyKwh: number;
  };
  warnings: Warning[];
  bom: BomLine[];
  trail: TrailEntry[];
  circuit: Circuit;
  /**
   * The phases of one cycle in time order, with pressure, flows and power (cycle.ts). Absent in
   * designs stored by engines before 2.10, which published specs keep: readers must allow for that.
   */
  cycle?: CyclePhase[];
}
