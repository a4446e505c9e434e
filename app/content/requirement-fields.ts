import { REQUIREMENT_DEFAULTS, REQUIREMENT_LIMITS, type RequirementsInput } from "~/hydraulics";
import { formatNumber } from "./number-format";
import { fromDisplay, parseWithUnit, roundForDisplay, toDisplay, unitLabel, UNITS, type Quantity, type UnitSystem } from "~/units";

// The questions a person answers about one axis: wording, examples, units and defaults, in one
// place for the quick-sizing page and the spec form. Values are typed in the person's unit
// system and handed to the engine in the units its fields name.

// The axis name is the spec's title or, in a machine, a text field of its own: not a question here.
export type RequirementKey = Exclude<keyof RequirementsInput, "name">;

interface BaseField {
  key: RequirementKey;
  label: string;
  /** The plain question, shown under the label. */
  help: string;
  /**
   * What a blank answer means, for optional fields without a pre-filled value ("Let the sizing
   * choose"): the form offers it as the first choice and the answers read it back in words.
   */
  emptyLabel?: string;
}

export interface NumberField extends BaseField {
  kind: "number";
  /** Display unit; none for plain numbers such as a friction coefficient. */
  quantity?: Quantity;
  /** An example, in the app's units (converted for display). */
  example: number;
  /** Pre-filled value in the app's units, where a sensible one exists. */
  defaultValue?: number;
  step?: number;
  /** Unit of a field without a display quantity (seconds, minutes): the same in every system. */
  unit?: string;
}

export interface ChoiceField extends BaseField {
  kind: "choice";
  options: { value: string; label: string; hint?: string }[];
  defaultValue?: string;
  /** Unit of the value the engine takes (50 for "50 Hz"). */
  unit?: string;
}

export type RequirementField = NumberField | ChoiceField;

