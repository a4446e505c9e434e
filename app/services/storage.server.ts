import { randomUUID } from "node:crypto";
import { env } from "~/env.server";
import { ObjectStore, type ObjectStoreSettings, StorageUnavailableError } from "./object-store.server";

// Where uploaded files live: one S3-compatible object store (S3_* settings) shared by every app
// server, so a file stored through one server is read through any other. Services use only
// this small interface; keys are made here, never from a user's filename.

export { StorageUnavailableError };

/** A File or Blob (streamed, its size known) or bytes already in memory. */
export type StorageBody = Blob | Uint8Array;

export interface FileStorage {
  /** Stores the bytes under `key`; nothing is visible under the key until all of them are written. */
  put(key: string, body: StorageBody, contentType?: string): Promise<{ size: number }>;
  /** The stored bytes as a stream, or null when nothing is stored under `key`. */
  get(key: string): Promise<ReadableStream<Uint8Array> | null>;
  /** Removes the file; removing a missing key is not an error. */
  remove(key: string): Promise<void>;
}

/** Keys are ours, never a user's filename: random, lower-case, with one folder level. */
export function newStorageKey(prefix: string): string {
  const id = randomUUID();
  return `${prefix}/${id.slice(0, 2)}/${id}`;
}

/** The object store the S3_* settings name. */
export function storageSettings(): ObjectStoreSettings {
  const { S3_ENDPOINT, S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY } = env();
  return { endpoint: S3_ENDPOINT, bucket: S3_BUCKET, region: S3_REGION, accessKeyId: S3_ACCESS_KEY_ID, secretAccessKey: S3_SECRET_ACCESS_KEY };
}

let shared: FileStorage | undefined;

/** The storage every request uses. */
export function fileStorage(): FileStorage {
  shared ??= new ObjectStore(storageSettings());
  return shared;
}

/** The first words of every message about a store that does not answer. */
export const STORAGE_DOWN = "Tenderflow cannot reach its file store just now.";

/**
 * Runs a read of stored files for a download; a store that does not answer becomes a 503 in
 * plain words (people reach a download by following a link, so no JSON), and the error itself
 * goes to the server log.
 */
export async function readingStorage<T>(read: () => Promise<T>): Promise<T> {
  try {
    return await read();
  } catch (error) {
    if (!(error instanceof StorageUnavailableError)) throw error;
    console.error(error);
    throw new Response(`${STORAGE_DOWN} Please try again in a few minutes.`, {
      status: 503,
      headers: { "Content-Type": "text/plain; charset=utf-8", "X-Content-Type-Options": "nosniff", "Retry-After": "60" },
    });
  }
}
