import type { Transaction } from "sequelize";
import { JobEvent, JobMilestone, User, type Job } from "~/models/index.server";
import { can, viewerOf } from "~/auth/access-policy.server";
import { formatDay, isoDay } from "~/content/dates";
import { FieldErrors } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { handoverAcceptedMail, handoverProblemMail } from "./mail-templates.server";
import { changeJob, partiesOf, record } from "./job-progress.server";
import {
  JOB_FILE_KINDS,
  UploadRefused,
  discardStaged,
  exchangedKindsFor,
  filesOfJob,
  receiveJobUpload,
  recordFiles,
  typedIn,
  type ExchangedKind,
  type JobFileView,
} from "./job-files.server";
import { scopedJob } from "./job-reads.server";

// The buyer's answer to the shop's "handed over": accept it, which closes the job, or raise a
// problem with a note and photos, which takes the handover back so the shop can put it right
// and record it again. Both lock the job, so of two tabs the second finds the answer given.

export const HANDOVER = "handed_over";

/** Why the buyer can't answer the handover now, or null when they can. */
export function handoverRefusal(job: Pick<Job, "acceptedAt">, milestones: Pick<JobMilestone, "key" | "reachedAt">[]): string | null {
  if (job.acceptedAt) return `The handover was accepted on ${formatDay(isoDay(job.acceptedAt))}; the job is closed.`;
  if (!milestones.find((m) => m.key === HANDOVER)?.reachedAt) return "The shop has not recorded the handover yet (or is putting a reported problem right).";
  return null;
}

async function tellParties(
  transaction: Transaction,
  job: Job,
  mail: (args: { name: string; specTitle: string; shopName: string; toShop: boolean }) => { subject: string; text: string },
) {
  const { spec, shop, people } = await partiesOf(transaction, job);
  for (const person of people) {
    await enqueueMail(
      { to: person.email, ...mail({ name: person.name, specTitle: spec.title, shopName: shop.name, toShop: person.organisationId === shop.id }) },
      transaction,
    );
  }
}

/** The buyer accepts the handover: the job closes. */
export async function acceptHandover(viewer: User, jobId: string | undefined) {
  return changeJob(viewer, jobId, "job.acceptHandover", async ({ job, milestones, transaction }) => {
    const refusal = handoverRefusal(job, milestones);
    if (refusal) throw new FieldErrors({ "": [refusal] });
    await job.update({ acceptedAt: new Date(), acceptedById: viewer.id }, { transaction });
    await record(transaction, job, viewer, "handover_accepted", { milestone: HANDOVER });
    await tellParties(transaction, job, (d) => handoverAcceptedMail({ ...d, jobId: job.id, buyerName: viewer.name }));
  });
}

/**
 * The buyer reports a problem with the handover, with a note and photos (a multipart form: note,
 * files). The handover is taken back; the shop sees the note and the photos on the job.
 */
export async function raiseHandoverProblem(viewer: User, jobId: string | undefined, request: Request) {
  // Refused before the photos are read: not the buyer of this job, or nothing to answer.
  await changeJob(viewer, jobId, "job.acceptHandover", async ({ job, milestones }) => {
    const refusal = handoverRefusal(job, milestones);
    if (refusal) throw new FieldErrors({ "": [refusal] });
  });
  const { fields, staged } = await receiveJobUpload(request, () => JOB_FILE_KINDS.problem_photo.allowed);
  const note = String(fields.get("note") ?? "").trim();
  const problem = note.length === 0 ? "Say what is wrong, so the shop can put it right." : note.length > 4000 ? "Keep the note under 4001 characters." : null;
  if (problem) {
    await discardStaged(staged);
    throw new UploadRefused({ note: [problem] }, typedIn(fields));
  }
  let committed = false;
  try {
    await changeJob(viewer, jobId, "job.acceptHandover", async ({ job, milestones, transaction }) => {
      // Another tab may have answered while the photos came in.
      const refusal = handoverRefusal(job, milestones);
      if (refusal) throw new UploadRefused({ "": [refusal] }, typedIn(fields));
      const handover = milestones.find((m) => m.key === HANDOVER)!;
      const was = { reachedAt: handover.reachedAt!.toISOString(), reachedById: handover.reachedById };
      handover.reachedAt = null;
      handover.reachedById = null;
      await handover.save({ transaction });
      const event = await record(transaction, job, viewer, "handover_problem", { milestone: HANDOVER, body: note, detail: { ...was, photos: staged.length } });
      await recordFiles(transaction, job, viewer, "problem_photo", staged, event.id);
      await tellParties(transaction, job, (d) => handoverProblemMail({ ...d, jobId: job.id, buyerName: viewer.name, note, photos: staged.length }));
    });
    committed = true;
  } finally {
    if (!committed) await discardStaged(staged);
  }
  return { photos: staged.length };
}

export interface HandoverPanel {
  /** not_yet: the shop has not handed over · awaiting: the buyer's answer is due · problem: back with the shop after a reported problem · accepted: closed */
  state: "not_yet" | "awaiting" | "problem" | "accepted";
  acceptedAt: string | null;
  acceptedBy: string | null;
  /** The last problem reported, while the handover is back with the shop. */
  problem: { note: string; at: string; by: string; photos: JobFileView[] } | null;
  canAnswer: boolean;
  /** The kinds the viewer may upload, the likeliest for their side first (none when they may not). */
  fileKinds: ExchangedKind[];
  /** Test certificates and approved drawings. */
  files: JobFileView[];
  /** Every photo sent with a problem report, for the history (by eventId). */
  photos: JobFileView[];
}

/** The job page's handover and files: where the handover stands and what the viewer may do. */
export async function handoverPanelOf(user: User, jobId: string | undefined): Promise<HandoverPanel> {
  const job = await scopedJob(user, jobId);
  const viewer = await viewerOf(user);
  const handover = await JobMilestone.findOne({ where: { jobId: job.id, key: HANDOVER }, rejectOnEmpty: true });
  const lastProblem = await JobEvent.findOne({
    where: { jobId: job.id, kind: "handover_problem" },
    include: [{ model: User, as: "user", attributes: ["name"] }],
    order: [["createdAt", "DESC"]],
  });
  const files = await filesOfJob(job);
  const state = job.acceptedAt ? "accepted" : handover.reachedAt ? "awaiting" : lastProblem ? "problem" : "not_yet";
  const acceptedBy = job.acceptedById ? await User.findByPk(job.acceptedById, { attributes: ["name"] }) : null;
  return {
    state,
    acceptedAt: job.acceptedAt?.toISOString() ?? null,
    acceptedBy: acceptedBy?.name ?? null,
    problem:
      state === "problem" && lastProblem
        ? {
            note: lastProblem.body,
            at: lastProblem.createdAt.toISOString(),
            by: (lastProblem.get("user") as User | undefined)?.name ?? "The buyer",
            photos: files.filter((f) => f.eventId === lastProblem.id),
          }
        : null,
    canAnswer: state === "awaiting" && can(viewer, "job.acceptHandover", job),
    fileKinds: can(viewer, "job.exchangeFiles", job) ? exchangedKindsFor(user) : [],
    files: files.filter((f) => f.kind !== "problem_photo"),
    photos: files.filter((f) => f.kind === "problem_photo"),
  };
}
