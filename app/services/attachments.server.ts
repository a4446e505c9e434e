import {
  type FileUpload,
  FormDataParseError,
  MaxFileSizeExceededError,
  MaxFilesExceededError,
  MaxPartsExceededError,
  MaxTotalSizeExceededError,
  MultipartParseError,
  parseFormData,
} from "@remix-run/form-data-parser";
import type { Transaction } from "sequelize";
import { Spec, SpecAttachment, sequelize } from "~/models/index.server";
import type { User } from "~/models/index.server";
import { notFound, requireId } from "./errors.server";
import { ACCEPTED_KINDS_TEXT, FILE_KINDS, SNIFF_BYTES, checkFileType, extensionOf } from "./file-types";
import { specForReader, specOfOwner } from "./spec-access.server";
import { STORAGE_DOWN, StorageUnavailableError, fileStorage, newStorageKey, readingStorage } from "./storage.server";

// Drawings and photos of a spec. Files are checked while the request streams in, stored under
// random keys, and recorded only when the whole upload is acceptable: a request either attaches
// all its files or none, so a refused upload leaves neither rows nor files behind.

const MB = 1024 * 1024;

/** The one place for the upload limits; the uploader receives them as a prop. */
export const ATTACHMENT_LIMITS = { maxFileBytes: 10 * MB, maxFilesPerSpec: 10 } as const;
export type AttachmentLimits = { maxFileBytes: number; maxFilesPerSpec: number };

/** The multipart field that carries the files. */
const FILES_FIELD = "files";

const MAX_NAME_LENGTH = 200; // spec_attachments.file_name
const STORAGE_PREFIX = "spec-attachments";

export interface AttachmentView {
  id: string;
  fileName: string;
  kindLabel: string;
  sizeBytes: number;
  uploadedAt: string;
  downloadUrl: string;
}

/** A refusal in plain words; fileName is null when the parser could not tell which file. */
export interface FileProblem {
  fileName: string | null;
  message: string;
}

export interface AttachmentFormResult {
  status: 200 | 400 | 409 | 503;
  attachments: AttachmentView[];
  errors: FileProblem[];
  /** One sentence saying what happened, for a status line or a toast. */
  summary: string;
}

const attachmentUrl = (specId: string, attachmentId: string) => `/specs/${specId}/attachments/${attachmentId}`;

const megabytes = (bytes: number) => `${Math.round(bytes / MB)} MB`;
const NOT_DRAFT = "Files can only be added or removed while the spec is a draft. This spec has been published.";

/**
 * A filename fit for display and for a download's name: no folders, no control or
 * direction-changing characters, none of the characters Windows refuses, at most 200 characters
 * with the extension kept.
 */
