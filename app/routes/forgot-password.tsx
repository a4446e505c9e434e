import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useNavigation } from "react-router";
import type { Route } from "./+types/forgot-password";
import { requireAnonymous } from "~/auth/permissions.server";
import { AuthCard } from "~/components/auth-card";
import { FormErrors, TextField } from "~/components/form-field";
import { Button, Notice } from "~/components/ui";
import { forgotPasswordSchema } from "~/schemas/account";
import { requestPasswordReset } from "~/services/accounts.server";
import { Throttled, clientOf, throttleMailForm } from "~/services/throttle.server";

export const meta: Route.MetaFunction = () => [{ title: "Reset your password · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireAnonymous(request);
  return null;
}

export async function action(args: Route.ActionArgs) {
  const { request } = args;
  const submission = parseWithZod(await request.formData(), { schema: forgotPasswordSchema });
  if (submission.status !== "success") return data({ result: submission.reply(), sent: false }, { status: 400 });
  try {
    await throttleMailForm(clientOf(args));
  } catch (error) {
    if (!(error instanceof Throttled)) throw error;
    const headers = { "Retry-After": String(error.retryAfterS) };
    return data({ result: submission.reply({ formErrors: [error.message] }), sent: false }, { status: 429, headers });
  }
  // Over an address's own limit this answers the same and sends nothing (throttle.server.ts).
  await requestPasswordReset(submission.value.email);
  return { result: submission.reply({ resetForm: true }), sent: true };
}

export default function ForgotPassword({ actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: actionData?.result,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: forgotPasswordSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  return (
    <AuthCard title="Reset your password" lead="We'll e-mail you a link to choose a new one.">
      {actionData?.sent ? (
        <div className="mb-4">
          <Notice tone="good">If an account uses that address, a reset link is on its way. It works once, for one hour.</Notice>
        </div>
      ) : null}
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextField meta={fields.email} label="E-mail address" type="email" autoComplete="email" />
        <Button type="submit" className="w-full" disabled={navigation.state === "submitting"}>
          Send the link
        </Button>
      </Form>
      <p className="mt-4 text-center text-sm">
        <Link to="/sign-in" className="text-flow-700 hover:underline">
          Back to sign-in
        </Link>
      </p>
    </AuthCard>
  );
}
