import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useNavigation } from "react-router";
import type { Route } from "./+types/sign-up";
import { requireAnonymous } from "~/auth/permissions.server";
import { HOME_BY_ROLE } from "~/auth/roles";
import { signInRedirect } from "~/auth/session.server";
import { AuthCard } from "~/components/auth-card";
import { FieldErrors, FormErrors, TextField } from "~/components/form-field";
import { Button } from "~/components/ui";
import { signUpSchema } from "~/schemas/account";
import { signUp } from "~/services/accounts.server";
import { FieldErrors as FieldErrorsError } from "~/services/errors.server";

export const meta: Route.MetaFunction = () => [{ title: "Create an account · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireAnonymous(request);
  return null;
}

export async function action({ request }: Route.ActionArgs) {
  const submission = parseWithZod(await request.formData(), { schema: signUpSchema });
  if (submission.status !== "success") return data(submission.reply({ hideFields: ["password"] }), { status: 400 });
  try {
    const user = await signUp(submission.value);
    return signInRedirect(request, user.id, HOME_BY_ROLE[user.role]);
  } catch (error) {
    if (!(error instanceof FieldErrorsError)) throw error;
    return data(submission.reply({ fieldErrors: error.fieldErrors, hideFields: ["password"] }), { status: 400 });
  }
}

const KINDS = [
  { value: "buyer", title: "We build machines", body: "Describe the hydraulic axes you need and collect comparable bids." },
  { value: "shop", title: "We build hydraulic systems", body: "Read clean specs from machine builders and bid on them." },
] as const;

export default function SignUp({ actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: actionData,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: signUpSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
    defaultValue: { kind: "buyer" },
  });
  return (
    <AuthCard title="Create an account" lead="It takes a minute. Your colleagues can join later.">
      <Form method="post" {...getFormProps(form)} className="space-y-5">
        <FormErrors id={form.errorId} errors={form.errors} />
        <fieldset aria-describedby={fields.kind.errorId}>
          <legend className="text-sm font-semibold text-ink-800">What does your company do?</legend>
          <div className="mt-2 grid gap-2 sm:grid-cols-2">
            {KINDS.map((kind) => (
              <label
                key={kind.value}
                className="flex cursor-pointer gap-2 rounded-md p-3 ring-1 ring-ink-200 has-[:checked]:bg-flow-50 has-[:checked]:ring-2 has-[:checked]:ring-flow-600"
              >
                <input
                  type="radio"
                  name={fields.kind.name}
                  value={kind.value}
                  defaultChecked={fields.kind.initialValue === kind.value}
                  className="mt-1 accent-flow-600"
                />
                <span>
                  <span className="block text-sm font-semibold">{kind.title}</span>
                  <span className="block text-xs text-ink-600">{kind.body}</span>
                </span>
              </label>
            ))}
          </div>
          <FieldErrors id={fields.kind.errorId} errors={fields.kind.errors} />
        </fieldset>
        <TextField meta={fields.organisationName} label="Company name" hint="For example: Harrow Lift Systems Ltd" autoComplete="organization" />
        <TextField meta={fields.name} label="Your name" autoComplete="name" />
        <TextField meta={fields.email} label="Work e-mail address" type="email" autoComplete="email" />
        <TextField meta={fields.password} label="Password" type="password" hint="At least 10 characters." autoComplete="new-password" />
        <Button type="submit" className="w-full" disabled={navigation.state === "submitting"}>
          {navigation.state === "submitting" ? "Creating your account…" : "Create account"}
        </Button>
      </Form>
      <p className="mt-4 text-center text-sm">
        Already have an account?{" "}
        <Link to="/sign-in" className="text-flow-700 hover:underline">
          Sign in
        </Link>
      </p>
    </AuthCard>
  );
}
