import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import type { Route } from "./+types/spec-question-answer";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { answerSchema } from "~/schemas/questions";
import { fieldErrorReply, requireId } from "~/services/errors.server";
import { answerQuestion } from "~/services/questions.server";
import { specOfOwner } from "~/services/spec-access.server";

// The buyer answers a shop's question on their own spec, or changes the answer.

/** What an answer form reads back (through its fetcher, or as the page's action data without JavaScript): the question it answers. */
export type AnswerReply = { form: "answer"; questionId: string; result: SubmissionResult<string[]> };

// Posted without JavaScript, a refused answer is answered with the spec page, the problem beside the text kept.
export { default, loader, meta } from "./spec";

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await specOfOwner(user, params.specId);
  const questionId = requireId(params.questionId);
  const submission = parseWithZod(await request.formData(), { schema: answerSchema });
  const refused = (result: SubmissionResult<string[]>) => data<AnswerReply>({ form: "answer", questionId, result }, { status: 400 });
  if (submission.status !== "success") return refused(submission.reply());
  try {
    const { edited, told } = await answerQuestion(user, spec.id, { questionId, answer: submission.value.answer });
    const people = told === 1 ? "1 person at the shops was" : `${told} people at the shops were`;
    return redirectWithToast(
      request,
      `/specs/${spec.id}#questions`,
      `${edited ? "Answer changed" : "Answer published"}: every shop reading the spec sees it, and ${people} e-mailed.`,
    );
  } catch (error) {
    return refused(fieldErrorReply(submission, error));
  }
}
