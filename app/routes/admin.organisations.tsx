import { parseWithZod } from "@conform-to/zod/v4";
import { Form, data, useSearchParams } from "react-router";
import type { Route } from "./+types/admin.organisations";
import { requireRole } from "~/auth/permissions.server";
import { KIND_LABELS, ORGANISATION_KINDS } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { Button, Card, Notice, PageHeader, Pager, SearchBar } from "~/components/ui";
import { assignManagerSchema, listQuerySchema } from "~/schemas/admin";
import { assignAccountManager, listAccountManagers, listOrganisations } from "~/services/admin.server";
import { FieldErrors } from "~/services/errors.server";

export const meta: Route.MetaFunction = () => [{ title: "Organisations · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, ["admin"]);
  const query = listQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const [{ organisations, total, page, pageCount }, managers] = await Promise.all([
    listOrganisations(query),
    listAccountManagers(),
  ]);
  return {
    total,
    page,
    pageCount,
    managers: managers.map((m) => ({ id: m.id, name: m.name })),
    organisations: organisations.map(({ organisation: o, memberCount }) => ({
      id: o.id,
      name: o.name,
      kind: o.kind,
      region: o.region,
      memberCount,
      accountManagerId: o.accountManagerId ?? "",
    })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  await requireRole(request, ["admin"]);
  const submission = parseWithZod(await request.formData(), { schema: assignManagerSchema });
  if (submission.status !== "success") return data({ error: "Choose an account manager." }, { status: 400 });
  try {
    await assignAccountManager(submission.value.organisationId, submission.value.managerId);
  } catch (error) {
    if (!(error instanceof FieldErrors)) throw error;
    return data({ error: error.message }, { status: 400 });
  }
  const back = new URL(request.url);
  return redirectWithToast(request, `${back.pathname}${back.search}`, "Account manager saved.");
}

export default function AdminOrganisations({ loaderData, actionData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  return (
    <>
      <PageHeader title="Organisations" lead={`${loaderData.total} organisation${loaderData.total === 1 ? "" : "s"}.`} />
      {actionData?.error ? (
        <div className="mb-4">
          <Notice tone="bad">{actionData.error}</Notice>
        </div>
      ) : null}
      <Card>
        <SearchBar label="Search organisations" placeholder="Organisation name" value={searchParams.get("q") ?? ""}>
          <label htmlFor="kind" className="sr-only">
            Kind
          </label>
          <select id="kind" name="kind" defaultValue={searchParams.get("kind") ?? ""} className="rounded-md px-2 py-2 text-sm ring-1 ring-ink-200">
            <option value="">All kinds</option>
            {ORGANISATION_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </SearchBar>
        <table className="w-full text-left text-sm">
          <thead className="text-ink-600">
            <tr>
              <th className="py-2">Organisation</th>
              <th>Kind</th>
              <th>Region</th>
              <th>Users</th>
              <th>Account manager</th>
            </tr>
          </thead>
          <tbody>
            {loaderData.organisations.map((o) => (
              <tr key={o.id} className="border-t border-ink-100">
                <td className="py-2 font-semibold">{o.name}</td>
                <td>{KIND_LABELS[o.kind]}</td>
                <td>{o.region ?? "—"}</td>
                <td>{o.memberCount}</td>
                <td>
                  {o.kind === "buyer" ? (
                    <Form method="post" className="flex items-center gap-1">
                      <input type="hidden" name="organisationId" value={o.id} />
                      <label htmlFor={`manager-${o.id}`} className="sr-only">
                        Account manager of {o.name}
                      </label>
                      <select
                        id={`manager-${o.id}`}
                        name="managerId"
                        defaultValue={o.accountManagerId}
                        className="rounded-md px-2 py-1 ring-1 ring-ink-200"
                      >
                        <option value="">Nobody yet</option>
                        {loaderData.managers.map((m) => (
                          <option key={m.id} value={m.id}>
                            {m.name}
                          </option>
                        ))}
                      </select>
                      <Button type="submit" tone="secondary" className="px-2 py-1">
                        Save
                      </Button>
                    </Form>
                  ) : (
                    <span className="text-ink-400">—</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {loaderData.organisations.length === 0 ? <p className="py-6 text-center text-ink-600">No organisation matches that search.</p> : null}
        <Pager page={loaderData.page} pageCount={loaderData.pageCount} search={searchParams} />
      </Card>
    </>
  );
}
