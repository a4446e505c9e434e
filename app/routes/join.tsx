import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data } from "react-router";
import type { Route } from "./+types/join";
import { HOME_BY_ROLE, ROLE_LABELS } from "~/auth/roles";
import { signInRedirect } from "~/auth/session.server";
import { AuthCard } from "~/components/auth-card";
import { FormErrors, TextField } from "~/components/form-field";
import { Button, Notice } from "~/components/ui";
import { acceptInvitationSchema } from "~/schemas/account";
import { acceptInvitation, findOpenInvitation } from "~/services/accounts.server";
import { fieldErrorReply } from "~/services/errors.server";

export const meta: Route.MetaFunction = () => [{ title: "Join your team · Tenderflow" }];

export async function loader({ params }: Route.LoaderArgs) {
  const invitation = await findOpenInvitation(params.token);
  if (!invitation) return { invitation: null };
  return {
    invitation: {
      email: invitation.email,
      role: invitation.role,
      organisationName: (invitation as typeof invitation & { organisation: { name: string } }).organisation.name,
    },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const submission = parseWithZod(await request.formData(), { schema: acceptInvitationSchema });
  if (submission.status !== "success") return data(submission.reply({ hideFields: ["password"] }), { status: 400 });
  try {
    const user = await acceptInvitation(params.token, submission.value.name, submission.value.password);
    return signInRedirect(request, user.id, HOME_BY_ROLE[user.role]);
  } catch (error) {
    return data(fieldErrorReply(submission, error, { asFormErrors: true, hideFields: ["password"] }), { status: 400 });
  }
}

export default function Join({ loaderData, actionData }: Route.ComponentProps) {
  const [form, fields] = useForm({
    lastResult: actionData,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: acceptInvitationSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const { invitation } = loaderData;
  if (!invitation) {
    return (
      <AuthCard title="This invitation no longer works">
        <Notice tone="warn">It may have expired, been revoked, or been used already. Ask your colleague to invite you again.</Notice>
        <p className="mt-4 text-sm">
          <Link to="/sign-in" className="font-semibold text-flow-700 hover:underline">
            Sign in instead
          </Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title={`Join ${invitation.organisationName}`} lead={`as ${ROLE_LABELS[invitation.role].toLowerCase()}, with ${invitation.email}`}>
      <Form method="post" {...getFormProps(form)} className="space-y-4">
        <FormErrors id={form.errorId} errors={form.errors} />
        <TextField meta={fields.name} label="Your name" autoComplete="name" />
        <TextField meta={fields.password} label="Choose a password" type="password" hint="At least 10 characters." autoComplete="new-password" />
        <Button type="submit" className="w-full">
          Join and sign in
        </Button>
      </Form>
    </AuthCard>
  );
}
