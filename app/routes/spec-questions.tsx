import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import type { Route } from "./+types/spec-questions";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { questionSchema } from "~/schemas/questions";
import { fieldErrorReply } from "~/services/errors.server";
import { askQuestion } from "~/services/questions.server";
import { specForReader } from "~/services/spec-access.server";

// A shop asks the machine builder a question on a spec open for bids.

/** What the question form reads back (through its fetcher, or as the page's action data without JavaScript). */
export type QuestionReply = { form: "question"; result: SubmissionResult<string[]> };

// Posted without JavaScript, a refused question is answered with the spec page, the problem beside the text kept.
export { default, loader, meta } from "./spec";

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.bidding);
  const spec = await specForReader(user, params.specId);
  const submission = parseWithZod(await request.formData(), { schema: questionSchema });
  if (submission.status !== "success") return data<QuestionReply>({ form: "question", result: submission.reply() }, { status: 400 });
  try {
    await askQuestion(user, spec.id, submission.value);
  } catch (error) {
    return data<QuestionReply>({ form: "question", result: fieldErrorReply(submission, error) }, { status: 400 });
  }
  return redirectWithToast(
    request,
    `/specs/${spec.id}#questions`,
    "Question sent. The machine builder has been e-mailed, and you will get an e-mail when it is answered.",
  );
}