export function cleanFileName(raw: string): string {
  const base = raw.split(/[\\/]/).pop() ?? "";
  const cleaned = base
    .normalize("NFC")
    // eslint-disable-next-line no-control-regex -- removing control characters is the point
    .replace(/[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u202a-\u202e\u2066-\u2069\ufeff]/g, "")
    .replace(/["*:<>?|]/g, "_")
    .replace(/\s+/g, " ")
    .trim()
    .replace(/^\.+/, "");
  const chars = Array.from(cleaned);
  if (chars.length === 0) return "file";
  if (chars.length <= MAX_NAME_LENGTH) return cleaned;
  const extension = Array.from(extensionOf(cleaned)).slice(0, 10);
  return (
    chars
      .slice(0, MAX_NAME_LENGTH - extension.length)
      .join("")
      .trimEnd() + extension.join("")
  );
}

/** `attachment` with an ASCII fallback name and the exact name as RFC 6266 filename*. */
export function contentDisposition(fileName: string): string {
  const fallback = fileName
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^\x20-\x7e]|["\\%]/g, "_");
  // encodeURIComponent leaves ' ( ) * as they are; RFC 8187 wants them encoded.
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}

/** A stored file as a page lists it (a spec's drawing, an offer's document), with where to download it. */
export function storedFileView(row: Pick<SpecAttachment, "id" | "fileName" | "contentType" | "sizeBytes" | "createdAt">, downloadUrl: string): AttachmentView {
  const kind = Object.values(FILE_KINDS).find((k) => k.mediaType === row.contentType);
  return {
    id: row.id,
    fileName: row.fileName,
    kindLabel: kind?.label ?? "File",
    sizeBytes: row.sizeBytes,
    uploadedAt: row.createdAt.toISOString(),
    downloadUrl,
  };
}

const toView = (row: SpecAttachment) => storedFileView(row, attachmentUrl(row.specId, row.id));

// Files of one upload can share a timestamp; their names order them then.
const rowsOf = (specId: string, transaction?: Transaction) =>
  SpecAttachment.findAll({
    where: { specId },
    order: [
      ["createdAt", "ASC"],
      ["fileName", "ASC"],
      ["id", "ASC"],
    ],
    transaction,
  });

/** The files of a spec the user may read (its owner; shops once published). */
export async function listAttachments(user: User, specId: string | undefined): Promise<AttachmentView[]> {
  const spec = await specForReader(user, specId);
  return (await rowsOf(spec.id)).map(toView);
}

interface StagedFile {
  fileName: string;
  contentType: string;
  storageKey: string;
  sizeBytes: number;
}

async function outcome(
  spec: Spec,
  status: AttachmentFormResult["status"],
  errors: FileProblem[],
  summary: string,
  transaction?: Transaction,
): Promise<AttachmentFormResult> {
  return { status, attachments: (await rowsOf(spec.id, transaction)).map(toView), errors, summary };
}

/** Deletes a stored file whose row is gone (or never made): a failure leaves litter in the store, never a broken link, so it is logged, not raised. */
async function forget(storageKey: string) {
  await fileStorage()
    .remove(storageKey)
    .catch((error) => console.error(`Could not delete stored file ${storageKey}:`, error));
}

async function discard(staged: StagedFile[]) {
  await Promise.all(staged.map((f) => forget(f.storageKey)));
}

/** What a refused parse means for the person who sent it. */
function parseProblem(error: unknown): FileProblem {
  const { maxFileBytes, maxFilesPerSpec } = ATTACHMENT_LIMITS;
  if (error instanceof MaxFileSizeExceededError) {
    return { fileName: null, message: `A file is larger than ${megabytes(maxFileBytes)}, the most a single file may be. Nothing was attached.` };
  }
  if (error instanceof MaxFilesExceededError || error instanceof MaxPartsExceededError) {
    return { fileName: null, message: `A spec holds at most ${maxFilesPerSpec} files. Choose fewer files. Nothing was attached.` };
  }
  if (error instanceof MaxTotalSizeExceededError) {
    return { fileName: null, message: `The upload is larger than ${maxFilesPerSpec} files of ${megabytes(maxFileBytes)}. Nothing was attached.` };
  }
  return { fileName: null, message: "The upload could not be read. Please choose the files again." };
}

/**
 * Reads the form, checking and storing each file as it arrives. Files after the first problem
 * are still checked (so each gets its own message) but no longer stored.
 */
async function receiveForm(request: Request, freeSlots: number) {
  const { maxFileBytes, maxFilesPerSpec } = ATTACHMENT_LIMITS;
  const staged: StagedFile[] = [];
  const errors: FileProblem[] = [];
  let accepted = 0;

  const handleFile = async (file: FileUpload) => {
    if (file.fieldName !== FILES_FIELD) return null;
    // A file input with nothing chosen still sends an unnamed, empty part.
    if (file.name === "" && file.size === 0) return null;
    const fileName = cleanFileName(file.name);
    if (file.size === 0) {
      errors.push({ fileName, message: "This file is empty (0 bytes). Choose the saved drawing or photo itself." });
      return null;
    }
    const head = new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer());
    const check = checkFileType(fileName, head);
    if (!check.ok) {
      errors.push({ fileName, message: check.reason });
      return null;
    }
    if (++accepted > freeSlots) {
      errors.push({
        fileName,
        message: `Not attached: a spec holds at most ${maxFilesPerSpec} files${freeSlots > 0 ? `, so only ${freeSlots} more fit` : " and this one is full"}. Remove a file first.`,
      });
      return null;
    }
    if (errors.length > 0) return null;
    const storageKey = newStorageKey(STORAGE_PREFIX);
    // The parser holds a part in memory (at most maxFileBytes) until this handler returns; it
    // streams on to the store with its length known.
    const contentType = FILE_KINDS[check.kind].mediaType;
    const { size } = await fileStorage().put(storageKey, file, contentType);
    staged.push({ fileName, contentType, storageKey, sizeBytes: size });
    return null;
  };

  try {
    // The parser stops reading as soon as a part passes the size limit. One file more than a spec
    // holds is let through so that it can be refused by name; beyond that the request is refused.
    const fields = await parseFormData(request, { maxFileSize: maxFileBytes, maxFiles: maxFilesPerSpec + 1, maxParts: maxFilesPerSpec + 20 }, handleFile);
    return { fields, staged, errors, status: 400 as const };
  } catch (error) {
    await discard(staged);
    if (error instanceof StorageUnavailableError) {
      console.error(error);
      return {
        fields: null,
        staged: [],
        errors: [{ fileName: null, message: `${STORAGE_DOWN} Nothing was attached; please try again in a few minutes.` }],
        status: 503 as const,
      };
    }
    // Anything else is ours, not the sender's: it stays a 500.
    if (!(error instanceof FormDataParseError || error instanceof MultipartParseError)) throw error;
    return { fields: null, staged: [], errors: [...errors, parseProblem(error)], status: 400 as const };
  }
}

/** Locks the spec row so uploads, removals and publishing of one spec happen one at a time. */
const lockedSpec = (specId: string, transaction: Transaction) => Spec.findByPk(specId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });

