import { redirect } from "react-router";
import type { Route } from "./+types/spec-new";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { createDraft } from "~/services/specs.server";

export function loader() {
  return redirect("/specs");
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const spec = await createDraft(user);
  return redirect(`/specs/${spec.id}/edit/machine`);
}
