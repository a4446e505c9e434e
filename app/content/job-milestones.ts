// The milestones an awarded job passes, in order, in Tenderflow's own words. A job's stage is
// the last milestone reached; before the first it is "awaiting retainer".
export const MILESTONES = [
  { key: "retainer_received", label: "Retainer received", hint: "The buyer has paid the retainer." },
  { key: "drawings_agreed", label: "Drawings agreed", hint: "Buyer and shop have agreed the circuit and the unit's drawings." },
  { key: "in_build", label: "In the workshop", hint: "The power unit and manifold are being built." },
  { key: "bench_tested", label: "Bench-tested", hint: "Run and pressure-tested on the shop's test bench." },
  { key: "dispatched", label: "Dispatched", hint: "On its way to the buyer." },
  { key: "handed_over", label: "Handed over", hint: "Delivered; the buyer accepts it (which closes the job) or reports a problem." },
] as const;

export type MilestoneKey = (typeof MILESTONES)[number]["key"];
export const MILESTONE_KEYS = MILESTONES.map((m) => m.key) as MilestoneKey[];
export const MILESTONE_LABELS = Object.fromEntries(MILESTONES.map((m) => [m.key, m.label])) as Record<MilestoneKey, string>;

/** Job stages: none reached yet, then each milestone. */
export const JOB_STAGES = ["awaiting_retainer", ...MILESTONE_KEYS] as const;
export type JobStage = (typeof JOB_STAGES)[number];
export const JOB_STAGE_LABELS: Record<JobStage, string> = { awaiting_retainer: "Awaiting retainer", ...MILESTONE_LABELS };

/** Milestones the payment records; shops record the others. */
export const PAYMENT_MILESTONE: MilestoneKey = "retainer_received";

/**
 * Default target dates from the award, spread over the shop's lead time (common practice for a
 * build schedule, not a rule): retainer within a week, drawings by a fifth of the lead time,
 * build to 70 %, test to 85 %, dispatch at the lead time, hand-over a week later.
 */
export const TARGET_SHARES: Record<MilestoneKey, { share: number; plusDays: number }> = {
  retainer_received: { share: 0, plusDays: 7 },
  drawings_agreed: { share: 0.2, plusDays: 0 },
  in_build: { share: 0.7, plusDays: 0 },
  bench_tested: { share: 0.85, plusDays: 0 },
  dispatched: { share: 1, plusDays: 0 },
  handed_over: { share: 1, plusDays: 7 },
};
