import type { Route } from "./+types/offer-document-download";
import { requireUser } from "~/auth/permissions.server";
import { storedFileResponse } from "~/services/file-download.server";
import { openOfferDocument } from "~/services/offer-documents.server";

// Downloads one document of an offer, for the shop, the spec's buyer (once offered), the buyer's
// account manager and admins; anyone else gets a 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return storedFileResponse(await openOfferDocument(user, params.specId, params.bidId, params.documentId));
}
