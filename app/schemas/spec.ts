import { z } from "zod";
import { parseRequirements, RequirementsError } from "~/hydraulics";
import { toRequirementsInput, type FormValues } from "~/content/requirement-fields";

import { ENGINE_KEYS_BY_STEP, type FormStepId } from "~/content/spec-steps";
import type { UnitSystem } from "~/units";
import { CURRENCIES } from "~/content/money";
import { fieldApplies, type RequirementKey } from "~/content/requirement-fields";
import { isIsoDay, todayUtc as today } from "~/content/dates";

// The spec form's schemas, one per step, shared by the server action and the Conform form.
// The engine's own requirement schema judges the axis fields: each step runs it over every
// answer given so far and keeps the problems of its own fields, so cross-field rules (an
// inclined axis needs its angle) hold without a second copy of them.

/** The longest answer each free-text field takes; every other field holds a number or a choice. */
export const TEXT_MAX = { title: 120, purpose: 2000, deliveryRegion: 80, notes: 4000 } as const;
/** A number or a choice as typed ("1 250,5", "400 V three-phase"): never longer than this. */
const SHORT_ANSWER_MAX = 40;
const tooLong = (max: number) => `Keep it under ${max + 1} characters.`;

const text = (max: number, message: string) => z.string({ error: message }).trim().min(1, message).max(max, tooLong(max));
const optionalText = (max: number) => z.string().trim().max(max, tooLong(max)).optional();

export const SUPPLY_VOLTAGES = [
  "230 V single-phase",
  "400 V three-phase",
  "415 V three-phase",
  "480 V three-phase",
  "575 V three-phase",
  "690 V three-phase",
] as const;
export const FLUIDS = ["ISO VG 32", "ISO VG 46", "ISO VG 68"] as const;

/** What a fresh step shows before the buyer answers: the usual choice, never a guess about the machine. */
export const STEP_DEFAULTS: Record<string, string> = {
  supplyVoltage: "400 V three-phase",
  fluid: "ISO VG 46",
  unitsWanted: "1",
  currency: "EUR",
  retainerPercent: "20",
};

// A real calendar day: 2099-13-45 and 2099-02-30 are refused here, not by the database later.
const isoDate = (message: string) => z.string({ error: message }).refine(isIsoDay, message);

const OWN_FIELDS = {
  machine: {
    title: text(TEXT_MAX.title, "Give the spec a short title, e.g. “Bending press, main ram”."),
    purpose: optionalText(TEXT_MAX.purpose),
  },
  motion: {},
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
} satisfies Record<FormStepId, z.ZodRawShape>;

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

/** The schema of one step, given the person's units and the answers of the other steps. */
export function stepSchema(step: FormStepId, system: UnitSystem, otherAnswers: FormValues) {
  const keys = ENGINE_KEYS_BY_STEP[step];
  // loose(): the engine fields pass through as typed, for the engine's schema to judge.
  const own = z.looseObject(OWN_FIELDS[step]);
  return own.superRefine(
    (values, ctx) => {
      if (step === "quotation") checkDates(values, ctx);
      if (!keys.length) return;
      const typed: FormValues = { ...otherAnswers };
      for (const key of keys) typed[key] = typeof values[key] === "string" ? (values[key] as string) : undefined;
      try {
        parseRequirements(toRequirementsInput(typed, system));
      } catch (error) {
        if (!(error instanceof RequirementsError)) throw error;
        for (const key of keys) {
          for (const message of error.fieldErrors[key] ?? []) ctx.addIssue({ code: "custom", path: [key], message });
        }
      }
    },
    // Run even when the step's own fields failed, so every problem shows at once.
    { when: (payload) => typeof payload.value === "object" && payload.value !== null },
  );
}

/** The names a step's form posts: its own fields and the engine fields it asks. */
export function stepFieldNames(step: FormStepId): string[] {
  return [...Object.keys(OWN_FIELDS[step]), ...ENGINE_KEYS_BY_STEP[step]];
}

/** The answers of every step but this one: the context its cross-field rules are judged in. */
export function otherStepsAnswers(answers: FormValues, step: FormStepId): FormValues {
  const mine = new Set(stepFieldNames(step));
  return Object.fromEntries(Object.entries(answers).filter(([k]) => !mine.has(k)));
}

/**
 * What a step's form posted, as the draft keeps it (strings as typed), on every path: Next,
 * Back and revising alike. An axis field that does not apply to the chosen orientation is kept
 * empty, and an answer longer than its field takes is reported, never stored.
 */
export function typedStepAnswers(step: FormStepId, posted: { get(name: string): unknown }, otherAnswers: FormValues) {
  const names = stepFieldNames(step);
  // The answers that decide which fields apply, from this post where the step asks them.
  const deciding = (key: "orientation" | "pressStrokeMm") =>
    typeof posted.get(key) === "string" && names.includes(key) ? (posted.get(key) as string) : otherAnswers[key];
  const decidingAnswers = { orientation: deciding("orientation"), pressStrokeMm: deciding("pressStrokeMm") };
  const typed: Record<string, string> = {};
  const tooLongErrors: Record<string, string[]> = {};
  for (const name of names) {
    const value = posted.get(name);
    const answer = typeof value === "string" ? value : "";
    const engineKey = (ENGINE_KEYS_BY_STEP[step] as readonly string[]).includes(name);
    if (engineKey && !fieldApplies(name as RequirementKey, decidingAnswers)) {
      typed[name] = "";
      continue;
    }
    const max = TEXT_MAX[name as keyof typeof TEXT_MAX] ?? SHORT_ANSWER_MAX;
    if (answer.trim().length > max) tooLongErrors[name] = [tooLong(max)];
    typed[name] = answer;
  }
  return { typed, tooLongErrors };
}
