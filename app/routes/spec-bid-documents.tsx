import type { Route } from "./+types/spec-bid-documents";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { isPageForm, type PageFormAnswer, uploadRefusal, type UploadReply } from "~/http/page-forms.server";
import { removeOfferDocument, uploadOfferDocuments } from "~/services/offer-documents.server";
import { action as bidPageAction } from "./spec-bid";

/** What the documents card reads back when an upload or removal is refused. */
export type OfferDocumentsReply = UploadReply<"offer-documents">;

// The form posts as a plain page (with or without JavaScript): a refusal is answered with the bid
// page itself, the problem beside the upload field.
export { default, loader, meta } from "./spec-bid";

// The documents of a shop's offer: a multipart upload (files in "files") or, with a documentId,
// a removal. Done, back to the bid form with what happened.
export async function action(args: Route.ActionArgs): PageFormAnswer<typeof bidPageAction> {
  const { request, params } = args;
  if (await isPageForm(request, ["documentId"])) return bidPageAction(args as unknown as Parameters<typeof bidPageAction>[0]);
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
    return uploadRefusal("offer-documents", error);
  }
}
