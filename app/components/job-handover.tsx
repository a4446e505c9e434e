import { useActionData, useFetcher, type FetcherWithComponents } from "react-router";
import { Badge, Button, Card, Notice } from "./ui";
import { FieldErrors, FormErrors } from "./form-field";
import { formatMoment } from "~/content/dates";
import type { JobUploadReply } from "~/routes/job-files";
import type { HandoverPanel as Panel } from "~/services/job-handover.server";
import type { ExchangedKind, JobFileView } from "~/services/job-files.server";

// The job page's handover (the buyer accepts, or raises a problem with a note and photos; the
// shop reads the problem) and the files buyer and shop exchange on the job. Uploads post as
// multipart through a fetcher, so a refusal shows beside the form and keeps the note typed;
// without JavaScript the upload route draws this page again with the reply as its action data.

const INPUT = "mt-1 block w-full rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200";

/** The last reply to one of these forms: its fetcher's, or the page's action data when posted without JavaScript. */
function useReply(fetcher: FetcherWithComponents<JobUploadReply>, form: JobUploadReply["form"]): JobUploadReply | undefined {
  const page = useActionData() as Partial<JobUploadReply> | undefined;
  return fetcher.data ?? (page?.form === form ? (page as JobUploadReply) : undefined);
}

export function FileList({ files }: { files: JobFileView[] }) {
  return (
    <ul className="space-y-2 text-sm">
      {files.map((f) => (
        <li key={f.id}>
          <a href={f.downloadUrl} className="font-semibold text-flow-700 hover:underline" download>
            {f.fileName}
          </a>{" "}
          <span className="text-ink-600">
            · {f.kindLabel} · {Math.max(1, Math.round(f.sizeBytes / 1024))} kB · uploaded by {f.uploadedBy}
            {f.uploadedByOrganisation ? ` (${f.uploadedByOrganisation})` : ""}, {formatMoment(f.uploadedAt)}
          </span>
        </li>
      ))}
    </ul>
  );
}

export function HandoverPanel({ jobId, handover }: { jobId: string; handover: Panel }) {
  if (handover.state === "not_yet") return null;
  return (
    <Card className="space-y-4">
      <h2 className="flex flex-wrap items-center gap-2 font-semibold">
        Handover{" "}
        {handover.state === "accepted" ? (
          <Badge tone="good">Accepted</Badge>
        ) : handover.state === "problem" ? (
          <Badge tone="bad">Problem reported</Badge>
        ) : (
          <Badge tone="warn">Awaiting the buyer</Badge>
        )}
      </h2>
      {handover.state === "accepted" ? (
        <p className="text-sm">
          Accepted {handover.acceptedAt ? formatMoment(handover.acceptedAt) : ""}
          {handover.acceptedBy ? ` by ${handover.acceptedBy}` : ""}. The job is closed.
        </p>
      ) : null}
      {handover.problem ? (
        <div className="space-y-2">
          <Notice tone="bad">
            {handover.problem.by} reported a problem on {formatMoment(handover.problem.at)}. The handover is back with the shop until it is recorded again.
          </Notice>
          <p className="whitespace-pre-wrap rounded-md bg-ink-50 px-3 py-2 text-sm">{handover.problem.note}</p>
          {handover.problem.photos.length ? <FileList files={handover.problem.photos} /> : null}
        </div>
      ) : null}
      {handover.state === "awaiting" && !handover.canAnswer ? (
        <p className="text-sm text-ink-600">The shop has handed over; the buyer accepts it or reports a problem.</p>
      ) : null}
      {handover.canAnswer ? <AnswerForms jobId={jobId} /> : null}
    </Card>
  );
}

