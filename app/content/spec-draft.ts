import { MACHINE_DUTY_FIELDS, NAME_MAX, MACHINE_LIMITS } from "~/hydraulics";
import type { FormValues } from "./requirement-fields";

// A draft spec's answers, as stored in `specs.answers` (JSONB, step → field → string as typed):
//
//   machine        { title, purpose, axes: "k3f9x2 p0q8w1", "name-k3f9x2": "Clamp", … }
//   <id>-mounting  an axis's mounting questions (orientation, mounting, …)
//   <id>-motion    an axis's load and motion questions, and how long it holds its load
//   cycle          { "extend-<id>": "1", "retract-<id>": "2", … } the step each motion runs in
//   duty           the machine's duty and site, asked once (cyclesPerHour, supplyVoltage, …)
//   quotation      as before
//
// A draft saved before machines (no `machine.axes`) is one axis whose answers sat in `machine`,
// `motion` and `duty.holdMinutes`; `readDraft` reads it as that axis, and the next save stores it
// in the layout above. Completed steps are the step ids: "machine", "<id>-mounting", … .

export type StepAnswers = Record<string, string>;
export type StoredAnswers = Record<string, StepAnswers>;

export const AXIS_STEP_KINDS = ["mounting", "motion"] as const;
export type AxisStepKind = (typeof AXIS_STEP_KINDS)[number];

export interface DraftAxis {
  id: string;
  name: string;
  mounting: StepAnswers;
  motion: StepAnswers;
}

export interface Draft {
  /** title and purpose */
  machine: StepAnswers;
  axes: DraftAxis[];
  cycle: StepAnswers;
  duty: StepAnswers;
  quotation: StepAnswers;
}

/** The axis a draft saved before machines is read as. */
export const FIRST_AXIS_ID = "axis01";
const AXIS_ID = /^[a-z0-9]{6}$/;
export const isAxisId = (id: string) => AXIS_ID.test(id);
export const AXIS_LIMITS = { ...MACHINE_LIMITS.axes, nameMax: NAME_MAX } as const;

export const axisNameField = (id: string) => `name-${id}`;
export const cycleField = (id: string, motion: "extend" | "retract") => `${motion}-${id}`;
export const axisStepId = (id: string, kind: AxisStepKind) => `${id}-${kind}`;

/** The mounting questions of an axis: the keys that sat on the old "machine" step. */
const MOUNTING_KEYS = ["orientation", "inclineDeg", "rodDirection", "mounting", "mountingStyle"];
const DUTY_KEYS: readonly string[] = MACHINE_DUTY_FIELDS;

const pick = (record: StepAnswers | undefined, keep: (key: string) => boolean): StepAnswers =>
  Object.fromEntries(Object.entries(record ?? {}).filter(([k, v]) => keep(k) && typeof v === "string"));

/** A fresh axis id: six lowercase letters and digits, unused in this draft. */
export function newAxisId(taken: readonly string[], random: () => number = Math.random): string {
  for (;;) {
    const id = Array.from({ length: 6 }, () => "abcdefghijklmnopqrstuvwxyz0123456789"[Math.floor(random() * 36)]).join("");
    if (!taken.includes(id) && id !== FIRST_AXIS_ID) return id;
  }
}

/** "Axis 2", or the next number not yet taken. */
export function freshAxisName(axes: readonly { name: string }[], base = "Axis"): string {
  const names = new Set(axes.map((a) => a.name.trim().toLowerCase()));
  for (let n = axes.length + 1; ; n++) if (!names.has(`${base} ${n}`.toLowerCase())) return `${base} ${n}`;
}

/** A copy's name: "Clamp (copy)", "Clamp (copy 2)", … within the name's length. */
export function copyName(name: string, axes: readonly { name: string }[]): string {
  const names = new Set(axes.map((a) => a.name.trim().toLowerCase()));
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? " (copy)" : ` (copy ${n})`;
    const candidate = `${name.trim().slice(0, NAME_MAX - suffix.length)}${suffix}`;
    if (!names.has(candidate.toLowerCase())) return candidate;
  }
}

/**
 * The draft in `answers`, with its completed steps read in the same layout. Reads the old
 * one-axis layout too (and records of it saved onto a new draft by older callers: `machine`
 * with mounting answers, `motion`, `duty.holdMinutes` go to the first axis).
 */
