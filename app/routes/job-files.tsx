import type { Route } from "./+types/job-files";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { isPageForm, type PageFormAnswer, uploadRefusal, type UploadReply } from "~/http/page-forms.server";
import { JOB_FILE_KINDS, uploadJobFiles } from "~/services/job-files.server";
import { action as jobPageAction } from "./job";

/** What the job page's upload forms read back (through a fetcher, or as the page's action data without JavaScript). */
export type JobUploadReply = UploadReply<"files" | "problem" | "accept">;

// Posted without JavaScript, a refused upload is answered with the job page, the problem beside the form.
export { default, loader, meta } from "./job";

// Uploads a test certificate or the approved drawing to a job (multipart: kind, files).
export async function action(args: Route.ActionArgs): PageFormAnswer<typeof jobPageAction> {
  const { request, params } = args;
  if (await isPageForm(request)) return jobPageAction(args as unknown as Parameters<typeof jobPageAction>[0]);
  const user = await requireUser(request);
  try {
    const { kind, names } = await uploadJobFiles(user, params.jobId, request);
    return redirectWithToast(request, `/jobs/${params.jobId}`, `${JOB_FILE_KINDS[kind].label} uploaded: ${names.join(", ")}.`);
  } catch (error) {
    return uploadRefusal("files", error);
  }
}
