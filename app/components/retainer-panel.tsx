import { useEffect, useState } from "react";
import { Form, useActionData, useFetcher, useSearchParams } from "react-router";
import { Badge, Button, Card, Notice } from "./ui";
import { FieldErrors as FieldErrorText } from "./form-field";
import { formatMoney } from "~/content/money";
import { formatMoment } from "~/content/dates";
import { PAYMENT_STATUS_LABELS, PAYMENT_STATUS_TONES, type PaymentStatus } from "~/content/payment-status";
import type { RefundReply } from "~/routes/payment-refund";

export interface PaymentView {
  id: string;
  status: PaymentStatus;
  amountCents: number;
  refundedCents: number;
  currency: string;
  failureMessage: string | null;
  createdAt: string;
  paidAt: string | null;
  refunds: {
    id: string;
    amountCents: number;
    reason: string;
    status: "requested" | "recorded" | "failed";
    by: string;
    at: string;
    failureMessage: string | null;
  }[];
}

const REFUND_LABELS = { requested: "Waiting for the card service", recorded: "Paid back", failed: "Refused" } as const;

// The retainer on the job page: the buyer pays (or tries again after a decline); account
// managers and admins see every attempt and can pay some or all of it back.
export function RetainerPanel({
  jobId,
  retainer,
  paid,
  canPay,
  canRefund,
  payments,
}: {
  jobId: string;
  retainer: string;
  paid: boolean;
  canPay: boolean;
  canRefund: boolean;
  payments: PaymentView[];
}) {
  const [params] = useSearchParams();
  const last = payments[0];
  return (
    <Card className="space-y-4">
      <h2 className="font-semibold">Retainer</h2>
      {params.get("payment") === "cancelled" && !paid ? <Notice tone="warn">You left the payment page; nothing was charged.</Notice> : null}
      {canPay && !paid ? (
        <>
          {last?.status === "failed" ? (
            <Notice tone="bad">
              Your last payment did not go through{last.failureMessage ? ` (“${last.failureMessage.replace(/\.$/, "")}”)` : ""}. Nothing was charged. Try again,
              with another card if need be.
            </Notice>
          ) : null}
          <p className="text-sm text-ink-600">Paid by card on the card service's secure page; the shop is told as soon as it arrives.</p>
          <Form method="post" action={`/jobs/${jobId}/pay`}>
            <Button type="submit">{last?.status === "failed" ? `Try again: pay ${retainer}` : `Pay the retainer of ${retainer}`}</Button>
          </Form>
        </>
      ) : null}
      {payments.length ? (
        <ul className="space-y-3 text-sm">
          {payments.map((p) => (
            <li key={p.id} className="rounded-md bg-ink-50 p-3">
              <p className="flex flex-wrap items-center gap-2">
                <Badge tone={PAYMENT_STATUS_TONES[p.status]}>{PAYMENT_STATUS_LABELS[p.status]}</Badge>
                <span className="font-semibold tabular-nums">{formatMoney(p.amountCents, p.currency)}</span>
                <span className="text-ink-600">{p.paidAt ? `paid ${formatMoment(p.paidAt)}` : `started ${formatMoment(p.createdAt)}`}</span>
              </p>
              {p.refundedCents ? <p className="mt-1">Paid back so far: {formatMoney(p.refundedCents, p.currency)}</p> : null}
              {p.refunds.map((r) => (
                <p key={r.id} className="mt-1 text-ink-700">
                  {formatMoney(r.amountCents, p.currency)} · {REFUND_LABELS[r.status]} · {r.reason} ({r.by}, {formatMoment(r.at)})
                  {r.failureMessage ? ` — ${r.failureMessage}` : ""}
                </p>
              ))}
              {canRefund && (p.status === "paid" || p.status === "partially_refunded") ? <RefundForm key={p.refunds.length} payment={p} /> : null}
            </li>
          ))}
        </ul>
      ) : !canPay ? (
        <p className="text-sm text-ink-600">{paid ? "Paid." : "The buyer has not paid yet."}</p>
      ) : null}
    </Card>
  );
}

