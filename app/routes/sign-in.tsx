import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useNavigation, useSearchParams } from "react-router";
import type { Route } from "./+types/sign-in";
import { authenticator } from "~/auth/authenticator.server";
import { requireAnonymous, safeRedirect } from "~/auth/permissions.server";
import { HOME_BY_ROLE } from "~/auth/roles";
import { signInRedirect } from "~/auth/session.server";
import { AuthCard } from "~/components/auth-card";
import { FormErrors, TextField } from "~/components/form-field";
import { Button } from "~/components/ui";
import { signInSchema } from "~/schemas/account";
import { SignInError } from "~/services/accounts.server";
import { recordAudit } from "~/services/audit.server";
import { Throttled, clientOf, throttledPasswordCheck } from "~/services/throttle.server";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireAnonymous(request);
  return null;
}

// Wrong passwords are counted per account and per client (throttle.server.ts); while blocked,
// no password is even compared.
const signInThrottled = (args: Route.ActionArgs, email: string) =>
  throttledPasswordCheck(clientOf(args), email, () =>
    authenticator.authenticate("form", args.request).catch((error) => {
      if (error instanceof SignInError && error.reason === "invalid") return null;
      throw error;
    }),
  );

export async function action(args: Route.ActionArgs) {
  const { request } = args;
  const submission = parseWithZod(await request.clone().formData(), { schema: signInSchema });
  if (submission.status !== "success") {
    return data(submission.reply({ hideFields: ["password"] }), { status: 400 });
  }
  try {
    const user = await signInThrottled(args, submission.value.email);
    if (!user) throw new SignInError("invalid");
    return signInRedirect(request, user.id, safeRedirect(submission.value.redirectTo, HOME_BY_ROLE[user.role]));
  } catch (error) {
    if (error instanceof Throttled) {
      // Refused before any password is compared, yet an attempt the admins should see like any failed one.
      await recordAudit({ actor: { typedEmail: submission.value.email }, action: "sign-in-failed", details: { reason: "throttled" } });
      const headers = { "Retry-After": String(error.retryAfterS) };
      return data(submission.reply({ formErrors: [error.message], hideFields: ["password"] }), { status: 429, headers });
    }
    if (!(error instanceof SignInError)) throw error;
    return data(submission.reply({ formErrors: [error.message], hideFields: ["password"] }), { status: 400 });
  }
}

export default function SignIn({ actionData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: actionData,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: signInSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  return (
    <AuthCard title="Sign in" lead="Welcome back to Tenderflow.">
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <FormErrors id={form.errorId} errors={form.errors} />
        <input type="hidden" name="redirectTo" value={searchParams.get("redirectTo") ?? ""} />
        <TextField meta={fields.email} label="E-mail address" type="email" autoComplete="email" />
        <TextField meta={fields.password} label="Password" type="password" autoComplete="current-password" />
        <Button type="submit" className="w-full" disabled={navigation.state === "submitting"}>
          {navigation.state === "submitting" ? "Signing in…" : "Sign in"}
        </Button>
      </Form>
      <div className="mt-4 flex justify-between text-sm">
        <Link to="/forgot-password" className="text-flow-700 hover:underline">
          Forgot your password?
        </Link>
        <Link to="/sign-up" className="text-flow-700 hover:underline">
          New here? Create an account
        </Link>
      </div>
    </AuthCard>
  );
}
