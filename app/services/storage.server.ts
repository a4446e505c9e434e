import { randomUUID } from "node:crypto";
import { createWriteStream } from "node:fs";
import { mkdir, open, rename, rm } from "node:fs/promises";
import path from "node:path";
import { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ReadableStream as WebReadableStream } from "node:stream/web";
import { env } from "~/env.server";

// Where uploaded files live. App servers keep no files of their own in production, so the
// services talk to this interface only; local disk serves development and tests, and an
// object-storage implementation can take its place without touching the callers.

export type StorageBody = ReadableStream<Uint8Array> | Uint8Array;

export interface FileStorage {
  /** Stores the bytes under `key`; nothing is visible under the key until all of them are written. */
  put(key: string, body: StorageBody): Promise<{ size: number }>;
  /** The stored bytes, or null when nothing is stored under `key`. */
  get(key: string): Promise<ReadableStream<Uint8Array> | null>;
  /** Removes the file; removing a missing key is not an error. */
  remove(key: string): Promise<void>;
}

/** Keys are ours, never a user's filename: random, lower-case, with one folder level. */
export function newStorageKey(prefix: string): string {
  const id = randomUUID();
  return `${prefix}/${id.slice(0, 2)}/${id}`;
}

const SAFE_KEY = /^[a-z0-9][a-z0-9-]*(?:\/[a-z0-9][a-z0-9-]*)*$/;

class LocalDiskStorage implements FileStorage {
  readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  // A key that could climb out of the root is a programming error, caught before any I/O.
  private pathOf(key: string) {
    if (!SAFE_KEY.test(key)) throw new Error(`Invalid storage key: ${key}`);
    return path.join(this.root, ...key.split("/"));
  }

  async put(key: string, body: StorageBody) {
    const target = this.pathOf(key);
    await mkdir(path.dirname(target), { recursive: true });
    // Written beside the target and renamed at the end, so a failed upload leaves no half file.
    const partial = `${target}.${randomUUID()}.partial`;
    let size = 0;
    const counter = new Transform({
      transform(chunk: Buffer, _encoding, done) {
        size += chunk.length;
        done(null, chunk);
      },
    });
    const source = body instanceof Uint8Array ? Readable.from([body]) : Readable.fromWeb(body as WebReadableStream<Uint8Array>);
    try {
      await pipeline(source, counter, createWriteStream(partial, { flags: "wx" }));
      await rename(partial, target);
    } catch (error) {
      await rm(partial, { force: true });
      throw error;
    }
    return { size };
  }

  async get(key: string) {
    try {
      const handle = await open(this.pathOf(key), "r");
      return Readable.toWeb(handle.createReadStream()) as ReadableStream<Uint8Array>;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw error;
    }
  }

  async remove(key: string) {
    await rm(this.pathOf(key), { force: true });
  }
}

let shared: { root: string; storage: FileStorage } | undefined;

/** The storage every request uses, configured by UPLOAD_DIR. */
export function fileStorage(): FileStorage {
  const root = env().UPLOAD_DIR;
  if (shared?.root !== root) shared = { root, storage: new LocalDiskStorage(root) };
  return shared.storage;
}
