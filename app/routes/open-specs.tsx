import { Link } from "react-router";
import type { Route } from "./+types/open-specs";
import { requireRole } from "~/auth/permissions.server";
import { Card, EmptyState, PageHeader } from "~/components/ui";
import { listOpenSpecs } from "~/services/specs.server";

export const meta: Route.MetaFunction = () => [{ title: "Open specs · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, ["shop"]);
  const specs = await listOpenSpecs();
  return {
    specs: specs.map((s) => ({
      id: s.id,
      title: s.title,
      region: s.deliveryRegion,
      revision: s.currentRevision,
      bidDeadline: s.bidDeadline!.toISOString(),
    })),
  };
}

export default function OpenSpecs({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title="Open specs" lead="Specs from machine builders that are open for bids." />
      {loaderData.specs.length === 0 ? (
        <EmptyState title="No specs are open for bids right now">
          <p>
            When a machine builder publishes a spec, it appears here with its preliminary circuit and bill of materials, and
            you can ask questions and bid line by line. You'll also get an e-mail.
          </p>
        </EmptyState>
      ) : (
        <Card>
          <table className="w-full text-left text-sm">
            <thead className="text-ink-600">
              <tr>
                <th scope="col" className="py-2">Spec</th>
                <th scope="col">Delivered to</th>
                <th scope="col">Bids until</th>
              </tr>
            </thead>
            <tbody>
              {loaderData.specs.map((s) => (
                <tr key={s.id} className="border-t border-ink-100">
                  <td className="py-2">
                    <Link to={`/specs/${s.id}`} className="font-semibold text-flow-700 hover:underline">{s.title}</Link>
                  </td>
                  <td>{s.region ?? "—"}</td>
                  <td>{new Date(s.bidDeadline).toLocaleDateString("en-GB")}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
      )}
    </>
  );
}
