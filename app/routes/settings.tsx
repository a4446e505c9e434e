import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, data } from "react-router";
import type { Route } from "./+types/settings";
import { requireUser } from "~/auth/permissions.server";
import { liveSessionsOf, redirectWithToast, signOutEverywhere, signOutRedirect } from "~/auth/session.server";
import { FieldErrors, TextField } from "~/components/form-field";
import { Button, Card, PageHeader } from "~/components/ui";
import { formatMoment } from "~/content/dates";
import { ProfileForm } from "~/components/profile-form";
import { settingsSchema } from "~/schemas/account";
import { profileSchema } from "~/schemas/profile";
import { ownProfile, saveProfile } from "~/services/organisation-profile.server";
import { updateSettings } from "~/services/accounts.server";
import { UNIT_SYSTEMS, UNIT_SYSTEM_LABELS } from "~/units";

export const meta: Route.MetaFunction = () => [{ title: "Your settings · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const [sessions, own] = await Promise.all([liveSessionsOf(request, user.id), ownProfile(user)]);
  return { name: user.name, email: user.email, unitSystem: user.unitSystem, sessions, profile: own.canEdit ? own.profile : null };
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = await request.formData();
  if (form.get("intent") === "sign-out-everywhere") {
    await signOutEverywhere(user.id);
    return signOutRedirect(request, "/sign-in", "You are signed out on every browser, this one included.");
  }
  if (form.get("intent") === "profile") {
    const profile = parseWithZod(form, { schema: profileSchema });
    if (profile.status !== "success") return data({ profile: profile.reply() }, { status: 400 });
    await saveProfile(user, profile.value);
    return redirectWithToast(request, "/settings", "Company profile saved.");
  }
  const submission = parseWithZod(form, { schema: settingsSchema });
  if (submission.status !== "success") return data(submission.reply(), { status: 400 });
  await updateSettings(user, submission.value);
  return redirectWithToast(request, "/settings", "Settings saved.");
}

export default function Settings({ loaderData, actionData }: Route.ComponentProps) {
  const [form, fields] = useForm({
    lastResult: actionData && !("profile" in actionData) ? actionData : undefined,
    defaultValue: { name: loaderData.name, unitSystem: loaderData.unitSystem },
    onValidate: ({ formData }) => parseWithZod(formData, { schema: settingsSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  return (
    <>
      <PageHeader title="Your settings" lead={`Signed in as ${loaderData.email}.`} />
      <Card className="max-w-xl">
        <Form method="post" {...getFormProps(form)} className="space-y-5">
          <TextField meta={fields.name} label="Your name" autoComplete="name" />
          <fieldset aria-describedby={fields.unitSystem.errorId}>
            <legend className="text-sm font-semibold text-ink-800">Units you work in</legend>
            <p className="text-sm text-ink-600">Every form and circuit shows values in these units. Tenderflow stores them in SI.</p>
            <div className="mt-2 flex flex-wrap gap-2">
              {UNIT_SYSTEMS.map((system) => (
                <label
                  key={system}
                  className="flex cursor-pointer items-center gap-2 rounded-md px-3 py-2 text-sm ring-1 ring-ink-200 has-[:checked]:bg-flow-50 has-[:checked]:ring-2 has-[:checked]:ring-flow-600"
                >
                  <input
                    type="radio"
                    name={fields.unitSystem.name}
                    value={system}
                    defaultChecked={fields.unitSystem.initialValue === system}
                    className="accent-flow-600"
                  />
                  {UNIT_SYSTEM_LABELS[system]}
                </label>
              ))}
            </div>
            <FieldErrors id={fields.unitSystem.errorId} errors={fields.unitSystem.errors} />
          </fieldset>
          <Button type="submit">Save settings</Button>
        </Form>
      </Card>
      {loaderData.profile ? (
        <ProfileForm profile={loaderData.profile} lastResult={actionData && "profile" in actionData ? actionData.profile : undefined} />
      ) : null}
      <Card className="mt-6 max-w-xl">
        <h2 className="font-semibold">Where you are signed in</h2>
        <ul className="mt-3 divide-y divide-ink-100 text-sm">
          {loaderData.sessions.map((s, i) => (
            <li key={i} className="py-2">
              <span className="font-semibold">{describeBrowser(s.userAgent)}</span>
              {s.current ? <span className="text-ink-600"> (this browser)</span> : null}
              <span className="block text-ink-600">
                Signed in {formatMoment(s.createdAt)} · last active {formatMoment(s.lastSeenAt)}
              </span>
            </li>
          ))}
        </ul>
        <p className="mt-3 text-sm text-ink-600">
          Signed in on a computer that isn't yours, or think someone else knows your password? End every session, this one included; then reset your password
          from the sign-in page.
        </p>
        <Form method="post" className="mt-3">
          <input type="hidden" name="intent" value="sign-out-everywhere" />
          <Button type="submit" tone="danger">
            Sign out everywhere
          </Button>
        </Form>
      </Card>
    </>
  );
}

/** "Firefox on Windows" from a user agent: enough to recognise one's own devices. */
function describeBrowser(userAgent: string | null) {
  if (!userAgent) return "Unknown browser";
  const browser = /Edg\//.test(userAgent)
    ? "Edge"
    : /Firefox\//.test(userAgent)
      ? "Firefox"
      : /Chrom(e|ium)\//.test(userAgent)
        ? "Chrome"
        : /Safari\//.test(userAgent)
          ? "Safari"
          : "A browser";
  const system = /Android/.test(userAgent)
    ? "Android"
    : /iPhone|iPad/.test(userAgent)
      ? "iOS"
      : /Windows/.test(userAgent)
        ? "Windows"
        : /Mac OS X/.test(userAgent)
          ? "macOS"
          : /Linux/.test(userAgent)
            ? "Linux"
            : null;
  return system ? `${browser} on ${system}` : browser;
}