export const REQUIREMENT_FIELDS: Record<RequirementKey, RequirementField> = {
  orientation: {
    key: "orientation",
    kind: "choice",
    label: "Direction of travel",
    help: "Which way does the load move?",
    defaultValue: "horizontal",
    options: [
      { value: "horizontal", label: "Horizontal", hint: "A feed, a slide, a pusher" },
      { value: "vertical", label: "Vertical", hint: "A press, a lift, a clamp from above" },
      { value: "inclined", label: "Inclined", hint: "A tilting deck, a ramp" },
    ],
  },
  inclineDeg: {
    key: "inclineDeg",
    kind: "number",
    label: "Incline angle",
    help: "How steep is the path, in degrees above horizontal?",
    example: 30,
    step: 1,
    unit: "°",
  },
  rodDirection: {
    key: "rodDirection",
    kind: "choice",
    label: "Rod moves when extending",
    help: "When the rod comes out of the cylinder, does the load go up or down? Either way the load is held by a valve when it would run ahead of the rod.",
    // A lift is the commoner vertical axis; pre-selected so the question reads as answered, and shown so it can be changed.
    defaultValue: "up",
    options: [
      { value: "up", label: "Up", hint: "Lifting: the load comes down again when the rod retracts" },
      { value: "down", label: "Down", hint: "Pressing: the load would run ahead of the rod if nothing held it" },
    ],
  },
  mounting: {
    key: "mounting",
    kind: "choice",
    label: "How the cylinder is held",
    help: "How are the cylinder body and the rod end fixed? It decides how long the rod can be before it buckles.",
    defaultValue: "pinned-pinned",
    options: [
      { value: "pinned-pinned", label: "Pivots at both ends", hint: "Clevis or trunnion at the back, rod eye at the front" },
      { value: "fixed-pinned", label: "Flange, rod end pinned", hint: "Flange-mounted body, rod end on a guided pin" },
      { value: "fixed-fixed", label: "Flange, rod end fixed and guided", hint: "Flange-mounted body, rod end bolted to a guided slide" },
      { value: "fixed-free", label: "Flange, rod end free", hint: "Flange-mounted body, rod end pushing an unguided load" },
    ],
  },
  massKg: {
    key: "massKg",
    kind: "number",
    label: "Moving mass",
    help: "Everything that moves with the rod: the load, the tooling and the slide.",
    quantity: "mass",
    example: 800,
  },
  processForceN: {
    key: "processForceN",
    kind: "number",
    label: "Working force at the end of the stroke",
    help: "Pressing, clamping or cutting force the rod must push with when extending. 0 if it only moves the load.",
    quantity: "force",
    example: 50_000,
    defaultValue: REQUIREMENT_DEFAULTS.processForceN,
  },
  frictionCoefficient: {
    key: "frictionCoefficient",
    kind: "number",
    label: "Friction of the guides",
    help: "Rolling rails about 0.01, greased slides about 0.1, dry steel on steel up to 0.2.",
    example: 0.1,
    defaultValue: REQUIREMENT_DEFAULTS.frictionCoefficient,
    step: 0.01,
  },
  strokeMm: {
    key: "strokeMm",
    kind: "number",
    label: "Stroke",
    help: "How far the rod travels from fully in to fully out.",
    quantity: "length",
    example: 500,
  },
  extendSpeedMmS: {
    key: "extendSpeedMmS",
    kind: "number",
    label: "Extending speed",
    help: "How fast the rod comes out.",
    quantity: "speed",
    example: 100,
  },
  retractSpeedMmS: {
    key: "retractSpeedMmS",
    kind: "number",
    label: "Retracting speed",
    help: "How fast the rod goes back in.",
    quantity: "speed",
    example: 150,
  },
  accelTimeS: {
    key: "accelTimeS",
    kind: "number",
    label: "Time to reach speed",
    help: "Seconds from standstill to full speed. 0.2 s suits most axes.",
    example: 0.2,
    defaultValue: REQUIREMENT_DEFAULTS.accelTimeS,
    step: 0.05,
    unit: "s",
  },
  cyclesPerHour: {
    key: "cyclesPerHour",
    kind: "number",
    label: "Cycles per hour",
    help: "One cycle is one extend and one retract.",
    example: 60,
    unit: "per hour",
  },
  hoursPerDay: {
    key: "hoursPerDay",
    kind: "number",
    label: "Hours of work per day",
    help: "How long the machine runs on a normal day.",
    example: 16,
    step: 0.5,
    unit: "h per day",
  },
  ambientC: {
    key: "ambientC",
    kind: "number",
    label: "Air temperature around the power unit",
    help: "The warmest the workshop gets in normal work.",
    quantity: "temperature",
    example: 25,
    defaultValue: REQUIREMENT_DEFAULTS.ambientC,
  },
  supplyHz: {
    key: "supplyHz",
    kind: "choice",
    label: "Mains frequency",
    help: "50 Hz in Europe and most of the world, 60 Hz in North America.",
    defaultValue: "50",
    unit: "Hz",
    options: [
      { value: "50", label: "50 Hz" },
      { value: "60", label: "60 Hz" },
    ],
  },
  pressStrokeMm: {
    key: "pressStrokeMm",
    kind: "number",
    label: "Pressing stroke",
    help: "The last part of the extension made slowly against the working force. 0 if the whole stroke runs at one speed.",
    quantity: "length",
    example: 30,
    defaultValue: REQUIREMENT_DEFAULTS.pressStrokeMm,
  },
  pressSpeedMmS: {
    key: "pressSpeedMmS",
    kind: "number",
    label: "Pressing speed",
    help: "How fast the rod moves while pressing; needed when there is a pressing stroke, and no faster than the extending speed.",
    quantity: "speed",
    example: 10,
  },
  dwellS: {
    key: "dwellS",
    kind: "number",
    label: "Dwell at force",
    help: "Seconds the rod keeps pressing at the end of the extension, every cycle. 0 if it returns at once.",
    example: 2,
    defaultValue: REQUIREMENT_DEFAULTS.dwellS,
    step: 0.5,
    unit: "s",
  },
  holdMinutes: {
    key: "holdMinutes",
    kind: "number",
    label: "Time the load is held at rest",
    help: "Minutes the axis must hold its load still without creeping, e.g. a clamp held through a machining cycle. 0 if it never waits under load.",
    example: 30,
    defaultValue: REQUIREMENT_DEFAULTS.holdMinutes,
    step: 1,
    unit: "min",
  },
  decelTimeS: {
    key: "decelTimeS",
    kind: "number",
    label: "Time to stop",
    help: "Seconds from full speed to standstill. Leave it empty to use the time to reach speed.",
    example: 0.2,
    step: 0.05,
    unit: "s",
    emptyLabel: "Same as the time to reach speed",
  },
  mountingStyle: {
    key: "mountingStyle",
    kind: "choice",
    label: "How the cylinder body is fixed",
    help: "Where the body is held decides how long the rod is free to buckle. Leave it empty if not yet known: the engine then assumes the longest free length.",
    emptyLabel: "Not known yet",
    options: [
      { value: "front-flange", label: "Front flange", hint: "Flange at the rod end of the body" },
      { value: "rear-flange", label: "Rear flange", hint: "Flange at the far end of the body" },
      { value: "trunnion", label: "Trunnion", hint: "Pins on the sides of the body" },
      { value: "clevis", label: "Rear clevis", hint: "A pin through an eye at the back" },
      { value: "foot", label: "Feet", hint: "Bolted down along the body" },
    ],
  },
  pumpType: {
    key: "pumpType",
    kind: "choice",
    label: "Pump",
    help: "Leave it empty to let the sizing choose. A double (high-low) or compensated pump saves power where fast motion and high force never meet.",
    emptyLabel: "Let the sizing choose",
    options: [
      { value: "fixed", label: "Fixed displacement", hint: "Simple and cheap; one flow at any pressure" },
      { value: "double", label: "Double (high-low)", hint: "Two sections: fast at low pressure, slow at high" },
      { value: "compensated", label: "Pressure-compensated", hint: "Delivers only the flow the axis takes" },
    ],
  },
  maxPressureBar: {
    key: "maxPressureBar",
    kind: "number",
    label: "Highest working pressure you accept",
    help: "160 bar suits standard industrial cylinders; lower it if your plant has a limit.",
    quantity: "pressure",
    example: 160,
    defaultValue: REQUIREMENT_DEFAULTS.maxPressureBar,
  },
};