function AnswerForms({ jobId }: { jobId: string }) {
  const accept = useFetcher<JobUploadReply>();
  const problem = useFetcher<JobUploadReply>();
  const refused = useReply(accept, "accept");
  const reply = useReply(problem, "problem");
  const errors = reply?.errors ?? {};
  return (
    <>
      <p className="text-sm text-ink-600">The shop has recorded the handover. Accept it when the unit is delivered as ordered; this closes the job.</p>
      <accept.Form method="post" action={`/jobs/${jobId}/handover?intent=accept`}>
        <FormErrors errors={refused?.errors[""]} />
        <Button type="submit" disabled={accept.state !== "idle"}>
          Accept the handover
        </Button>
      </accept.Form>
      <details className="rounded-md ring-1 ring-ink-200 open:p-3" open={Object.keys(errors).length > 0 || undefined}>
        <summary className="cursor-pointer px-3 py-2 text-sm font-semibold">Something is wrong: report a problem</summary>
        <problem.Form method="post" action={`/jobs/${jobId}/handover?intent=problem`} encType="multipart/form-data" className="mt-3 space-y-3">
          <FormErrors errors={errors[""]} />
          <div>
            <label htmlFor="problem-note" className="block text-sm font-semibold">
              What is wrong
            </label>
            <textarea
              id="problem-note"
              name="note"
              rows={4}
              maxLength={4000}
              defaultValue={reply?.typed.note}
              className={INPUT}
              aria-invalid={errors.note ? true : undefined}
              aria-describedby={errors.note ? "problem-note-error" : undefined}
            />
            <FieldErrors id="problem-note-error" errors={errors.note} />
          </div>
          <div>
            <label htmlFor="problem-photos" className="block text-sm font-semibold">
              Photos (optional; PNG or JPEG, up to 6 of 10 MB each)
            </label>
            <input
              id="problem-photos"
              name="files"
              type="file"
              multiple
              accept=".png,.jpg,.jpeg"
              className={INPUT}
              aria-invalid={errors.files ? true : undefined}
              aria-describedby={errors.files ? "problem-photos-error" : undefined}
            />
            <FieldErrors id="problem-photos-error" errors={errors.files} />
          </div>
          <Button type="submit" tone="danger" disabled={problem.state !== "idle"}>
            Report the problem
          </Button>
        </problem.Form>
      </details>
    </>
  );
}

const KIND_OPTIONS: Record<ExchangedKind, string> = {
  test_certificate: "A test certificate (PDF, PNG or JPEG)",
  approved_drawing: "The approved drawing (PDF, PNG, JPEG, DXF or STEP)",
};

/** Test certificates and the approved drawing: listed for every reader of the job, uploaded by buyer and shop. */
export function JobFilesPanel({ jobId, files, kinds }: { jobId: string; files: JobFileView[]; kinds: ExchangedKind[] }) {
  const upload = useFetcher<JobUploadReply>();
  const reply = useReply(upload, "files");
  const errors = reply?.errors ?? {};
  const canUpload = kinds.length > 0;
  if (!files.length && !canUpload) return null;
  return (
    <Card title="Certificates and drawings">
      {files.length ? <FileList files={files} /> : <p className="text-sm text-ink-600">No files yet.</p>}
      {canUpload ? (
        <upload.Form method="post" action={`/jobs/${jobId}/files`} encType="multipart/form-data" className="mt-4 space-y-3 border-t border-ink-100 pt-4">
          <FormErrors errors={errors[""]} />
          <div>
            <label htmlFor="job-file-kind" className="block text-sm font-semibold">
              The file is
            </label>
            {/* The viewer's side's usual kind comes first and is chosen at the start. */}
            <select id="job-file-kind" name="kind" className={INPUT} defaultValue={reply?.typed.kind ?? kinds[0]}>
              {kinds.map((kind) => (
                <option key={kind} value={kind}>
                  {KIND_OPTIONS[kind]}
                </option>
              ))}
            </select>
            <FieldErrors id="job-file-kind-error" errors={errors.kind} />
          </div>
          <div>
            <label htmlFor="job-files" className="block text-sm font-semibold">
              Files (up to 6 of 10 MB each)
            </label>
            <input
              id="job-files"
              name="files"
              type="file"
              multiple
              className={INPUT}
              aria-invalid={errors.files ? true : undefined}
              aria-describedby={errors.files ? "job-files-error" : undefined}
            />
            <FieldErrors id="job-files-error" errors={errors.files} />
          </div>
          <Button type="submit" tone="secondary" disabled={upload.state !== "idle"}>
            Upload
          </Button>
        </upload.Form>
      ) : null}
    </Card>
  );
}
