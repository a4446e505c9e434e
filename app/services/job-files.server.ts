import {
  type FileUpload,
  FormDataParseError,
  MaxFileSizeExceededError,
  MaxFilesExceededError,
  MaxPartsExceededError,
  MultipartParseError,
  parseFormData,
} from "@remix-run/form-data-parser";
import type { Transaction } from "sequelize";
import { JobFile, User, sequelize, type Job } from "~/models/index.server";
import type { JobFileKind } from "~/models/job.server";
import { authorize, viewerOf, type Action } from "~/auth/access-policy.server";
import { record } from "./job-progress.server";
import { scopedJob } from "./job-reads.server";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { ATTACHMENT_LIMITS, cleanFileName } from "./attachments.server";
import { ACCEPTED_KINDS_TEXT, FILE_KINDS, SNIFF_BYTES, checkFileType, type FileKind } from "./file-types";
import { STORAGE_DOWN, StorageUnavailableError, fileStorage, newStorageKey, readingStorage } from "./storage.server";

// Files exchanged on a job: test certificates and the approved drawing (buyer or shop), and the
// photos of a problem with the handover (buyer). The spec's drawings' rules hold: types known by
// their first bytes, 10 MB a file, all of an upload or none. Each file keeps who uploaded it and
// when; the shop, the buyer and the account's staff read them.

export const JOB_FILE_KINDS: Record<JobFileKind, { label: string; allowed: readonly FileKind[] }> = {
  test_certificate: { label: "Test certificate", allowed: ["pdf", "png", "jpeg"] },
  approved_drawing: { label: "Approved drawing", allowed: ["pdf", "png", "jpeg", "dxf", "step"] },
  problem_photo: { label: "Photo of a problem", allowed: ["png", "jpeg"] },
};

/** At most this many files in one upload (or photos with one problem report). */
export const JOB_FILES_PER_UPLOAD = 6;
const FILES_FIELD = "files";
const STORAGE_PREFIX = "job-files";

export interface JobFileView {
  id: string;
  kind: JobFileKind;
  kindLabel: string;
  fileName: string;
  sizeBytes: number;
  uploadedAt: string;
  uploadedBy: string;
  uploadedByOrganisation: string;
  eventId: string | null;
  downloadUrl: string;
}

export interface StagedFile {
  fileName: string;
  contentType: string;
  storageKey: string;
  sizeBytes: number;
}

export async function discardStaged(staged: StagedFile[]) {
  await Promise.all(
    staged.map((f) =>
      fileStorage()
        .remove(f.storageKey)
        .catch((error) => console.error(`Could not delete ${f.storageKey}:`, error)),
    ),
  );
}

/**
 * A refused upload, with the text fields sent beside the files (the note, the kind), so a page
 * drawn again without JavaScript shows what was typed. A store that does not answer while the
 * files stream in is ours, not the sender's: a 503.
 */
export class UploadRefused extends FieldErrors {
  constructor(
    fieldErrors: Record<string, string[]>,
    public readonly typed: Record<string, string> = {},
    public readonly status: 400 | 503 = 400,
  ) {
    super(fieldErrors);
    this.name = "UploadRefused";
  }
}

/** The text fields of a parsed form: what the person typed or chose beside the files. */
export const typedIn = (fields: FormData) => Object.fromEntries([...fields].filter((entry): entry is [string, string] => typeof entry[1] === "string"));

function parseProblem(error: unknown): string {
  if (error instanceof MaxFileSizeExceededError) return `A file is larger than ${ATTACHMENT_LIMITS.maxFileBytes / 1024 / 1024} MB. Nothing was uploaded.`;
  if (error instanceof MaxFilesExceededError || error instanceof MaxPartsExceededError) {
    return `At most ${JOB_FILES_PER_UPLOAD} files go in one upload. Nothing was uploaded.`;
  }
  return "The upload could not be read. Please choose the files again.";
}

/**
 * Reads a multipart form, checking each file of the "files" field by its first bytes as it
 * arrives and storing it, then holds every file to the kinds `allowed(fields)` permits. Any
 * problem (a file or the form) is an UploadRefused on "files", after what was stored is deleted.
 */
export async function receiveJobUpload(request: Request, allowed: (fields: FormData) => readonly FileKind[], prefix = STORAGE_PREFIX) {
  const staged: (StagedFile & { kind: FileKind })[] = [];
  const problems: string[] = [];
  const handleFile = async (file: FileUpload) => {
    if (file.fieldName !== FILES_FIELD) return null;
    if (file.name === "" && file.size === 0) return null;
    const fileName = cleanFileName(file.name);
    const head = new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer());
    const check = file.size === 0 ? { ok: false as const, reason: "This file is empty (0 bytes)." } : checkFileType(fileName, head);
    if (!check.ok) problems.push(`${fileName}: ${check.reason}`);
    if (problems.length > 0 || !check.ok) return null;
    const storageKey = newStorageKey(prefix);
    // Bytes in memory (the parser holds a part of at most 10 MB anyway): every storage adapter takes them.
    const { size } = await fileStorage().put(storageKey, new Uint8Array(await file.arrayBuffer()));
    staged.push({ fileName, contentType: FILE_KINDS[check.kind].mediaType, storageKey, sizeBytes: size, kind: check.kind });
    return null;
  };
  let fields: FormData;
  try {
    const limits = { maxFileSize: ATTACHMENT_LIMITS.maxFileBytes, maxFiles: JOB_FILES_PER_UPLOAD, maxParts: JOB_FILES_PER_UPLOAD + 10 };
    fields = await parseFormData(request, limits, handleFile);
  } catch (error) {
    await discardStaged(staged);
    if (error instanceof StorageUnavailableError) {
      console.error(error);
      throw new UploadRefused({ files: [`${STORAGE_DOWN} Nothing was uploaded; please try again in a few minutes.`] }, {}, 503);
    }
    if (!(error instanceof FormDataParseError || error instanceof MultipartParseError)) throw error;
    throw new UploadRefused({ files: [parseProblem(error)] });
  }
  const kinds = allowed(fields);
  for (const f of staged) {
    if (!kinds.includes(f.kind)) {
      problems.push(`${f.fileName}: a ${FILE_KINDS[f.kind].label} can't go here; choose ${kinds.map((k) => FILE_KINDS[k].label).join(" or ")}.`);
    }
  }
  if (problems.length > 0) {
    await discardStaged(staged);
    throw new UploadRefused({ files: [...problems, "Nothing was uploaded."] }, typedIn(fields));
  }
  return { fields, staged };
}

