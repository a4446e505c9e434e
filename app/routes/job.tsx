import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Link, data } from "react-router";
import type { Route } from "./+types/job";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { FormErrors } from "~/components/form-field";
import { ManagerNoteForm, ProgressNoteForm, ReachForm, TargetForm, UndoForm } from "~/components/job-forms";
import { Badge, ButtonLink, Card, PageHeader } from "~/components/ui";
import { formatMoney } from "~/content/money";
import { formatDay, formatMoment } from "~/content/dates";
import { JOB_STAGE_LABELS, MILESTONE_LABELS, type MilestoneKey } from "~/content/job-milestones";
import { jobActionSchema, type JobActionIntent } from "~/schemas/jobs";
import { fieldErrorReply } from "~/services/errors.server";
import { addManagerNote, addProgressNote, changeTargetDate, reachMilestones, undoLastMilestone } from "~/services/job-progress.server";
import { jobFor, scopedJob, type JobEventView } from "~/services/job-reads.server";
import { retainerPanelOf } from "~/services/payments.server";
import { openableOrganisations } from "~/services/organisation-page.server";
import { OrganisationName } from "~/components/organisation-link";
import { countOf } from "~/content/count";
import { RetainerPanel } from "~/components/retainer-panel";
import { RetainerBadge } from "~/components/retainer-badge";
import { FileList, HandoverPanel, JobFilesPanel } from "~/components/job-handover";
import { handoverPanelOf } from "~/services/job-handover.server";
import { balancePanelOf } from "~/services/balance.server";
import { BalancePanel } from "~/components/balance-panel";
import { AfterHandoverNote } from "~/components/job-state";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.job.specTitle || "Job"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const [job, retainer, handover, balance] = await Promise.all([
    jobFor(user, params.jobId),
    retainerPanelOf(user, params.jobId),
    handoverPanelOf(user, params.jobId),
    balancePanelOf(user, params.jobId),
  ]);
  return { job, retainer, handover, balance, openable: await openableOrganisations(user, [job.buyerId, job.shopId]) };
}

type ActionResult = { intent: JobActionIntent | null; result: SubmissionResult<string[]> };

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  // Someone else's job, or a forged id, is "not found" whatever the form says.
  const job = await scopedJob(user, params.jobId);
  const formData = await request.formData();
  const submission = parseWithZod(formData, { schema: jobActionSchema });
  const intent = (jobActionSchema.options.map((o) => o.shape.intent.value) as string[]).includes(String(formData.get("intent")))
    ? (formData.get("intent") as JobActionIntent)
    : null;
  if (submission.status !== "success") return data<ActionResult>({ intent, result: submission.reply() }, { status: 400 });
  const back = `/jobs/${job.id}`;
  const change = submission.value;
  try {
    switch (change.intent) {
      case "reach": {
        const reached = await reachMilestones(user, job.id, change);
        // The mail is queued with the change; the mail worker sends it, never this request.
        return redirectWithToast(
          request,
          back,
          `Recorded as reached: ${reached.map((k) => MILESTONE_LABELS[k]).join(", ")}. Buyer and shop have been e-mailed.`,
        );
      }
      case "undo": {
        const undone = await undoLastMilestone(user, job.id, change);
        return redirectWithToast(request, back, `${MILESTONE_LABELS[undone]} is no longer marked as reached.`);
      }
      case "target": {
        const moved = await changeTargetDate(user, job.id, change);
        return redirectWithToast(request, back, `${MILESTONE_LABELS[moved]} is now planned for ${formatDay(change.targetDate)}.`);
      }
      case "progress-note":
        await addProgressNote(user, job.id, change);
        return redirectWithToast(request, back, "Your note is in the job's history.");
      case "manager-note":
        await addManagerNote(user, job.id, change);
        return redirectWithToast(request, back, "Internal note saved. Buyer and shop do not see it.");
    }
  } catch (error) {
    return data<ActionResult>({ intent: change.intent, result: fieldErrorReply(submission, error) }, { status: 400 });
  }
}

type Job = Route.ComponentProps["loaderData"]["job"];

