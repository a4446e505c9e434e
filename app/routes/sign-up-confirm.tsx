import { Form, Link, data, useNavigation } from "react-router";
import type { Route } from "./+types/sign-up-confirm";
import { HOME_BY_ROLE, KIND_LABELS } from "~/auth/roles";
import { signInRedirect } from "~/auth/session.server";
import { AuthCard } from "~/components/auth-card";
import { FormErrors } from "~/components/form-field";
import { Button, Notice } from "~/components/ui";
import { fieldErrorsOf } from "~/services/errors.server";
import { completeSignUp, findUsableSignUp } from "~/services/sign-up.server";

export const meta: Route.MetaFunction = () => [{ title: "Finish creating your account · Tenderflow" }];

// Opening the link only shows the page (mail scanners open links too); the button makes the account.
export async function loader({ params }: Route.LoaderArgs) {
  const pending = await findUsableSignUp(params.token);
  if (!pending) return { pending: null };
  return { pending: { email: pending.email, name: pending.name, organisationName: pending.organisationName, kind: pending.kind } };
}

export async function action({ request, params }: Route.ActionArgs) {
  try {
    const user = await completeSignUp(params.token);
    return signInRedirect(request, user.id, HOME_BY_ROLE[user.role]);
  } catch (error) {
    return data({ errors: Object.values(fieldErrorsOf(error).fieldErrors).flat() }, { status: 400 });
  }
}

export default function SignUpConfirm({ loaderData, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const { pending } = loaderData;
  if (!pending) {
    return (
      <AuthCard title="This link no longer works">
        <Notice tone="warn">Sign-up links work once and expire after 24 hours.</Notice>
        <p className="mt-4 flex justify-between text-sm">
          <Link to="/sign-up" className="font-semibold text-flow-700 hover:underline">
            Sign up again
          </Link>
          <Link to="/sign-in" className="font-semibold text-flow-700 hover:underline">
            Sign in
          </Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Finish creating your account" lead={`${pending.organisationName}, ${KIND_LABELS[pending.kind].toLowerCase()}`}>
      <Form method="post" className="space-y-4">
        <FormErrors id="sign-up-confirm-errors" errors={actionData?.errors} />
        <p className="text-sm text-ink-700">
          You are signing up as {pending.name} with {pending.email}. You will sign in with the password you chose.
        </p>
        <Button type="submit" className="w-full" disabled={navigation.state === "submitting"}>
          {navigation.state === "submitting" ? "Creating your account…" : "Create my account"}
        </Button>
      </Form>
    </AuthCard>
  );
}
