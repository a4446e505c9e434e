// Runs the S3 fake on its own, for `npm run dev`: `npx tsx fakes/s3-main.ts`. It keeps its files
// in .data/s3, where `npm start` keeps them, so both see the same uploads.
import path from "node:path";
import { startS3Fake } from "./s3";

const fake = await startS3Fake({
  port: Number(process.env.TENDERFLOW_S3_PORT ?? 4569),
  directory: path.resolve(import.meta.dirname, "..", ".data", "s3"),
  bucket: process.env.S3_BUCKET ?? "tenderflow-files",
});
console.log(
  `S3 fake on ${fake.url}. Set for the app:\n${Object.entries(fake.env)
    .map(([k, v]) => `  ${k}=${v}`)
    .join("\n")}`,
);

const stop = async () => {
  await fake.close();
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