export default function JobPage({ loaderData, actionData }: Route.ComponentProps) {
  const { job, retainer, handover, balance } = loaderData;
  const result = (intent: JobActionIntent) => (actionData?.intent === intent ? actionData.result : undefined);
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/jobs" className="text-flow-700 hover:underline">
          ← Jobs
        </Link>
      </p>
      <PageHeader
        title={job.specTitle || "Untitled spec"}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            {handover.state === "accepted" ? (
              <Badge tone="good">Closed: handover accepted</Badge>
            ) : (
              <Badge tone={job.overdue ? "bad" : "neutral"}>{job.overdue ? "Overdue" : JOB_STAGE_LABELS[job.stage]}</Badge>
            )}
            <span>
              For <OrganisationName id={job.buyerId} name={job.buyerName} linked={loaderData.openable.includes(job.buyerId)} /> · built by{" "}
              <OrganisationName id={job.shopId} name={job.shopName} linked={loaderData.openable.includes(job.shopId)} /> · awarded {formatDay(job.awardedAt)} (
              {job.daysSinceAward === 0 ? "today" : `${countOf(job.daysSinceAward, "day")} ago`})
            </span>
          </span>
        }
        actions={
          // Whoever sees the job may read its (awarded) spec: see spec-access.server.ts.
          <>
            <ButtonLink to={`/jobs/${job.id}/order`} tone="secondary">
              Order confirmation
            </ButtonLink>
            <ButtonLink to={`/specs/${job.specId}`} tone="secondary">
              Open the spec
            </ButtonLink>
            <ButtonLink to={`/jobs/${job.id}/priced-bill.xlsx`} reloadDocument tone="secondary">
              Download the priced bill (XLSX)
            </ButtonLink>
          </>
        }
      />
      {actionData && actionData.intent === null ? (
        <div className="mb-4">
          <FormErrors errors={["That change was not understood. Reload the page and try again."]} />
        </div>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-2">
          <Facts job={job} />
          <Timeline job={job} />
          <JobFilesPanel jobId={job.id} files={handover.files} kinds={handover.fileKinds} />
          <History job={job} photos={handover.photos} />
        </div>
        {/* Keyed by the history's length, so every saved change starts the forms afresh. On a phone the
            actions (pay, record progress) come first, not under the milestones and the history. */}
        <div key={job.events.length} className="order-first space-y-6 lg:order-none">
          <HandoverPanel jobId={job.id} handover={handover} />
          {handover.state !== "not_yet" || balance.paidAt ? <BalancePanel jobId={job.id} balance={balance} /> : null}
          {retainer.canPay || retainer.canRefund || retainer.payments.length ? (
            <RetainerPanel
              jobId={job.id}
              retainer={formatMoney(job.retainerCents, job.currency)}
              paid={Boolean(job.retainerPaidAt)}
              canPay={retainer.canPay}
              canRefund={retainer.canRefund}
              payments={retainer.payments}
            />
          ) : null}
          {job.canRecordProgress && handover.state !== "accepted" ? (
            <>
              {job.open.length ? <ReachForm open={job.open} lastResult={result("reach")} /> : null}
              {job.open.length ? <TargetForm open={job.open} lastResult={result("target")} /> : null}
              <ProgressNoteForm lastResult={result("progress-note")} />
              {job.lastReached ? <UndoForm last={job.lastReached} lastResult={result("undo")} /> : null}
            </>
          ) : null}
          {job.canWriteManagerNote ? <ManagerNoteForm lastResult={result("manager-note")} /> : null}
        </div>
      </div>
    </>
  );
}

function Facts({ job }: { job: Job }) {
  const facts = [
    { label: "Total", value: formatMoney(job.totalCents, job.currency) },
    {
      label: `Retainer (${Number(job.retainerPercent)} %)`,
      value: (
        <>
          {formatMoney(job.retainerCents, job.currency)}{" "}
          <RetainerBadge paidAt={job.retainerPaidAt} refundedCents={job.retainerRefundedCents} retainerCents={job.retainerCents} withDate />
        </>
      ),
    },
    {
      label: "Stage",
      value: (
        <>
          {JOB_STAGE_LABELS[job.stage]}
          <AfterHandoverNote job={job} />
        </>
      ),
    },
    { label: "Lead time", value: job.leadTimeWeeks ? `${job.leadTimeWeeks} weeks` : "—" },
  ];
  return (
    <Card>
      <dl className="grid gap-4 sm:grid-cols-2">
        {facts.map((f) => (
          <div key={f.label}>
            <dt className="text-sm text-ink-600">{f.label}</dt>
            <dd className="font-semibold">{f.value}</dd>
          </div>
        ))}
      </dl>
    </Card>
  );
}

