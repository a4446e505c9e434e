import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import type { Route } from "./+types/payment-refund";
import { requireRole, requireUser } from "~/auth/permissions.server";
import { OPERATOR_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { formatMoney } from "~/content/money";
import { isPageForm, type PageFormAnswer } from "~/http/page-forms.server";
import { currentPasswordField } from "~/schemas/account";
import { refundSchema } from "~/schemas/payments";
import { confirmOwnPassword } from "~/services/accounts.server";
import { fieldErrorReply } from "~/services/errors.server";
import { Throttled, clientOf } from "~/services/throttle.server";
import { jobIdOfPayment, refundQuestion, requestRefund } from "~/services/payments.server";
import { action as jobPageAction, loader as jobPageLoader } from "./job";

const confirmedSchema = refundSchema.extend({ currentPassword: currentPasswordField });
const OWN_FIELDS = ["amount", "reason", "confirm", "currentPassword"];

/** What a refund form reads back (through its fetcher, or as the job page's action data without JavaScript). */
export type RefundReply = {
  form: "refund";
  paymentId: string;
  result: SubmissionResult<string[]>;
  /** The question asked before the money moves, with what was typed to send again. */
  confirm?: { question: string; amount: string; reason: string };
};

// Posted without JavaScript, the refund's question or refusal is answered with the job page of the
// payment, the reply beside the form (and the page's other forms, posted here, go to its action).
export { default, meta } from "./job";

/** The job page's arguments for the job this payment is for (a payment the user can't see is a 404). */
async function atItsJob<Args extends Route.LoaderArgs | Route.ActionArgs>(args: Args) {
  const jobId = await jobIdOfPayment(await requireUser(args.request), args.params.paymentId);
  return { ...args, params: { ...args.params, jobId } } as unknown as Parameters<typeof jobPageLoader>[0];
}

export async function loader(args: Route.LoaderArgs) {
  return jobPageLoader(await atItsJob(args));
}

// An account manager (or admin) pays back part or all of a retainer, from the job page, in two
// steps: the amount and reason first, answered by the question with the amount spelled out;
// then, confirming, their password again (a stolen session alone moves no money).
export async function action(args: Route.ActionArgs): PageFormAnswer<typeof jobPageAction, RefundReply> {
  const { request, params } = args;
  if (await isPageForm(request, OWN_FIELDS)) return jobPageAction(await atItsJob(args));
  const user = await requireRole(request, OPERATOR_ROLES);
  const paymentId = String(params.paymentId);
  const formData = await request.formData();
  const hideFields = ["currentPassword"];
  const confirming = formData.get("confirm") === "yes";
  const submission = parseWithZod(formData, { schema: confirming ? confirmedSchema : refundSchema });
  const reply = (result: SubmissionResult<string[]>, init?: ResponseInit) => data<RefundReply>({ form: "refund", paymentId, result }, init);
  if (submission.status !== "success") return reply(submission.reply({ hideFields }), { status: 400 });
  const { amount: amountCents, reason } = submission.value;
  try {
    if (!confirming) {
      const question = await refundQuestion(user, params.paymentId, amountCents);
      const confirm = { question, amount: String(formData.get("amount")), reason };
      return data<RefundReply>({ form: "refund", paymentId, result: submission.reply({ hideFields }), confirm });
    }
    // Checked by confirmedSchema above.
    await confirmOwnPassword(clientOf(args), user, String(formData.get("currentPassword")));
    const { refund, payment } = await requestRefund(user, params.paymentId, { amountCents, reason });
    return redirectWithToast(
      request,
      `/jobs/${payment.jobId}`,
      `Refund of ${formatMoney(refund.amountCents, payment.currency)} sent to the card service; it is recorded here once they confirm it.`,
    );
  } catch (error) {
    if (error instanceof Throttled) {
      const result = submission.reply({ fieldErrors: { currentPassword: [error.message] }, hideFields });
      return reply(result, { status: 429, headers: { "Retry-After": String(error.retryAfterS) } });
    }
    // A wrong password keeps the question on screen (drawn again without JavaScript too).
    const confirm = confirming ? await refundQuestion(user, params.paymentId, amountCents).catch(() => null) : null;
    const result = fieldErrorReply(submission, error, { hideFields });
    return data<RefundReply>(
      { form: "refund", paymentId, result, ...(confirm ? { confirm: { question: confirm, amount: String(formData.get("amount")), reason } } : {}) },
      { status: 400 },
    );
  }
}