export function readDraft(answers: StoredAnswers | null | undefined, completedSteps: readonly string[] = []): { draft: Draft; completed: string[] } {
  const raw = answers ?? {};
  const machineRaw = raw.machine ?? {};
  const listed = String(machineRaw.axes ?? "")
    .split(/\s+/)
    .filter(isAxisId)
    .filter((id, i, all) => all.indexOf(id) === i)
    .slice(0, AXIS_LIMITS.max);
  const ids = listed.length ? listed : [FIRST_AXIS_ID];
  const axes: DraftAxis[] = ids.map((id, i) => ({
    id,
    name: machineRaw[axisNameField(id)] ?? (ids.length === 1 && !listed.length ? "Axis 1" : `Axis ${i + 1}`),
    mounting: pick(raw[axisStepId(id, "mounting")], (k) => MOUNTING_KEYS.includes(k)),
    motion: pick(raw[axisStepId(id, "motion")], (k) => !MOUNTING_KEYS.includes(k) && !DUTY_KEYS.includes(k)),
  }));
  const completed = new Set(completedSteps);
  // The old layout, or old-layout records saved onto this draft: they belong to the first axis.
  const first = axes[0];
  const legacyMounting = pick(machineRaw, (k) => MOUNTING_KEYS.includes(k));
  if (Object.keys(legacyMounting).length) {
    first.mounting = { ...first.mounting, ...legacyMounting };
    if (completed.has("machine")) completed.add(axisStepId(first.id, "mounting"));
  }
  if (raw.motion) {
    first.motion = { ...first.motion, ...pick(raw.motion, (k) => !MOUNTING_KEYS.includes(k)) };
    if (completed.has("motion")) completed.add(axisStepId(first.id, "motion"));
  }
  completed.delete("motion");
  if (typeof raw.duty?.holdMinutes === "string") first.motion = { ...first.motion, holdMinutes: raw.duty.holdMinutes };

  const draft: Draft = {
    machine: pick(machineRaw, (k) => k === "title" || k === "purpose"),
    axes,
    cycle: pick(raw.cycle, (k) => ids.some((id) => k === cycleField(id, "extend") || k === cycleField(id, "retract"))),
    duty: pick(raw.duty, (k) => k !== "holdMinutes"),
    quotation: { ...(raw.quotation ?? {}) },
  };
  const known = new Set(stepIdsOf(draft));
  return { draft, completed: [...completed].filter((s) => known.has(s)) };
}

/** The draft as `specs.answers` stores it. */
export function writeDraft(draft: Draft): StoredAnswers {
  const stored: StoredAnswers = {
    machine: { ...draft.machine, axes: draft.axes.map((a) => a.id).join(" "), ...Object.fromEntries(draft.axes.map((a) => [axisNameField(a.id), a.name])) },
  };
  for (const axis of draft.axes) {
    stored[axisStepId(axis.id, "mounting")] = axis.mounting;
    stored[axisStepId(axis.id, "motion")] = axis.motion;
  }
  if (Object.keys(draft.cycle).length) stored.cycle = draft.cycle;
  stored.duty = draft.duty;
  stored.quotation = draft.quotation;
  return stored;
}

/** Every answer of one axis as the engine's form fields take them: its own questions and the machine's duty. */
export function axisFormValues(draft: Draft, axis: DraftAxis): FormValues & Record<string, string | undefined> {
  return { ...draft.duty, ...axis.mounting, ...axis.motion };
}

/** The step ids of a draft, in order: the machine, each axis's two steps, the cycle (2+ axes), duty, quotation. */
export function stepIdsOf(draft: Pick<Draft, "axes">): string[] {
  return [
    "machine",
    ...draft.axes.flatMap((a) => AXIS_STEP_KINDS.map((k) => axisStepId(a.id, k))),
    ...(draft.axes.length > 1 ? ["cycle"] : []),
    "duty",
    "quotation",
  ];
}

// ---- the machine cycle ----

export interface CycleMotion {
  axisId: string;
  motion: "extend" | "retract";
}

/** The default cycle: each axis in order extends, then retracts, one at a time (as the engine's default). */
export function defaultCycle(axes: readonly { id: string }[]): StepAnswers {
  return Object.fromEntries(
    axes.flatMap((a, i) => [
      [cycleField(a.id, "extend"), String(2 * i + 1)],
      [cycleField(a.id, "retract"), String(2 * i + 2)],
    ]),
  );
}

/** The cycle's answers with every motion given a step: a saved answer where valid, else after the others. */
export function cycleAnswers(draft: Pick<Draft, "axes" | "cycle">): StepAnswers {
  const max = 2 * draft.axes.length;
  const valid = (v: string | undefined) => v !== undefined && /^\d+$/.test(v.trim()) && Number(v) >= 1 && Number(v) <= max;
  const given = Object.values(draft.cycle).filter(valid).map(Number);
  let next = given.length ? Math.max(...given) : 0;
  const out: StepAnswers = {};
  for (const axis of draft.axes) {
    for (const motion of ["extend", "retract"] as const) {
      const name = cycleField(axis.id, motion);
      out[name] = valid(draft.cycle[name]) ? String(Number(draft.cycle[name])) : String(Math.min(max, ++next));
    }
  }
  return Object.keys(draft.cycle).length ? out : defaultCycle(draft.axes);
}

/** The cycle as steps of motions moving together, in step order (gaps in the numbers closed). */
export function cycleSteps(axes: readonly { id: string }[], answers: StepAnswers): CycleMotion[][] {
  const at = new Map<number, CycleMotion[]>();
  for (const axis of axes) {
    for (const motion of ["extend", "retract"] as const) {
      const step = Number(answers[cycleField(axis.id, motion)]);
      if (!Number.isInteger(step)) continue;
      at.set(step, [...(at.get(step) ?? []), { axisId: axis.id, motion }]);
    }
  }
  return [...at.entries()].sort(([a], [b]) => a - b).map(([, motions]) => motions);
}

/** The cycle in words: "Clamp extends, then Main ram extends together with Ejector retracts, then …". */
export function cycleInWords(axes: readonly { id: string; name: string }[], steps: CycleMotion[][]): string {
  const name = (id: string) => axes.find((a) => a.id === id)?.name.trim() || "An axis";
  const phrase = (m: CycleMotion) => `${name(m.axisId)} ${m.motion === "extend" ? "extends" : "retracts"}`;
  const text = steps.map((step) => step.map(phrase).join(" together with ")).join(", then ");
  return text ? `${text}.` : "";
}
