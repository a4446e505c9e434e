import { Readable } from "node:stream";
import type { ReadableStream as WebReadableStream } from "node:stream/web";
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";

// Files in an S3-compatible object store through the standard S3 API: AWS S3 itself, or any
// service that speaks it (the local fake, s3rver, in `npm start` and the tests).

export interface ObjectStoreSettings {
  /** Unset means AWS S3 itself; else the service's address, e.g. http://127.0.0.1:4569. */
  endpoint?: string;
  bucket: string;
  region: string;
  /** Both or neither: without them the SDK's own chain applies (AWS_* variables, an instance role). */
  accessKeyId?: string;
  secretAccessKey?: string;
}

/** The store did not answer, or answered with a failure: our fault, never the sender's. */
export class StorageUnavailableError extends Error {
  constructor(action: string, key: string, cause: unknown) {
    super(`File storage failed to ${action} ${key}: ${cause instanceof Error ? cause.message : String(cause)}`, { cause });
    this.name = "StorageUnavailableError";
  }
}

export function s3Client(settings: ObjectStoreSettings): S3Client {
  const { endpoint, region, accessKeyId, secretAccessKey } = settings;
  return new S3Client({
    endpoint,
    region,
    // A service of our own is reached by address; AWS prefers the bucket in the host name.
    forcePathStyle: Boolean(endpoint),
    credentials: accessKeyId && secretAccessKey ? { accessKeyId, secretAccessKey } : undefined,
    // Checksums only where S3 requires them: the default (a CRC trailer in aws-chunked bodies) is
    // stored by s3rver as part of the file, framing and all. Uploads are checked by their first
    // bytes and sizes already.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    // A store that does not answer fails the request in seconds, not at the socket's default.
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 30_000 },
    maxAttempts: 2,
  });
}

/** Creates the bucket when it is missing: for the local stack and the tests, whose store starts empty. */
export async function ensureBucket(settings: ObjectStoreSettings) {
  const client = s3Client(settings);
  try {
    await client.send(new HeadBucketCommand({ Bucket: settings.bucket }));
  } catch (error) {
    if (!(error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404)) throw error;
    await client.send(new CreateBucketCommand({ Bucket: settings.bucket }));
  } finally {
    client.destroy();
  }
}

/** Runs one call to the store; whatever goes wrong becomes a StorageUnavailableError. */
async function attempt<T>(action: string, key: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    throw new StorageUnavailableError(action, key, error);
  }
}

export class ObjectStore {
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(settings: ObjectStoreSettings) {
    this.client = s3Client(settings);
    this.bucket = settings.bucket;
  }

  /** S3 makes an object visible only once all its bytes arrived, so a failed upload leaves nothing. */
  async put(key: string, body: Blob | Uint8Array, contentType?: string) {
    // A Blob (an uploaded File) streams with its known length; S3 wants the length up front.
    const size = body instanceof Uint8Array ? body.byteLength : body.size;
    const stream = body instanceof Uint8Array ? body : Readable.fromWeb(body.stream() as WebReadableStream<Uint8Array>);
    await attempt("store", key, () =>
      this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: stream, ContentLength: size, ContentType: contentType })),
    );
    return { size };
  }

  async get(key: string): Promise<ReadableStream<Uint8Array> | null> {
    try {
      const object = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return object.Body ? (object.Body.transformToWebStream() as ReadableStream<Uint8Array>) : null;
    } catch (error) {
      if (error instanceof NoSuchKey) return null;
      throw new StorageUnavailableError("read", key, error);
    }
  }

  /** Deleting a missing key succeeds in S3, as it should here. */
  async remove(key: string) {
    await attempt("delete", key, () => this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key })));
  }
}
