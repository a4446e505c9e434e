import { parseWithZod } from "@conform-to/zod/v4";
import { data, redirect } from "react-router";
import type { Route } from "./+types/job-balance";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { bankTransferSchema } from "~/schemas/jobs";
import { recordBankTransfer } from "~/services/balance.server";
import { fieldErrorReply } from "~/services/errors.server";

// The account manager records the balance as paid by bank transfer (reference and day).
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const submission = parseWithZod(await request.formData(), { schema: bankTransferSchema });
  if (submission.status !== "success") return data({ result: submission.reply() }, { status: 400 });
  try {
    await recordBankTransfer(user, params.jobId, submission.value);
  } catch (error) {
    return data({ result: fieldErrorReply(submission, error) }, { status: 400 });
  }
  return redirectWithToast(request, `/jobs/${params.jobId}`, "The balance is recorded as paid by bank transfer. Buyer and shop have been sent receipts.");
}

export function loader({ params }: Route.LoaderArgs) {
  return redirect(`/jobs/${params.jobId}`);
}
