import { Link } from "react-router";
import { formatDay } from "~/content/dates";
import type { Route } from "./+types/accounts";
import { requireRole } from "~/auth/permissions.server";
import { OPERATOR_ROLES } from "~/auth/roles";
import { Card, EmptyState, PageHeader, TableScroll } from "~/components/ui";
import { accountsOf } from "~/services/admin.server";

export const meta: Route.MetaFunction = () => [{ title: "My accounts · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, OPERATOR_ROLES);
  const accounts = await accountsOf(user);
  return {
    isAdmin: user.role === "admin",
    accounts: accounts.map(({ organisation, memberCount }) => ({
      id: organisation.id,
      name: organisation.name,
      region: organisation.region,
      memberCount,
      since: organisation.createdAt.toISOString(),
    })),
  };
}

export default function Accounts({ loaderData }: Route.ComponentProps) {
  const { accounts, isAdmin } = loaderData;
  return (
    <>
      <PageHeader
        title={isAdmin ? "Buyer accounts" : "My accounts"}
        lead={isAdmin ? "Every machine builder on Tenderflow." : "The machine builders whose awarded jobs you follow to delivery."}
      />
      {accounts.length === 0 ? (
        <EmptyState title="No accounts assigned to you yet">
          <p>An administrator assigns buyer accounts to account managers. Once they do, the accounts and their jobs appear here.</p>
        </EmptyState>
      ) : (
        <Card>
          <TableScroll label="Accounts">
            <table className="w-full min-w-[40rem] text-left text-sm">
              <thead className="text-ink-600">
                <tr>
                  <th className="py-2">Account</th>
                  <th>Region</th>
                  <th>Users</th>
                  <th>Customer since</th>
                </tr>
              </thead>
              <tbody>
                {accounts.map((a) => (
                  <tr key={a.id} className="border-t border-ink-100">
                    <td className="py-2">
                      <Link to={`/accounts/${a.id}`} className="font-semibold text-flow-700 hover:underline">
                        {a.name}
                      </Link>
                    </td>
                    <td>{a.region ?? "—"}</td>
                    <td>{a.memberCount}</td>
                    <td>{formatDay(a.since)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        </Card>
      )}
    </>
  );
}
