import type { Route } from "./+types/specs";
import { requireRole } from "~/auth/permissions.server";
import { EmptyState, PageHeader } from "~/components/ui";

export const meta: Route.MetaFunction = () => [{ title: "My specs · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, ["buyer"]);
  return { organisationName: user.organisation.name };
}

export default function Specs({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title="My specs" lead={`Hydraulic axes that ${loaderData.organisationName} has described for quotation.`} />
      <EmptyState title="No specs yet">
        <p>
          A spec describes one hydraulic axis of your machine: what it moves, how far, how fast and how often. Tenderflow
          sizes a preliminary circuit from it, and fluid-power shops bid against the same bill of materials.
        </p>
        <p className="mt-3">
          Have the moving mass, the stroke and the speeds at hand: those are the first things the spec asks for.
        </p>
      </EmptyState>
    </>
  );
}
