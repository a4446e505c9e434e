import { z } from "zod";

/**
 * The one schema for an axis's requirements: the web form, the API and the engine all use it.
 * Units are SI-based and named in each field; the UI converts for display.
 */

const num = (message: string) => z.number({ error: message });

const orientation = z.enum(["horizontal", "vertical", "inclined"], {
  error: "Choose how the axis moves: horizontal, vertical or inclined",
});
const rodDirection = z.enum(["up", "down"], {
  error: "Choose which way the rod moves when it extends: up or down",
});
const mounting = z.enum(["fixed-free", "pinned-pinned", "fixed-pinned", "fixed-fixed"], {
  error: "Choose how the cylinder is mounted: fixed-free, pinned-pinned, fixed-pinned or fixed-fixed",
});

const MESSAGES = {
  inclineDeg: "Enter the incline angle in degrees, more than 0 and less than 90",
  rodDirection: "Choose which way the rod moves when it extends: up or down",
  massKg: "Enter the moving mass in kilograms, 0 or more (up to 500 000)",
  processForceN: "Enter the process force in newtons, 0 or more (up to 10 000 000)",
  frictionCoefficient: "Enter the friction coefficient of the guides, from 0 to 1 (0.1 if unsure)",
  strokeMm: "Enter the stroke in millimetres, more than 0 (up to 10 000)",
  extendSpeedMmS: "Enter the extend speed in millimetres per second, more than 0 (up to 2000)",
  retractSpeedMmS: "Enter the retract speed in millimetres per second, more than 0 (up to 2000)",
  accelTimeS: "Enter the time to reach speed in seconds, more than 0 (up to 10; 0.2 if unsure)",
  cyclesPerHour: "Enter the cycles per hour, 0 or more (up to 3600)",
  hoursPerDay: "Enter the hours of use per day, from 0 to 24",
  ambientC: "Enter the ambient temperature in °C, from -30 to 55",
  supplyHz: "Choose the electrical supply frequency: 50 or 60 Hz",
  maxPressureBar: "Enter the highest working pressure you accept in bar, from 20 to 250 (160 if unsure)",
} as const;

const fields = {
  orientation,
  inclineDeg: num(MESSAGES.inclineDeg).gt(0, MESSAGES.inclineDeg).lt(90, MESSAGES.inclineDeg).optional(),
  rodDirection: rodDirection.optional(),
  massKg: num(MESSAGES.massKg).min(0, MESSAGES.massKg).max(500_000, MESSAGES.massKg),
  processForceN: num(MESSAGES.processForceN).min(0, MESSAGES.processForceN).max(10_000_000, MESSAGES.processForceN).default(0),
  frictionCoefficient: num(MESSAGES.frictionCoefficient).min(0, MESSAGES.frictionCoefficient).max(1, MESSAGES.frictionCoefficient).default(0.1),
  strokeMm: num(MESSAGES.strokeMm).gt(0, MESSAGES.strokeMm).max(10_000, MESSAGES.strokeMm),
  extendSpeedMmS: num(MESSAGES.extendSpeedMmS).gt(0, MESSAGES.extendSpeedMmS).max(2000, MESSAGES.extendSpeedMmS),
  retractSpeedMmS: num(MESSAGES.retractSpeedMmS).gt(0, MESSAGES.retractSpeedMmS).max(2000, MESSAGES.retractSpeedMmS),
  accelTimeS: num(MESSAGES.accelTimeS).gt(0, MESSAGES.accelTimeS).max(10, MESSAGES.accelTimeS).default(0.2),
  mounting,
  cyclesPerHour: num(MESSAGES.cyclesPerHour).min(0, MESSAGES.cyclesPerHour).max(3600, MESSAGES.cyclesPerHour),
  hoursPerDay: num(MESSAGES.hoursPerDay).min(0, MESSAGES.hoursPerDay).max(24, MESSAGES.hoursPerDay),
  ambientC: num(MESSAGES.ambientC).min(-30, MESSAGES.ambientC).max(55, MESSAGES.ambientC).default(25),
  supplyHz: z.union([z.literal(50), z.literal(60)], { error: MESSAGES.supplyHz }),
  maxPressureBar: num(MESSAGES.maxPressureBar).min(20, MESSAGES.maxPressureBar).max(250, MESSAGES.maxPressureBar).default(160),
};

export const requirementsSchema = z.object(fields, { error: "Send the axis requirements as an object" }).superRefine(
  (value, ctx) => {
    // Runs even when other fields failed, so every problem is reported at once.
    const v = value as Partial<Record<keyof typeof fields, unknown>>;
    const tilted = v.orientation === "inclined";
    if (tilted && v.inclineDeg === undefined) {
      ctx.addIssue({ code: "custom", path: ["inclineDeg"], message: MESSAGES.inclineDeg });
    }
    if ((tilted || v.orientation === "vertical") && v.rodDirection === undefined) {
      ctx.addIssue({ code: "custom", path: ["rodDirection"], message: MESSAGES.rodDirection });
    }
  },
  { when: (payload) => typeof payload.value === "object" && payload.value !== null },
);

