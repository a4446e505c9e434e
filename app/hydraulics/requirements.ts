import { z } from "zod";
import {
  REQUIREMENT_LIMITS,
  REQUIREMENT_DEFAULTS,
  ORIENTATIONS,
  ROD_DIRECTIONS,
  MOUNTINGS,
  MOUNTING_STYLES,
  PUMP_TYPES,
  NAME_MAX,
  type NumberLimit,
} from "./requirement-limits";

/**
 * The one schema for an axis's requirements: the web form, the API and the engine all use it.
 * Units are SI-based and named in each field; the UI converts for display. Limits, defaults
 * live in the tables of requirement-limits.ts (a form reads the same numbers the engine checks,
 * without loading zod to read them), the messages below, and nowhere else.
 */

export const REQUIREMENT_MESSAGES = {
  name: `Give the axis a short name, up to ${NAME_MAX} characters, e.g. “Main ram”`,
  orientation: "Choose how the axis moves: horizontal, vertical or inclined",
  inclineDeg: "Enter the incline angle in degrees, more than 0 and less than 90",
  rodDirection: "Choose which way the rod moves when it extends: up or down",
  massKg: "Enter the moving mass in kilograms, 0 or more (up to 500 000)",
  processForceN: "Enter the process force in newtons, 0 or more (up to 10 000 000)",
  frictionCoefficient: "Enter the friction coefficient of the guides, from 0 to 1 (0.1 if unsure)",
  strokeMm: "Enter the stroke in millimetres, more than 0 (up to 10 000)",
  extendSpeedMmS: "Enter the extend speed in millimetres per second, more than 0 (up to 2000)",
  retractSpeedMmS: "Enter the retract speed in millimetres per second, more than 0 (up to 2000)",
  pressStrokeMm: "Enter the pressing stroke in millimetres, from 0 up to the whole stroke (0 if the whole stroke is one speed)",
  pressStrokeLongerThanStroke: "The pressing stroke is part of the stroke: enter no more than the whole stroke",
  pressSpeedMmS: "Enter the pressing speed in millimetres per second, more than 0 (up to 2000)",
  pressSpeedNeeded: "Enter the pressing speed: it is needed when there is a pressing stroke",
  pressSpeedAboveApproach: "The pressing speed is the slow part of the extension: enter no more than the extend (approach) speed",
  dwellS: "Enter the dwell at force in seconds, 0 or more (up to 3600)",
  holdMinutes: "Enter how long the load must be held at rest in minutes, 0 or more (up to 10 080, a week)",
  accelTimeS: "Enter the time to reach speed in seconds, more than 0 (up to 10; 0.2 if unsure)",
  decelTimeS: "Enter the time to stop in seconds, more than 0 (up to 10; the time to reach speed if unsure)",
  mounting: "Choose how the cylinder is mounted: fixed-free, pinned-pinned, fixed-pinned or fixed-fixed",
  mountingStyle: "Choose how the cylinder body is held: front flange, rear flange, trunnion, clevis or foot",
  cyclesPerHour: "Enter the cycles per hour, 0 or more (up to 3600)",
  hoursPerDay: "Enter the hours of use per day, from 0 to 24",
  ambientC: "Enter the ambient temperature in °C, from -30 to 55",
  supplyHz: "Choose the electrical supply frequency: 50 or 60 Hz",
  maxPressureBar: "Enter the highest working pressure you accept in bar, from 20 to 250 (160 if unsure)",
  pumpType: "Choose the pump: fixed, double (high-low) or compensated, or leave it to the engine",
} as const;

type LimitedKey = keyof typeof REQUIREMENT_LIMITS;
type DefaultedKey = keyof typeof REQUIREMENT_DEFAULTS;

/** A number within its limits, with the field's one message for every way it can be wrong. */
function limited<K extends LimitedKey>(key: K) {
  const limit: NumberLimit = REQUIREMENT_LIMITS[key];
  const message = REQUIREMENT_MESSAGES[key];
  let schema = z.number({ error: message });
  schema = limit.minExclusive ? schema.gt(limit.min, message) : schema.min(limit.min, message);
  schema = limit.maxExclusive ? schema.lt(limit.max, message) : schema.max(limit.max, message);
  return schema;
}
const defaulted = <K extends LimitedKey & DefaultedKey>(key: K) => limited(key).default(REQUIREMENT_DEFAULTS[key]);
const choice = <T extends readonly [string, ...string[]]>(values: T, message: string) => z.enum(values, { error: message });

