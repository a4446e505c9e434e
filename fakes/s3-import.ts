// Before uploads moved to object storage, `npm start` kept them on disk in .data/uploads, each at
// its storage key as a path. They are copied into the S3 fake's bucket once, under the same
// keys, so the rows that name them keep working; the folder is then renamed, not deleted.
import { existsSync } from "node:fs";
import { readFile, readdir, rename } from "node:fs/promises";
import path from "node:path";
import { ObjectStore, type ObjectStoreSettings } from "../app/services/object-store.server";

/** Copies the files of `folder` into the bucket; how many were copied (0 when there is no folder). */
export async function importLocalUploads(folder: string, settings: ObjectStoreSettings): Promise<number> {
  if (!existsSync(folder)) return 0;
  const store = new ObjectStore(settings);
  // A ".partial" file is an upload that never finished: no row names it.
  const files = (await readdir(folder, { recursive: true, withFileTypes: true })).filter((e) => e.isFile() && !e.name.endsWith(".partial"));
  for (const file of files) {
    const full = path.join(file.parentPath, file.name);
    await store.put(path.relative(folder, full).split(path.sep).join("/"), await readFile(full));
  }
  await rename(folder, `${folder}-copied-to-s3`);
  return files.length;
}
