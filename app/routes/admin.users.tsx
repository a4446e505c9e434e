import { parseWithZod } from "@conform-to/zod/v4";
import { formatDay } from "~/content/dates";
import { Form, Link, data, useSearchParams } from "react-router";
import type { Route } from "./+types/admin.users";
import { requireRole } from "~/auth/permissions.server";
import { ROLES_BY_KIND, ROLE_LABELS, type Role, PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { ActiveBadge, Button, ButtonLink, Card, ErrorNotice, ListTable, PageHeader, RowChoiceForm, SearchBar, SortChoice } from "~/components/ui";
import { FieldErrors as FieldErrorText } from "~/components/form-field";
import { OrganisationName } from "~/components/organisation-link";
import { countOf } from "~/content/count";
import { userActionSchema, userListQuerySchema } from "~/schemas/admin";
import { LIST_SORTS } from "~/schemas/list-sort";
import { confirmOwnPassword } from "~/services/accounts.server";
import { assignAccountManager, changeRole, listAccountManagers, listUsers, roleChangeTarget, setActive } from "~/services/admin.server";
import { unassignedAccounts } from "~/services/unassigned-accounts.server";
import { UnassignedAccounts } from "~/components/unassigned-accounts";
import { openableOrganisations } from "~/services/organisation-page.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { Throttled, clientOf } from "~/services/throttle.server";

interface RoleConfirmation {
  userId: string;
  name: string;
  role: Role;
  passwordErrors?: string[];
}
type ActionData = { error?: string; confirm?: RoleConfirmation };

export const meta: Route.MetaFunction = () => [{ title: "Users · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const query = userListQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const [{ users, total, page, pageCount }, unassigned, managers] = await Promise.all([
    listUsers(admin, query),
    unassignedAccounts(admin),
    listAccountManagers(admin),
  ]);
  const openable = await openableOrganisations(
    admin,
    users.map((u) => u.organisationId),
  );
  return {
    unassigned,
    managers: managers.map((m) => ({ id: m.id, name: m.name })),
    adminId: admin.id,
    sort: query.sort,
    total,
    page,
    pageCount,
    users: users.map((u) => ({
      id: u.id,
      name: u.name,
      email: u.email,
      role: u.role,
      active: u.active,
      organisationId: u.organisationId,
      organisationName: u.organisation!.name,
      organisationLinked: openable.includes(u.organisationId),
      allowedRoles: ROLES_BY_KIND[u.organisation!.kind],
      lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
    })),
  };
}

export async function action(args: Route.ActionArgs) {
  const { request } = args;
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const submission = parseWithZod(await request.formData(), { schema: userActionSchema });
  if (submission.status !== "success") {
    const error = submission.error?.managerId?.[0] ?? "That change was not understood.";
    return data<ActionData>({ error }, { status: 400 });
  }
  const back = new URL(request.url);
  try {
    const change = submission.value;
    if (change.intent === "change-role") {
      // A role is changed only after the admin types their own password on a second step.
      const target = await roleChangeTarget(admin, change.userId, change.role);
      const confirm: RoleConfirmation = { userId: target.id, name: target.name, role: change.role };
      if (!change.confirm) return data<ActionData>({ confirm }, { status: 400 });
      if (!change.currentPassword) return data<ActionData>({ confirm: { ...confirm, passwordErrors: ["Enter your password to confirm."] } }, { status: 400 });
      try {
        await confirmOwnPassword(clientOf(args), admin, change.currentPassword);
      } catch (error) {
        if (error instanceof Throttled) {
          return data<ActionData>(
            { confirm: { ...confirm, passwordErrors: [error.message] } },
            { status: 429, headers: { "Retry-After": String(error.retryAfterS) } },
          );
        }
        return data<ActionData>({ confirm: { ...confirm, passwordErrors: fieldErrorsOf(error).fieldErrors.currentPassword } }, { status: 400 });
      }
      const user = await changeRole(admin, change.userId, change.role);
      return redirectWithToast(request, `${back.pathname}${back.search}`, `${user.name} is now ${ROLE_LABELS[user.role].toLowerCase()}.`);
    }
    if (change.intent === "assign-manager") {
      await assignAccountManager(admin, change.organisationId, change);
      return redirectWithToast(request, `${back.pathname}${back.search}`, "Account manager assigned; the account is theirs now.");
    }
    const user = await setActive(admin, change.userId, change.active);
    return redirectWithToast(
      request,
      `${back.pathname}${back.search}`,
      user.active ? `${user.name} can sign in again.` : `${user.name} is deactivated and can no longer sign in.`,
    );
  } catch (error) {
    return data<ActionData>({ error: fieldErrorsOf(error).message }, { status: 400 });
  }
}