/** The answers that decide whether another field is asked, typed (strings) or as sized (numbers). */
export type DecidingAnswers = { orientation?: string; pressStrokeMm?: string | number };

/** A typed number as the form reads it ("1 234,5" included); NaN when it is not one. */
export const typedNumber = (raw: string) => Number(raw.replace(/\s/g, "").replace(",", "."));

/** Fields that only apply to some axes. */
export function fieldApplies(key: RequirementKey, answers: DecidingAnswers) {
  const { orientation } = answers;
  if (key === "inclineDeg") return orientation === "inclined";
  if (key === "rodDirection") return orientation === "vertical" || orientation === "inclined";
  if (key === "frictionCoefficient") return orientation !== "vertical";
  // A pressing speed belongs to a pressing stroke; > 0 reads the same in every unit system.
  if (key === "pressSpeedMmS") {
    const press = answers.pressStrokeMm;
    if (typeof press === "number") return press > 0;
    const typed = typedNumber(press ?? "");
    return (Number.isFinite(typed) ? typed : (parseWithUnit("length", press ?? "") ?? 0)) > 0;
  }
  return true;
}

/** What a field shows: a value in the app's units, converted and rounded for the person. */
export function displayValue(field: NumberField, value: number, system: UnitSystem): string {
  if (!field.quantity) return String(value);
  const decimals = UNITS[field.quantity][system].decimals;
  return String(roundForDisplay(toDisplay(field.quantity, value, system), decimals));
}

export type FormValues = Partial<Record<RequirementKey, string>>;

/** The pre-filled form: defaults where a sensible one exists, blanks elsewhere. */
export function defaultFormValues(system: UnitSystem): FormValues {
  const values: FormValues = {};
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    if (field.defaultValue === undefined) continue;
    values[field.key] = field.kind === "number" ? displayValue(field, field.defaultValue, system) : field.defaultValue;
  }
  return values;
}

