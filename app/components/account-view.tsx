import { Form, Link } from "react-router";
import { Badge, Button, Card } from "./ui";
import { FieldErrors as FieldErrorText } from "./form-field";
import { countOf } from "~/content/count";
import { formatDay, formatMoment } from "~/content/dates";
import { formatMoney } from "~/content/money";
import { PAYMENT_STATUS_LABELS, PAYMENT_STATUS_TONES, type PaymentStatus } from "~/content/payment-status";
import { ACCOUNT_NOTE_MAX } from "~/schemas/account-notes";

// The account manager's parts of a buyer account's page (routes/account.tsx): open specs with
// bids and deadlines, payments, and the notes kept on the account. Data from account-view.server.ts.

export function OpenSpecs({ specs }: { specs: { id: string; title: string; deadline: string | null; bids: number; daysLate: number }[] }) {
  return (
    <Card title={`Open specs (${specs.length})`}>
      {specs.length === 0 ? (
        <p className="text-sm text-ink-600">No spec open for bids.</p>
      ) : (
        <ul className="divide-y divide-ink-100 text-sm">
          {specs.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <Link to={`/specs/${s.id}`} className="font-semibold text-flow-700 hover:underline">
                {s.title || "Untitled spec"}
              </Link>
              <span className="flex flex-wrap items-center gap-2 text-ink-600">
                {countOf(s.bids, "bid")} received · {s.deadline ? `bids until ${formatDay(s.deadline)}` : "no deadline"}
                {s.daysLate ? (
                  <Badge tone={s.bids ? "warn" : "bad"}>{`Deadline passed ${countOf(s.daysLate, "day")} ago${s.bids ? "" : ", no bid"}`}</Badge>
                ) : null}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

interface PaymentRow {
  id: string;
  jobId: string;
  specTitle: string;
  purpose: "retainer" | "balance";
  /** A balance the account manager recorded as paid by bank transfer (no card payment). */
  byTransfer: boolean;
  status: PaymentStatus;
  amountCents: number;
  refundedCents: number;
  currency: string;
  paidAt: string | null;
  createdAt: string;
}

export function AccountPayments({ payments }: { payments: PaymentRow[] }) {
  return (
    <Card title="Payments">
      {payments.length === 0 ? (
        <p className="text-sm text-ink-600">No payment yet.</p>
      ) : (
        <ul className="divide-y divide-ink-100 text-sm">
          {payments.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <Link to={`/jobs/${p.jobId}`} className="font-semibold text-flow-700 hover:underline">
                {p.specTitle}
              </Link>
              <span className="flex flex-wrap items-center gap-2 text-ink-600">
                <span>
                  {p.purpose === "balance" ? "Balance" : "Retainer"} <span className="tabular-nums">{formatMoney(p.amountCents, p.currency)}</span>
                  {p.byTransfer ? " by bank transfer" : ""}
                </span>
                {p.refundedCents ? <span>({formatMoney(p.refundedCents, p.currency)} paid back)</span> : null}
                <span>{p.paidAt ? `paid ${formatDay(p.paidAt)}` : `started ${formatDay(p.createdAt)}`}</span>
                <Badge tone={PAYMENT_STATUS_TONES[p.status]}>{PAYMENT_STATUS_LABELS[p.status]}</Badge>
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

interface Note {
  id: string;
  body: string;
  author: string;
  createdAt: string;
  editedBy: string | null;
  updatedAt: string;
}

type NoteAnswer = { noteId: string; result: { initialValue?: Record<string, unknown> | null; error?: Record<string, string[] | null> | null } } | undefined;

/** One note form: a new note, or the text of one being edited. What was typed comes back with a refusal. */
function NoteForm({ note, answer }: { note?: Note; answer: NoteAnswer }) {
  const key = note?.id ?? "new";
  const mine = answer?.noteId === key ? answer.result : null;
  const problem = mine?.error?.body ?? mine?.error?.noteId ?? undefined;
  const id = `note-${key}`;
  return (
    <Form method="post" className="space-y-2">
      <input type="hidden" name="intent" value={note ? "edit-note" : "add-note"} />
      <input type="hidden" name="noteId" value={note?.id ?? "new"} />
      <label htmlFor={id} className="block text-sm font-semibold">
        {note ? "Edit the note" : "Add a note"}
      </label>
      <textarea
        id={id}
        name="body"
        rows={3}
        maxLength={ACCOUNT_NOTE_MAX}
        defaultValue={typeof mine?.initialValue?.body === "string" ? mine.initialValue.body : (note?.body ?? "")}
        aria-invalid={problem ? true : undefined}
        aria-describedby={problem ? `${id}-error` : undefined}
        className="w-full rounded-md px-2 py-1 text-sm ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
      />
      <FieldErrorText id={`${id}-error`} errors={problem ?? undefined} />
      <Button type="submit" tone="secondary" className="px-3 py-1">
        {note ? "Save the note" : "Add the note"}
      </Button>
    </Form>
  );
}

export function AccountNotes({ notes, answer }: { notes: Note[]; answer: NoteAnswer }) {
  return (
    <Card title="Notes on the account">
      <p className="mb-3 text-sm text-ink-600">For Tenderflow's staff only: the buyer never sees them.</p>
      {/* Keyed by the count, so the box starts empty again once a note is added. */}
      <NoteForm key={notes.length} answer={answer} />
      <ul className="mt-4 divide-y divide-ink-100 text-sm">
        {notes.map((n) => (
          // Keyed by the last edit too, so a saved note's editor closes.
          <li key={`${n.id}-${n.updatedAt}`} className="py-3">
            <p className="break-words whitespace-pre-line">{n.body}</p>
            <p className="mt-1 text-xs text-ink-600">
              {n.author}, {formatMoment(n.createdAt)}
              {n.editedBy ? ` · edited by ${n.editedBy}, ${formatMoment(n.updatedAt)}` : ""}
            </p>
            <details className="mt-1" open={answer?.noteId === n.id}>
              <summary className="cursor-pointer text-xs text-flow-700">Edit</summary>
              <div className="mt-2">
                <NoteForm note={n} answer={answer} />
              </div>
            </details>
          </li>
        ))}
      </ul>
    </Card>
  );
}
