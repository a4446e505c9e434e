import { contentDisposition } from "./attachments.server";

// One answer for every stored file a person downloads (a spec's drawings, a job's files, an
// offer's documents): the type sniffed at upload, the browser told not to guess another, and the
// file always saved rather than shown inside our origin.
export function storedFileResponse(file: { body: ReadableStream<Uint8Array>; fileName: string; contentType: string; sizeBytes: number }) {
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
