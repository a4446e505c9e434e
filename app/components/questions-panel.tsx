import { getFormProps, getTextareaProps, useForm, type SubmissionResult } from "@conform-to/react";
import { formatDay } from "~/content/dates";
import { parseWithZod } from "@conform-to/zod/v4";
import { useActionData, useFetcher } from "react-router";
import type { QuestionReply } from "~/routes/spec-questions";
import type { AnswerReply } from "~/routes/spec-question-answer";
import { ANSWER_MAX, QUESTION_MAX, answerSchema, questionSchema } from "~/schemas/questions";
import type { QuestionView, QuestionsPanel as PanelData } from "~/services/questions.server";
import { FieldErrors } from "./form-field";
import { Badge, Button, Card, Notice } from "./ui";

// Questions and answers on a spec. The forms post through fetchers: a refused question or answer
// comes back with its message beside the text, which stays as typed; an accepted one redirects
// back to the spec with a toast. Without JavaScript the form's route draws the spec page again,
// the reply as its action data.

const textareaClass =
  "mt-1 block w-full rounded-md border-0 bg-white px-3 py-2 text-sm text-ink-900 shadow-sm ring-1 ring-ink-200 placeholder:text-ink-400 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600";

const when = (iso: string) => formatDay(iso);

/** The last reply to a form: its fetcher's, or (drawn again without JavaScript) the page's action data when it is this form's. */
function useReply<Reply extends { result: SubmissionResult<string[]> }>(fetcher: { state: string; data?: Reply }, mine: (page: Partial<Reply>) => boolean) {
  const page = useActionData() as Partial<Reply> | undefined;
  if (fetcher.state !== "idle") return null;
  return fetcher.data?.result ?? (page && mine(page) ? page.result : undefined);
}

function AskForm({ specId }: { specId: string }) {
  const fetcher = useFetcher<QuestionReply>();
  const [form, fields] = useForm({
    id: "ask-question",
    lastResult: useReply(fetcher, (page) => page.form === "question"),
    onValidate: ({ formData }) => parseWithZod(formData, { schema: questionSchema }),
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
  });
  return (
    <fetcher.Form method="post" action={`/specs/${specId}/questions`} {...getFormProps(form)} className="mt-6 space-y-3 border-t border-ink-100 pt-4">
      <div>
        <label htmlFor={fields.body.id} className="block text-sm font-semibold text-ink-800">
          Ask the machine builder
        </label>
        <p id={fields.body.descriptionId} className="mt-1 text-sm text-ink-600">
          For example: "May the power unit stand up to 8 m from the press?" Only your company and the machine builder see the question until it is answered;
          then every shop sees it, without your company's name. Up to {QUESTION_MAX} characters.
        </p>
        <textarea
          {...getTextareaProps(fields.body, { ariaDescribedBy: fields.body.descriptionId })}
          key={fields.body.key}
          rows={4}
          maxLength={QUESTION_MAX}
          className={textareaClass}
        />
        <FieldErrors id={fields.body.errorId} errors={fields.body.errors} />
      </div>
      <Button type="submit" disabled={fetcher.state !== "idle"}>
        {fetcher.state !== "idle" ? "Sending…" : "Send the question"}
      </Button>
    </fetcher.Form>
  );
}

function AnswerForm({ specId, question }: { specId: string; question: QuestionView }) {
  const fetcher = useFetcher<AnswerReply>();
  const [form, fields] = useForm({
    id: `answer-${question.id}`,
    defaultValue: { answer: question.answer ?? "" },
    lastResult: useReply(fetcher, (page) => page.form === "answer" && page.questionId === question.id),
    onValidate: ({ formData }) => parseWithZod(formData, { schema: answerSchema }),
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
  });
  return (
    <fetcher.Form method="post" action={`/specs/${specId}/questions/${question.id}/answer`} {...getFormProps(form)} className="mt-3 space-y-2">
      <label htmlFor={fields.answer.id} className="block text-sm font-semibold text-ink-800">
        {question.answer ? "Change your answer" : "Your answer"}
      </label>
      <textarea {...getTextareaProps(fields.answer)} key={fields.answer.key} rows={3} maxLength={ANSWER_MAX} className={textareaClass} />
      <FieldErrors id={fields.answer.errorId} errors={fields.answer.errors} />
      <Button type="submit" tone={question.answer ? "secondary" : "primary"} disabled={fetcher.state !== "idle"}>
        {fetcher.state !== "idle" ? "Saving…" : question.answer ? "Save the changed answer" : "Publish the answer"}
      </Button>
    </fetcher.Form>
  );
}

function QuestionItem({ specId, question, canAnswer, isBuyer }: { specId: string; question: QuestionView; canAnswer: boolean; isBuyer: boolean }) {
  return (
    <li className="py-4">
      <p className="flex flex-wrap items-center gap-2 text-xs text-ink-600">
        {question.isOwn ? <Badge tone="good">Your question</Badge> : <span className="font-semibold text-ink-800">{question.askedBy}</span>}
        <span>{when(question.askedAt)}</span>
        {!question.answer ? <Badge tone="warn">Not answered yet</Badge> : null}
      </p>
      <p className="mt-1 whitespace-pre-line text-sm">{question.body}</p>
      {question.answer ? (
        <div className="mt-2 rounded-md bg-ink-50 px-3 py-2 text-sm">
          <p className="text-xs font-semibold text-ink-600">Machine builder's answer · {when(question.answeredAt!)}</p>
          <p className="mt-1 whitespace-pre-line">{question.answer}</p>
        </div>
      ) : question.isOwn ? (
        <p className="mt-2 text-xs text-ink-600">Only your company and the machine builder see this question until it is answered.</p>
      ) : isBuyer ? (
        <p className="mt-2 text-xs text-ink-600">Only the shop that asked sees this question until you answer it.</p>
      ) : null}
      {/* A new key once the answer is saved: the form starts again from the stored answer. */}
      {canAnswer ? <AnswerForm key={question.answeredAt ?? "unanswered"} specId={specId} question={question} /> : null}
    </li>
  );
}

export function QuestionsPanel({ specId, panel }: { specId: string; panel: PanelData }) {
  const { questions, canAsk, canAnswer, isBuyer, closedNote } = panel;
  const lead = isBuyer
    ? "Shops' questions about this spec. Your answers are shown to every shop; the name of the shop that asked is shown to you only."
    : canAsk
      ? "Anything the spec leaves open. Answers are shown to every shop, so all bids rest on the same facts."
      : "Questions from shops and the machine builder's answers.";
  return (
    <Card>
      <h2 id="questions" className="font-semibold">
        Questions and answers
      </h2>
      <p className="mt-1 text-sm text-ink-600">{lead}</p>
      {questions.length ? (
        <ul className="mt-2 divide-y divide-ink-100">
          {questions.map((q) => (
            <QuestionItem key={q.id} specId={specId} question={q} canAnswer={canAnswer} isBuyer={isBuyer} />
          ))}
        </ul>
      ) : (
        <p className="mt-4 text-sm text-ink-600">
          {isBuyer ? "No shop has asked anything yet. You will get an e-mail when one does." : "No questions have been answered yet."}
        </p>
      )}
      {/* A new key once the shop's new question is listed: the box empties only when it was taken. */}
      {canAsk ? <AskForm key={questions.filter((q) => q.isOwn).length} specId={specId} /> : null}
      {closedNote ? (
        <div className="mt-4">
          <Notice>{closedNote}</Notice>
        </div>
      ) : null}
    </Card>
  );
}
