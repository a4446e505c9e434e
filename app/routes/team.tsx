import { getFormProps, useForm } from "@conform-to/react";
import { formatDay } from "~/content/dates";
import { parseWithZod } from "@conform-to/zod/v4";
import { Form, data, useNavigation } from "react-router";
import type { Route } from "./+types/team";
import { requireRole } from "~/auth/permissions.server";
import { ROLES_BY_KIND, ROLE_LABELS, TEAM_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { FormErrors, SelectField, TextField } from "~/components/form-field";
import { ActiveBadge, Button, Card, ListTable, PageHeader } from "~/components/ui";
import { inviteSchema } from "~/schemas/account";
import { inviteColleague, teamOf } from "~/services/accounts.server";
import { fieldErrorReply } from "~/services/errors.server";
import { Throttled } from "~/services/throttle.server";

export const meta: Route.MetaFunction = () => [{ title: "Team · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, TEAM_ROLES);
  const { members, invitations } = await teamOf(user);
  return {
    organisationName: user.organisation.name,
    invitableRoles: ROLES_BY_KIND[user.organisation.kind],
    members: members.map((m) => ({ id: m.id, name: m.name, email: m.email, role: m.role, active: m.active, isYou: m.id === user.id })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString() })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireRole(request, TEAM_ROLES);
  const submission = parseWithZod(await request.formData(), { schema: inviteSchema });
  if (submission.status !== "success") return data(submission.reply(), { status: 400 });
  try {
    await inviteColleague(user, submission.value.email, submission.value.role);
  } catch (error) {
    if (error instanceof Throttled) {
      return data(submission.reply({ formErrors: [error.message] }), { status: 429, headers: { "Retry-After": String(error.retryAfterS) } });
    }
    return data(fieldErrorReply(submission, error), { status: 400 });
  }
  // The invitation is queued in the outbox; the mail worker sends it (never this request).
  // The same words whether or not the address has an account elsewhere (accounts.server.ts).
  return redirectWithToast(request, "/team", `Invitation sent to ${submission.value.email}.`);
}

export default function Team({ loaderData, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const [form, fields] = useForm({
    lastResult: navigation.state === "idle" ? actionData : null,
    onValidate: ({ formData }) => parseWithZod(formData, { schema: inviteSchema }),
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
  });
  const { invitableRoles } = loaderData;
  return (
    <>
      <PageHeader title="Team" lead={`People of ${loaderData.organisationName} who use Tenderflow.`} />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-3">
        <Card className="lg:col-span-2" title="Members">
          <ListTable label="Members" minWidth="min-w-[30rem]" columns={["Name", "E-mail", "Role", "Status"]}>
            {loaderData.members.map((m) => (
              <tr key={m.id} className="border-t border-ink-100">
                <td className="py-2 font-semibold">
                  {m.name} {m.isYou ? <span className="font-normal text-ink-400">(you)</span> : null}
                </td>
                <td>{m.email}</td>
                <td>{ROLE_LABELS[m.role]}</td>
                <td>
                  <ActiveBadge active={m.active} />
                </td>
              </tr>
            ))}
          </ListTable>
          {loaderData.invitations.length ? (
            <>
              <h2 className="mb-3 mt-8 font-semibold">Invitations waiting for an answer</h2>
              <ul className="divide-y divide-ink-100 text-sm">
                {loaderData.invitations.map((i) => (
                  <li key={i.id} className="flex items-center justify-between py-2">
                    <span>
                      {i.email} · {ROLE_LABELS[i.role]} · until {formatDay(i.expiresAt)}
                    </span>
                    <Form method="post" action={`/team/invitations/${i.id}/revoke`}>
                      <Button tone="danger" type="submit" className="px-3 py-1">
                        Revoke
                      </Button>
                    </Form>
                  </li>
                ))}
              </ul>
            </>
          ) : null}
        </Card>
        <Card>
          <h2 className="mb-1 font-semibold">Invite a colleague</h2>
          <p className="mb-4 text-sm text-ink-600">They get an e-mail with a link to choose their password and join {loaderData.organisationName}.</p>
          <Form method="post" {...getFormProps(form)} className="space-y-4">
            <FormErrors id={form.errorId} errors={form.errors} />
            <TextField meta={fields.email} label="Their e-mail address" type="email" hint="For example: j.okafor@yourcompany.com" />
            {invitableRoles.length > 1 ? (
              <SelectField meta={fields.role} label="Role" options={invitableRoles.map((r) => ({ value: r, label: ROLE_LABELS[r] }))} />
            ) : null}
            <Button type="submit" disabled={navigation.state === "submitting"}>
              Send invitation
            </Button>
          </Form>
        </Card>
      </div>
    </>
  );
}
