import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data } from "react-router";
import type { Route } from "./+types/reset-password";
import { HOME_BY_ROLE } from "~/auth/roles";
import { signInRedirect } from "~/auth/session.server";
import { AuthCard } from "~/components/auth-card";
import { FormErrors, TextField } from "~/components/form-field";
import { Button, Notice } from "~/components/ui";
import { resetPasswordSchema } from "~/schemas/account";
import { findUsableReset, resetPassword } from "~/services/accounts.server";
import { fieldErrorReply } from "~/services/errors.server";
import { clearSignInThrottle, clientOf } from "~/services/throttle.server";

export const meta: Route.MetaFunction = () => [{ title: "Choose a new password · Tenderflow" }];

export async function loader({ params }: Route.LoaderArgs) {
  return { usable: Boolean(await findUsableReset(params.token)) };
}

export async function action(args: Route.ActionArgs) {
  const { request, params } = args;
  const submission = parseWithZod(await request.formData(), { schema: resetPasswordSchema });
  if (submission.status !== "success") return data(submission.reply({ hideFields: ["password", "confirm"] }), { status: 400 });
  try {
    // Every other session of the account ends; this browser starts a new one.
    const user = await resetPassword(params.token, submission.value.password);
    await clearSignInThrottle(clientOf(args), user.email);
    return signInRedirect(request, user.id, HOME_BY_ROLE[user.role]);
  } catch (error) {
    return data(fieldErrorReply(submission, error, { asFormErrors: true, hideFields: ["password", "confirm"] }), { status: 400 });
  }
}

export default function ResetPassword({ loaderData, actionData }: Route.ComponentProps) {
  const [form, fields] = useForm({
    lastResult: actionData,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: resetPasswordSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  if (!loaderData.usable) {
    return (
      <AuthCard title="This link no longer works">
        <Notice tone="warn">Reset links work once and expire after an hour.</Notice>
        <p className="mt-4 text-sm">
          <Link to="/forgot-password" className="font-semibold text-flow-700 hover:underline">
            Ask for a new link
          </Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password">
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextField meta={fields.password} label="New password" type="password" hint="At least 10 characters." autoComplete="new-password" />
        <TextField meta={fields.confirm} label="The new password again" type="password" autoComplete="new-password" />
        <Button type="submit" className="w-full">
          Save and sign in
        </Button>
      </Form>
    </AuthCard>
  );
}
