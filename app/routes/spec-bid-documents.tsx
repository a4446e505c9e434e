import type { Route } from "./+types/spec-bid-documents";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { removeOfferDocument, uploadOfferDocuments } from "~/services/offer-documents.server";

// The documents of a shop's offer: a multipart upload (files in "files") or, with
// intent=remove and documentId, a removal. Either way back to the bid form, with what happened.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireRole(request, PAGE_ROLES.bidding);
  const back = `/specs/${params.specId}/bid#offer-documents`;
  try {
    const type = request.headers.get("Content-Type") ?? "";
    if (type.startsWith("multipart/form-data")) {
      const names = await uploadOfferDocuments(user, params.specId, request);
      return redirectWithToast(request, back, `Attached to your offer: ${names.join(", ")}.`);
    }
    const form = await request.formData();
    const name = await removeOfferDocument(user, params.specId, form.get("documentId")?.toString());
    return redirectWithToast(request, back, `Removed ${name} from your offer.`);
  } catch (error) {
    const { fieldErrors, message } = fieldErrorsOf(error);
    return redirectWithToast(request, back, (fieldErrors.files ?? [message]).join(" "));
  }
}
