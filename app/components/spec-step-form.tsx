import { getFormProps, parse, useForm, type Submission, type SubmissionResult } from "@conform-to/react";
import { useEffect, useMemo, useRef, useState } from "react";
import { Form, Link, useBlocker } from "react-router";
import { SelectField, SubmitButton, TextAreaField, TextField } from "~/components/form-field";
import { MoreQuestions } from "~/components/more-questions";
import { RequirementInput } from "~/components/requirement-input";
import { AttachmentUploader, AxesFields, CycleFields, MachineCyclePreview, MachinePreview, QuotationFields, SpecLivePreview } from "~/components/loaded-later";
import { useMachineSizing } from "~/components/use-machine-sizing";
import { sequenceOf } from "~/content/machine-input";
import { Button, Card, Notice, STICKY_ACTION_BAR } from "~/components/ui";
import {
  REQUIREMENT_FIELDS,
  differsFromDefault,
  displayValue,
  fieldApplies,
  fieldMessages,
  type FormValues,
  type RequirementKey,
} from "~/content/requirement-fields";
import { FORM_QUESTIONS, type FormStepKind, type StepRef } from "~/content/spec-steps";
import { FLUIDS, STEP_DEFAULTS, SUPPLY_VOLTAGES, TEXT_MAX, stepFieldNames, type StepContext } from "~/schemas/spec-fields";
import type { AttachmentLimits, AttachmentView } from "~/services/attachments.server";
import { UNIT_SYSTEM_LABELS, type UnitSystem } from "~/units";

// One step of the spec form (the machine and its axes, an axis's mounting or motion, the cycle,
// duty, quotation): its questions, the live preview beside an axis's motion and the machine
// beside its cycle, and Back / Save and continue. What was typed survives a refused submission,
// with or without JavaScript: the fields start from the server's reply.

export interface SpecStepFormProps {
  specId: string;
  step: StepRef;
  /** the step Back goes to, if any */
  previous: string | null;
  system: UnitSystem;
  context: StepContext;
  /** this step's own answers as stored */
  stepAnswers: Record<string, string | undefined>;
  /** an axis step's answers of its axis with the duty, for the live preview */
  axisValues: FormValues | null;
  /** the cycle step's machine: the saved axes and duty (unanswered duty assumed) without its cycle */
  machineBase: { input: Record<string, unknown> | null; assumed: string[] } | null;
  attachments: AttachmentView[];
  attachmentLimits: AttachmentLimits;
  lastResult: SubmissionResult<string[]> | null;
}

type Answers = Record<string, string | undefined>;

