import type { Route } from "./+types/job-priced-bill.xlsx";
import { requireUser } from "~/auth/permissions.server";
import { workbookDownload } from "~/services/exports/download.server";
import { pricedBillSource } from "~/services/exports/export-sources.server";
import { workbookFileName } from "~/services/exports/file-name";
import { buildPricedBillWorkbook } from "~/services/exports/priced-bill-workbook.server";

// The awarded bid's priced bill, for whoever may read the job: buyer, winning shop, the
// account's account manager, admins (the job's scope decides).
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const input = await pricedBillSource(user, params.jobId);
  return workbookDownload(buildPricedBillWorkbook(input), workbookFileName(input.title, input.revision, "priced bill"));
}
