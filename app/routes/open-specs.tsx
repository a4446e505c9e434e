import type { Route } from "./+types/open-specs";
import { requireRole } from "~/auth/permissions.server";
import { EmptyState, PageHeader } from "~/components/ui";

export const meta: Route.MetaFunction = () => [{ title: "Open specs · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, ["shop"]);
  return null;
}

export default function OpenSpecs() {
  return (
    <>
      <PageHeader title="Open specs" lead="Specs from machine builders that are open for bids." />
      <EmptyState title="No specs are open for bids right now">
        <p>
          When a machine builder publishes a spec, it appears here with its preliminary circuit and bill of materials, and
          you can ask questions and bid line by line. You'll also get an e-mail.
        </p>
      </EmptyState>
    </>
  );
}
