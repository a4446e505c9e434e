/**
 * A sized machine (sizing contract, "MachineDesign"): each axis as an axis alone would get it,
 * and one power unit sized over the machine cycle.
 */
import type { CyclePhaseFigures } from "./cycle";
import type { BomLine, Circuit, CircuitComponent, DcvPositions, Design } from "./design";
import type { MachineMotion, MachineRequirements } from "./machine-requirements";
import type { MachinePhaseName, PhaseKind } from "./machine-timeline";
import type { TrailEntry } from "./trail";
import type { Warning } from "./warnings";

/** One axis of the machine: its own cylinder, valve and load holding. */
export interface MachineAxis {
  name: string;
  requirements: Design["requirements"];
  loads: Design["loads"];
  cylinder: Design["cylinder"];
  pressuresBar: Design["pressuresBar"];
  flowsLpm: Omit<Design["flowsLpm"], "pump" | "returnMax">;
  speedsMmS: Design["speedsMmS"];
  regenerative: boolean;
  regeneration: Design["regeneration"];
  pressSpeedControl: Design["pressSpeedControl"];
  counterbalance: Design["counterbalance"];
  holding: Design["holding"];
  decompression: Design["decompression"];
  directionalValve: Design["directionalValve"];
  /** the axis's own work lines, valve A to cap end and valve B to rod end */
  lines: { capWork: Design["lines"]["capWork"]; rodWork: Design["lines"]["rodWork"] };
  /**
   * A pressure-compensated meter-in flow control that holds the axis's speed where the shared
   * pump delivers more than the axis draws; null where the axis takes the pump's whole flow.
   */
  speedControl: { flowLpm: number; reason: string } | null;
}

/** One phase of the machine cycle, in time order (contract: step, axes, demandLpm, pressureBar, pumpFlowLpm, durationS, hydraulicKw). */
export interface MachineCyclePhase extends CyclePhaseFigures {
  /** index into the sequence; null in neutral */
  step: number | null;
  /** "recharge": every valve in neutral while the pump refills the accumulator */
  phase: MachinePhaseName | "recharge" | "neutral";
  kind: PhaseKind | "neutral";
  /** what each axis taking part is doing */
  motions: { axis: string; phase: string }[];
  /** heat made in the phase: shaft power less the work done on the loads */
  heatKw: number;
}

export type MachineCircuitComponent = CircuitComponent & {
  /** the axis the component belongs to; absent on the power unit */
  axis?: string;
  /** a directional valve's port pairs in each position */
  dcvPositions?: DcvPositions;
};

export interface MachineCircuit {
  components: MachineCircuitComponent[];
  connections: Circuit["connections"];
}

/**
 * A bladder accumulator on the pressure line (sources §11.6): charged by a fixed pump through a
 * check valve, the charging (unloading) valve dumping the pump to tank at `maxBar` and loading it
 * again at `minBar`; a safety block with a shut-off valve, a safety relief and a normally open
 * solenoid discharge valve vents it to tank whenever the power unit is switched off (ISO 4413).
 */
export interface MachineAccumulator {
  /** why it pays, in words */
  reason: string;
  /** gas volume at precharge the formula asks for, and the catalogue size chosen, L */
  gasVolumeL: number;
  nominalL: number;
  /** the highest pump pressure any axis needs in the cycle, which p1 stands above, bar */
  highestNeedBar: number;
  /** precharge p0, lowest working p1 and highest working p2 pressures, bar gauge */
  prechargeBar: number;
  minBar: number;
  maxBar: number;
  /** oil it gives between p2 and p1 over the worst stretch of the cycle, L */
  usableL: number;
  /** oil it holds at p2 (isothermal, at rest), which the discharge valve returns to the tank, L */
  oilAtMaxL: number;
  /** polytropic exponent the volume was sized with (1.4: discharge within a cycle) */
  exponent: number;
  /** the pump it lets the machine have instead of the one the peaks would need, cm³/rev */
  withoutDisplacementCcRev: number;
}

export interface MachineDesign {
  engineVersion: string;
  requirements: MachineRequirements;
  sequence: MachineMotion[][];
  axes: MachineAxis[];
  cycle: MachineCyclePhase[];
  pump: Design["pump"];
  motor: Omit<Design["motor"], "phases"> & { phases: { name: string; kw: number; durationS: number }[] };
  flowsLpm: { pump: number; returnMax: number; requiredMax: number };
  pressuresBar: { reliefSetting: number; workingMax: number };
  reservoir: Design["reservoir"];
  cooler: Design["cooler"];
  returnFilter: Design["returnFilter"];
  lines: { pressure: Design["lines"]["pressure"]; return: Design["lines"]["return"]; suction: Design["lines"]["suction"] };
  reliefVent: Design["reliefVent"];
  /** a gas-loaded accumulator that carries the cycle's flow peaks, so the pump is sized nearer the mean flow; null without one */
  accumulator: MachineAccumulator | null;
  heat: {
    averageLossKw: number;
    neutralLossKw: number;
    neutralPressureBar: number;
    tankDissipationKw: number;
    coolerKw: number;
    dailyEnergyKwh: number;
    /** seconds of the cycle the axes are busy, and the cycle time (null without cycles) */
    busyS: number;
    cycleS: number | null;
  };
  warnings: Warning[];
  bom: BomLine[];
  trail: TrailEntry[];
  circuit: MachineCircuit;
}
