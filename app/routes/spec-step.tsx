import { parseWithZod } from "@conform-to/zod/v4";
import { Link, data, redirect } from "react-router";
import type { Route } from "./+types/spec-step";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { SpecProgress } from "~/components/spec-progress";
import { SpecReview } from "~/components/loaded-later";
import { SpecStepForm } from "~/components/spec-step-form";
import { Notice, PageHeader } from "~/components/ui";
import { machineInput, machineSequence, withAssumedDuty } from "~/content/machine-input";
import { axisFormValues, axisStepId, cycleAnswers } from "~/content/spec-draft";
import { findStep, nextStep, previousStep, specSteps, type FormStepKind } from "~/content/spec-steps";
import { stepContext, stepSchema, typedStepAnswers } from "~/schemas/spec";
import { fieldErrorsOf, notFound } from "~/services/errors.server";
import { redirectWithToast } from "~/auth/session.server";
import { specOfOwner } from "~/services/spec-access.server";
import { changeAxes, designOf, draftOf, isEditable, publish, saveStep, type AxisChange } from "~/services/specs.server";
import { ATTACHMENT_LIMITS, listAttachments } from "~/services/attachments.server";
import type { UnitSystem } from "~/units";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.stepTitle ?? "Spec"} · ${d?.spec.title || "New spec"} · Tenderflow` }];

async function load(request: Request, params: { specId?: string; step?: string }) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await specOfOwner(user, params.specId);
  const { draft, completed } = draftOf(spec);
  const steps = specSteps(draft.axes);
  // The motion step of the form before machines is the first axis's (an old bookmark or tab).
  const stepId = params.step === "motion" ? axisStepId(draft.axes[0].id, "motion") : params.step;
  const step = findStep(steps, stepId);
  // A step of an axis removed meanwhile (e.g. in another tab): back to the list of axes, saying so.
  if (!step && /^[a-z0-9]{6}-(mounting|motion)$/.test(params.step ?? ""))
    throw await redirectWithToast(
      request,
      `/specs/${spec.id}/edit/machine#axes`,
      "That axis is no longer in this spec, perhaps removed in another tab; nothing from its page was saved.",
    );
  if (!step) notFound("No such step.");
  return { user, spec, draft, completed, steps, step };
}

/** What a step's form starts from: the stored answers of that step (the cycle with its defaults filled in). */
function stepAnswersOf(draft: ReturnType<typeof draftOf>["draft"], kind: FormStepKind, axisId: string | undefined): Record<string, string> {
  const axis = draft.axes.find((a) => a.id === axisId);
  if (kind === "mounting") return axis?.mounting ?? {};
  if (kind === "motion") return axis?.motion ?? {};
  if (kind === "machine") return { ...draft.machine, ...Object.fromEntries(draft.axes.map((a) => [`name-${a.id}`, a.name])) };
  if (kind === "cycle") return cycleAnswers(draft);
  return draft[kind];
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const { user, spec, draft, completed, steps, step } = await load(request, params);
  if (!isEditable(spec)) throw redirect(`/specs/${spec.id}`);
  if (step.id !== params.step) throw redirect(`/specs/${spec.id}/edit/${step.id}`);
  const kind = step.kind;
  const sized = kind === "review" ? designOf(spec) : null;
  // The cycle step sizes the machine in the browser as the buyer chooses; here its axes and duty.
  const assumed = kind === "cycle" ? withAssumedDuty(draft, spec.unitSystem as UnitSystem) : null;
  const machineBase = assumed ? { input: machineInput(assumed.draft, spec.unitSystem as UnitSystem, { withSequence: false }), assumed: assumed.assumed } : null;
  const attachments = kind === "quotation" || kind === "review" ? await listAttachments(user, spec.id) : [];
  const axis = step.axis ? draft.axes.find((a) => a.id === step.axis!.id) : undefined;
  return {
    spec: {
      id: spec.id,
      title: spec.title,
      revising: spec.revising,
      nextRevision: spec.currentRevision + 1,
      unitSystem: spec.unitSystem as UnitSystem,
      completedSteps: completed,
    },
    step,
    steps,
    stepTitle: step.axis ? `${step.axis.name}: ${step.title}` : step.title,
    axes: draft.axes.map((a) => ({ id: a.id, name: a.name })),
    context: kind === "review" ? null : stepContext(draft, kind, step.axis?.id),
    stepAnswers: kind === "review" ? {} : stepAnswersOf(draft, kind, step.axis?.id),
    /** the axis's answers with the duty, for its live preview */
    axisValues: axis ? axisFormValues(draft, axis) : null,
    draft: kind === "review" ? draft : null,
    sequence: draft.axes.length > 1 ? machineSequence(draft) : null,
    review: sized,
    machineBase,
    attachments,
    attachmentLimits: ATTACHMENT_LIMITS,
  };
}