export default function AdminUsers({ loaderData, actionData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Users"
        lead={`${countOf(loaderData.total, "user")} across all organisations.`}
        // The audit log is linked from the admin's home: the main menu has no room left on a laptop.
        actions={
          <ButtonLink to="/admin/audit" tone="secondary">
            Audit log
          </ButtonLink>
        }
      />
      <ErrorNotice error={actionData?.error} />
      {actionData?.confirm ? <ConfirmRoleChange confirm={actionData.confirm} /> : null}
      <UnassignedAccounts {...loaderData.unassigned} managers={loaderData.managers} />
      <Card>
        <SearchBar label="Search users" placeholder="Name, e-mail or organisation" value={searchParams.get("q") ?? ""}>
          {/* A new search keeps the order chosen. */}
          <input type="hidden" name="sort" value={loaderData.sort} />
        </SearchBar>
        <SortChoice options={LIST_SORTS.users} current={loaderData.sort} search={searchParams} />
        <ListTable
          label="Users"
          pager={{ page: loaderData.page, pageCount: loaderData.pageCount, search: searchParams }}
          empty="No user matches that search."
          columns={["Name", "Organisation", "Role", "Status", "Last signed in", { label: "", srLabel: "Action" }]}
        >
          {loaderData.users.map((u) => (
            <tr key={u.id} className="border-t border-ink-100 align-middle">
              <td className="py-2">
                <span className="block font-semibold">{u.name}</span>
                <span className="block text-xs text-ink-600">{u.email}</span>
              </td>
              <td>
                <OrganisationName id={u.organisationId} name={u.organisationName} linked={u.organisationLinked} />
              </td>
              <td>
                {u.allowedRoles.length > 1 && u.id !== loaderData.adminId ? (
                  <RowChoiceForm
                    id={`role-${u.id}`}
                    name="role"
                    label={`Role of ${u.name}`}
                    value={u.role}
                    options={u.allowedRoles.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
                    fields={{ intent: "change-role", userId: u.id }}
                  />
                ) : (
                  ROLE_LABELS[u.role]
                )}
              </td>
              <td>
                <ActiveBadge active={u.active} />
              </td>
              <td>{u.lastSignInAt ? formatDay(u.lastSignInAt) : "Never"}</td>
              <td className="text-right">
                {u.id !== loaderData.adminId ? (
                  <Form
                    method="post"
                    onSubmit={(event) => {
                      // Deactivating signs the person out at once; ask before doing it.
                      if (u.active && !window.confirm(`Deactivate ${u.name}? They are signed out at once and can't sign in until reactivated.`))
                        event.preventDefault();
                    }}
                  >
                    <input type="hidden" name="intent" value="set-active" />
                    <input type="hidden" name="userId" value={u.id} />
                    <input type="hidden" name="active" value={u.active ? "false" : "true"} />
                    <Button type="submit" tone={u.active ? "danger" : "secondary"} className="px-3 py-1">
                      {u.active ? "Deactivate" : "Reactivate"}
                    </Button>
                  </Form>
                ) : null}
              </td>
            </tr>
          ))}
        </ListTable>
      </Card>
    </>
  );
}

/** The second step of a role change: the admin's own password, so a stolen session can't promote anyone. */
function ConfirmRoleChange({ confirm }: { confirm: RoleConfirmation }) {
  const [searchParams] = useSearchParams();
  const errorId = "confirm-role-password-error";
  return (
    <Card className="mb-4 max-w-xl">
      <Form method="post" className="space-y-3">
        <h2 className="font-semibold">
          Make {confirm.name} {ROLE_LABELS[confirm.role].toLowerCase()}?
        </h2>
        <input type="hidden" name="intent" value="change-role" />
        <input type="hidden" name="userId" value={confirm.userId} />
        <input type="hidden" name="role" value={confirm.role} />
        <input type="hidden" name="confirm" value="yes" />
        <div>
          <label htmlFor="confirm-role-password" className="block text-sm font-semibold">
            Your password
          </label>
          <input
            id="confirm-role-password"
            name="currentPassword"
            type="password"
            autoComplete="current-password"
            // The panel opens on the admin's click to ask for this one field: focus goes where they type next.
            // eslint-disable-next-line jsx-a11y/no-autofocus
            autoFocus
            className="mt-1 w-full rounded-md px-3 py-2 ring-1 ring-ink-200"
            aria-invalid={confirm.passwordErrors ? true : undefined}
            aria-describedby={confirm.passwordErrors ? errorId : undefined}
          />
          <FieldErrorText id={errorId} errors={confirm.passwordErrors} />
        </div>
        <div className="flex items-center gap-3">
          <Button type="submit">Change the role</Button>
          <Link to={`?${searchParams.toString()}`} className="text-sm text-flow-700 hover:underline">
            Cancel
          </Link>
        </div>
      </Form>
    </Card>
  );
}
