import { redirect } from "react-router";
import type { Route } from "./+types/spec-revise";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { startRevision } from "~/services/specs.server";

export function loader() {
  return redirect("/specs");
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  try {
    await startRevision(user, params.specId);
  } catch (error) {
    return redirectWithToast(request, `/specs/${params.specId}`, fieldErrorsOf(error).message);
  }
  return redirect(`/specs/${params.specId}/edit/machine`);
}
