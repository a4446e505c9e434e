import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, useNavigation } from "react-router";
import { FormErrors, SelectField, SubmitButton, TextAreaField, TextField } from "./form-field";
import { Card } from "./ui";
import { MILESTONE_LABELS, type MilestoneKey } from "~/content/job-milestones";
import { managerNoteSchema, progressNoteSchema, reachSchema, targetSchema, undoSchema } from "~/schemas/jobs";

// The job page's forms, one per change (intent). Each is judged by its schema here and again by
// the server; the page passes each form only its own last result.

// A form shows its server errors until the next submission starts.
function useIdleResult(lastResult: SubmissionResult<string[]> | undefined) {
  return useNavigation().state === "idle" ? lastResult : null;
}

const VALIDATE = { shouldValidate: "onBlur", shouldRevalidate: "onInput" } as const;

type FormProps = { lastResult: SubmissionResult<string[]> | undefined };

export function ReachForm({ open, lastResult }: FormProps & { open: MilestoneKey[] }) {
  const [form, fields] = useForm({
    id: "reach",
    lastResult: useIdleResult(lastResult),
    defaultValue: { milestone: open[0] },
    onValidate: ({ formData }) => parseWithZod(formData, { schema: reachSchema }),
    ...VALIDATE,
  });
  return (
    <Card>
      <h2 className="mb-1 font-semibold">Record progress</h2>
      <p className="mb-4 text-sm text-ink-600">Buyer and shop get an e-mail. Choosing a later milestone records the ones before it as well.</p>
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <input type="hidden" name="intent" value="reach" />
        <FormErrors id={form.errorId} errors={form.errors} />
        <SelectField meta={fields.milestone} label="Reached up to and including" options={open.map((k) => ({ value: k, label: MILESTONE_LABELS[k] }))} />
        <TextAreaField meta={fields.note} label="Note (optional)" hint="For example: pressure test passed at 1.5 × the relief setting." />
        <SubmitButton>Record as reached</SubmitButton>
      </Form>
    </Card>
  );
}

export function TargetForm({ open, lastResult }: FormProps & { open: MilestoneKey[] }) {
  const [form, fields] = useForm({
    id: "target",
    lastResult: useIdleResult(lastResult),
    defaultValue: { milestone: open[0] },
    onValidate: ({ formData }) => parseWithZod(formData, { schema: targetSchema }),
    ...VALIDATE,
  });
  return (
    <Card>
      <h2 className="mb-1 font-semibold">Move a target date</h2>
      <p className="mb-4 text-sm text-ink-600">The change and your reason go into the history.</p>
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <input type="hidden" name="intent" value="target" />
        <FormErrors id={form.errorId} errors={form.errors} />
        <SelectField meta={fields.milestone} label="Milestone" options={open.map((k) => ({ value: k, label: MILESTONE_LABELS[k] }))} />
        <TextField meta={fields.targetDate} label="New target date" type="date" />
        <TextAreaField meta={fields.reason} label="Reason (optional)" hint="For example: the motor arrives two weeks late." />
        <SubmitButton tone="secondary">Save the date</SubmitButton>
      </Form>
    </Card>
  );
}

export function ProgressNoteForm({ lastResult }: FormProps) {
  const [form, fields] = useForm({
    id: "progress-note",
    lastResult: useIdleResult(lastResult),
    onValidate: ({ formData }) => parseWithZod(formData, { schema: progressNoteSchema }),
    ...VALIDATE,
  });
  return (
    <Card>
      <h2 className="mb-1 font-semibold">Note for the buyer</h2>
      <Form method="post" {...getFormProps(form)} className="mt-3 space-y-4">
        <input type="hidden" name="intent" value="progress-note" />
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextAreaField meta={fields.body} label="Note" hint="Seen by the buyer and by Tenderflow staff." />
        <SubmitButton tone="secondary">Add the note</SubmitButton>
      </Form>
    </Card>
  );
}

export function UndoForm({ last, lastResult }: FormProps & { last: MilestoneKey }) {
  const [form, fields] = useForm({
    id: "undo",
    lastResult: useIdleResult(lastResult),
    onValidate: ({ formData }) => parseWithZod(formData, { schema: undoSchema }),
    ...VALIDATE,
  });
  return (
    <Card>
      <h2 className="mb-1 font-semibold">Take back “{MILESTONE_LABELS[last]}”</h2>
      <p className="mb-4 text-sm text-ink-600">Only the last milestone reached can be taken back. It stays in the history with your reason.</p>
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <input type="hidden" name="intent" value="undo" />
        <input type="hidden" name="milestone" value={last} />
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextAreaField meta={fields.reason} label="Reason" hint="For example: the test has to be repeated after a seal change." />
        <SubmitButton tone="danger">Take it back</SubmitButton>
      </Form>
    </Card>
  );
}

export function ManagerNoteForm({ lastResult }: FormProps) {
  const [form, fields] = useForm({
    id: "manager-note",
    lastResult: useIdleResult(lastResult),
    onValidate: ({ formData }) => parseWithZod(formData, { schema: managerNoteSchema }),
    ...VALIDATE,
  });
  return (
    <Card>
      <h2 className="mb-1 font-semibold">Internal note</h2>
      <p className="mb-4 text-sm text-ink-600">Only Tenderflow staff see these notes, never the buyer or the shop.</p>
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <input type="hidden" name="intent" value="manager-note" />
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextAreaField meta={fields.body} label="Note" />
        <SubmitButton tone="secondary">Save the note</SubmitButton>
      </Form>
    </Card>
  );
}
