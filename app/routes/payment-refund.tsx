import { parseWithZod } from "@conform-to/zod/v4";
import { data, redirect } from "react-router";
import type { Route } from "./+types/payment-refund";
import { requireRole } from "~/auth/permissions.server";
import { OPERATOR_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { formatMoney } from "~/content/money";
import { currentPasswordField } from "~/schemas/account";
import { refundSchema } from "~/schemas/payments";
import { confirmOwnPassword } from "~/services/accounts.server";
import { fieldErrorReply } from "~/services/errors.server";
import { Throttled, clientOf } from "~/services/throttle.server";
import { refundQuestion, requestRefund } from "~/services/payments.server";

const confirmedSchema = refundSchema.extend({ currentPassword: currentPasswordField });

// An account manager (or admin) pays back part or all of a retainer, from the job page, in two
// steps: the amount and reason first, answered by the question with the amount spelled out;
// then, confirming, their password again (a stolen session alone moves no money).
export async function action(args: Route.ActionArgs) {
  const { request, params } = args;
  const user = await requireRole(request, OPERATOR_ROLES);
  const formData = await request.formData();
  const hideFields = ["currentPassword"];
  const confirming = formData.get("confirm") === "yes";
  const submission = parseWithZod(formData, { schema: confirming ? confirmedSchema : refundSchema });
  if (submission.status !== "success") return data({ result: submission.reply({ hideFields }) }, { status: 400 });
  const { amount: amountCents, reason } = submission.value;
  try {
    if (!confirming) {
      const question = await refundQuestion(user, params.paymentId, amountCents);
      return data({ result: submission.reply({ hideFields }), confirm: { question, amount: formData.get("amount") as string, reason } });
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
      return data({ result }, { status: 429, headers: { "Retry-After": String(error.retryAfterS) } });
    }
    return data({ result: fieldErrorReply(submission, error, { hideFields }) }, { status: 400 });
  }
}

export function loader() {
  return redirect("/payments");
}
