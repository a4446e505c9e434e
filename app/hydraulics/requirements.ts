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

/** Parses requirements or throws a RequirementsError naming each bad field. */
export function parseRequirements(input: unknown): Requirements {
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