/** An axis button of the machine step: `add`, or `duplicate:<id>`, `remove:<id>`, `up:<id>`, `down:<id>`. */
function axisChangeOf(intent: unknown): AxisChange | null {
  if (intent === "add") return { op: "add" };
  const match = typeof intent === "string" ? /^(duplicate|remove|up|down):([a-z0-9]{6})$/.exec(intent) : null;
  return match ? { op: match[1] as "duplicate" | "remove" | "up" | "down", axisId: match[2] } : null;
}

export async function action({ request, params }: Route.ActionArgs) {
  const { user, spec, draft, steps, step } = await load(request, params);
  const formData = await request.formData();
  const intent = formData.get("intent");

  if (step.kind === "review") {
    try {
      await publish(user, spec.id, { cautionsRead: formData.get("cautionsRead") === "on" });
    } catch (error) {
      return data({ publishError: fieldErrorsOf(error).message, result: null }, { status: 400 });
    }
    return redirect(`/specs/${spec.id}?published=1`);
  }

  const kind = step.kind;
  const context = stepContext(draft, kind, step.axis?.id);
  // A second tab opened before an axis was added posts no answer for it: that axis keeps what is stored.
  if (kind === "machine" || kind === "cycle") {
    for (const [name, value] of Object.entries(stepAnswersOf(draft, kind, undefined)))
      if (!formData.has(name) && name !== "title" && name !== "purpose") formData.set(name, value);
  }
  const submission = parseWithZod(formData, { schema: stepSchema(kind, spec.unitSystem, context) });
  const { typed, tooLongErrors } = typedStepAnswers(kind, formData, context);
  const refused = () =>
    data(
      {
        result: submission.reply({ fieldErrors: { ...(submission.status === "error" ? submission.error : {}), ...tooLongErrors } as Record<string, string[]> }),
        publishError: null,
      },
      { status: 400 },
    );
  // Going back, or changing the axes, never loses what was typed (the step stays incomplete until
  // it validates), but an answer longer than its field takes is refused on every path.
  const change = kind === "machine" ? axisChangeOf(intent) : null;
  const back = intent === "back";
  if (Object.keys(tooLongErrors).length || (!back && !change && submission.status !== "success")) return refused();
  try {
    if (change) {
      // The list is shown again, so a new axis is named where it appears.
      await changeAxes(user, spec.id, { change, machine: typed, complete: submission.status === "success" });
      return redirect(`/specs/${spec.id}/edit/machine#axes`);
    }
    await saveStep(user, spec.id, { step: step.id, answers: typed, complete: submission.status === "success" });
  } catch (error) {
    const message = fieldErrorsOf(error).message;
    // An axis change the machine cannot take (a ninth axis, the last one removed): said on the step.
    if (change && isEditable(await specOfOwner(user, spec.id))) return redirectWithToast(request, `/specs/${spec.id}/edit/machine#axes`, message);
    // Published meanwhile, e.g. from another tab: the step is not saved over the published spec.
    return redirectWithToast(request, `/specs/${spec.id}`, `${message} Nothing from this step was saved.`);
  }
  return redirect(`/specs/${spec.id}/edit/${(back ? previousStep(steps, step.id) : nextStep(steps, step.id)) ?? step.id}`);
}

export default function SpecStep({ loaderData, actionData }: Route.ComponentProps) {
  const { spec, step } = loaderData;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/specs" className="text-flow-700 hover:underline">
          ← My specs
        </Link>
      </p>
      <PageHeader title={spec.title || "New spec"} lead={`${step.title}: ${step.lead}`} />
      {spec.revising ? (
        <div className="mb-4">
          <Notice tone="warn">You are preparing revision {spec.nextRevision}. Shops keep seeing the published revision until you publish this one.</Notice>
        </div>
      ) : null}
      <SpecProgress specId={spec.id} steps={loaderData.steps} current={step.id} completed={spec.completedSteps} axes={loaderData.axes} />
      {step.kind === "review" || !loaderData.context ? (
        <SpecReview
          spec={spec}
          draft={loaderData.draft!}
          sequence={loaderData.sequence}
          steps={loaderData.steps}
          published={loaderData.review?.published ?? null}
          problems={loaderData.review?.problems ?? []}
          attachments={loaderData.attachments}
          publishError={actionData?.publishError ?? null}
        />
      ) : (
        <SpecStepForm
          // A new form where the stored answers changed (an axis added, moved or renamed by a button).
          key={`${step.id} ${JSON.stringify(loaderData.stepAnswers)}`}
          specId={spec.id}
          step={step}
          previous={previousStep(loaderData.steps, step.id)}
          system={spec.unitSystem}
          context={loaderData.context}
          stepAnswers={loaderData.stepAnswers}
          axisValues={loaderData.axisValues}
          machineBase={loaderData.machineBase}
          attachments={loaderData.attachments}
          attachmentLimits={loaderData.attachmentLimits}
          lastResult={actionData?.result ?? null}
        />
      )}
    </>
  );
}