async function attach(user: User, spec: Spec, staged: StagedFile[]): Promise<AttachmentFormResult> {
  const { maxFilesPerSpec } = ATTACHMENT_LIMITS;
  let committed = false;
  try {
    const result = await sequelize.transaction(async (transaction) => {
      const current = await lockedSpec(spec.id, transaction);
      if (current.status !== "draft") return outcome(spec, 409, [{ fileName: null, message: NOT_DRAFT }], "Nothing was attached.");
      const held = await SpecAttachment.count({ where: { specId: spec.id }, transaction });
      // Another upload may have finished while this one streamed in.
      if (held + staged.length > maxFilesPerSpec) {
        const over = staged.slice(Math.max(maxFilesPerSpec - held, 0));
        return outcome(
          spec,
          400,
          over.map((f) => ({ fileName: f.fileName, message: `Not attached: a spec holds at most ${maxFilesPerSpec} files.` })),
          "Nothing was attached.",
        );
      }
      await SpecAttachment.bulkCreate(
        staged.map((f) => ({ ...f, specId: spec.id, uploadedById: user.id })),
        { transaction },
      );
      const names = staged.map((f) => f.fileName);
      return outcome(spec, 200, [], names.length === 1 ? `Attached ${names[0]}.` : `Attached ${names.length} files: ${names.join(", ")}.`, transaction);
    });
    committed = result.status === 200;
    return result;
  } finally {
    // Files are kept only when their rows committed.
    if (!committed) await discard(staged);
  }
}

async function detach(spec: Spec, attachmentId: string | undefined): Promise<AttachmentFormResult> {
  const id = requireId(attachmentId);
  const removed = await sequelize.transaction(async (transaction) => {
    const current = await lockedSpec(spec.id, transaction);
    const row = await SpecAttachment.findOne({ where: { id, specId: spec.id }, transaction });
    if (!row) notFound("No such file.");
    if (current.status !== "draft") return null;
    await row.destroy({ transaction });
    return row;
  });
  if (!removed) return outcome(spec, 409, [{ fileName: null, message: NOT_DRAFT }], "Nothing was removed.");
  await forget(removed.storageKey);
  return outcome(spec, 200, [], `Removed ${removed.fileName}.`);
}

/**
 * Handles the attachments form of a spec the user's organisation owns: intent "upload" with
 * files in the "files" field, or intent "remove" with an attachmentId. Others' specs are a 404.
 */
export async function submitAttachmentForm(user: User, specId: string | undefined, request: Request): Promise<AttachmentFormResult> {
  const spec = await specOfOwner(user, specId);
  // Refused before the body is read: a published spec's files are fixed.
  if (spec.status !== "draft") return outcome(spec, 409, [{ fileName: null, message: NOT_DRAFT }], "Nothing was changed.");
  const held = await SpecAttachment.count({ where: { specId: spec.id } });
  const { fields, staged, errors, status } = await receiveForm(request, ATTACHMENT_LIMITS.maxFilesPerSpec - held);
  const intent = fields?.get("intent");
  const refuse = async (problems: FileProblem[], summary: string) => {
    await discard(staged);
    return outcome(spec, status, problems, summary);
  };

  if (errors.length > 0) return refuse(errors, "Nothing was attached.");
  if (intent === "remove") {
    await discard(staged);
    return detach(spec, fields?.get("attachmentId")?.toString());
  }
  if (intent !== "upload") return refuse([{ fileName: null, message: "Choose files to attach or a file to remove." }], "Nothing was changed.");
  if (staged.length === 0) return refuse([{ fileName: null, message: `Choose at least one ${ACCEPTED_KINDS_TEXT} file to attach.` }], "Nothing was attached.");
  return attach(user, spec, staged);
}

export interface OpenedAttachment {
  body: ReadableStream<Uint8Array>;
  fileName: string;
  contentType: string;
  sizeBytes: number;
}

/** A file's bytes for a reader of its spec; a missing file is as "not found" as a missing row. */
export async function openAttachment(user: User, specId: string | undefined, attachmentId: string | undefined): Promise<OpenedAttachment> {
  const spec = await specForReader(user, specId);
  const row = await SpecAttachment.findOne({ where: { id: requireId(attachmentId), specId: spec.id } });
  if (!row) notFound("No such file.");
  const body = await readingStorage(() => fileStorage().get(row.storageKey));
  if (!body) notFound("This file is no longer stored.");
  return { body, fileName: row.fileName, contentType: row.contentType, sizeBytes: row.sizeBytes };
}

/** Deletes every file of a draft, for when the draft itself is deleted (rows cascade, files don't). */
export async function removeAllAttachments(user: User, specId: string | undefined): Promise<void> {
  const spec = await specOfOwner(user, specId);
  const rows = await rowsOf(spec.id);
  await SpecAttachment.destroy({ where: { specId: spec.id } });
  await Promise.all(rows.map((r) => forget(r.storageKey)));
}
