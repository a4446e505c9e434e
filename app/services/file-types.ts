// Which drawings and photos a spec accepts, recognised by their first bytes rather than trusted
// from the name or the browser's guess. Pure: the upload service and the uploader share it.

export type FileKind = "pdf" | "png" | "jpeg" | "dxf" | "step";

export interface FileKindInfo {
  label: string;
  /** Sent as Content-Type on download: always ours, never the uploader's. */
  mediaType: string;
  extensions: readonly string[];
}

export const FILE_KINDS: Record<FileKind, FileKindInfo> = {
  pdf: { label: "PDF", mediaType: "application/pdf", extensions: [".pdf"] },
  png: { label: "PNG image", mediaType: "image/png", extensions: [".png"] },
  jpeg: { label: "JPEG photo", mediaType: "image/jpeg", extensions: [".jpg", ".jpeg"] },
  dxf: { label: "DXF drawing", mediaType: "image/vnd.dxf", extensions: [".dxf"] },
  step: { label: "STEP model", mediaType: "model/step", extensions: [".step", ".stp"] },
};

/** For `<input type="file" accept>`: a hint to the file picker, not a check. */
export const ACCEPTED_EXTENSIONS = Object.values(FILE_KINDS).flatMap((k) => k.extensions);
export const ACCEPT_ATTRIBUTE = ACCEPTED_EXTENSIONS.join(",");
export const ACCEPTED_KINDS_TEXT = "PDF, PNG, JPEG, DXF or STEP";

/** How many leading bytes sniffing needs (an ASCII DXF may open with a comment line). */
export const SNIFF_BYTES = 512;

const startsWith = (head: Uint8Array, signature: readonly number[], offset = 0) =>
  head.length >= offset + signature.length && signature.every((byte, i) => head[offset + i] === byte);

const ascii = (text: string) => Array.from(text, (c) => c.charCodeAt(0));

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG_SOI = [0xff, 0xd8, 0xff];
const PDF_HEADER = ascii("%PDF-");
const BINARY_DXF_SENTINEL = ascii("AutoCAD Binary DXF\r\n\x1a\x00");

// Text formats may begin with a UTF-8 byte-order mark and blank space.
// ASCII DXF: pairs of lines, a group code then a value; the first section is opened by
// code 0 "SECTION", possibly after 999 comment pairs.
const ASCII_DXF = /^\uFEFF?(?:\s*999\r?\n[^\r\n]*\r?\n)*\s*0\r?\nSECTION\r?\n/;
const STEP_HEADER = /^\uFEFF?\s*ISO-10303-21;/;

/** The kind the bytes show, or null when they are none of the accepted formats. */
export function sniffFileKind(head: Uint8Array): FileKind | null {
  if (startsWith(head, PNG_SIGNATURE)) return "png";
  if (startsWith(head, JPEG_SOI)) return "jpeg";
  if (startsWith(head, PDF_HEADER)) return "pdf";
  if (startsWith(head, BINARY_DXF_SENTINEL)) return "dxf";
  // A NUL byte means binary: never one of the text formats below.
  if (head.includes(0)) return null;
  const text = new TextDecoder("utf-8", { fatal: false }).decode(head.subarray(0, SNIFF_BYTES));
  if (ASCII_DXF.test(text)) return "dxf";
  if (STEP_HEADER.test(text)) return "step";
  return null;
}

/** The lower-case extension with its dot ("" when the name has none). */
export function extensionOf(fileName: string): string {
  const dot = fileName.lastIndexOf(".");
  return dot > 0 ? fileName.slice(dot).toLowerCase() : "";
}

export type FileCheck = { ok: true; kind: FileKind } | { ok: false; reason: string };

/**
 * A file is accepted when its extension is an accepted one and its content is of that same kind,
 * so a renamed program or a photo saved as ".pdf" is refused with a reason a person understands.
 */
export function checkFileType(fileName: string, head: Uint8Array): FileCheck {
  const extension = extensionOf(fileName);
  const named = (Object.keys(FILE_KINDS) as FileKind[]).find((k) => FILE_KINDS[k].extensions.includes(extension));
  if (!named) {
    const shown = extension ? `"${extension}" files` : "Files without an extension";
    return { ok: false, reason: `${shown} can't be attached. Choose a ${ACCEPTED_KINDS_TEXT} file.` };
  }
  const found = sniffFileKind(head);
  if (found === named) return { ok: true, kind: found };
  if (found) {
    return {
      ok: false,
      reason: `The name ends in ${extension} but the file is a ${FILE_KINDS[found].label}. Rename it to ${FILE_KINDS[found].extensions[0]} and try again.`,
    };
  }
  return { ok: false, reason: `The name ends in ${extension} but the content is not a ${FILE_KINDS[named].label}. Is the file damaged or of another type?` };
}
