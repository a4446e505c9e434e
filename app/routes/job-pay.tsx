import { redirect } from "react-router";
import type { Route } from "./+types/job-pay";
import { requireUser } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { startBalancePayment, startRetainerPayment } from "~/services/payments.server";

// "Pay the retainer" (or, with ?for=balance, "Pay the balance"): sends the buyer to the card
// service's hosted payment page.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const start = new URL(request.url).searchParams.get("for") === "balance" ? startBalancePayment : startRetainerPayment;
  try {
    return redirect(await start(user, params.jobId));
  } catch (error) {
    return redirectWithToast(request, `/jobs/${params.jobId}`, fieldErrorsOf(error).message);
  }
}

export function loader({ params }: Route.LoaderArgs) {
  return redirect(`/jobs/${params.jobId}`);
}
