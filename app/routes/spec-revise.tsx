import { redirect } from "react-router";
import type { Route } from "./+types/spec-revise";
import { requireRole } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { FieldErrors } from "~/services/errors.server";
import { specOfOwner } from "~/services/spec-access.server";
import { startRevision } from "~/services/specs.server";

export function loader() {
  return redirect("/specs");
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, ["buyer"]);
  const spec = await specOfOwner(user, params.specId);
  try {
    await startRevision(spec);
  } catch (error) {
    if (!(error instanceof FieldErrors)) throw error;
    return redirectWithToast(request, `/specs/${spec.id}`, error.message);
  }
  return redirect(`/specs/${spec.id}/edit/machine`);
}
