import { z } from "zod";
import { NAME_MAX, parseRequirements, RequirementsError } from "~/hydraulics";
import { fieldApplies, toRequirementsInput, type FormValues, type RequirementKey } from "~/content/requirement-fields";
import { axisFormValues, axisNameField, cycleField, type Draft } from "~/content/spec-draft";
import { FLUIDS, OWN_FIELD_NAMES, SUPPLY_VOLTAGES, TEXT_MAX, ownFieldNames, stepFieldNames, type StepContext } from "./spec-fields";
import { ENGINE_KEYS_BY_STEP, type FormStepKind } from "~/content/spec-steps";
import type { UnitSystem } from "~/units";
import { CURRENCIES } from "~/content/money";
import { isIsoDay, todayUtc as today } from "~/content/dates";

// The spec form's schemas, one per step, shared by the server action and the Conform form (which
// loads them after the page; the fields' names, lengths and choices are in spec-fields.ts).
// The engine's own requirement schema judges the axis fields: each step runs it over every
// answer given so far and keeps the problems of its own fields, so cross-field rules (an
// inclined axis needs its angle) hold without a second copy of them.

/** A number or a choice as typed ("1 250,5", "400 V three-phase"): never longer than this. */
const SHORT_ANSWER_MAX = 40;
const tooLong = (max: number) => `Keep it under ${max + 1} characters.`;

const text = (max: number, message: string) => z.string({ error: message }).trim().min(1, message).max(max, tooLong(max));
const optionalText = (max: number) => z.string().trim().max(max, tooLong(max)).optional();

// Read by server code beside the schemas.
export { TEXT_MAX, type StepContext };

// A real calendar day: 2099-13-45 and 2099-02-30 are refused here, not by the database later.
const isoDate = (message: string) => z.string({ error: message }).refine(isIsoDay, message);

const OWN_FIELDS = {
  machine: {
    title: text(TEXT_MAX.title, "Give the spec a short title, e.g. “Bending press”."),
    purpose: optionalText(TEXT_MAX.purpose),
  },
  mounting: {},
  motion: {},
  cycle: {},
  duty: {
    supplyVoltage: z.enum(SUPPLY_VOLTAGES, { error: "Choose the mains voltage at the machine." }),
    fluid: z.enum(FLUIDS, { error: "Choose a fluid grade (ISO VG 46 if unsure)." }),
  },
  quotation: {
    unitsWanted: z.coerce
      .number({ error: "Enter how many units you want quoted." })
      .int("Enter a whole number.")
      .min(1, "At least 1.")
      .max(1000, "At most 1000."),
    dateNeeded: isoDate("Enter the date you need the units by."),
    bidDeadline: isoDate("Enter the last day shops can bid."),
    deliveryRegion: text(TEXT_MAX.deliveryRegion, "Say where the units are delivered, e.g. “UK — West Midlands”."),
    // Specs started before the currency was asked are quoted in euros.
    currency: z.preprocess((v) => (v === "" || v === undefined ? "EUR" : v), z.enum(CURRENCIES, { error: "Choose the currency shops quote in." })),
    retainerPercent: z.coerce.number({ error: "Enter the retainer share in percent." }).min(0, "From 0 to 50 %.").max(50, "From 0 to 50 %."),
    notes: optionalText(TEXT_MAX.notes),
  },
} satisfies { [K in FormStepKind]: Record<(typeof OWN_FIELD_NAMES)[K][number], z.ZodType> };

/** The quotation's dates: a deadline still ahead, and delivery after it. */
function checkDates(v: Record<string, unknown>, ctx: z.RefinementCtx) {
  const deadline = typeof v.bidDeadline === "string" ? v.bidDeadline : null;
  const needed = typeof v.dateNeeded === "string" ? v.dateNeeded : null;
  if (deadline && deadline <= today()) ctx.addIssue({ code: "custom", path: ["bidDeadline"], message: "The bid deadline must be after today." });
  if (deadline && needed && needed <= deadline)
    ctx.addIssue({ code: "custom", path: ["dateNeeded"], message: "The date needed must be after the bid deadline." });
  else if (needed && needed <= today()) ctx.addIssue({ code: "custom", path: ["dateNeeded"], message: "The date needed must be after today." });
}

export const quotationSchema = z.object(OWN_FIELDS.quotation).superRefine(checkDates);

/** The context of a step of this draft: the axis of an axis step, every axis for the duty step. */
export function stepContext(draft: Draft, kind: FormStepKind, axisId?: string): StepContext {
  const axes = draft.axes.map((a) => ({ id: a.id, name: a.name }));
  const mine = new Set<string>(ENGINE_KEYS_BY_STEP[kind]);
  const without = (values: FormValues) => Object.fromEntries(Object.entries(values).filter(([k]) => !mine.has(k))) as FormValues;
  if (kind === "mounting" || kind === "motion") {
    const axis = draft.axes.find((a) => a.id === axisId);
    return { axes, others: axis ? [without(axisFormValues(draft, axis))] : [] };
  }
  if (kind === "duty") return { axes, others: draft.axes.map((a) => without(axisFormValues(draft, a))) };
  return { axes, others: [] };
}

const nameSchema = z
  .string({ error: "Name the axis, e.g. “Clamp” or “Main ram”." })
  .trim()
  .min(1, "Name the axis, e.g. “Clamp” or “Main ram”.")
  .max(NAME_MAX, tooLong(NAME_MAX));