/** Whether any of these answers says more than its blank or pre-filled default. */
export function differsFromDefault(keys: readonly RequirementKey[], values: FormValues, system: UnitSystem): boolean {
  const defaults = defaultFormValues(system);
  return keys.some((k) => {
    const v = values[k]?.trim();
    return !!v && v !== defaults[k] && !(defaults[k] !== undefined && typedNumber(v) === typedNumber(defaults[k]!));
  });
}

/**
 * One typed number in the app's units: a plain number is in the person's units; a number with
 * its own unit ("150 kN", "6 in") is read in that unit. NaN when it is neither.
 */
function typedAppValue(field: NumberField, raw: string, system: UnitSystem): number {
  const number = typedNumber(raw);
  if (Number.isFinite(number)) return field.quantity ? fromDisplay(field.quantity, number, system) : number;
  return (field.quantity && parseWithUnit(field.quantity, raw)) ?? Number.NaN;
}

/** An answer as the person typed it, with the unit system they typed it in. */
export type TypedAnswers = Partial<Record<RequirementKey, { text: string; system: UnitSystem }>>;

/** Form values typed in one unit system, as typed answers. */
export function typedAnswers(values: FormValues, system: UnitSystem): TypedAnswers {
  return Object.fromEntries(Object.entries(values).map(([k, text]) => [k, { text: text ?? "", system }]));
}

/**
 * Typed answers → the engine's input. Each number is converted once, from the system it was
 * typed in, so switching units back and forth never changes what is sized. Blank fields are
 * left out so the engine's defaults and "required" messages apply; text that isn't a number is
 * passed on as text so the engine's schema reports it against the right field.
 */
export function typedToRequirementsInput(typed: TypedAnswers): Record<string, unknown> {
  const deciding = { orientation: typed.orientation?.text, pressStrokeMm: typed.pressStrokeMm?.text };
  const input: Record<string, unknown> = {};
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    const answer = typed[field.key];
    const raw = answer?.text.trim();
    if (!answer || !raw || !fieldApplies(field.key, deciding)) continue;
    if (field.kind === "choice") {
      input[field.key] = field.key === "supplyHz" ? Number(raw) : raw;
      continue;
    }
    const value = typedAppValue(field, raw, answer.system);
    input[field.key] = Number.isFinite(value) ? value : raw;
  }
  return input;
}

/** Typed values (strings in the person's units) → the engine's input. */
export function toRequirementsInput(values: FormValues, system: UnitSystem): Record<string, unknown> {
  return typedToRequirementsInput(typedAnswers(values, system));
}

/**
 * What the form shows in a unit system: an answer typed in it exactly as typed, one typed in
 * the other system converted and rounded for display (the typed text itself is kept).
 */
export function shownValues(typed: TypedAnswers, system: UnitSystem): FormValues {
  const shown: FormValues = {};
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    const answer = typed[field.key];
    if (!answer) continue;
    if (answer.system === system || field.kind !== "number" || !field.quantity || !answer.text.trim()) {
      shown[field.key] = answer.text;
      continue;
    }
    const value = typedAppValue(field, answer.text, answer.system);
    shown[field.key] = Number.isFinite(value) ? displayValue(field, value, system) : answer.text;
  }
  return shown;
}

/**
 * The engine's bounds of a numeric field, in the app's units: the limits its schema is built
 * from, read as plain numbers so the page does not carry the schema library to show them.
 */
function schemaBounds(key: RequirementKey): { min: number | null; max: number | null } | null {
  const limit = (REQUIREMENT_LIMITS as Partial<Record<string, { min: number; max: number }>>)[key];
  return limit ? { min: limit.min, max: limit.max } : null;
}

/**
 * The engine's messages name its own units (millimetres, bar); a person typing US customary
 * units gets the same rule in their units instead.
 */
export function fieldMessages(key: RequirementKey, messages: string[] | undefined, system: UnitSystem): string[] | undefined {
  const field = REQUIREMENT_FIELDS[key];
  if (!messages?.length || system === "metric" || field.kind !== "number" || !field.quantity) return messages;
  const bounds = schemaBounds(key);
  if (!bounds || bounds.min === null || bounds.max === null) return messages;
  const show = (v: number) => displayValue(field, v, system);
  return [`Enter a number between ${show(bounds.min)} and ${show(bounds.max)} ${unitLabel(field.quantity, system)}.`];
}

