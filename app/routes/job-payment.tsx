import { useEffect } from "react";
import { Form, Link, useRevalidator } from "react-router";
import type { Route } from "./+types/job-payment";
import { requireUser } from "~/auth/permissions.server";
import { Button, ButtonLink, Card, Notice, PageHeader } from "~/components/ui";
import { formatMoney } from "~/content/money";
import { PAYMENT_STATUS_LABELS, type PaymentStatus } from "~/content/payment-status";
import { paymentOfSession } from "~/services/payments.server";

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `${d?.purpose === "balance" ? "Balance" : "Retainer"} payment · ${d?.title || "Job"} · Tenderflow` },
];

// Where the card service sends the buyer back. The payment counts only once its signed webhook
// has arrived, so until then this page says "processing" and looks again every two seconds.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const { job, payment, title } = await paymentOfSession(user, params.jobId, new URL(request.url).searchParams.get("session_id"));
  return {
    jobId: job.id,
    title,
    purpose: payment.purpose,
    status: payment.status as PaymentStatus,
    amount: formatMoney(payment.amountCents, payment.currency),
    failure: payment.failureMessage,
    duplicate: payment.duplicate,
    since: payment.updatedAt.toISOString(),
  };
}

const POLL_MS = 2_000;

export default function JobPayment({ loaderData: d }: Route.ComponentProps) {
  const revalidator = useRevalidator();
  const waiting = d.status === "pending" || d.status === "failed";
  const what = d.purpose === "balance" ? "balance" : "retainer";
  useEffect(() => {
    if (!waiting) return;
    const timer = setInterval(() => revalidator.state === "idle" && revalidator.revalidate(), POLL_MS);
    return () => clearInterval(timer);
  }, [waiting, revalidator]);

  return (
    <>
      <PageHeader
        title={d.purpose === "balance" ? "Balance payment" : "Retainer payment"}
        // Which job it paid for: the card service's page is the last thing the buyer saw.
        lead={`${d.title || "Untitled spec"} · ${d.amount} · ${waiting ? "Processing" : PAYMENT_STATUS_LABELS[d.status]}`}
      />
      <Card className="max-w-xl space-y-4">
        {waiting ? (
          <div role="status" aria-live="polite" className="space-y-2">
            <p className="text-lg font-semibold">Processing your payment…</p>
            <p className="text-sm text-ink-600">
              The card service has your payment and is confirming it to us. This page updates by itself, usually within a few seconds; you can also leave it,
              and you will get a receipt by e-mail.
            </p>
          </div>
        ) : d.duplicate ? (
          <Notice tone="warn">
            The {what} had already been paid, so this second payment of {d.amount} is being refunded to your card in full. You will get an e-mail about it;
            nothing else is needed from you.
          </Notice>
        ) : d.status === "paid" || d.status === "partially_refunded" || d.status === "refunded" ? (
          <Notice tone="good">
            Paid: the {what} of {d.amount} has been received. A receipt is on its way to you, and the shop has been told.
          </Notice>
        ) : (
          <>
            <Notice tone="warn">This payment attempt lapsed before it was completed. Nothing was charged.</Notice>
            <Form method="post" action={`/jobs/${d.jobId}/pay${d.purpose === "balance" ? "?for=balance" : ""}`}>
              <Button type="submit">Pay the {what}</Button>
            </Form>
          </>
        )}
        <ButtonLink to={`/jobs/${d.jobId}`} tone="secondary">
          Back to the job
        </ButtonLink>
      </Card>
      {waiting ? (
        <p className="mt-4 text-sm text-ink-600">
          Problems with a card?{" "}
          <Link to={`/jobs/${d.jobId}`} className="text-flow-700 hover:underline">
            The job page
          </Link>{" "}
          shows the last attempt and lets you try again.
        </p>
      ) : null}
    </>
  );
}
