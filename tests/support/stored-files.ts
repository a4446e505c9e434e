// What the test file's own bucket in the S3 fake holds, read through the S3 API itself (not
// through the app's storage module), so a test sees what any other server would.
import { GetObjectCommand, ListObjectsV2Command } from "@aws-sdk/client-s3";
import { s3Client } from "~/services/object-store.server";
import { storageSettings } from "~/services/storage.server";

/** Every key in the bucket, sorted. */
export async function storedKeys(): Promise<string[]> {
  const client = s3Client(storageSettings());
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: storageSettings().bucket, ContinuationToken: token }));
    keys.push(...(page.Contents ?? []).map((o) => o.Key!));
    token = page.NextContinuationToken;
  } while (token);
  client.destroy();
  return keys.sort();
}

/** The bytes and type stored under `key`. */
export async function storedObject(key: string) {
  const client = s3Client(storageSettings());
  const object = await client.send(new GetObjectCommand({ Bucket: storageSettings().bucket, Key: key }));
  const bytes = await object.Body!.transformToByteArray();
  client.destroy();
  return { bytes, contentType: object.ContentType };
}