/** The axis the quick-sizing page opens with: a downstroking press, in the app's units. */
export const EXAMPLE_AXIS = {
  orientation: "vertical",
  rodDirection: "down",
  mounting: "pinned-pinned",
  massKg: 800,
  processForceN: 50_000,
  frictionCoefficient: 0.1,
  strokeMm: 500,
  extendSpeedMmS: 100,
  retractSpeedMmS: 150,
  accelTimeS: 0.2,
  cyclesPerHour: 60,
  hoursPerDay: 16,
  ambientC: 25,
  supplyHz: 50,
  maxPressureBar: 160,
} as const satisfies RequirementsInput;

/** A set of requirements (app units) as form values in the person's units. */
export function toFormValues(input: Partial<Record<RequirementKey, string | number>>, system: UnitSystem): FormValues {
  const values: FormValues = {};
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    const value = input[field.key];
    if (value === undefined) continue;
    values[field.key] = field.kind === "number" && typeof value === "number" ? displayValue(field, value, system) : String(value);
  }
  return values;
}

/** The unit shown beside a field's value in the person's system, if any. */
export function fieldUnit(field: RequirementField, system: UnitSystem): string | null {
  if (field.kind === "number" && field.quantity) return unitLabel(field.quantity, system);
  return field.unit ?? null;
}

/**
 * One answer in words, as the review and the spec page show it: a choice by its label, a
 * number with its unit, a blank optional answer by what it means. Null when there is nothing
 * to say (a blank answer with no meaning of its own).
 */
export function answerInWords(key: RequirementKey, raw: string | undefined, system: UnitSystem): string | null {
  const field = REQUIREMENT_FIELDS[key];
  const text = raw?.trim();
  if (!text) return field.emptyLabel ?? null;
  if (field.kind === "choice") return field.options.find((o) => o.value === text)?.label ?? text;
  const unit = fieldUnit(field, system);
  // "150 kN" carries its own unit.
  return unit && Number.isFinite(typedNumber(text)) ? `${text} ${unit}` : text;
}

/** Phases a zero leaves out: the reader sees "none", not "0 mm". */
const NONE_WHEN_ZERO: ReadonlySet<RequirementKey> = new Set(["pressStrokeMm", "dwellS"]);

/** A stored number for reading: in the reader's units, grouped ("400,000 N"), or "none" for a phase left out. */
function numberInWords(field: NumberField, value: number, system: UnitSystem): string {
  if (value === 0 && NONE_WHEN_ZERO.has(field.key)) return "none";
  const decimals = field.quantity ? UNITS[field.quantity][system].decimals : 6;
  const shown = formatNumber(Number(displayValue(field, value, system)), decimals);
  const unit = fieldUnit(field, system);
  return unit ? `${shown} ${unit}` : shown;
}

/**
 * The requirements an axis was sized with (app units, defaults filled in) in words and in the
 * reader's units. A blank optional choice is listed by its meaning only for a design sized
 * since the choice was asked (holdMinutes is always filled in since then).
 */
export function requirementsInWords(requirements: Partial<Record<RequirementKey, unknown>>, system: UnitSystem) {
  const asked = requirements.holdMinutes !== undefined;
  const deciding = { orientation: String(requirements.orientation ?? ""), pressStrokeMm: Number(requirements.pressStrokeMm ?? 0) };
  const rows: { key: RequirementKey; label: string; value: string }[] = [];
  for (const field of Object.values(REQUIREMENT_FIELDS)) {
    if (!fieldApplies(field.key, deciding)) continue;
    const value = requirements[field.key];
    let words: string | null;
    if (value === undefined || value === null) words = asked && field.kind === "choice" ? (field.emptyLabel ?? null) : null;
    else if (field.kind === "number" && typeof value === "number") words = numberInWords(field, value, system);
    else words = answerInWords(field.key, String(value), system);
    if (words) rows.push({ key: field.key, label: field.label, value: words });
  }
  return rows;
}
