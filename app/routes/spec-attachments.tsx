import type { Route } from "./+types/spec-attachments";
import { requireUser, safeRedirect } from "~/auth/permissions.server";
import { redirectWithToast } from "~/auth/session.server";
import { type AttachmentFormResult, listAttachments, submitAttachmentForm } from "~/services/attachments.server";

// The files of a spec. GET lists them for anyone who may read the spec. POST uploads
// (intent=upload, files in "files") or removes (intent=remove, attachmentId): the uploader's
// XMLHttpRequest asks for JSON; a plain form post (no JavaScript) is sent back where it came from.

const wantsJson = (request: Request) => (request.headers.get("Accept") ?? "").includes("application/json");

/** The page the form was on, if it is one of ours; else the form step that holds the uploads. */
function pageBefore(request: Request, specId: string) {
  const fallback = `/specs/${specId}/edit/quotation`;
  const referer = request.headers.get("Referer");
  if (!referer) return fallback;
  const from = new URL(referer, request.url);
  if (from.origin !== new URL(request.url).origin) return fallback;
  return safeRedirect(`${from.pathname}${from.search}`, fallback);
}

const toastOf = (result: AttachmentFormResult) =>
  [result.summary, ...result.errors.map((e) => (e.fileName ? `${e.fileName}: ${e.message}` : e.message))].join(" ");

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return Response.json({ attachments: await listAttachments(user, params.specId) });
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const result = await submitAttachmentForm(user, params.specId, request);
  if (wantsJson(request)) {
    const { attachments, errors, summary } = result;
    return Response.json({ attachments, errors, summary }, { status: result.status });
  }
  return redirectWithToast(request, pageBefore(request, params.specId), toastOf(result));
}
