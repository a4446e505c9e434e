import { MILESTONE_KEYS, TARGET_SHARES, type MilestoneKey } from "~/content/job-milestones";
import { addDays, daysBetween } from "~/content/dates";

// A job's schedule, pure arithmetic over calendar days (no database): the default targets from the
// award day and the lead time, the stage, what is overdue, and how a moved target carries the
// later ones along. The commands in job-progress.server.ts apply it.

/**
 * Default target day of each milestone: the award day plus its share of the lead time (rounded
 * to whole days) plus its extra days. Without a lead time only the retainer gets a date.
 */
export function targetDates(awardDay: string, leadTimeWeeks: number | null): Record<MilestoneKey, string | null> {
  return Object.fromEntries(
    MILESTONE_KEYS.map((key) => {
      const { share, plusDays } = TARGET_SHARES[key];
      if (share > 0 && leadTimeWeeks == null) return [key, null];
      return [key, addDays(awardDay, Math.round((leadTimeWeeks ?? 0) * 7 * share) + plusDays)];
    }),
  ) as Record<MilestoneKey, string | null>;
}

/** A job's stage: the furthest milestone reached, or awaiting the retainer before any. */
export function stageOf(milestones: { key: MilestoneKey; position: number; reachedAt: Date | null }[]): MilestoneKey | null {
  const reached = milestones.filter((m) => m.reachedAt).sort((a, b) => b.position - a.position);
  return reached[0]?.key ?? null;
}

/** Whether a milestone is past its target day and not reached (days compared as YYYY-MM-DD). */
export const isOverdue = (m: { reachedAt: Date | string | null; targetDate: string | null }, today: string) =>
  !m.reachedAt && m.targetDate !== null && m.targetDate < today;

/**
 * The later open milestones (in order, each with a target) a moved target carries along: each
 * one the new day would overtake moves by the same number of days as the moved one, and never
 * before the one ahead of it. Those already after the new day stay, and so do all after them.
 */
export function carriedTargets(
  later: { key: MilestoneKey; targetDate: string }[],
  from: string,
  to: string,
): { key: MilestoneKey; from: string; to: string }[] {
  const slip = daysBetween(from, to);
  const moves: { key: MilestoneKey; from: string; to: string }[] = [];
  let floor = to;
  for (const next of later) {
    if (next.targetDate >= floor) break;
    const slipped = addDays(next.targetDate, slip);
    const moved = slipped < floor ? floor : slipped;
    moves.push({ key: next.key, from: next.targetDate, to: moved });
    floor = moved;
  }
  return moves;
}
