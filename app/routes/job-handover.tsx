import type { Route } from "./+types/job-handover";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { isPageForm, type PageFormAnswer, uploadRefusal } from "~/http/page-forms.server";
import { FieldErrors } from "~/services/errors.server";
import { acceptHandover, raiseHandoverProblem } from "~/services/job-handover.server";
import { action as jobPageAction } from "./job";

// Posted without JavaScript, a refused answer is answered with the job page, the problem beside the form.
export { default, loader, meta } from "./job";

// The buyer's answer to the handover: ?intent=accept (a plain form) or ?intent=problem (multipart:
// note and photos). The intent rides in the address, so it is known before the body is read.
export async function action(args: Route.ActionArgs): PageFormAnswer<typeof jobPageAction> {
  const { request, params } = args;
  if (await isPageForm(request)) return jobPageAction(args as unknown as Parameters<typeof jobPageAction>[0]);
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
    throw new FieldErrors({ "": ["That answer was not understood. Reload the page and try again."] });
  } catch (error) {
    return uploadRefusal(intent === "accept" ? "accept" : "problem", error);
  }
}
