import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useMemo } from "react";
import { Form, Link, data, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/spec-step";
import { requireRole } from "~/auth/permissions.server";
import { CircuitDiagram } from "~/components/circuit-diagram";
import { CautionsPanel, KeySizes } from "~/components/design-panels";
import { DesignReport } from "~/components/design-report";
import { RequirementInput } from "~/components/requirement-input";
import { SpecProgress } from "~/components/spec-progress";
import { Button, Card, Notice, PageHeader } from "~/components/ui";
import { useLiveSizing } from "~/components/use-live-sizing";
import { EXAMPLE_AXIS, REQUIREMENT_FIELDS, answerInWords, differsFromDefault, displayValue, fieldApplies, toFormValues, fieldMessages, toRequirementsInput, type FormValues, type RequirementKey } from "~/content/requirement-fields";
import { AXIS_QUESTIONS, ENGINE_KEYS_BY_STEP, SPEC_STEPS, isSpecStep, nextStep, previousStep, type FormStepId } from "~/content/spec-steps";
import { MoreQuestions } from "~/components/more-questions";
import { FLUIDS, SUPPLY_VOLTAGES, stepFieldNames, stepSchema, typedStepAnswers } from "~/schemas/spec";
import { FieldErrors, notFound } from "~/services/errors.server";
import { redirectWithToast } from "~/auth/session.server";
import { specOfOwner } from "~/services/spec-access.server";
import { allAnswers, designOf, isEditable, publish, saveStep } from "~/services/specs.server";
import { ATTACHMENT_LIMITS, listAttachments } from "~/services/attachments.server";
import { AttachmentUploader, formatBytes } from "~/components/attachment-uploader";
import { UNIT_SYSTEM_LABELS, type UnitSystem } from "~/units";
import { CURRENCIES } from "~/content/currencies";
import { formatDay, isIsoDay } from "~/content/dates";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.stepTitle ?? "Spec"} · ${d?.spec.title || "New spec"} · Tenderflow` }];

function othersOf(answers: FormValues, step: FormStepId): FormValues {
  const mine = new Set(stepFieldNames(step));
  return Object.fromEntries(Object.entries(answers).filter(([k]) => !mine.has(k)));
}

async function load(request: Request, params: { specId?: string; step?: string }) {
  const user = await requireRole(request, ["buyer"]);
  const spec = await specOfOwner(user, params.specId);
  if (!isSpecStep(params.step)) notFound("No such step.");
  return { user, spec, step: params.step };
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, spec, step } = await load(request, params);
  if (!isEditable(spec)) throw redirect(`/specs/${spec.id}`);
  const answers = allAnswers(spec);
  const review = step === "review" ? designOf(spec) : null;
  const attachments = step === "quotation" || step === "review" ? await listAttachments(user, spec.id) : [];
  return {
    spec: { id: spec.id, title: spec.title, revising: spec.revising, nextRevision: spec.currentRevision + 1, unitSystem: spec.unitSystem as UnitSystem, completedSteps: spec.completedSteps as string[] },
    step,
    stepTitle: SPEC_STEPS.find((s) => s.id === step)!.title,
    answers,
    stepAnswers: step === "review" ? {} : (spec.answers[step] ?? {}),
    review,
    attachments,
    attachmentLimits: ATTACHMENT_LIMITS,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, spec, step } = await load(request, params);
  const formData = await request.formData();
  const intent = formData.get("intent");

  if (step === "review") {
    try {
      await publish(spec, user, formData.get("cautionsRead") === "on");
    } catch (error) {
      if (!(error instanceof FieldErrors)) throw error;
      return data({ publishError: error.message, result: null }, { status: 400 });
    }
    return redirect(`/specs/${spec.id}?published=1`);
  }

  const others = othersOf(allAnswers(spec), step);
  const submission = parseWithZod(formData, { schema: stepSchema(step, spec.unitSystem, others) });
  const { typed, tooLongErrors } = typedStepAnswers(step, formData, others);
  // Going back never loses what was typed (the step stays incomplete until it validates), but
  // an answer longer than its field takes is refused on this path too.
  const back = intent === "back";
  if (Object.keys(tooLongErrors).length || (!back && submission.status !== "success")) {
    return data({ result: submission.reply({ fieldErrors: { ...(submission.status === "error" ? submission.error : {}), ...tooLongErrors } as Record<string, string[]> }), publishError: null }, { status: 400 });
  }
  try {
    await saveStep(spec, step, typed, submission.status === "success");
  } catch (error) {
    if (!(error instanceof FieldErrors)) throw error;
    // Published meanwhile, e.g. from another tab: the step is not saved over the published spec.
    return redirectWithToast(request, `/specs/${spec.id}`, `${error.message} Nothing from this step was saved.`);
  }
  return redirect(`/specs/${spec.id}/edit/${(back ? previousStep(step) : nextStep(step)) ?? step}`);
}

export default function SpecStep({ loaderData, actionData }: Route.ComponentProps) {
  const { spec, step } = loaderData;
  const meta = SPEC_STEPS.find((s) => s.id === step)!;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/specs" className="text-flow-700 hover:underline">
          ← My specs
        </Link>
      </p>
      <PageHeader title={spec.title || "New spec"} lead={`${meta.title}: ${meta.lead}`} />
      {spec.revising ? (
        <div className="mb-4">
          <Notice tone="warn">You are preparing revision {spec.nextRevision}. Shops keep seeing the published revision until you publish this one.</Notice>
        </div>
      ) : null}
      <SpecProgress specId={spec.id} current={step} completed={spec.completedSteps} />
      {step === "review" ? (
        <Review loaderData={loaderData} publishError={actionData?.publishError ?? null} />
      ) : (
        <StepForm key={step} loaderData={loaderData} lastResult={actionData?.result ?? null} />
      )}
    </>
  );
}

type LoaderData = Route.ComponentProps["loaderData"];

function StepForm({ loaderData, lastResult }: { loaderData: LoaderData; lastResult: Parameters<typeof useForm>[0]["lastResult"] }) {
  const step = loaderData.step as FormStepId;
  const { spec, answers, stepAnswers } = loaderData;
  const system = spec.unitSystem;
  const navigation = useNavigation();
  const others = useMemo(() => othersOf(answers, step), [answers, step]);
  const [form, fields] = useForm({
    lastResult,
    defaultValue: stepAnswers,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: stepSchema(step, system, others) }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const current = { ...others, ...(form.value as FormValues | undefined) } as FormValues;
  const field = (name: string) => (fields as unknown as Record<string, { errors?: string[] }>)[name];
  const deciding = { orientation: current.orientation ?? others.orientation, pressStrokeMm: current.pressStrokeMm };
  const questions = step === "quotation" ? undefined : AXIS_QUESTIONS[step];
  const asked = (keys: RequirementKey[] | undefined) => (keys ?? []).filter((k) => fieldApplies(k, deciding));
  const question = (key: RequirementKey) => (
    <RequirementInput
      key={key}
      field={REQUIREMENT_FIELDS[key]}
      value={stepAnswers[key] ?? defaultFor(key, system)}
      system={system}
      errors={fieldMessages(key, field(key)?.errors, system)}
    />
  );

  return (
    <div className={step === "motion" ? "grid gap-6 lg:grid-cols-[1fr_26rem]" : "max-w-2xl"}>
      <div>
      <Form method="post" {...getFormProps(form)} className="space-y-5">
        <Card className="space-y-5">
          {step === "machine" ? (
            <>
              <TextInput name="title" label="Title" help="A short name shops will see, e.g. “Bending press, main ram”." defaultValue={stepAnswers.title} errors={field("title")?.errors} />
              <TextArea name="purpose" label="What the machine does" help="A sentence or two: what the axis moves and why. Optional, but it helps shops." defaultValue={stepAnswers.purpose} errors={field("purpose")?.errors} />
            </>
          ) : null}
          {asked(questions?.keys).map(question)}
          {questions?.more ? (
            <MoreQuestions
              title={questions.more.title}
              summary={questions.more.summary}
              startOpen={differsFromDefault(questions.more.keys, stepAnswers, system)}
              attention={questions.more.keys.some((k) => field(k)?.errors?.length)}
            >
              {asked(questions.more.keys).map(question)}
            </MoreQuestions>
          ) : null}
          {step === "duty" ? (
            <>
              <Choice name="supplyVoltage" label="Mains voltage" help="The supply at the machine; the motor is quoted for it." options={SUPPLY_VOLTAGES} defaultValue={stepAnswers.supplyVoltage ?? "400 V three-phase"} errors={field("supplyVoltage")?.errors} />
              <Choice name="fluid" label="Hydraulic fluid" help="Mineral oil grade by ISO 3448. ISO VG 46 suits most indoor machines." options={FLUIDS} defaultValue={stepAnswers.fluid ?? "ISO VG 46"} errors={field("fluid")?.errors} />
            </>
          ) : null}
          {step === "quotation" ? <QuotationFields answers={stepAnswers} field={field} /> : null}
          <p className="text-xs text-ink-600">
            Values in {UNIT_SYSTEM_LABELS[system]}. <Link to="/settings" className="text-flow-700 hover:underline">Change your units</Link> for new specs.
          </p>
        </Card>
      </Form>
      {step === "quotation" ? (
        // A form of its own (forms cannot nest); the step's buttons below reach their form by id.
        <Card className="mt-6">
          <AttachmentUploader specId={spec.id} attachments={loaderData.attachments} limits={loaderData.attachmentLimits} />
        </Card>
      ) : null}
      <div className="mt-5 flex justify-between">
        {previousStep(step) ? (
          <Button type="submit" form={form.id} name="intent" value="back" tone="secondary" formNoValidate>
            ← Back
          </Button>
        ) : (
          <span />
        )}
        <Button type="submit" form={form.id} name="intent" value="next" disabled={navigation.state === "submitting"}>
          Save and continue →
        </Button>
      </div>
      </div>
      {step === "motion" ? <LivePreview values={current} system={system} /> : null}
    </div>
  );
}

/** A fresh step shows the field's sensible default, in the person's units. */
function defaultFor(key: RequirementKey, system: UnitSystem): string | undefined {
  const f = REQUIREMENT_FIELDS[key];
  if (f.defaultValue === undefined) return undefined;
  return f.kind === "number" ? displayValue(f, f.defaultValue, system) : f.defaultValue;
}

/** An assumed value after its label: units where the label does not already name them ("cycles per hour 60"). */
function assumedValue(key: RequirementKey, value: string | undefined, system: UnitSystem) {
  const f = REQUIREMENT_FIELDS[key];
  return f.kind === "number" && !f.quantity ? (value ?? "") : answerInWords(key, value, system);
}

/** Later steps not answered yet are taken from the example axis, and the preview says so. */
const PREVIEW_FALLBACK_KEYS = ENGINE_KEYS_BY_STEP.duty.filter((k) => k in EXAMPLE_AXIS);

function LivePreview({ values, system }: { values: FormValues; system: UnitSystem }) {
  const fallback = useMemo(() => toFormValues(EXAMPLE_AXIS, system), [system]);
  const assumed = PREVIEW_FALLBACK_KEYS.filter((k) => !values[k]);
  const input = useMemo(() => {
    const filled = { ...values };
    for (const k of PREVIEW_FALLBACK_KEYS) if (!filled[k]) filled[k] = fallback[k];
    return toRequirementsInput(filled, system);
  }, [values, system, fallback]);
  const live = useLiveSizing(input, { design: null, fieldErrors: {} }, 400);
  return (
    <aside aria-label="Live preview" aria-live="polite" className="space-y-4 lg:sticky lg:top-4 lg:self-start">
      <Card className="!p-4">
        <h2 className="mb-2 font-semibold">Preliminary circuit</h2>
        {live.design ? (
          <>
            <CircuitDiagram design={live.design} units={system} />
            <div className="mt-3">
              <KeySizes design={live.design} units={system} />
            </div>
            {assumed.length ? (
              <p className="mt-2 text-xs text-ink-600">
                Until you answer the duty step, the preview assumes {assumed.map((k) => `${REQUIREMENT_FIELDS[k].label.toLowerCase()} ${assumedValue(k, fallback[k], system)}`).join(", ")}.
              </p>
            ) : null}
          </>
        ) : (
          <p className="text-sm text-ink-600">
            {live.status === "sizing" ? "Sizing…" : "Fill in the load, stroke and speeds and the circuit appears here."}
          </p>
        )}
      </Card>
    </aside>
  );
}

function QuotationFields({ answers, field }: { answers: Record<string, string>; field: (n: string) => { errors?: string[] } | undefined }) {
  return (
    <>
      <TextInput name="unitsWanted" label="Units wanted" help="How many identical axes shops should quote for." inputMode="numeric" defaultValue={answers.unitsWanted ?? "1"} errors={field("unitsWanted")?.errors} />
      <TextInput name="bidDeadline" label="Bid deadline" help="The last day shops can bid. Example: three weeks from today." type="date" defaultValue={answers.bidDeadline} errors={field("bidDeadline")?.errors} />
      <TextInput name="dateNeeded" label="Date needed" help="When the units must be delivered." type="date" defaultValue={answers.dateNeeded} errors={field("dateNeeded")?.errors} />
      <TextInput name="deliveryRegion" label="Delivery region" help="Where the units go, e.g. “UK — West Midlands”." defaultValue={answers.deliveryRegion} errors={field("deliveryRegion")?.errors} />
      <Choice name="currency" label="Currency of the bids" help="Every shop prices its bid in this currency, so bids compare directly." options={CURRENCIES} defaultValue={answers.currency ?? "EUR"} errors={field("currency")?.errors} />
      <TextInput name="retainerPercent" label="Retainer for the chosen shop (%)" help="The share of the awarded price you pay up front by card when you award. 20 % is usual." inputMode="decimal" defaultValue={answers.retainerPercent ?? "20"} errors={field("retainerPercent")?.errors} />
      <TextArea name="notes" label="Notes for the shops" help="Anything else: paint, standards your plant follows, access for installation. Optional." defaultValue={answers.notes} errors={field("notes")?.errors} />
    </>
  );
}

function Review({ loaderData, publishError }: { loaderData: LoaderData; publishError: string | null }) {
  const { spec, answers, review } = loaderData;
  const navigation = useNavigation();
  const design = review?.design ?? null;
  const incomplete = SPEC_STEPS.filter((s) => s.id !== "review" && !spec.completedSteps.includes(s.id));
  return (
    <div className="space-y-6">
      {publishError ? <Notice tone="bad">{publishError}</Notice> : null}
      {incomplete.length ? (
        <Notice tone="warn">
          Still to complete:{" "}
          {incomplete.map((s, i) => (
            <span key={s.id}>
              {i ? ", " : ""}
              <Link className="font-semibold underline" to={`/specs/${spec.id}/edit/${s.id}`}>{s.title}</Link>
            </span>
          ))}
          .
        </Notice>
      ) : null}
      {design ? <DesignReport design={design} units={spec.unitSystem} componentsTitle="Components shops will price" cautions={false} /> : null}
      <Card>
        <h2 className="mb-3 font-semibold">Your answers</h2>
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[16rem_1fr_auto]">
          {SPEC_STEPS.filter((s) => s.id !== "review").flatMap((s) =>
            stepFieldNames(s.id as FormStepId)
              .map((name) => ({ name, ...shownAnswer(name, answers, spec.unitSystem) }))
              .filter((a) => a.value)
              .map(({ name, label, value }) => (
                <div key={name} className="contents">
                  <dt className="text-ink-600">{label}</dt>
                  <dd className="font-semibold">{value}</dd>
                  <dd>
                    <Link className="text-flow-700 hover:underline" to={`/specs/${spec.id}/edit/${s.id}`} aria-label={`Change ${label.toLowerCase()}`}>
                      Change
                    </Link>
                  </dd>
                </div>
              )),
          )}
        </dl>
      </Card>
      <Card>
        <h2 className="mb-3 font-semibold">Drawings and photos</h2>
        {loaderData.attachments.length ? (
          <ul className="text-sm">
            {loaderData.attachments.map((a) => (
              <li key={a.id}>
                <a className="text-flow-700 hover:underline" href={a.downloadUrl}>{a.fileName}</a> · {a.kindLabel} · {formatBytes(a.sizeBytes)}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-600">None attached. <Link className="text-flow-700 hover:underline" to={`/specs/${spec.id}/edit/quotation`}>Add drawings or photos</Link></p>
        )}
      </Card>
      <CautionsPanel />
      <Form method="post" className="space-y-4">
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" name="cautionsRead" className="mt-1 accent-flow-600" required />
          <span>I have read the cautions above and understand that this circuit is a preliminary design for quotation.</span>
        </label>
        <Button type="submit" name="intent" value="publish" disabled={!design || incomplete.length > 0 || navigation.state === "submitting"}>
          {spec.revising ? `Publish revision ${spec.nextRevision}` : "Publish for bids"}
        </Button>
      </Form>
    </div>
  );
}

const LABELS: Record<string, string> = {
  title: "Title",
  purpose: "What the machine does",
  supplyVoltage: "Mains voltage",
  fluid: "Hydraulic fluid",
  unitsWanted: "Units wanted",
  bidDeadline: "Bid deadline",
  dateNeeded: "Date needed",
  deliveryRegion: "Delivery region",
  currency: "Currency",
  retainerPercent: "Retainer",
  notes: "Notes",
};

/** One answer of the review in words: a choice by its label, a number with its unit. */
function shownAnswer(name: string, answers: FormValues & Record<string, string | undefined>, system: UnitSystem): { label: string; value: string | null } {
  if (name in REQUIREMENT_FIELDS) {
    const key = name as RequirementKey;
    return { label: REQUIREMENT_FIELDS[key].label, value: fieldApplies(key, answers) ? answerInWords(key, answers[key], system) : null };
  }
  const value = answers[name]?.trim();
  if (!value) return { label: LABELS[name] ?? name, value: null };
  if ((name === "bidDeadline" || name === "dateNeeded") && isIsoDay(value)) return { label: LABELS[name], value: formatDay(value) };
  return { label: LABELS[name] ?? name, value: name === "retainerPercent" ? `${value} %` : value };
}

const inputClass =
  "mt-1 block w-full rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600";

function Help({ id, help, errors }: { id: string; help: string; errors?: string[] }) {
  return (
    <>
      <p id={`${id}-help`} className="text-xs text-ink-600">
        {help}
      </p>
      {errors?.length ? (
        <p id={`${id}-error`} className="mt-1 text-xs font-semibold text-alarm-600">
          {errors.join(" ")}
        </p>
      ) : null}
    </>
  );
}

function TextInput({ name, label, help, errors, ...rest }: { name: string; label: string; help: string; errors?: string[] } & React.InputHTMLAttributes<HTMLInputElement>) {
  const id = `spec-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">{label}</label>
      <Help id={id} help={help} errors={errors} />
      <input id={id} name={name} aria-invalid={errors?.length ? true : undefined} aria-describedby={`${id}-help${errors?.length ? ` ${id}-error` : ""}`} className={inputClass} {...rest} />
    </div>
  );
}

function TextArea({ name, label, help, errors, defaultValue }: { name: string; label: string; help: string; errors?: string[]; defaultValue?: string }) {
  const id = `spec-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">{label}</label>
      <Help id={id} help={help} errors={errors} />
      <textarea id={id} name={name} rows={3} defaultValue={defaultValue} aria-invalid={errors?.length ? true : undefined} aria-describedby={`${id}-help${errors?.length ? ` ${id}-error` : ""}`} className={inputClass} />
    </div>
  );
}

function Choice({ name, label, help, options, defaultValue, errors }: { name: string; label: string; help: string; options: readonly string[]; defaultValue?: string; errors?: string[] }) {
  const id = `spec-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">{label}</label>
      <Help id={id} help={help} errors={errors} />
      <select id={id} name={name} defaultValue={defaultValue} aria-invalid={errors?.length ? true : undefined} aria-describedby={`${id}-help`} className={inputClass}>
        {options.map((o) => (
          <option key={o} value={o}>{o}</option>
        ))}
      </select>
    </div>
  );
}
