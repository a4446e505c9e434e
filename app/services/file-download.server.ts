import { contentDisposition } from "./attachments.server";

/**
 * One answer for every file a person downloads (a spec's drawings, a job's files, an offer's
 * documents, the order PDF, the workbooks): the browser told not to guess another type, the file
 * always saved rather than shown, and, should a browser show it anyway, sandboxed with nothing
 * allowed, so a crafted file can never run as a page of our origin. The root middleware keeps
 * this CSP instead of the pages' own.
 */
export function downloadResponse(body: BodyInit, file: { fileName: string; contentType: string; sizeBytes: number }) {
  return new Response(body, {
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

/** A stored file, its bytes streamed from the object store, with the type sniffed at upload. */
export function storedFileResponse(file: { body: ReadableStream<Uint8Array>; fileName: string; contentType: string; sizeBytes: number }) {
  return downloadResponse(file.body, file);
}
