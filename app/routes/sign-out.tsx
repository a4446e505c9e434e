import { redirect } from "react-router";
import type { Route } from "./+types/sign-out";
import { signOutRedirect } from "~/auth/session.server";

// Signing out is a POST (a link crawler must not sign anyone out); a GET just goes home.
export async function loader() {
  return redirect("/");
}

export async function action({ request }: Route.ActionArgs) {
  return signOutRedirect(request, "/sign-in");
}
