import type { Route } from "./+types/spec-bids.xlsx";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { buildComparisonWorkbook } from "~/services/exports/comparison-workbook.server";
import { workbookDownload } from "~/services/exports/download.server";
import { comparisonSource } from "~/services/exports/export-sources.server";
import { workbookFileName } from "~/services/exports/file-name";

// The buyer's comparison of the offers on their spec as a workbook; nobody else sees it.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const input = await comparisonSource(user, params.specId, new URL(request.url).searchParams.get("sort"));
  return workbookDownload(buildComparisonWorkbook(input), workbookFileName(input.title, input.revision, "comparison of offers"));
}
