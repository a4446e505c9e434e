// File names for downloaded workbooks, built from a spec's title and revision. A title is typed
// by a buyer, so anything a file system refuses is taken out here: Windows forbids / \ : * ? " <
// > | and control characters, names ending in a dot or space, and device names such as CON or
// COM1; most file systems stop at 255 bytes. Non-ASCII letters stay: the download's header
// carries them in an RFC 5987 filename* beside an ASCII fallback (contentDisposition).

// eslint-disable-next-line no-control-regex -- control characters are among what a file name may not hold
const FORBIDDEN = /[/\\:*?"<>|\u0000-\u001f\u007f-\u009f]/g;
const WINDOWS_DEVICES = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\..*)?$/i;
/** Characters of the title kept; with the suffix the name stays far below 255 bytes of UTF-8. */
const TITLE_LIMIT = 80;

/** A title made safe as (part of) a file name on every common OS. */
export function safeFileStem(text: string, fallback = "Untitled spec"): string {
  let stem = text.normalize("NFC").replace(FORBIDDEN, " ").replace(/\s+/g, " ").trim();
  // Cut by code points, so a letter outside the BMP is never split in half.
  stem = Array.from(stem).slice(0, TITLE_LIMIT).join("");
  stem = stem.replace(/[. ]+$/, "").replace(/^[. ]+/, "");
  if (!stem) return fallback;
  return WINDOWS_DEVICES.test(stem) ? `${stem} spec` : stem;
}

/** "Bending press, main ram - rev 2 - bill of materials.xlsx" */
export function workbookFileName(title: string, revision: number, what: string): string {
  return `${safeFileStem(title)} - rev ${revision} - ${what}.xlsx`;
}