export function SpecStepForm({
  specId,
  step,
  previous,
  system,
  context,
  stepAnswers,
  axisValues,
  machineBase,
  attachments,
  attachmentLimits,
  lastResult,
}: SpecStepFormProps) {
  const kind = step.kind as FormStepKind;
  const defaultValue = useMemo(() => {
    const mine = stepFieldNames(kind, context.axes);
    const usual = Object.fromEntries(Object.entries(STEP_DEFAULTS).filter(([k]) => mine.includes(k)));
    return { ...usual, ...stepAnswers };
  }, [kind, context.axes, stepAnswers]);
  const check = useStepCheck();
  const [form, fields] = useForm<Answers, Record<string, unknown>>({
    lastResult,
    defaultValue,
    onValidate: ({ formData }) => check.validate(formData, (schemas) => schemas.stepSchema(kind, system, context)),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  // A field left before the schema had arrived is checked as soon as it has.
  useEffect(() => check.whenLoaded((name) => form.validate({ name })), [check, form]);
  const others = context.others[0] ?? {};
  const current = { ...others, ...(form.value as FormValues | undefined) } as FormValues;
  const leave = useUnsavedGuard(form.dirty);
  const deciding = { orientation: current.orientation ?? others.orientation, pressStrokeMm: current.pressStrokeMm };
  const questions = kind === "mounting" || kind === "motion" || kind === "duty" ? FORM_QUESTIONS[kind] : undefined;
  const asked = (keys: RequirementKey[] | undefined) => (keys ?? []).filter((k) => kind === "duty" || fieldApplies(k, deciding));
  const question = (key: RequirementKey) => (
    <RequirementInput
      key={key}
      field={REQUIREMENT_FIELDS[key]}
      value={(fields[key].initialValue as string | undefined) ?? defaultFor(key, system)}
      system={system}
      errors={fieldMessages(key, fields[key].errors, system)}
    />
  );
  const wide = kind === "motion" || kind === "cycle";
  const formValue = form.value as Answers | undefined;
  const sequence = useMemo(() => {
    if (kind !== "cycle") return [];
    const chosen = { ...defaultValue, ...formValue };
    return sequenceOf(context.axes, Object.fromEntries(Object.entries(chosen).filter((e): e is [string, string] => typeof e[1] === "string")));
  }, [kind, context.axes, defaultValue, formValue]);
  const sizing = useMachineSizing(kind === "cycle" ? (machineBase?.input ?? null) : null, sequence, context.axes);

  return (
    <>
      <div className={wide ? "grid gap-6 lg:grid-cols-[1fr_26rem]" : "max-w-2xl"}>
        <div>
          <Form
            method="post"
            {...getFormProps(form)}
            onSubmit={(event) => {
              getFormProps(form).onSubmit(event);
              // Saving is not leaving: the guard lets this form's own submission through.
              leave.saving.current = !event.defaultPrevented;
            }}
            className="space-y-5"
          >
            {/* Enter in a field saves and continues: the form's first submit button is the default one. */}
            <button type="submit" name="intent" value="next" className="sr-only" tabIndex={-1} aria-hidden="true" />
            {form.errors?.length ? <Notice tone="bad">{form.errors.join(" ")}</Notice> : null}
            <Card className="space-y-5">
              {kind === "machine" ? (
                <>
                  <TextField
                    meta={fields.title}
                    label="Title"
                    hint={`A short name shops will see, e.g. “Bending press” or “Scissor lift table”. At most ${TEXT_MAX.title} characters.`}
                    maxLength={TEXT_MAX.title}
                  />
                  <TextAreaField
                    meta={fields.purpose}
                    label="What the machine does"
                    hint={`A sentence or two: what the machine moves and why. Optional, but it helps shops. At most ${TEXT_MAX.purpose} characters.`}
                    maxLength={TEXT_MAX.purpose}
                  />
                </>
              ) : null}
              {asked(questions?.keys).map(question)}
              {questions?.more ? (
                <MoreQuestions
                  title={questions.more.title}
                  summary={questions.more.summary}
                  startOpen={differsFromDefault(questions.more.keys, stepAnswers, system)}
                  attention={questions.more.keys.some((k) => fields[k].errors?.length)}
                >
                  {asked(questions.more.keys).map(question)}
                </MoreQuestions>
              ) : null}
              {kind === "duty" ? (
                <>
                  {context.axes.length > 1 ? (
                    <p className="text-sm text-ink-600">These answers hold for the whole machine: one power unit feeds every axis.</p>
                  ) : null}
                  <SelectField
                    meta={fields.supplyVoltage}
                    label="Mains voltage"
                    hint="The supply at the machine; the motor is quoted for it."
                    options={SUPPLY_VOLTAGES}
                  />
                  <SelectField
                    meta={fields.fluid}
                    label="Hydraulic fluid"
                    hint="Mineral oil grade by ISO 3448. ISO VG 46 suits most indoor machines."
                    options={FLUIDS}
                  />
                </>
              ) : null}
              {kind === "quotation" ? <QuotationFields fields={fields} /> : null}
              {kind === "cycle" ? <CycleFields fields={fields} axes={context.axes} values={form.value as Answers | undefined} /> : null}
              {kind !== "machine" && kind !== "cycle" ? (
                <p className="text-xs text-ink-600">
                  Values in {UNIT_SYSTEM_LABELS[system]}.{" "}
                  <Link to="/settings" className="text-flow-700 hover:underline">
                    Change your units
                  </Link>{" "}
                  for new specs.
                </p>
              ) : null}
            </Card>
            {kind === "machine" ? <AxesFields fields={fields} axes={context.axes} /> : null}
          </Form>
          {kind === "quotation" ? (
            // A form of its own (forms cannot nest); the step's buttons below reach their form by id.
            <Card className="mt-6">
              <AttachmentUploader specId={specId} attachments={attachments} limits={attachmentLimits} />
            </Card>
          ) : null}
          {leave.blocker.state === "blocked" ? (
            <div role="alertdialog" aria-labelledby="unsaved-title" className="mt-5 rounded-lg bg-signal-50 p-4 ring-1 ring-signal-500/40">
              <p id="unsaved-title" className="font-semibold text-ink-900">
                Leave this step without saving?
              </p>
              <p className="mt-1 text-sm text-ink-700">What you changed here is not saved yet. Save and continue keeps it; leaving now loses it.</p>
              <div className="mt-3 flex flex-wrap gap-2">
                <Button type="button" tone="secondary" onClick={() => leave.blocker.reset?.()}>
                  Stay on this step
                </Button>
                <Button type="button" tone="danger" onClick={() => leave.blocker.proceed?.()}>
                  Leave without saving
                </Button>
              </div>
            </div>
          ) : null}
          {/* Save and continue stays in view on a laptop's screen, however long the step. */}
          <div className={`mt-5 ${STICKY_ACTION_BAR}`} data-step-actions="">
            {previous ? (
              <Button type="submit" form={form.id} name="intent" value="back" tone="secondary" formNoValidate>
                ← Back
              </Button>
            ) : (
              <span />
            )}
            <SubmitButton form={form.id} name="intent" value="next">
              Save and continue →
            </SubmitButton>
          </div>
        </div>
        {kind === "motion" ? (
          <SpecLivePreview values={{ ...axisValues, ...current }} system={system} axisName={step.axis?.name} inMachine={context.axes.length > 1} />
        ) : null}
        {kind === "cycle" ? <MachinePreview {...sizing} assumed={machineBase?.assumed ?? []} system={system} /> : null}
      </div>
      {kind === "cycle" ? (
        <div className="mt-6">
          <MachineCyclePreview machine={sizing.machine} system={system} />
        </div>
      ) : null}
    </>
  );
}

type StepSchemas = typeof import("~/schemas/spec");
type ZodParse = typeof import("@conform-to/zod/v4").parseWithZod;

/**
 * The step's schema and zod load just after the page (a sixth of its script), so the questions are
 * ready sooner. Until they have arrived a field left is noted and checked once they are, and
 * "Save and continue" posts to the server, which judges the step with the same schema.
 */
function useStepCheck() {
  const [loaded, setLoaded] = useState<{ schemas: StepSchemas; parseWithZod: ZodParse } | null>(null);
  const [waiting] = useState(() => new Set<string>());
  useEffect(() => {
    void Promise.all([import("~/schemas/spec"), import("@conform-to/zod/v4")]).then(([schemas, zod]) => setLoaded({ schemas, parseWithZod: zod.parseWithZod }));
  }, []);
  return useMemo(
    () => ({
      validate(formData: FormData, schemaOf: (schemas: StepSchemas) => ReturnType<StepSchemas["stepSchema"]>): Submission<Record<string, unknown>, string[]> {
        if (loaded) return loaded.parseWithZod(formData, { schema: schemaOf(loaded.schemas) });
        return parse(formData, {
          resolve: (value, intent) => {
            if (intent?.type === "validate" && intent.payload.name) waiting.add(intent.payload.name);
            return { value };
          },
        });
      },
      whenLoaded(validate: (name: string) => void) {
        if (!loaded) return;
        for (const name of waiting) validate(name);
        waiting.clear();
      },
    }),
    [loaded, waiting],
  );
}

/**
 * Asks before a half-filled step is left: a link inside the app is held with a question
 * (useBlocker), closing or reloading the tab gets the browser's own warning (beforeunload).
 */
function useUnsavedGuard(dirty: boolean | undefined) {
  const saving = useRef(false);
  const blocker = useBlocker(({ currentLocation, nextLocation }) => Boolean(dirty) && !saving.current && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => {
      if (saving.current) return;
      event.preventDefault();
      event.returnValue = "";
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);
  return { blocker, saving };
}

/** A fresh step shows the field's sensible default, in the person's units. */
function defaultFor(key: RequirementKey, system: UnitSystem): string | undefined {
  const f = REQUIREMENT_FIELDS[key];
  if (f.defaultValue === undefined) return undefined;
  return f.kind === "number" ? displayValue(f, f.defaultValue, system) : f.defaultValue;
}