/** The cycle: each motion's step is a whole number from 1 to twice the axes. */
const cycleStepSchema = (count: number) =>
  z.coerce
    .number({ error: `Choose a step from 1 to ${count}.` })
    .int(`Choose a step from 1 to ${count}.`)
    .min(1, `Choose a step from 1 to ${count}.`)
    .max(count, `Choose a step from 1 to ${count}.`);

function ownShape(kind: FormStepKind, ctx: StepContext): z.ZodRawShape {
  const fixed: Partial<Record<string, z.ZodType>> = OWN_FIELDS[kind];
  const count = 2 * ctx.axes.length;
  // Besides the fixed fields: the machine step's axis names, the cycle step's motion steps.
  return Object.fromEntries(ownFieldNames(kind, ctx.axes).map((n) => [n, fixed[n] ?? (kind === "cycle" ? cycleStepSchema(count) : nameSchema)]));
}

/** Two axes of one name, told at the later one (names are compared as shops read them: trimmed, any case). */
function checkNames(values: Record<string, unknown>, ctx: z.RefinementCtx, axes: StepContext["axes"]) {
  const seen = new Set<string>();
  for (const axis of axes) {
    const name = values[axisNameField(axis.id)];
    if (typeof name !== "string" || !name.trim()) continue;
    const key = name.trim().toLowerCase();
    if (seen.has(key)) ctx.addIssue({ code: "custom", path: [axisNameField(axis.id)], message: `Another axis is already called “${name.trim()}”.` });
    seen.add(key);
  }
}

/** An axis cannot extend and retract at the same time. */
function checkCycle(values: Record<string, unknown>, ctx: z.RefinementCtx, axes: StepContext["axes"]) {
  for (const axis of axes) {
    const out = String(values[cycleField(axis.id, "extend")] ?? "");
    const back = String(values[cycleField(axis.id, "retract")] ?? "");
    if (out && out === back)
      ctx.addIssue({
        code: "custom",
        path: [cycleField(axis.id, "retract")],
        message: `“${axis.name}” cannot extend and retract in the same step: give its retraction a later step.`,
      });
  }
}

/** The schema of one step, given the person's units and the step's context. */
export function stepSchema(kind: FormStepKind, system: UnitSystem, ctx: StepContext) {
  const keys = ENGINE_KEYS_BY_STEP[kind];
  // loose(): the engine fields pass through as typed, for the engine's schema to judge.
  const own = z.looseObject(ownShape(kind, ctx));
  return own.superRefine(
    (values, refine) => {
      if (kind === "quotation") checkDates(values, refine);
      if (kind === "machine") checkNames(values, refine, ctx.axes);
      if (kind === "cycle") checkCycle(values, refine, ctx.axes);
      if (!keys.length) return;
      const reported = new Set<string>();
      for (const others of ctx.others.length ? ctx.others : [{}]) {
        const typed: FormValues = { ...others };
        for (const key of keys) typed[key] = typeof values[key] === "string" ? (values[key] as string) : undefined;
        try {
          parseRequirements(toRequirementsInput(typed, system));
        } catch (error) {
          if (!(error instanceof RequirementsError)) throw error;
          for (const key of keys) {
            for (const message of error.fieldErrors[key] ?? []) {
              if (reported.has(`${key} ${message}`)) continue;
              reported.add(`${key} ${message}`);
              refine.addIssue({ code: "custom", path: [key], message });
            }
          }
        }
      }
    },
    // Run even when the step's own fields failed, so every problem shows at once.
    { when: (payload) => typeof payload.value === "object" && payload.value !== null },
  );
}

/**
 * What a step's form posted, as the draft keeps it (strings as typed), on every path: Next,
 * Back, the axis buttons and revising alike. An axis field that does not apply to the chosen
 * orientation is kept empty, and an answer longer than its field takes is reported, never stored.
 */
export function typedStepAnswers(kind: FormStepKind, posted: { get(name: string): unknown }, ctx: StepContext) {
  const names = stepFieldNames(kind, ctx.axes);
  const others = ctx.others[0] ?? {};
  // The answers that decide which fields apply, from this post where the step asks them.
  const deciding = (key: "orientation" | "pressStrokeMm") =>
    typeof posted.get(key) === "string" && names.includes(key) ? (posted.get(key) as string) : others[key];
  const decidingAnswers = { orientation: deciding("orientation"), pressStrokeMm: deciding("pressStrokeMm") };
  const typed: Record<string, string> = {};
  const tooLongErrors: Record<string, string[]> = {};
  const engineKeys = ENGINE_KEYS_BY_STEP[kind] as readonly string[];
  for (const name of names) {
    const value = posted.get(name);
    const answer = typeof value === "string" ? value : "";
    const engineKey = engineKeys.includes(name);
    // Only an axis step decides what applies; the duty step's fields apply to every axis.
    if (engineKey && kind !== "duty" && !fieldApplies(name as RequirementKey, decidingAnswers)) {
      typed[name] = "";
      continue;
    }
    const max = name.startsWith("name-") ? NAME_MAX : (TEXT_MAX[name as keyof typeof TEXT_MAX] ?? SHORT_ANSWER_MAX);
    if (answer.trim().length > max) tooLongErrors[name] = [tooLong(max)];
    typed[name] = answer;
  }
  return { typed, tooLongErrors };
}
