import { data, redirect } from "react-router";
import type { Route } from "./+types/job-files";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { JOB_FILE_KINDS, uploadJobFiles } from "~/services/job-files.server";

/** What the job page's file forms read back: the field problems, or nothing (a redirect) on success. */
export type JobUploadReply = { errors: Record<string, string[]> };

// Uploads a test certificate or the approved drawing to a job (multipart: kind, files).
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  try {
    const { kind, names } = await uploadJobFiles(user, params.jobId, request);
    return redirectWithToast(request, `/jobs/${params.jobId}`, `${JOB_FILE_KINDS[kind].label} uploaded: ${names.join(", ")}.`);
  } catch (error) {
    return data<JobUploadReply>({ errors: fieldErrorsOf(error).fieldErrors }, { status: 400 });
  }
}

export function loader({ params }: Route.LoaderArgs) {
  return redirect(`/jobs/${params.jobId}`);
}
