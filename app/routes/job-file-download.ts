import type { Route } from "./+types/job-file-download";
import { requireUser } from "~/auth/permissions.server";
import { storedFileResponse } from "~/services/file-download.server";
import { openJobFile } from "~/services/job-files.server";

// Downloads one file of a job for a reader of the job: saved, never shown inside our origin, with
// the type sniffed at upload.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return storedFileResponse(await openJobFile(user, params.jobId, params.fileId));
}
