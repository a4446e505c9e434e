import type { Route } from "./+types/spec-attachment-download";
import { requireUser } from "~/auth/permissions.server";
import { openAttachment } from "~/services/attachments.server";
import { storedFileResponse } from "~/services/file-download.server";

// Downloads one file of a spec, its bytes streamed from the object store as they arrive (no copy
// on this server). The type is the one sniffed at upload, the browser is told not to guess
// another, and the file is always saved rather than shown inside our origin.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return storedFileResponse(await openAttachment(user, params.specId, params.attachmentId));
}
