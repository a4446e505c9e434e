import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useNavigation } from "react-router";
import type { Route } from "./+types/sign-up";
import { requireAnonymous } from "~/auth/permissions.server";
import { AuthCard } from "~/components/auth-card";
import { FieldErrors, FormErrors, TextField } from "~/components/form-field";
import { Button, Notice } from "~/components/ui";
import { signUpSchema } from "~/schemas/account";
import { requestSignUp } from "~/services/sign-up.server";
import { Throttled, clientOf, throttleMailForm } from "~/services/throttle.server";

export const meta: Route.MetaFunction = () => [{ title: "Create an account · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireAnonymous(request);
  return null;
}

// The answer is the same for a new address and one that has an account (sign-up.server.ts):
// "check your inbox", where the link to finish or a note to the owner waits.
export async function action(args: Route.ActionArgs) {
  const { request } = args;
  const submission = parseWithZod(await request.formData(), { schema: signUpSchema });
  if (submission.status !== "success") return data({ result: submission.reply({ hideFields: ["password"] }), sentTo: null }, { status: 400 });
  try {
    await throttleMailForm(clientOf(args));
  } catch (error) {
    if (!(error instanceof Throttled)) throw error;
    const result = submission.reply({ formErrors: [error.message], hideFields: ["password"] });
    return data({ result, sentTo: null }, { status: 429, headers: { "Retry-After": String(error.retryAfterS) } });
  }
  await requestSignUp(submission.value);
  return { result: null, sentTo: submission.value.email };
}

const KINDS = [
  { value: "buyer", title: "We build machines", body: "Describe the hydraulic axes you need and collect comparable bids." },
  { value: "shop", title: "We build hydraulic systems", body: "Read clean specs from machine builders and bid on them." },
] as const;

export default function SignUp({ actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: actionData?.result,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: signUpSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
    defaultValue: { kind: "buyer" },
  });
  if (actionData?.sentTo) {
    return (
      <AuthCard title="Check your inbox" lead={`We sent a message to ${actionData.sentTo}.`}>
        <Notice tone="good">Open the link in it within 24 hours to finish creating your account. It may take a minute to arrive.</Notice>
        <p className="mt-4 text-sm text-ink-600">
          Nothing there? Look in your spam folder, or{" "}
          <Link to="/sign-up" className="text-flow-700 hover:underline">
            sign up again
          </Link>
          .
        </p>
      </AuthCard>
    );
  }
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
