import { Link } from "react-router";
import type { Route } from "./+types/account";
import { requireRole } from "~/auth/permissions.server";
import { ACCOUNT_ROLES } from "~/auth/roles";
import { Badge, Card, PageHeader } from "~/components/ui";
import { accountOf } from "~/services/admin.server";
import { requireId } from "~/services/errors.server";
import type { User } from "~/models/index.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.name ?? "Account"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requireRole(request, ACCOUNT_ROLES);
  const organisation = await accountOf(viewer, requireId(params.organisationId));
  const users = ((organisation as typeof organisation & { users?: User[] }).users ?? []).map((u) => ({
    id: u.id,
    name: u.name,
    email: u.email,
    active: u.active,
    lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
  }));
  return { name: organisation.name, region: organisation.region, users };
}

export default function Account({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/accounts" className="text-flow-700 hover:underline">
          ← All accounts
        </Link>
      </p>
      <PageHeader title={loaderData.name} lead={loaderData.region ? `Machine builder · ${loaderData.region}` : "Machine builder"} />
      <Card>
        <h2 className="mb-3 font-semibold">People</h2>
        <table className="w-full text-left text-sm">
          <thead className="text-ink-600">
            <tr>
              <th className="py-2">Name</th>
              <th>E-mail</th>
              <th>Status</th>
              <th>Last signed in</th>
            </tr>
          </thead>
          <tbody>
            {loaderData.users.map((u) => (
              <tr key={u.id} className="border-t border-ink-100">
                <td className="py-2 font-semibold">{u.name}</td>
                <td>{u.email}</td>
                <td>{u.active ? <Badge tone="good">Active</Badge> : <Badge tone="bad">Deactivated</Badge>}</td>
                <td>{u.lastSignInAt ? new Date(u.lastSignInAt).toLocaleString("en-GB") : "Never"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>
    </>
  );
}