const fields = {
  orientation: choice(ORIENTATIONS, REQUIREMENT_MESSAGES.orientation),
  inclineDeg: limited("inclineDeg").optional(),
  rodDirection: choice(ROD_DIRECTIONS, REQUIREMENT_MESSAGES.rodDirection).optional(),
  massKg: limited("massKg"),
  processForceN: defaulted("processForceN"),
  frictionCoefficient: defaulted("frictionCoefficient"),
  strokeMm: limited("strokeMm"),
  extendSpeedMmS: limited("extendSpeedMmS"),
  retractSpeedMmS: limited("retractSpeedMmS"),
  accelTimeS: defaulted("accelTimeS"),
  mounting: choice(MOUNTINGS, REQUIREMENT_MESSAGES.mounting),
  cyclesPerHour: limited("cyclesPerHour"),
  hoursPerDay: limited("hoursPerDay"),
  ambientC: defaulted("ambientC"),
  supplyHz: z.union([z.literal(50), z.literal(60)], { error: REQUIREMENT_MESSAGES.supplyHz }),
  maxPressureBar: defaulted("maxPressureBar"),
  // Contract version 2: all optional or defaulted, so version-1 requests and stored specs still parse.
  name: z.string({ error: REQUIREMENT_MESSAGES.name }).trim().min(1, REQUIREMENT_MESSAGES.name).max(NAME_MAX, REQUIREMENT_MESSAGES.name).optional(),
  pressStrokeMm: defaulted("pressStrokeMm"),
  pressSpeedMmS: limited("pressSpeedMmS").optional(),
  dwellS: defaulted("dwellS"),
  holdMinutes: defaulted("holdMinutes"),
  decelTimeS: limited("decelTimeS").optional(),
  mountingStyle: choice(MOUNTING_STYLES, REQUIREMENT_MESSAGES.mountingStyle).optional(),
  pumpType: choice(PUMP_TYPES, REQUIREMENT_MESSAGES.pumpType).optional(),
};

const isNumber = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

export const requirementsSchema = z.object(fields, { error: "Send the axis requirements as an object" }).superRefine(
  (value, ctx) => {
    // Runs even when other fields failed, so every problem is reported at once.
    const v = value as Partial<Record<keyof typeof fields, unknown>>;
    const tilted = v.orientation === "inclined";
    const issue = (path: keyof typeof fields, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (tilted && v.inclineDeg === undefined) issue("inclineDeg", REQUIREMENT_MESSAGES.inclineDeg);
    if ((tilted || v.orientation === "vertical") && v.rodDirection === undefined) issue("rodDirection", REQUIREMENT_MESSAGES.rodDirection);
    // A pressing phase is the slow last part of the extension: it needs its speed, no faster
    // than the approach (equal is a single-speed extension with the force over its last part).
    if (isNumber(v.pressStrokeMm) && v.pressStrokeMm > 0) {
      if (v.pressSpeedMmS === undefined) issue("pressSpeedMmS", REQUIREMENT_MESSAGES.pressSpeedNeeded);
      else if (isNumber(v.pressSpeedMmS) && isNumber(v.extendSpeedMmS) && v.pressSpeedMmS > v.extendSpeedMmS) {
        issue("pressSpeedMmS", REQUIREMENT_MESSAGES.pressSpeedAboveApproach);
      }
      if (isNumber(v.strokeMm) && v.pressStrokeMm > v.strokeMm) issue("pressStrokeMm", REQUIREMENT_MESSAGES.pressStrokeLongerThanStroke);
    }
  },
  { when: (payload) => typeof payload.value === "object" && payload.value !== null },
);

/** Requirements as the engine sees them, with defaults filled in (decelTimeS from accelTimeS). */
export type Requirements = Omit<z.output<typeof requirementsSchema>, "decelTimeS"> & { decelTimeS: number };
/** Requirements as a form or API client sends them. */
export type RequirementsInput = z.input<typeof requirementsSchema>;

/** Thrown for invalid requirements; lists every invalid field at once. */
export class RequirementsError extends Error {
  readonly fieldErrors: Record<string, string[]>;
  constructor(fieldErrors: Record<string, string[]>) {
    const names = Object.keys(fieldErrors);
    super(`Some requirements need attention: ${names.join(", ")}`);
    this.name = "RequirementsError";
    this.fieldErrors = fieldErrors;
  }
}

/** Field key used for problems with the request as a whole. */
export const FORM_ERROR_KEY = "_form";

/** Parses requirements or throws a RequirementsError naming each bad field. */
export function parseRequirements(input: unknown): Requirements {
  const result = requirementsSchema.safeParse(input);
  if (result.success) {
    const data = result.data;
    return { ...data, decelTimeS: data.decelTimeS ?? data.accelTimeS };
  }
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length > 0 ? String(issue.path[0]) : FORM_ERROR_KEY;
    const list = (fieldErrors[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  throw new RequirementsError(fieldErrors);
}
