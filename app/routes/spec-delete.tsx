import { redirect } from "react-router";
import type { Route } from "./+types/spec-delete";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { deleteDraft } from "~/services/specs.server";

export function loader() {
  return redirect("/specs");
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  try {
    const spec = await deleteDraft(user, params.specId);
    return redirectWithToast(request, "/specs", `Draft “${spec.title || "untitled"}” deleted.`);
  } catch (error) {
    return redirectWithToast(request, `/specs/${params.specId}`, fieldErrorsOf(error).message);
  }
}
