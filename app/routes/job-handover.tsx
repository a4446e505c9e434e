import { data, redirect } from "react-router";
import type { Route } from "./+types/job-handover";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { acceptHandover, raiseHandoverProblem } from "~/services/job-handover.server";
import type { JobUploadReply } from "./job-files";

// The buyer's answer to the handover: ?intent=accept (a plain form) or ?intent=problem (multipart:
// note and photos). The intent rides in the address, so it is known before the body is read.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const back = `/jobs/${params.jobId}`;
  const intent = new URL(request.url).searchParams.get("intent");
  try {
    if (intent === "accept") {
      await acceptHandover(user, params.jobId);
      return redirectWithToast(request, back, "Handover accepted: the job is closed. The shop has been told.");
    }
    if (intent === "problem") {
      await raiseHandoverProblem(user, params.jobId, request);
      return redirectWithToast(request, back, "Problem reported: the handover is back with the shop, who has been e-mailed your note.");
    }
    return data<JobUploadReply>({ errors: { "": ["That answer was not understood. Reload the page and try again."] } }, { status: 400 });
  } catch (error) {
    return data<JobUploadReply>({ errors: fieldErrorsOf(error).fieldErrors }, { status: 400 });
  }
}

export function loader({ params }: Route.LoaderArgs) {
  return redirect(`/jobs/${params.jobId}`);
}
