import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import type { Route } from "./+types/job-balance";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { bankTransferSchema } from "~/schemas/jobs";
import { recordBankTransfer } from "~/services/balance.server";
import { fieldErrorReply } from "~/services/errors.server";
import { isPageForm, type PageFormAnswer } from "~/http/page-forms.server";
import { action as jobPageAction } from "./job";

/** What the bank transfer form reads back (through its fetcher, or as the page's action data without JavaScript). */
export type TransferReply = { form: "balance"; result: SubmissionResult<string[]> };

// Posted without JavaScript, a refused transfer is answered with the job page, the problem beside its field.
export { default, loader, meta } from "./job";

// The account manager records the balance as paid by bank transfer (reference and day).
export async function action(args: Route.ActionArgs): PageFormAnswer<typeof jobPageAction, TransferReply> {
  const { request, params } = args;
  if (await isPageForm(request, ["reference", "paidOn"])) return jobPageAction(args as unknown as Parameters<typeof jobPageAction>[0]);
  const user = await requireUser(request);
  const submission = parseWithZod(await request.formData(), { schema: bankTransferSchema });
  if (submission.status !== "success") return data<TransferReply>({ form: "balance", result: submission.reply() }, { status: 400 });
  try {
    await recordBankTransfer(user, params.jobId, submission.value);
  } catch (error) {
    return data<TransferReply>({ form: "balance", result: fieldErrorReply(submission, error) }, { status: 400 });
  }
  return redirectWithToast(request, `/jobs/${params.jobId}`, "The balance is recorded as paid by bank transfer. Buyer and shop have been sent receipts.");
}
