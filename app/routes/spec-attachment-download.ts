import type { Route } from "./+types/spec-attachment-download";
import { requireUser } from "~/auth/permissions.server";
import { contentDisposition, openAttachment } from "~/services/attachments.server";

// Downloads one file of a spec. The type is the one sniffed at upload, the browser is told not
// to guess another, and the file is always saved rather than shown inside our origin.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const file = await openAttachment(user, params.specId, params.attachmentId);
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
