// Upload routes that answer as a page. With JavaScript their forms post through a fetcher and read
// the reply as data; without it the browser posts the form itself and must get a page back, so
// each upload route also exports its page's loader and component (the page is drawn at the upload's
// address with the reply beside the form). Every other form of that page then posts to the same
// address: those are handed to the page's own action.
import { data } from "react-router";
import { fieldErrorsOf } from "~/services/errors.server";
import { UploadRefused } from "~/services/job-files.server";

/** What an upload form reads back: its field problems and what was typed beside the files. */
export type UploadReply<Form extends string> = { form: Form; errors: Record<string, string[]>; typed: Record<string, string> };
type Refusal<Form extends string> = ReturnType<typeof data<UploadReply<Form>>>;

/**
 * A form of the page itself, posted to an upload's address because the page was drawn there:
 * URL-encoded (uploads are multipart) with a field that is not one of the route's own (`own`: the
 * offer documents' removal sends a documentId; the handover's acceptance sends nothing). A body
 * that cannot be read is the upload route's to refuse.
 */
export async function isPageForm(request: Request, own: readonly string[] = []) {
  const type = (request.headers.get("Content-Type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/x-www-form-urlencoded") return false;
  const fields = await request
    .clone()
    .formData()
    .catch(() => null);
  return [...(fields?.keys() ?? [])].some((name) => !own.includes(name));
}

/** What an upload route answers: a redirect, its refusal, or the page's own action's answer (written out: the route's types are made from it). */
export type PageFormAnswer<PageAction extends (...args: never[]) => unknown, Reply = UploadReply<string>> = Promise<
  Response | ReturnType<typeof data<Reply>> | Awaited<ReturnType<PageAction>>
>;

/** A refused upload as its form's reply: 503 when the file store did not answer, else 400. */
export function uploadRefusal<Form extends string>(form: Form, error: unknown): Refusal<Form> {
  const { fieldErrors } = fieldErrorsOf(error);
  const refused = error instanceof UploadRefused ? error : null;
  return data<UploadReply<Form>>({ form, errors: fieldErrors, typed: refused?.typed ?? {} }, { status: refused?.status ?? 400 });
}