/** Records staged files on a job inside the caller's transaction. */
export async function recordFiles(transaction: Transaction, job: Job, user: User, kind: JobFileKind, staged: StagedFile[], eventId: string | null = null) {
  return JobFile.bulkCreate(
    staged.map((f) => ({ ...f, jobId: job.id, kind, uploadedById: user.id, eventId })),
    { transaction },
  );
}

/** A job of the viewer's (404 otherwise) that they may take `action` on (the policy's refusal otherwise); locked inside a transaction. */
export async function jobForAction(user: User, jobId: string | undefined, action: Action, transaction?: Transaction) {
  const job = await scopedJob(user, jobId, transaction);
  authorize(await viewerOf(user, transaction), action, job);
  return job;
}

/** The kinds buyer and shop exchange (either may upload either). */
export type ExchangedKind = "test_certificate" | "approved_drawing";
const isExchangedKind = (kind: unknown): kind is ExchangedKind => kind === "test_certificate" || kind === "approved_drawing";

/** The kinds in the order the upload form offers them, the first chosen at the start: the shop sends test certificates, the buyer the approved drawing. */
export const exchangedKindsFor = (user: Pick<User, "role">): ExchangedKind[] =>
  user.role === "shop" ? ["test_certificate", "approved_drawing"] : ["approved_drawing", "test_certificate"];

/** A test certificate or the approved drawing, uploaded by the buyer or the shop. */
export async function uploadJobFiles(user: User, jobId: string | undefined, request: Request) {
  const job = await jobForAction(user, jobId, "job.exchangeFiles");
  const { fields, staged } = await receiveJobUpload(request, (f) => {
    const kind = f.get("kind");
    return isExchangedKind(kind) ? JOB_FILE_KINDS[kind].allowed : ACCEPTED_KIND_LIST;
  });
  const kind = fields.get("kind");
  if (!isExchangedKind(kind)) {
    await discardStaged(staged);
    throw new UploadRefused({ kind: ["Choose what the file is: a test certificate or the approved drawing."] }, typedIn(fields));
  }
  if (staged.length === 0) throw new UploadRefused({ files: [`Choose at least one ${ACCEPTED_KINDS_TEXT} file.`] }, typedIn(fields));
  let committed = false;
  try {
    await sequelize.transaction(async (transaction) => {
      const locked = await jobForAction(user, job.id, "job.exchangeFiles", transaction);
      const rows = await recordFiles(transaction, locked, user, kind, staged);
      await record(transaction, locked, user, "file_added", { detail: { kind, files: rows.map((r) => ({ id: r.id, fileName: r.fileName })) } });
    });
    committed = true;
  } finally {
    if (!committed) await discardStaged(staged);
  }
  return { kind, names: staged.map((f) => f.fileName) };
}

const ACCEPTED_KIND_LIST = Object.keys(FILE_KINDS) as FileKind[];

/** The job's files, oldest first, with who uploaded each and when. */
export async function filesOfJob(job: Pick<Job, "id">): Promise<JobFileView[]> {
  const rows = await JobFile.findAll({
    where: { jobId: job.id },
    include: [{ model: User, as: "uploadedBy", attributes: ["name"], include: ["organisation"] }],
    order: [
      ["createdAt", "ASC"],
      ["fileName", "ASC"],
    ],
  });
  return rows.map((r) => {
    const by = r.get("uploadedBy") as (User & { organisation?: { name: string } }) | undefined;
    return {
      id: r.id,
      kind: r.kind,
      kindLabel: JOB_FILE_KINDS[r.kind].label,
      fileName: r.fileName,
      sizeBytes: r.sizeBytes,
      uploadedAt: r.createdAt.toISOString(),
      uploadedBy: by?.name ?? "Someone",
      uploadedByOrganisation: by?.organisation?.name ?? "",
      eventId: r.eventId,
      downloadUrl: `/jobs/${job.id}/files/${r.id}`,
    };
  });
}

/** A job file's bytes for a reader of the job; anyone else (or a file of another job) gets a 404. */
export async function openJobFile(user: User, jobId: string | undefined, fileId: string | undefined) {
  const job = await scopedJob(user, jobId);
  const row = await JobFile.findOne({ where: { id: requireId(fileId), jobId: job.id } });
  if (!row) notFound("No such file.");
  const body = await readingStorage(() => fileStorage().get(row.storageKey));
  if (!body) notFound("This file is no longer stored.");
  return { body, fileName: row.fileName, contentType: row.contentType, sizeBytes: row.sizeBytes };
}
