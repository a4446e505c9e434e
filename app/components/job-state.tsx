import { Badge } from "./ui";
import { countOf } from "~/content/count";
import type { JobStage } from "~/content/job-milestones";

// Where a job stands beyond its milestones, in the same words on the job dashboard, an account's
// page and the job page: after the handover, whether the buyer has accepted and whether the
// balance is in; before it, how late the next milestone is.

interface AfterHandover {
  stage: JobStage;
  acceptedAt: string | null;
  retainerPaidAt: string | null;
  balancePaidAt: string | null;
  totalCents: number;
  retainerCents: number;
}

/** "Awaiting the buyer's acceptance, balance due", "Accepted, paid in full"…; null before the handover. */
export function afterHandoverWords(job: AfterHandover): string | null {
  if (!job.acceptedAt && job.stage !== "handed_over") return null;
  const acceptance = job.acceptedAt ? "Accepted" : "Awaiting the buyer's acceptance";
  if (job.balancePaidAt || job.totalCents <= job.retainerCents) return `${acceptance}, paid in full`;
  // The balance falls due at the handover, once the retainer is in (balance.server.ts).
  return job.retainerPaidAt ? `${acceptance}, balance due` : acceptance;
}

/** The line under a job's stage in lists; nothing before the handover. */
export function AfterHandoverNote({ job }: { job: AfterHandover }) {
  const words = afterHandoverWords(job);
  return words ? <span className="block text-xs text-ink-600">{words}</span> : null;
}

/** An overdue job's badge: how many days its next milestone is past its target, where known. */
export function OverdueBadge({ daysLate }: { daysLate: number }) {
  return <Badge tone="bad">{daysLate > 0 ? `${countOf(daysLate, "day")} late` : "Overdue"}</Badge>;
}
