import { getFormProps, useForm, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form } from "react-router";
import { TextAreaField, TextField } from "./form-field";
import { Button, Card } from "./ui";
import type { OrganisationProfile } from "./organisation-profile";
import { PROFILE_LIMITS, profileSchema } from "~/schemas/profile";

/** The company profile form of the settings page (intent "profile"). */
export function ProfileForm({ profile, lastResult }: { profile: OrganisationProfile; lastResult: SubmissionResult<string[]> | undefined }) {
  const [form, fields] = useForm({
    id: "profile",
    lastResult,
    defaultValue: {
      address: profile.address ?? "",
      region: profile.region ?? "",
      taxNumber: profile.taxNumber ?? "",
      quoteContactName: profile.quoteContact?.name ?? "",
      quoteContactEmail: profile.quoteContact?.email ?? "",
      quoteContactPhone: profile.quoteContact?.phone ?? "",
    },
    onValidate: ({ formData }) => parseWithZod(formData, { schema: profileSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const who =
    profile.kind === "shop"
      ? "Machine builders see it beside your offers and on their orders."
      : "Shops see your region on your open specs; both sides see the profile on an order.";
  return (
    <Card className="mt-6 max-w-xl">
      <h2 className="font-semibold">{profile.name}: company profile</h2>
      <p className="mt-1 text-sm text-ink-600">{who} Leave out anything you'd rather not show.</p>
      <Form method="post" {...getFormProps(form)} className="mt-4 space-y-4">
        <input type="hidden" name="intent" value="profile" />
        <TextAreaField meta={fields.address} label="Postal address" rows={3} maxLength={PROFILE_LIMITS.address} autoComplete="street-address" />
        <TextField meta={fields.region} label="Region" hint="As shops should read it, e.g. UK — West Midlands." maxLength={PROFILE_LIMITS.region} />
        <TextField meta={fields.taxNumber} label="Tax number (VAT)" maxLength={PROFILE_LIMITS.taxNumber} />
        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-ink-800">Contact for quotes</legend>
          <TextField meta={fields.quoteContactName} label="Name" autoComplete="name" maxLength={PROFILE_LIMITS.contactName} />
          <TextField meta={fields.quoteContactEmail} label="E-mail address" type="email" autoComplete="email" />
          <TextField meta={fields.quoteContactPhone} label="Phone" type="tel" autoComplete="tel" maxLength={PROFILE_LIMITS.contactPhone} />
        </fieldset>
        <Button type="submit">Save the profile</Button>
      </Form>
    </Card>
  );
}