const FIELD_CLASS = "mt-1 w-full rounded-md bg-white px-2 py-1 ring-1 ring-ink-200";

// Paying back in two steps: the amount and reason, then the question with the amount spelled
// out, answered with the person's password. A wrong password keeps the question on screen; a
// problem with the amount or reason goes back to the first step with what was typed.
function RefundForm({ payment }: { payment: PaymentView }) {
  const fetcher = useFetcher<RefundReply>();
  // Without JavaScript the form's route draws the job page again, the reply as its action data.
  const page = useActionData() as Partial<RefundReply> | undefined;
  const drawnAgain = page?.form === "refund" && page.paymentId === payment.id ? page : undefined;
  const errors = (fetcher.data ?? drawnAgain)?.result?.error ?? {};
  const id = `refund-${payment.id}`;
  const [asked, setAsked] = useState<RefundReply["confirm"] | null>(drawnAgain?.confirm ?? null);
  const [typed, setTyped] = useState(() => {
    const was = (drawnAgain?.confirm ?? drawnAgain?.result?.initialValue ?? {}) as Record<string, unknown>;
    return { amount: typeof was.amount === "string" ? was.amount : "", reason: typeof was.reason === "string" ? was.reason : "" };
  });
  // The password field starts empty again after every answer, right or wrong.
  const [round, setRound] = useState(0);
  useEffect(() => {
    if (fetcher.state !== "idle") return;
    setRound((r) => r + 1);
    const answer = fetcher.data;
    if (answer?.confirm) setAsked(answer.confirm);
    else if (answer?.result?.error?.amount || answer?.result?.error?.reason) setAsked(null);
  }, [fetcher.state, fetcher.data]);
  const field = (name: "amount" | "reason", label: string) => (
    <div>
      <label htmlFor={`${id}-${name}`} className="block text-xs font-semibold">
        {label}
      </label>
      <input
        id={`${id}-${name}`}
        name={name}
        required
        inputMode={name === "amount" ? "decimal" : undefined}
        value={typed[name]}
        onChange={(e) => setTyped((t) => ({ ...t, [name]: e.target.value }))}
        className={FIELD_CLASS}
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={errors[name] ? `${id}-${name}-error` : undefined}
      />
      <FieldErrorText id={`${id}-${name}-error`} errors={errors[name] ?? undefined} />
    </div>
  );
  return (
    <fetcher.Form method="post" action={`/payments/${payment.id}/refund`} className="mt-3 space-y-2 border-t border-ink-200 pt-3">
      <p className="font-semibold">Pay back</p>
      {asked ? (
        <>
          <input type="hidden" name="amount" value={asked.amount} />
          <input type="hidden" name="reason" value={asked.reason} />
          <input type="hidden" name="confirm" value="yes" />
          <Notice tone="warn">
            <span className="font-semibold">{asked.question}</span> Reason: {asked.reason}
          </Notice>
          <div>
            <label htmlFor={`${id}-password`} className="block text-xs font-semibold">
              Your password
            </label>
            <input
              key={round}
              id={`${id}-password`}
              name="currentPassword"
              type="password"
              autoComplete="current-password"
              className={FIELD_CLASS}
              aria-invalid={errors.currentPassword ? true : undefined}
              aria-describedby={`${id}-password-hint`}
            />
            <p id={`${id}-password-hint`} className="mt-1 text-xs text-ink-600">
              Asked again before any money moves.
            </p>
            <FieldErrorText id={`${id}-password-error`} errors={errors.currentPassword ?? undefined} />
          </div>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" tone="danger" disabled={fetcher.state !== "idle"}>
              Yes, refund
            </Button>
            <Button type="button" tone="secondary" onClick={() => setAsked(null)}>
              Change the amount
            </Button>
          </div>
        </>
      ) : (
        <>
          {field("amount", `Amount (${payment.currency})`)}
          {field("reason", "Reason (the buyer reads it on the job page)")}
          <Button type="submit" tone="secondary" disabled={fetcher.state !== "idle"}>
            Continue
          </Button>
        </>
      )}
    </fetcher.Form>
  );
}