function Timeline({ job }: { job: Job }) {
  return (
    <Card title="Milestones">
      <ol className="space-y-4">
        {job.milestones.map((m) => (
          <li key={m.key} className="flex gap-3">
            <span
              aria-hidden="true"
              className={`mt-1 h-3 w-3 shrink-0 rounded-full ${m.reachedAt ? "bg-flow-600" : m.overdue ? "bg-alarm-600" : "bg-ink-200"}`}
            />
            <div className="flex-1">
              <p className="flex flex-wrap items-center gap-2 font-semibold">
                {m.label}
                {m.reachedAt ? <Badge tone="good">Reached</Badge> : m.overdue ? <Badge tone="bad">Overdue</Badge> : null}
              </p>
              <p className="text-sm text-ink-600">{m.hint}</p>
              <p className="mt-1 text-sm">
                Target: {m.targetDate ? formatDay(m.targetDate) : "not set"}
                {m.reachedAt ? ` · reached ${formatMoment(m.reachedAt)}${m.reachedBy ? ` by ${m.reachedBy}` : ""}` : ""}
              </p>
              {m.recordedByPayment && !m.reachedAt ? (
                <p className="text-xs text-ink-600">Recorded when the buyer's payment arrives; the workshop does not wait for it here.</p>
              ) : null}
            </div>
          </li>
        ))}
      </ol>
    </Card>
  );
}

function describe(e: JobEventView, job: Job) {
  const label = e.milestone ? MILESTONE_LABELS[e.milestone] : "";
  const day = (v: unknown) => (typeof v === "string" ? formatDay(v) : "no date");
  // History rows keep what they knew when written; amounts are in the job's currency.
  const money = (cents: unknown) =>
    typeof cents === "number" || typeof cents === "string" ? formatMoney(Number(cents), job.currency) : "an amount not recorded";
  switch (e.kind) {
    case "awarded":
      return `Awarded the bid of ${job.shopName}: ${money(e.detail.totalCents)}, retainer ${money(e.detail.retainerCents)}.`;
    case "milestone_reached":
      return typeof e.detail.reachedWith === "string"
        ? `Recorded ${label} as reached, together with ${MILESTONE_LABELS[e.detail.reachedWith as MilestoneKey]}.`
        : `Recorded ${label} as reached.`;
    case "milestone_undone":
      return `Took back ${label}.`;
    case "target_changed":
      return `Moved the target of ${label} from ${day(e.detail.from)} to ${day(e.detail.to)}${typeof e.detail.pushedBy === "string" ? `, carried along by ${MILESTONE_LABELS[e.detail.pushedBy as MilestoneKey]}` : ""}.`;
    case "progress_note":
      return "Progress note.";
    case "manager_note":
      return "Internal note.";
    case "retainer_paid":
      return `Paid the retainer of ${money(e.detail.amountCents)} by card.`;
    case "retainer_refunded":
      return `Paid back ${money(e.detail.amountCents)} of the retainer.`;
    case "handover_accepted":
      return "Accepted the handover; the job is closed.";
    case "handover_problem":
      return "Reported a problem with the handover; it is back with the shop.";
    case "file_added": {
      const files = Array.isArray(e.detail.files) ? (e.detail.files as { fileName: string }[]).map((f) => f.fileName).join(", ") : "";
      return `Uploaded ${e.detail.kind === "approved_drawing" ? "the approved drawing" : "a test certificate"}: ${files}.`;
    }
    case "balance_paid":
      return e.detail.method === "bank_transfer"
        ? `Recorded the balance of ${money(e.detail.amountCents)} as paid by bank transfer${typeof e.detail.reference === "string" && e.detail.reference ? ` (reference ${e.detail.reference})` : ""}.`
        : `Paid the balance of ${money(e.detail.amountCents)} by card.`;
    case "balance_refunded":
      return `Paid back ${money(e.detail.amountCents)} of the balance.`;
  }
}

function History({ job, photos }: { job: Job; photos: Route.ComponentProps["loaderData"]["handover"]["photos"] }) {
  return (
    <Card title="History">
      <ol className="divide-y divide-ink-100">
        {job.events.map((e) => (
          <li key={e.id} className="py-3 text-sm">
            <p className="flex flex-wrap items-center gap-2">
              <span className="font-semibold">{e.who}</span>
              {e.whoOrganisation ? <span className="text-ink-600">{e.whoOrganisation}</span> : null}
              <time dateTime={e.at} className="text-ink-600">
                · {formatMoment(e.at)}
              </time>
              {e.visibility === "operator" ? <Badge tone="warn">Tenderflow staff only</Badge> : null}
            </p>
            <p className="mt-1">{describe(e, job)}</p>
            {e.body ? <p className="mt-1 whitespace-pre-wrap rounded-md bg-ink-50 px-3 py-2 text-ink-800">{e.body}</p> : null}
            {e.kind === "handover_problem" ? <FileList files={photos.filter((p) => p.eventId === e.id)} /> : null}
          </li>
        ))}
      </ol>
    </Card>
  );
}
