// Bounds on every request before any route parses it: a form library asked to build
// `lines[10000000]` builds ten million slots, and PostgreSQL refuses a NUL character with an
// error, so both are stopped here, once, for every page, action, API and resource route.
import { ATTACHMENT_LIMITS } from "~/services/attachments.server";

export const REQUEST_LIMITS = {
  /** A URL-encoded form: the largest is a bid of 200 lines with descriptions (~150 kB). */
  formBytes: 512 * 1024,
  jsonBytes: 64 * 1024,
  fields: 1_000,
  fieldNameLength: 120,
  /** The largest list any form holds (bid lines); an index beyond it is never ours. */
  listIndex: 999,
  queryLength: 4_096,
  queryFields: 50,
  /** Uploads are streamed by their route's own parser, which bounds each file and part. */
  uploadBytes: ATTACHMENT_LIMITS.maxFilesPerSpec * ATTACHMENT_LIMITS.maxFileBytes + 1024 * 1024,
} as const;

/** Routes whose action takes multipart uploads; everywhere else multipart is refused. */
const UPLOAD_PATH = /^\/(?:specs\/[^/]+\/(?:attachments|bid\/documents)|jobs\/[^/]+\/(?:files|handover))(\.data)?$/;

export type BoundsProblem = { status: 400 | 413 | 415; message: string };

const bodyless = (method: string) => method === "GET" || method === "HEAD" || method === "OPTIONS";

/** A field name as our forms write them: `title`, `lines[3].unitPrice`, `lines[12]`. */
const FIELD_NAME = /^[A-Za-z_][\w-]*(?:\[\d+\]|\.[A-Za-z_][\w-]*)*$/;
const INDEX = /\[(\d+)\]/g;
const NUL = "\u0000";

/** A form's fields: few, named as ours are, within our lists, no NUL, each sent once. */
function checkFields(entries: Iterable<[string, string]>): BoundsProblem | null {
  const seen = new Set<string>();
  let count = 0;
  for (const [name, value] of entries) {
    if (++count > REQUEST_LIMITS.fields) return { status: 413, message: `Too many fields in the form (at most ${REQUEST_LIMITS.fields}).` };
    if (name.length > REQUEST_LIMITS.fieldNameLength || !FIELD_NAME.test(name)) {
      return { status: 400, message: `The form has a field name this site does not use: “${printable(name)}”.` };
    }
    for (const [, index] of name.matchAll(INDEX)) {
      if (Number(index) > REQUEST_LIMITS.listIndex)
        return { status: 400, message: `The field “${printable(name)}” points past the end of any list on this site.` };
    }
    if (name.includes(NUL) || value.includes(NUL)) {
      return { status: 400, message: `The field “${printable(name)}” contains a NUL character, which text here cannot hold.` };
    }
    if (seen.has(name)) return { status: 400, message: `The field “${printable(name)}” was sent more than once.` };
    seen.add(name);
  }
  return null;
}

/** A name quoted back in a message: shortened, control characters shown as �. */
function printable(name: string) {
  // eslint-disable-next-line no-control-regex
  const clean = name.replace(/[\u0000-\u001f\u007f]/g, "�");
  return clean.length > 60 ? `${clean.slice(0, 57)}…` : clean;
}

/** The URL's query: short, few fields, no NUL (search boxes reach SQL as parameters). */
function checkQuery(url: URL): BoundsProblem | null {
  if (url.search.length > REQUEST_LIMITS.queryLength)
    return { status: 413, message: `The address is too long (at most ${REQUEST_LIMITS.queryLength} characters after “?”).` };
  if (url.pathname.includes("%00") || url.pathname.includes(NUL)) return { status: 400, message: "The address contains a NUL character." };
  for (const [name, value] of url.searchParams) {
    if (name.includes(NUL) || value.includes(NUL)) return { status: 400, message: `The search field “${printable(name)}” contains a NUL character.` };
  }
  if ([...url.searchParams.keys()].length > REQUEST_LIMITS.queryFields)
    return { status: 413, message: `Too many fields in the address (at most ${REQUEST_LIMITS.queryFields}).` };
  return null;
}

/**
 * Reads at most `limit` bytes of a copy of the body (the route still reads the original), or
 * null when the body is longer. The copy is dropped as soon as it passes the limit.
 */
async function readBounded(request: Request, limit: number): Promise<string | null> {
  const declared = request.headers.get("Content-Length");
  if (declared !== null && Number(declared) > limit) return null;
  const body = request.clone().body;
  if (!body) return "";
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      // Not awaited: a cancelled branch of a tee settles only once the other is cancelled too.
      reader.cancel().catch(() => {});
      return null;
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

const mediaType = (request: Request) => (request.headers.get("Content-Type") ?? "").split(";")[0].trim().toLowerCase();

/** Whatever is wrong with this request's size or shape, or null when it may go on to its route. */
export async function checkRequestBounds(request: Request): Promise<BoundsProblem | null> {
  const url = new URL(request.url);
  const queryProblem = checkQuery(url);
  if (queryProblem) return queryProblem;
  if (bodyless(request.method)) return null;

  const type = mediaType(request);
  if (type === "multipart/form-data") {
    if (!UPLOAD_PATH.test(url.pathname)) return { status: 415, message: "This address does not take file uploads." };
    const declared = Number(request.headers.get("Content-Length") ?? "0");
    if (declared > REQUEST_LIMITS.uploadBytes)
      return {
        status: 413,
        message: `Uploads are limited to ${ATTACHMENT_LIMITS.maxFilesPerSpec} files of ${ATTACHMENT_LIMITS.maxFileBytes / 1024 / 1024} MB.`,
      };
    return null;
  }
  if (type === "application/json") {
    const text = await readBounded(request, REQUEST_LIMITS.jsonBytes);
    if (text === null) return { status: 413, message: `The JSON body is too large (at most ${REQUEST_LIMITS.jsonBytes / 1024} kB).` };
    return null;
  }
  if (type === "application/x-www-form-urlencoded") {
    const text = await readBounded(request, REQUEST_LIMITS.formBytes);
    if (text === null) return { status: 413, message: `The form is too large (at most ${REQUEST_LIMITS.formBytes / 1024} kB).` };
    return checkFields(new URLSearchParams(text));
  }
  // Every form of ours says what it sends; a route could not read a body that does not.
  if (type === "") return { status: 415, message: "Say what the body is: send forms as application/x-www-form-urlencoded." };
  // Stripe's webhooks are JSON; nothing of ours takes any other kind of body.
  return { status: 415, message: `This site does not take “${printable(type)}” bodies.` };
}
