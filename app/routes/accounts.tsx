import { Link, useSearchParams } from "react-router";
import { formatDay } from "~/content/dates";
import type { Route } from "./+types/accounts";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { Card, EmptyState, ListTable, PageHeader, SortChoice } from "~/components/ui";
import { accountListQuerySchema } from "~/schemas/admin";
import { LIST_SORTS } from "~/schemas/list-sort";
import { accountsOf } from "~/services/admin.server";

export const meta: Route.MetaFunction = () => [{ title: "My accounts · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.accounts);
  const { sort } = accountListQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const accounts = await accountsOf(user, sort);
  return {
    isAdmin: user.role === "admin",
    sort,
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
  const [searchParams] = useSearchParams();
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
          <SortChoice options={LIST_SORTS.accounts} current={loaderData.sort} search={searchParams} />
          <ListTable label="Accounts" columns={["Account", "Region", "Users", "Customer since"]}>
            {accounts.map((a) => (
              <tr key={a.id} className="border-t border-ink-100">
                <td className="py-2 pr-3">
                  <Link to={`/accounts/${a.id}`} className="font-semibold text-flow-700 hover:underline">
                    {a.name}
                  </Link>
                </td>
                <td className="pr-3">{a.region ?? "—"}</td>
                <td className="pr-3">{a.memberCount}</td>
                <td>{formatDay(a.since)}</td>
              </tr>
            ))}
          </ListTable>
        </Card>
      )}
    </>
  );
}
