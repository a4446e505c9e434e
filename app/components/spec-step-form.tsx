import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useEffect, useMemo, useRef } from "react";
import { Form, Link, useBlocker } from "react-router";
import { AttachmentUploader } from "~/components/attachment-uploader";
import { SelectField, SubmitButton, TextAreaField, TextField } from "~/components/form-field";
import { MoreQuestions } from "~/components/more-questions";
import { RequirementInput } from "~/components/requirement-input";
import { SpecLivePreview } from "~/components/spec-live-preview";
import { Button, Card } from "~/components/ui";
import { CURRENCIES } from "~/content/money";
import {
  REQUIREMENT_FIELDS,
  differsFromDefault,
  displayValue,
  fieldApplies,
  fieldMessages,
  type FormValues,
  type RequirementKey,
} from "~/content/requirement-fields";
import { AXIS_QUESTIONS, previousStep, type FormStepId } from "~/content/spec-steps";
import { FLUIDS, STEP_DEFAULTS, SUPPLY_VOLTAGES, TEXT_MAX, otherStepsAnswers, stepFieldNames, stepSchema } from "~/schemas/spec";
import type { AttachmentLimits, AttachmentView } from "~/services/attachments.server";
import { UNIT_SYSTEM_LABELS, type UnitSystem } from "~/units";

// One step of the spec form (machine, motion, duty, quotation): its questions, the live
// preview beside the motion step, and Back / Save and continue. What was typed survives a
// refused submission, with or without JavaScript: the fields start from the server's reply.

export interface SpecStepFormProps {
  specId: string;
  step: FormStepId;
  system: UnitSystem;
  /** every answer of the spec so far, and this step's own */
  answers: FormValues;
  stepAnswers: Record<string, string | undefined>;
  attachments: AttachmentView[];
  attachmentLimits: AttachmentLimits;
  lastResult: SubmissionResult<string[]> | null;
}

type Answers = Record<string, string | undefined>;

export function SpecStepForm({ specId, step, system, answers, stepAnswers, attachments, attachmentLimits, lastResult }: SpecStepFormProps) {
  const others = useMemo(() => otherStepsAnswers(answers, step), [answers, step]);
  const defaultValue = useMemo(() => {
    const mine = stepFieldNames(step);
    const usual = Object.fromEntries(Object.entries(STEP_DEFAULTS).filter(([k]) => mine.includes(k)));
    return { ...usual, ...stepAnswers };
  }, [step, stepAnswers]);
  const [form, fields] = useForm<Answers, Record<string, unknown>>({
    lastResult,
    defaultValue,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: stepSchema(step, system, others) }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const current = { ...others, ...(form.value as FormValues | undefined) } as FormValues;
  const leave = useUnsavedGuard(form.dirty);
  const deciding = { orientation: current.orientation ?? others.orientation, pressStrokeMm: current.pressStrokeMm };
  const questions = step === "quotation" ? undefined : AXIS_QUESTIONS[step];
  const asked = (keys: RequirementKey[] | undefined) => (keys ?? []).filter((k) => fieldApplies(k, deciding));
  const question = (key: RequirementKey) => (
    <RequirementInput
      key={key}
      field={REQUIREMENT_FIELDS[key]}
      value={(fields[key].initialValue as string | undefined) ?? defaultFor(key, system)}
      system={system}
      errors={fieldMessages(key, fields[key].errors, system)}
    />
  );

  return (
    <div className={step === "motion" ? "grid gap-6 lg:grid-cols-[1fr_26rem]" : "max-w-2xl"}>
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
          <Card className="space-y-5">
            {step === "machine" ? (
              <>
                <TextField
                  meta={fields.title}
                  label="Title"
                  hint={`A short name shops will see, e.g. “Bending press, main ram”. At most ${TEXT_MAX.title} characters.`}
                  maxLength={TEXT_MAX.title}
                />
                <TextAreaField
                  meta={fields.purpose}
                  label="What the machine does"
                  hint={`A sentence or two: what the axis moves and why. Optional, but it helps shops. At most ${TEXT_MAX.purpose} characters.`}
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
            {step === "duty" ? (
              <>
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
            {step === "quotation" ? <QuotationFields fields={fields} /> : null}
            <p className="text-xs text-ink-600">
              Values in {UNIT_SYSTEM_LABELS[system]}.{" "}
              <Link to="/settings" className="text-flow-700 hover:underline">
                Change your units
              </Link>{" "}
              for new specs.
            </p>
          </Card>
        </Form>
        {step === "quotation" ? (
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
        <div className="mt-5 flex justify-between">
          {previousStep(step) ? (
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
      {step === "motion" ? <SpecLivePreview values={current} system={system} /> : null}
    </div>
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

function QuotationFields({ fields }: { fields: ReturnType<typeof useForm<Answers, Record<string, unknown>>>[1] }) {
  return (
    <>
      <TextField meta={fields.unitsWanted} label="Units wanted" hint="How many identical axes shops should quote for." inputMode="numeric" />
      <TextField meta={fields.bidDeadline} label="Bid deadline" hint="The last day shops can bid. Example: three weeks from today." type="date" />
      <TextField meta={fields.dateNeeded} label="Date needed" hint="When the units must be delivered." type="date" />
      <TextField
        meta={fields.deliveryRegion}
        label="Delivery region"
        hint={`Where the units go, e.g. “UK — West Midlands”. At most ${TEXT_MAX.deliveryRegion} characters.`}
        maxLength={TEXT_MAX.deliveryRegion}
      />
      <SelectField
        meta={fields.currency}
        label="Currency of the bids"
        hint="Every shop prices its bid in this currency, so bids compare directly."
        options={CURRENCIES}
      />
      <TextField
        meta={fields.retainerPercent}
        label="Retainer for the chosen shop (%)"
        hint="The share of the awarded price you pay up front by card when you award. 20 % is usual."
        inputMode="decimal"
      />
      <TextAreaField
        meta={fields.notes}
        label="Notes for the shops"
        hint={`Anything else: paint, standards your plant follows, access for installation. Optional. At most ${TEXT_MAX.notes} characters.`}
        maxLength={TEXT_MAX.notes}
      />
    </>
  );
}
