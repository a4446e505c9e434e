import type { Route } from "./+types/spec-bill.xlsx";
import { requireUser } from "~/auth/permissions.server";
import { buildBillWorkbook } from "~/services/exports/bill-workbook.server";
import { workbookDownload } from "~/services/exports/download.server";
import { billSource } from "~/services/exports/export-sources.server";
import { workbookFileName } from "~/services/exports/file-name";

// The bill of materials of a published spec as a workbook, for whoever may read the spec.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const input = await billSource(user, params.specId, new URL(request.url).searchParams.get("revision"));
  return workbookDownload(buildBillWorkbook(input), workbookFileName(input.title, input.revision, "bill of materials"));
}
