import { getFormProps, useForm, type DefaultValue, type FormMetadata, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import type { z } from "zod";
import { Form, useNavigation } from "react-router";
import { FormErrors, SelectField, SubmitButton, TextAreaField, TextField } from "./form-field";
import { Card } from "./ui";
import { MILESTONE_LABELS, type MilestoneKey } from "~/content/job-milestones";
import { managerNoteSchema, progressNoteSchema, reachSchema, targetSchema, undoSchema, type JobActionIntent } from "~/schemas/jobs";

// The job page's forms, one per change (intent). Each is judged by its schema here and again by
// the server; the page passes each form only its own last result.

// A form shows its server errors until the next submission starts.
function useIdleResult(lastResult: SubmissionResult<string[]> | undefined) {
  return useNavigation().state === "idle" ? lastResult : null;
}

/** A job form's Conform state: judged by its schema as the person types, named by its intent. */
function useJobForm<Schema extends z.ZodObject>(
  intent: JobActionIntent,
  schema: Schema,
  lastResult: SubmissionResult<string[]> | undefined,
  defaultValue?: DefaultValue<z.input<Schema>>,
) {
  return useForm<z.input<Schema>, z.output<Schema>>({
    id: intent,
    lastResult: useIdleResult(lastResult),
    defaultValue,
    onValidate: ({ formData }) => parseWithZod(formData, { schema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
}

type FormProps = { lastResult: SubmissionResult<string[]> | undefined };

/** The frame every job form shares: a card with its title and lead, the intent it posts (the form's id), and its form-level errors. */
function JobFormCard<Shape extends Record<string, unknown>>(props: {
  title: React.ReactNode;
  lead?: string;
  form: FormMetadata<Shape, string[]>;
  children: React.ReactNode;
}) {
  return (
    <Card>
      <h2 className="mb-1 font-semibold">{props.title}</h2>
      {props.lead ? <p className="mb-4 text-sm text-ink-600">{props.lead}</p> : null}
      <Form method="post" {...getFormProps(props.form)} className={props.lead ? "space-y-4" : "mt-3 space-y-4"}>
        <input type="hidden" name="intent" value={props.form.id} />
        <FormErrors id={props.form.errorId} errors={props.form.errors} />
        {props.children}
      </Form>
    </Card>
  );
}

export function ReachForm({ open, lastResult }: FormProps & { open: MilestoneKey[] }) {
  const [form, fields] = useJobForm("reach", reachSchema, lastResult, { milestone: open[0] });
  return (
    <JobFormCard title="Record progress" lead="Buyer and shop get an e-mail. Choosing a later milestone records the ones before it as well." form={form}>
      <SelectField meta={fields.milestone} label="Reached up to and including" options={open.map((k) => ({ value: k, label: MILESTONE_LABELS[k] }))} />
      <TextAreaField meta={fields.note} label="Note (optional)" hint="For example: pressure test passed at 1.5 × the relief setting." />
      <SubmitButton>Record as reached</SubmitButton>
    </JobFormCard>
  );
}

export function TargetForm({ open, lastResult }: FormProps & { open: MilestoneKey[] }) {
  const [form, fields] = useJobForm("target", targetSchema, lastResult, { milestone: open[0] });
  return (
    <JobFormCard title="Move a target date" lead="The change and your reason go into the history." form={form}>
      <SelectField meta={fields.milestone} label="Milestone" options={open.map((k) => ({ value: k, label: MILESTONE_LABELS[k] }))} />
      <TextField meta={fields.targetDate} label="New target date" type="date" />
      <TextAreaField meta={fields.reason} label="Reason (optional)" hint="For example: the motor arrives two weeks late." />
      <SubmitButton tone="secondary">Save the date</SubmitButton>
    </JobFormCard>
  );
}

export function ProgressNoteForm({ lastResult }: FormProps) {
  const [form, fields] = useJobForm("progress-note", progressNoteSchema, lastResult);
  return (
    <JobFormCard title="Note for the buyer" form={form}>
      <TextAreaField meta={fields.body} label="Note" hint="Seen by the buyer and by Tenderflow staff." />
      <SubmitButton tone="secondary">Add the note</SubmitButton>
    </JobFormCard>
  );
}

export function UndoForm({ last, lastResult }: FormProps & { last: MilestoneKey }) {
  const [form, fields] = useJobForm("undo", undoSchema, lastResult);
  return (
    <JobFormCard
      title={<>Take back “{MILESTONE_LABELS[last]}”</>}
      lead="Only the last milestone reached can be taken back. It stays in the history with your reason."
      form={form}
    >
      <input type="hidden" name="milestone" value={last} />
      <TextAreaField meta={fields.reason} label="Reason" hint="For example: the test has to be repeated after a seal change." />
      <SubmitButton tone="danger">Take it back</SubmitButton>
    </JobFormCard>
  );
}

export function ManagerNoteForm({ lastResult }: FormProps) {
  const [form, fields] = useJobForm("manager-note", managerNoteSchema, lastResult);
  return (
    <JobFormCard title="Internal note" lead="Only Tenderflow staff see these notes, never the buyer or the shop." form={form}>
      <TextAreaField meta={fields.body} label="Note" />
      <SubmitButton tone="secondary">Save the note</SubmitButton>
    </JobFormCard>
  );
}
