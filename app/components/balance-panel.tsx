import { Form, useActionData, useFetcher } from "react-router";
import type { SubmissionResult } from "@conform-to/react";
import { Badge, Button, Card } from "./ui";
import { FieldErrors, FormErrors } from "./form-field";
import { formatDay, formatMoment, todayUtc } from "~/content/dates";
import { formatMoney } from "~/content/money";
import { PAYMENT_STATUS_LABELS, PAYMENT_STATUS_TONES } from "~/content/payment-status";
import type { BalancePanel as Panel } from "~/services/balance.server";
import type { TransferReply } from "~/routes/job-balance";

// The balance on the job page: when it falls due, the buyer's "Pay the balance" (the card
// service's page, as for the retainer), the account manager's record of a bank transfer, and
// the card attempts for those who see payments.

const INPUT = "mt-1 block w-full rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200";

/** What was typed in a field of a refused form, to show it again. */
const typedValue = (result: SubmissionResult<string[]> | undefined, name: string) => {
  const value = (result?.initialValue as Record<string, unknown> | null | undefined)?.[name];
  return typeof value === "string" ? value : undefined;
};

export function BalancePanel({ jobId, balance }: { jobId: string; balance: Panel }) {
  const amount = formatMoney(balance.amountCents, balance.currency);
  const last = balance.payments[0];
  return (
    <Card className="space-y-3">
      <h2 className="flex flex-wrap items-center gap-2 font-semibold">
        Balance {amount} {balance.paidAt ? <Badge tone="good">Paid</Badge> : balance.waiting ? <Badge>Not due yet</Badge> : <Badge tone="warn">Due</Badge>}
      </h2>
      {balance.paidAt ? (
        <p className="text-sm">
          Paid {balance.method === "card" ? "by card" : "by bank transfer"} on {formatDay(balance.paidAt)}
          {balance.reference ? ` (reference ${balance.reference})` : ""}.
        </p>
      ) : balance.waiting ? (
        <p className="text-sm text-ink-600">{balance.waiting}</p>
      ) : (
        <p className="text-sm text-ink-600">The rest of the price after the retainer, due now the shop has handed over.</p>
      )}
      {balance.canPay ? (
        <>
          {last?.status === "failed" ? (
            <p className="text-sm font-semibold text-alarm-600">Your last card payment did not go through. Nothing was charged.</p>
          ) : null}
          <Form method="post" action={`/jobs/${jobId}/pay?for=balance`}>
            <Button type="submit">Pay the balance of {amount}</Button>
          </Form>
          <p className="text-xs text-ink-600">Paying by bank transfer instead? Your account manager records it when it arrives.</p>
        </>
      ) : null}
      {balance.canRecordTransfer ? <TransferForm jobId={jobId} /> : null}
      {balance.payments.length ? (
        <ul className="space-y-1 text-sm">
          {balance.payments.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center gap-2">
              <Badge tone={PAYMENT_STATUS_TONES[p.status]}>{PAYMENT_STATUS_LABELS[p.status]}</Badge>
              <span className="text-ink-600">card, {p.paidAt ? `paid ${formatMoment(p.paidAt)}` : `started ${formatMoment(p.createdAt)}`}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}

function TransferForm({ jobId }: { jobId: string }) {
  const fetcher = useFetcher<TransferReply>();
  // Without JavaScript the form's route draws the job page again, the reply as its action data.
  const page = useActionData() as Partial<TransferReply> | undefined;
  const result = fetcher.data?.result ?? (page?.form === "balance" ? page.result : undefined);
  const errors = result?.error ?? {};
  return (
    <details className="rounded-md ring-1 ring-ink-200 open:p-3" open={Object.keys(errors).length > 0 || undefined}>
      <summary className="cursor-pointer px-3 py-2 text-sm font-semibold">Record a bank transfer</summary>
      <fetcher.Form method="post" action={`/jobs/${jobId}/balance`} className="mt-3 space-y-3">
        <FormErrors errors={errors[""] ?? undefined} />
        <div>
          <label htmlFor="transfer-reference" className="block text-sm font-semibold">
            Reference on the bank statement
          </label>
          <input
            id="transfer-reference"
            name="reference"
            maxLength={200}
            defaultValue={typedValue(result, "reference")}
            className={INPUT}
            aria-invalid={errors.reference ? true : undefined}
          />
          <FieldErrors id="transfer-reference-error" errors={errors.reference ?? undefined} />
        </div>
        <div>
          <label htmlFor="transfer-day" className="block text-sm font-semibold">
            Arrived on
          </label>
          <input
            id="transfer-day"
            name="paidOn"
            type="date"
            defaultValue={typedValue(result, "paidOn") ?? todayUtc()}
            className={INPUT}
            aria-invalid={errors.paidOn ? true : undefined}
          />
          <FieldErrors id="transfer-day-error" errors={errors.paidOn ?? undefined} />
        </div>
        <Button type="submit" tone="secondary" disabled={fetcher.state !== "idle"}>
          Record as paid
        </Button>
      </fetcher.Form>
    </details>
  );
}
