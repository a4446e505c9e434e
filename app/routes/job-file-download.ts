import type { Route } from "./+types/job-file-download";
import { requireUser } from "~/auth/permissions.server";
import { contentDisposition } from "~/services/attachments.server";
import { openJobFile } from "~/services/job-files.server";

// Downloads one file of a job for a reader of the job: saved, never shown inside our origin, with
// the type sniffed at upload.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const file = await openJobFile(user, params.jobId, params.fileId);
  return new Response(file.body, {
    headers: {
      "Content-Type": file.contentType,
      "Content-Length": String(file.sizeBytes),
      "Content-Disposition": contentDisposition(file.fileName),
      "X-Content-Type-Options": "nosniff",
      "Content-Security-Policy": "default-src 'none'; sandbox",
      "Cache-Control": "private, no-store",
    },
  });
}
