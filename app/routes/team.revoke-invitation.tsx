import { redirect } from "react-router";
import type { Route } from "./+types/team.revoke-invitation";
import { requireRole } from "~/auth/permissions.server";
import { TEAM_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { requireId } from "~/services/errors.server";
import { revokeInvitation } from "~/services/accounts.server";

export async function loader() {
  return redirect("/team");
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, TEAM_ROLES);
  await revokeInvitation(user, requireId(params.invitationId));
  return redirectWithToast(request, "/team", "Invitation revoked.");
}