/** Requirements as the engine sees them, with defaults filled in. */
export type Requirements = z.output<typeof requirementsSchema>;
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

const finite = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);
const within = (x: unknown, min: number, max: number): x is number => finite(x) && x >= min && x <= max;
const above = (x: unknown, min: number, max: number): x is number => finite(x) && x > min && x <= max;
/** A field with a default: absent (or undefined) takes the default, as the schema does. */
const orDefault = (x: unknown, fallback: number, min: number, max: number): number | undefined =>
  x === undefined ? fallback : within(x, min, max) ? x : undefined;

/**
 * The schema's answer for a plain object it accepts, worked out directly: the same checks, the
 * same defaults, the same keys in the same order, unknown keys dropped. Anything it is not sure
 * of (a problem, an explicit undefined on an optional field, an unusual object) returns
 * undefined, and the schema itself decides and words the errors. A property test holds the two
 * to the same output. It exists because the schema costs more than the sizing search.
 */
function acceptedRequirements(input: unknown): Requirements | undefined {
  if (typeof input !== "object" || input === null) return undefined;
  const proto = Object.getPrototypeOf(input);
  if (proto !== Object.prototype && proto !== null) return undefined;
  const o = input as Record<string, unknown>;
  const orientation = o.orientation;
  if (orientation !== "horizontal" && orientation !== "vertical" && orientation !== "inclined") return undefined;
  const inclineDeg = o.inclineDeg;
  if (inclineDeg === undefined ? orientation === "inclined" || "inclineDeg" in o : !(finite(inclineDeg) && inclineDeg > 0 && inclineDeg < 90)) {
    return undefined;
  }
  const rodDirection = o.rodDirection;
  if (rodDirection === undefined ? orientation !== "horizontal" || "rodDirection" in o : rodDirection !== "up" && rodDirection !== "down") {
    return undefined;
  }
  const { massKg, strokeMm, extendSpeedMmS, retractSpeedMmS, mounting, cyclesPerHour, hoursPerDay, supplyHz } = o;
  if (!within(massKg, 0, 500_000) || !above(strokeMm, 0, 10_000)) return undefined;
  if (!above(extendSpeedMmS, 0, 2000) || !above(retractSpeedMmS, 0, 2000)) return undefined;
  if (mounting !== "fixed-free" && mounting !== "pinned-pinned" && mounting !== "fixed-pinned" && mounting !== "fixed-fixed") return undefined;
  if (!within(cyclesPerHour, 0, 3600) || !within(hoursPerDay, 0, 24) || (supplyHz !== 50 && supplyHz !== 60)) return undefined;
  const processForceN = orDefault(o.processForceN, 0, 0, 10_000_000);
  const frictionCoefficient = orDefault(o.frictionCoefficient, 0.1, 0, 1);
  const accelTime = o.accelTimeS;
  const accelTimeS = accelTime === undefined ? 0.2 : above(accelTime, 0, 10) ? accelTime : undefined;
  const ambientC = orDefault(o.ambientC, 25, -30, 55);
  const maxPressureBar = orDefault(o.maxPressureBar, 160, 20, 250);
  if (processForceN === undefined || frictionCoefficient === undefined || accelTimeS === undefined) return undefined;
  if (ambientC === undefined || maxPressureBar === undefined) return undefined;
  const out: Partial<Requirements> = { orientation };
  if (inclineDeg !== undefined) out.inclineDeg = inclineDeg as number;
  if (rodDirection !== undefined) out.rodDirection = rodDirection as "up" | "down";
  out.massKg = massKg;
  out.processForceN = processForceN;
  out.frictionCoefficient = frictionCoefficient;
  out.strokeMm = strokeMm;
  out.extendSpeedMmS = extendSpeedMmS;
  out.retractSpeedMmS = retractSpeedMmS;
  out.accelTimeS = accelTimeS;
  out.mounting = mounting;
  out.cyclesPerHour = cyclesPerHour;
  out.hoursPerDay = hoursPerDay;
  out.ambientC = ambientC;
  out.supplyHz = supplyHz;
  out.maxPressureBar = maxPressureBar;
  return out as Requirements;
}

/** Parses requirements or throws a RequirementsError naming each bad field. */
export function parseRequirements(input: unknown): Requirements {
  const accepted = acceptedRequirements(input);
  if (accepted) return accepted;
  const result = requirementsSchema.safeParse(input);
  if (result.success) return result.data;
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length > 0 ? String(issue.path[0]) : FORM_ERROR_KEY;
    const list = (fieldErrors[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  throw new RequirementsError(fieldErrors);
}
