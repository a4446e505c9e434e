import { z } from "zod";
import { JOB_STAGES, MILESTONE_KEYS, PAYMENT_MILESTONE, type MilestoneKey } from "~/content/job-milestones";
import { isIsoDay } from "~/content/dates";

// The job list's filters and the job page's forms: one set of rules for server and Conform.

/** The milestones a shop records; the retainer is recorded by the payment. */
const SHOP_MILESTONES = MILESTONE_KEYS.filter((k) => k !== PAYMENT_MILESTONE) as [MilestoneKey, ...MilestoneKey[]];

/** Filters of the job list, from the URL; a bad value is ignored rather than failing the page. */
export const jobListQuerySchema = z.object({
  q: z.string().trim().max(100).optional().catch(undefined),
  stage: z.enum(JOB_STAGES).optional().catch(undefined),
  retainer: z.enum(["paid", "unpaid", "refunded"]).optional().catch(undefined),
  overdue: z
    .enum(["1", "on", "true"])
    .transform(() => true)
    .optional()
    .catch(undefined),
  account: z.uuid().optional().catch(undefined),
  /** One shop's jobs (from the organisation page's link). */
  shop: z.uuid().optional().catch(undefined),
  page: z.coerce.number().int().min(1).max(100_000).optional().catch(undefined),
});
export type JobListQuery = z.infer<typeof jobListQuerySchema>;

const text = (max: number, missing: string) =>
  z
    .string({ error: missing })
    .trim()
    .min(1, missing)
    .max(max, `Keep it under ${max + 1} characters.`);

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Keep it under ${max + 1} characters.`)
    .optional()
    .transform((v) => v ?? "");

const shopMilestone = z.enum(SHOP_MILESTONES, { error: "Choose a milestone the workshop records." });
const anyMilestone = z.enum(MILESTONE_KEYS, { error: "Choose a milestone." });

export const reachSchema = z.object({
  intent: z.literal("reach"),
  milestone: shopMilestone,
  note: optionalText(2000),
});

export const undoSchema = z.object({
  intent: z.literal("undo"),
  /** The milestone the form showed as the last one reached, so a stale page undoes nothing. */
  milestone: shopMilestone,
  reason: text(2000, "Say why the milestone is taken back."),
});

export const targetSchema = z.object({
  intent: z.literal("target"),
  milestone: anyMilestone,
  targetDate: z.string({ error: "Enter the new target date." }).trim().refine(isIsoDay, "Enter a date like 2026-09-30."),
  reason: optionalText(2000),
});

export const progressNoteSchema = z.object({
  intent: z.literal("progress-note"),
  body: text(4000, "Write the note first."),
});

export const managerNoteSchema = z.object({
  intent: z.literal("manager-note"),
  body: text(4000, "Write the note first."),
});

export const jobActionSchema = z.discriminatedUnion("intent", [reachSchema, undoSchema, targetSchema, progressNoteSchema, managerNoteSchema]);
export type JobAction = z.infer<typeof jobActionSchema>;
export type JobActionIntent = JobAction["intent"];

/** The account manager's record of a balance paid by bank transfer. */
export const bankTransferSchema = z.object({
  reference: text(200, "Enter the transfer's reference, as the bank statement shows it."),
  paidOn: z.string({ error: "Enter the day the money arrived." }).trim().refine(isIsoDay, "Enter a date like 2026-09-30."),
});
