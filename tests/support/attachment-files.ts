// Files and forms for the tests of uploads: minimal real openings of accepted formats (the rest
// of a file is filler), the uploader's two forms, how it posts them, and a draft to attach them to.
import { Spec, type User } from "~/models/index.server";
import * as attachments from "~/routes/spec-attachments";
import { makeMember } from "./factories";
import { call, type Visitor } from "./routes";
import { signedIn } from "./sessions";

export const PDF_BYTES = new TextEncoder().encode("%PDF-1.7\n1 0 obj\n<< /Type /Catalog >>\nendobj\n%%EOF\n");
export const PNG_BYTES = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
export const pdf = (name = "layout.pdf") => new File([PDF_BYTES], name, { type: "application/pdf" });
export const png = (name = "photo.png") => new File([PNG_BYTES], name, { type: "image/png" });

/** The uploader's form: intent "upload" with the files in "files". */
export const uploadForm = (...files: File[]) => {
  const form = new FormData();
  form.set("intent", "upload");
  for (const file of files) form.append("files", file);
  return form;
};

/** The form of a file's Remove button. */
export const removeForm = (attachmentId: string) => {
  const form = new FormData();
  form.set("intent", "remove");
  form.set("attachmentId", attachmentId);
  return form;
};

/** Posts the form the way the uploader's XMLHttpRequest does (asking for JSON), to this process's route. */
export function postAttachments(visitor: Visitor, specId: string, body: FormData, headers: Record<string, string> = { Accept: "application/json" }) {
  const request = visitor.request(`/specs/${specId}/attachments`, { method: "POST", body, headers });
  return call(attachments.action, request, { specId });
}

/** A new buyer, their signed-in browser and an empty draft of theirs. */
export async function ownDraft() {
  const buyer = await makeMember("buyer");
  return { buyer, owner: await signedIn(buyer), spec: await draftOf(buyer) };
}

/** An empty draft of the buyer's organisation, to attach files to. */
export const draftOf = (buyer: User) =>
  Spec.create({
    organisationId: buyer.organisationId,
    createdById: buyer.id,
    bidDeadline: null,
    retainerPercent: null,
    deliveryRegion: null,
    publishedAt: null,
  });

// A route's typed args carry more than a test gives; `never` lets any resource loader in.
type ResourceLoader = (args: never) => Promise<Response>;

/** A download's bytes, read straight from the route's Response (the shared `call` reads bodies as text). */
export async function downloadedBytes(loader: ResourceLoader, request: Request, params: Record<string, string>) {
  const response = await loader({ request, params, context: {} } as never);
  return new Uint8Array(await response.arrayBuffer());
}
