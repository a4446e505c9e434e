// Short titles for the engine's warnings, as people read them on pages and in workbooks. The
// engine's code stays in the data (exports and reviewers key on it); nobody is shown it as a name.
import type { WarningCode } from "~/hydraulics";

const TITLES: Partial<Record<WarningCode, string>> = {
  BUCKLING_MARGIN: "Rod close to buckling",
  ROD_SIDE_INTENSIFICATION: "Pressure multiplied on the rod side",
  HEAT_COOLER_NEEDED: "Cooler needed",
  PUMP_SPEED_MISMATCH: "A stroke runs at another speed than asked",
  PUMP_ON_RELIEF_IN_NEUTRAL: "Pump runs over the relief valve at rest",
  RELIEF_VENTED_IN_NEUTRAL: "Relief valve vented at rest",
  PRESSURE_NEAR_LIMIT: "Working pressure close to your limit",
  PRESSURE_LIMIT_EXCEEDED: "Working pressure above your limit",
  VALVE_NEAR_LIMIT: "Valve near its flow limit",
  BORE_OUT_OF_SERIES: "No standard cylinder is large enough",
  LINE_SIZE_BEYOND_RANGE: "Lines larger than the usual hose range",
  PUMP_BEYOND_SERIES: "No standard pump is large enough",
  MOTOR_BEYOND_SERIES: "No standard motor is large enough",
  DUTY_CYCLE_OVERLOAD: "The cycles asked for do not fit in an hour",
  CBV_SETTING_LOW: "Counterbalance setting unusually low",
  REQUIREMENT_NOT_YET_SIZED: "An answer this design does not use yet",
  NO_CYLINDER_MEETS_PRESSURE: "No cylinder works within your pressure limit",
  METER_OUT_INTENSIFICATION: "Rod side pushed above its rating when metered out",
  PIVOTED_BODY_FREE_ROD: "A pivoted cylinder with a free rod end cannot push",
  PISTON_SPEED_HIGH: "Piston faster than standard seals allow",
  CUSHION_PRESSURE_HIGH: "Stroke-end cushion above the cylinder's rating",
  DECOMPRESSION_NEEDED: "Oil must be decompressed before the return stroke",
  PUMP_TYPE_NOT_SUITED: "The pump you asked for does not suit this axis",
  REGENERATIVE_APPROACH: "The approach runs regeneratively",
  PRESS_CONTROL_DROP_LOW: "Pressing-speed control has little pressure to work with",
  MACHINE_FLOW_SHORT: "The pump cannot feed every axis moving together",
  AXIS_PRESSURE_REDUCED: "An axis gets a pressure-reducing valve",
  ACCUMULATOR_STORED_ENERGY: "An accumulator stores pressure: vent it before any work",
};

/** The title of a warning; a code without one yet still reads as a sentence, never as a code. */
export function warningTitle(code: WarningCode | string): string {
  return TITLES[code as WarningCode] ?? "A point for the reviewing engineer";
}

export const WARNING_TITLES = TITLES;
