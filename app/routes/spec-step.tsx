import { parseWithZod } from "@conform-to/zod/v4";
import { Link, data, redirect } from "react-router";
import type { Route } from "./+types/spec-step";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { SpecProgress } from "~/components/spec-progress";
import { SpecReview } from "~/components/spec-review";
import { SpecStepForm } from "~/components/spec-step-form";
import { Notice, PageHeader } from "~/components/ui";
import { SPEC_STEPS, isSpecStep, nextStep, previousStep, type FormStepId } from "~/content/spec-steps";
import { otherStepsAnswers, stepSchema, typedStepAnswers } from "~/schemas/spec";
import { fieldErrorsOf, notFound } from "~/services/errors.server";
import { redirectWithToast } from "~/auth/session.server";
import { specOfOwner } from "~/services/spec-access.server";
import { allAnswers, designOf, isEditable, publish, saveStep } from "~/services/specs.server";
import { ATTACHMENT_LIMITS, listAttachments } from "~/services/attachments.server";
import type { UnitSystem } from "~/units";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.stepTitle ?? "Spec"} · ${d?.spec.title || "New spec"} · Tenderflow` }];

async function load(request: Request, params: { specId?: string; step?: string }) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
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
    spec: {
      id: spec.id,
      title: spec.title,
      revising: spec.revising,
      nextRevision: spec.currentRevision + 1,
      unitSystem: spec.unitSystem as UnitSystem,
      completedSteps: spec.completedSteps as string[],
    },
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
      await publish(user, spec.id, { cautionsRead: formData.get("cautionsRead") === "on" });
    } catch (error) {
      return data({ publishError: fieldErrorsOf(error).message, result: null }, { status: 400 });
    }
    return redirect(`/specs/${spec.id}?published=1`);
  }

  const others = otherStepsAnswers(allAnswers(spec), step);
  const submission = parseWithZod(formData, { schema: stepSchema(step, spec.unitSystem, others) });
  const { typed, tooLongErrors } = typedStepAnswers(step, formData, others);
  // Going back never loses what was typed (the step stays incomplete until it validates), but
  // an answer longer than its field takes is refused on this path too.
  const back = intent === "back";
  if (Object.keys(tooLongErrors).length || (!back && submission.status !== "success")) {
    return data(
      {
        result: submission.reply({ fieldErrors: { ...(submission.status === "error" ? submission.error : {}), ...tooLongErrors } as Record<string, string[]> }),
        publishError: null,
      },
      { status: 400 },
    );
  }
  try {
    await saveStep(user, spec.id, { step, answers: typed, complete: submission.status === "success" });
  } catch (error) {
    // Published meanwhile, e.g. from another tab: the step is not saved over the published spec.
    return redirectWithToast(request, `/specs/${spec.id}`, `${fieldErrorsOf(error).message} Nothing from this step was saved.`);
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
        <SpecReview
          spec={spec}
          answers={loaderData.answers}
          design={loaderData.review?.design ?? null}
          attachments={loaderData.attachments}
          publishError={actionData?.publishError ?? null}
        />
      ) : (
        <SpecStepForm
          key={step}
          specId={spec.id}
          step={step as FormStepId}
          system={spec.unitSystem}
          answers={loaderData.answers}
          stepAnswers={loaderData.stepAnswers}
          attachments={loaderData.attachments}
          attachmentLimits={loaderData.attachmentLimits}
          lastResult={actionData?.result ?? null}
        />
      )}
    </>
  );
}
