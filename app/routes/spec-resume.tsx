import { redirect } from "react-router";
import type { Route } from "./+types/spec-resume";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { resumeStep, specSteps } from "~/content/spec-steps";
import { specOfOwner } from "~/services/spec-access.server";
import { draftOf, isEditable } from "~/services/specs.server";

// A draft opened again resumes at the first step not yet completed.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await specOfOwner(user, params.specId);
  if (!isEditable(spec)) return redirect(`/specs/${spec.id}`);
  const { draft, completed } = draftOf(spec);
  return redirect(`/specs/${spec.id}/edit/${resumeStep(specSteps(draft.axes), completed)}`);
}
