// A local S3-compatible object store for `npm start` and the tests: s3rver on 127.0.0.1, its
// buckets kept as plain folders under `directory`. The app reaches it through the same S3 API
// (and settings) it uses for a real store.
import S3rver from "s3rver";
import { ensureBucket, type ObjectStoreSettings } from "../app/services/object-store.server";

// s3rver's own built-in account: it checks request signatures against this pair.
const FAKE_KEY = "S3RVER";

/** The S3_* settings an app server needs to use the fake (bucket included). */
export type S3FakeEnv = Record<"S3_ENDPOINT" | "S3_BUCKET" | "S3_REGION" | "S3_ACCESS_KEY_ID" | "S3_SECRET_ACCESS_KEY", string>;

export interface S3Fake {
  url: string;
  env: S3FakeEnv;
  settings: ObjectStoreSettings;
  close(): Promise<void>;
}

/** Starts the store (port 0 picks a free one) and creates `bucket` in it unless it is there. */
export async function startS3Fake({ port = 0, directory, bucket }: { port?: number; directory: string; bucket: string }): Promise<S3Fake> {
  // The SDK is pinned to its last release for Node 20 on purpose; its notice about later releases
  // would otherwise repeat in every process this one starts.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
  const server = new S3rver({ port, address: "127.0.0.1", silent: true, directory });
  const address = await server.run();
  const url = `http://127.0.0.1:${address.port}`;
  const settings: ObjectStoreSettings = { endpoint: url, bucket, region: "us-east-1", accessKeyId: FAKE_KEY, secretAccessKey: FAKE_KEY };
  await ensureBucket(settings);
  return {
    url,
    settings,
    env: { S3_ENDPOINT: url, S3_BUCKET: bucket, S3_REGION: settings.region, S3_ACCESS_KEY_ID: FAKE_KEY, S3_SECRET_ACCESS_KEY: FAKE_KEY },
    close: () => server.close(),
  };
}
