// npm start copies uploads that an older checkout kept on disk into the S3 fake, once.
import { existsSync } from "node:fs";
import { mkdir, mkdtemp, rm, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { storageSettings } from "~/services/storage.server";
import { importLocalUploads } from "../../fakes/s3-import";
import { PDF_BYTES, PNG_BYTES } from "../support/attachment-files";
import { storedKeys, storedObject } from "../support/stored-files";

const root = await mkdtemp(path.join(os.tmpdir(), "tenderflow-uploads-"));
afterAll(() => rm(root, { recursive: true, force: true }));

describe("importing .data/uploads into the bucket", () => {
  it("stores each finished file under its path as the key, skips unfinished ones, and renames the folder", async () => {
    const folder = path.join(root, "uploads");
    await mkdir(path.join(folder, "spec-attachments", "ab"), { recursive: true });
    await mkdir(path.join(folder, "spec-attachments", "cd"), { recursive: true });
    await writeFile(path.join(folder, "spec-attachments", "ab", "ab12-drawing"), PDF_BYTES);
    await writeFile(path.join(folder, "spec-attachments", "cd", "cd34-photo"), PNG_BYTES);
    await writeFile(path.join(folder, "spec-attachments", "cd", "cd56-photo.0f1e.partial"), PNG_BYTES);

    expect(await importLocalUploads(folder, storageSettings())).toBe(2);
    const keys = await storedKeys();
    expect(keys).toEqual(expect.arrayContaining(["spec-attachments/ab/ab12-drawing", "spec-attachments/cd/cd34-photo"]));
    expect(keys.some((k) => k.includes("partial"))).toBe(false);
    expect((await storedObject("spec-attachments/cd/cd34-photo")).bytes).toEqual(PNG_BYTES);
    expect(existsSync(folder)).toBe(false);
    expect(existsSync(`${folder}-copied-to-s3`)).toBe(true);

    // The next start finds no folder and copies nothing.
    expect(await importLocalUploads(folder, storageSettings())).toBe(0);
  });
});
