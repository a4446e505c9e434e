/** Warning codes are stable: exports and reviewers key on them. */
export const WARNING_CODES = [
  "BUCKLING_MARGIN",
  "ROD_SIDE_INTENSIFICATION",
  "HEAT_COOLER_NEEDED",
  "PUMP_SPEED_MISMATCH",
  "PUMP_ON_RELIEF_IN_NEUTRAL",
  /** a note, not a fault: the relief is vented in neutral and the controls must energise the vent valve */
  "RELIEF_VENTED_IN_NEUTRAL",
  "PRESSURE_NEAR_LIMIT",
  "PRESSURE_LIMIT_EXCEEDED",
  "VALVE_NEAR_LIMIT",
  "BORE_OUT_OF_SERIES",
  "LINE_SIZE_BEYOND_RANGE",
  "PUMP_BEYOND_SERIES",
  "MOTOR_BEYOND_SERIES",
  "DUTY_CYCLE_OVERLOAD",
  "CBV_SETTING_LOW",
  /** an answer of contract version 2 an earlier engine accepted but did not size (engines 1.2–2.8); kept for stored designs */
  "REQUIREMENT_NOT_YET_SIZED",
  /** nothing in the series meets the pressures: carried by NotSizableError, never in a design */
  "NO_CYLINDER_MEETS_PRESSURE",
  /** a rod-side restriction while extending would intensify the rod side above the cylinder's rating */
  "METER_OUT_INTENSIFICATION",
  /** a trunnion or clevis body with a free rod end cannot carry a push */
  "PIVOTED_BODY_FREE_ROD",
  /** the piston moves faster than standard seals allow */
  "PISTON_SPEED_HIGH",
  /** a stroke-end cushion would push the trapped side above the cylinder's rating */
  "CUSHION_PRESSURE_HIGH",
  /** the cap end's compressed oil asks for a controlled release before the return */
  "DECOMPRESSION_NEEDED",
  /** the pump type asked for cannot work on this axis; another is sized and the message says why */
  "PUMP_TYPE_NOT_SUITED",
  /** a note, not a fault: the approach regenerates, and the controls must switch the regeneration valve */
  "REGENERATIVE_APPROACH",
  /** the pressing-speed flow control has less pressure across it than it needs to regulate */
  "PRESS_CONTROL_DROP_LOW",
  /** a machine: the axes moving together in a phase draw more than the shared pump delivers then */
  "MACHINE_FLOW_SHORT",
  /** a machine: an axis rated below the shared relief gets a pressure-reducing valve */
  "AXIS_PRESSURE_REDUCED",
  /** a machine: an accumulator stores energy; it is vented on shut-down and must read zero before work on the circuit */
  "ACCUMULATOR_STORED_ENERGY",
] as const;

export type WarningCode = (typeof WARNING_CODES)[number];

export interface Warning {
  code: WarningCode;
  message: string;
}

export class Warnings {
  readonly list: Warning[] = [];
  add(code: WarningCode, message: string): void {
    this.list.push({ code, message });
  }
}
