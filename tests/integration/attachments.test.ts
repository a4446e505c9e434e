import { createHash } from "node:crypto";
import { beforeEach, describe, expect, it } from "vitest";
import * as attachments from "~/routes/spec-attachments";
import * as download from "~/routes/spec-attachment-download";
import { type Spec, SpecAttachment } from "~/models/index.server";
import { ATTACHMENT_LIMITS, cleanFileName, contentDisposition, removeAllAttachments } from "~/services/attachments.server";
import { PDF_BYTES, PNG_BYTES, downloadedBytes, draftOf, pdf, png, ownDraft, postAttachments, removeForm, uploadForm } from "../support/attachment-files";
import { makeMember } from "../support/factories";
import { Visitor, call } from "../support/routes";
import { signedIn } from "../support/sessions";
import { storedKeys as storedFiles, storedObject } from "../support/stored-files";

const sha256 = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

function fetchFile(visitor: Visitor, specId: string, attachmentId: string) {
  return call(download.loader, visitor.request(`/specs/${specId}/attachments/${attachmentId}`), { specId, attachmentId });
}

describe("uploading drawings and photos to a draft", () => {
  it("stores each file in the bucket under a random key, records it and lists it", async () => {
    const { buyer, owner: visitor, spec } = await ownDraft();

    const res = await postAttachments(visitor, spec.id, uploadForm(pdf("Press frame.pdf"), png("site photo.png")));
    expect(res.status).toBe(200);
    expect(res.data.errors).toEqual([]);
    expect(res.data.attachments.map((a: { fileName: string; kindLabel: string; sizeBytes: number }) => [a.fileName, a.kindLabel, a.sizeBytes])).toEqual([
      ["Press frame.pdf", "PDF", PDF_BYTES.length],
      ["site photo.png", "PNG image", PNG_BYTES.length],
    ]);

    const rows = await SpecAttachment.findAll({ where: { specId: spec.id }, order: [["fileName", "ASC"]] });
    expect(rows.map((r) => [r.contentType, r.uploadedById])).toEqual([
      ["application/pdf", buyer.id],
      ["image/png", buyer.id],
    ]);
    const files = await storedFiles();
    for (const row of rows) expect(files).toContain(row.storageKey);
    for (const row of rows) expect(row.storageKey).not.toMatch(/press|photo|\.pdf|\.png/i);
    expect(await storedObject(rows[0].storageKey)).toEqual({ bytes: PDF_BYTES, contentType: "application/pdf" });
    expect(await storedObject(rows[1].storageKey)).toEqual({ bytes: PNG_BYTES, contentType: "image/png" });

    const list = await call(attachments.loader, visitor.request(`/specs/${spec.id}/attachments`), { specId: spec.id });
    expect(list.data.attachments.map((a: { downloadUrl: string }) => a.downloadUrl)).toEqual(
      res.data.attachments.map((a: { id: string }) => `/specs/${spec.id}/attachments/${a.id}`),
    );
  });

  it("keeps the name readable but drops folders and invisible characters", async () => {
    const { owner: visitor, spec } = await ownDraft();
    const res = await postAttachments(visitor, spec.id, uploadForm(pdf("../../mount\u202Efdp.pdf")));
    expect(res.status).toBe(200);
    expect(res.data.attachments[0].fileName).toBe("mountfdp.pdf");

    expect(cleanFileName("C:\\fakepath\\plan.pdf")).toBe("plan.pdf");
    expect(cleanFileName("../../etc/passwd.pdf")).toBe("passwd.pdf");
    expect(cleanFileName('plan: "rev B"?.pdf')).toBe("plan_ _rev B__.pdf");
    expect(cleanFileName("...")).toBe("file");
    const long = cleanFileName(`${"a".repeat(300)}.step`);
    expect(long).toHaveLength(200);
    expect(long.endsWith(".step")).toBe(true);
  });
});

describe("refused uploads store nothing", () => {
  let visitor: Visitor;
  let spec: Spec;
  beforeEach(async () => {
    ({ owner: visitor, spec } = await ownDraft());
  });

  async function expectRefused(form: FormData, expected: { fileName: string | null; message: RegExp }[]) {
    const filesBefore = await storedFiles();
    const rowsBefore = await SpecAttachment.count();
    const res = await postAttachments(visitor, spec.id, form);
    expect(res.status).toBe(400);
    expect(res.data.errors).toHaveLength(expected.length);
    expected.forEach((e, i) => {
      expect(res.data.errors[i].fileName).toBe(e.fileName);
      expect(res.data.errors[i].message).toMatch(e.message);
    });
    expect(await SpecAttachment.count()).toBe(rowsBefore);
    expect(await storedFiles()).toEqual(filesBefore);
    return res;
  }

  it("refuses a program renamed to .pdf, and the good file sent with it", async () => {
    const exe = new File([new Uint8Array([0x4d, 0x5a, 0x90, 0x00, 0x03])], "drawing.pdf", { type: "application/pdf" });
    await expectRefused(uploadForm(pdf(), exe), [{ fileName: "drawing.pdf", message: /content is not a PDF/ }]);
  });

  it("refuses a type we don't take, and a photo whose name claims another type", async () => {
    const zip = new File([new Uint8Array([0x50, 0x4b, 0x03, 0x04])], "parts.zip");
    const photoAsPdf = new File([PNG_BYTES], "scan.pdf");
    await expectRefused(uploadForm(zip, photoAsPdf), [
      { fileName: "parts.zip", message: /"\.zip" files can't be attached/ },
      { fileName: "scan.pdf", message: /is a PNG image/ },
    ]);
  });

  it("refuses a file over 10 MB", async () => {
    const big = new Uint8Array(11 * 1024 * 1024);
    big.set(PDF_BYTES);
    const res = await expectRefused(uploadForm(pdf("small.pdf"), new File([big], "huge.pdf")), [{ fileName: null, message: /larger than 10 MB/ }]);
    expect(res.data.summary).toBe("Nothing was attached.");
  });

  it("accepts a file of exactly 10 MB", async () => {
    const limit = new Uint8Array(ATTACHMENT_LIMITS.maxFileBytes);
    limit.set(PDF_BYTES);
    const res = await postAttachments(visitor, spec.id, uploadForm(new File([limit], "limit.pdf")));
    expect(res.status).toBe(200);
    expect(res.data.attachments[0].sizeBytes).toBe(ATTACHMENT_LIMITS.maxFileBytes);
    const row = await SpecAttachment.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    // Compared by digest: a deep equality of ten million bytes takes minutes.
    expect(sha256((await storedObject(row.storageKey)).bytes)).toBe(sha256(limit));
  });

  it("refuses an empty file", async () => {
    await expectRefused(uploadForm(new File([], "blank.pdf")), [{ fileName: "blank.pdf", message: /empty/ }]);
  });

  it("asks for a file when none was chosen", async () => {
    // The exact body a browser sends for a file input left empty (Node's FormData omits filename="").
    const body = [
      "--edge",
      'Content-Disposition: form-data; name="intent"',
      "",
      "upload",
      "--edge",
      'Content-Disposition: form-data; name="files"; filename=""',
      "Content-Type: application/octet-stream",
      "",
      "",
      "--edge--",
      "",
    ].join("\r\n");
    const filesBefore = await storedFiles();
    const request = visitor.request(`/specs/${spec.id}/attachments`, {
      method: "POST",
      body,
      headers: { Accept: "application/json", "Content-Type": "multipart/form-data; boundary=edge" },
    });
    const res = await call(attachments.action, request, { specId: spec.id });
    expect(res.status).toBe(400);
    expect(res.data.errors).toEqual([{ fileName: null, message: "Choose at least one PDF, PNG, JPEG, DXF or STEP file to attach." }]);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(0);
    expect(await storedFiles()).toEqual(filesBefore);
  });

  it("refuses the 11th file of a spec, by name, whether sent alone or in one batch", async () => {
    const ten = Array.from({ length: ATTACHMENT_LIMITS.maxFilesPerSpec }, (_, i) => pdf(`sheet-${i + 1}.pdf`));
    await expectRefused(uploadForm(...ten, pdf("sheet-11.pdf")), [{ fileName: "sheet-11.pdf", message: /at most 10 files, so only 10 more fit/ }]);

    expect((await postAttachments(visitor, spec.id, uploadForm(...ten))).status).toBe(200);
    await expectRefused(uploadForm(pdf("sheet-11.pdf")), [{ fileName: "sheet-11.pdf", message: /at most 10 files and this one is full/ }]);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(10);
  });
});

describe("who may change and read a spec's files", () => {
  async function specWithPhoto() {
    const { owner, spec } = await ownDraft();
    const res = await postAttachments(owner, spec.id, uploadForm(png("rig – Ø63 bore.png")));
    expect(res.status).toBe(200);
    return { owner, spec, attachmentId: res.data.attachments[0].id as string };
  }

  it("gives another buyer organisation a 404 for upload, remove and download", async () => {
    const { spec, attachmentId } = await specWithPhoto();
    const stranger = await signedIn(await makeMember("buyer"));
    const filesBefore = await storedFiles();

    expect((await postAttachments(stranger, spec.id, uploadForm(pdf()))).status).toBe(404);
    expect((await postAttachments(stranger, spec.id, removeForm(attachmentId))).status).toBe(404);
    expect((await fetchFile(stranger, spec.id, attachmentId)).status).toBe(404);
    expect((await call(attachments.loader, stranger.request(`/specs/${spec.id}/attachments`), { specId: spec.id })).status).toBe(404);

    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(1);
    expect(await storedFiles()).toEqual(filesBefore);
  });

  it("lets a shop download only once the spec is published, and never upload", async () => {
    const { spec, attachmentId } = await specWithPhoto();
    const shop = await signedIn(await makeMember("shop"));
    expect((await fetchFile(shop, spec.id, attachmentId)).status).toBe(404);

    await spec.update({ status: "open", publishedAt: new Date() });
    const res = await fetchFile(shop, spec.id, attachmentId);
    expect(res.status).toBe(200);
    const request = shop.request(`/specs/${spec.id}/attachments/${attachmentId}`);
    expect(await downloadedBytes(download.loader, request, { specId: spec.id, attachmentId })).toEqual(PNG_BYTES);
    expect((await postAttachments(shop, spec.id, uploadForm(pdf()))).status).toBe(404);
  });

  it("sends the sniffed type, nosniff and an attachment disposition with the exact name", async () => {
    const { owner, spec, attachmentId } = await specWithPhoto();
    const res = await fetchFile(owner, spec.id, attachmentId);
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toBe("image/png");
    expect(res.headers.get("Content-Length")).toBe(String(PNG_BYTES.length));
    expect(res.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(res.headers.get("Content-Disposition")).toBe(`attachment; filename="rig _ _63 bore.png"; filename*=UTF-8''rig%20%E2%80%93%20%C3%9863%20bore.png`);
    expect(contentDisposition(`it's (v2)*.pdf`)).toBe(`attachment; filename="it's (v2)*.pdf"; filename*=UTF-8''it%27s%20%28v2%29%2A.pdf`);
  });

  it("a missing or malformed attachment id is a 404", async () => {
    const { owner, spec } = await specWithPhoto();
    expect((await fetchFile(owner, spec.id, "00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await fetchFile(owner, spec.id, "not-an-id")).status).toBe(404);
    expect((await postAttachments(owner, spec.id, removeForm("not-an-id"))).status).toBe(404);
  });
});

describe("removing files", () => {
  it("removes a draft's file and its stored bytes", async () => {
    const { owner, spec } = await ownDraft();
    const added = await postAttachments(owner, spec.id, uploadForm(pdf("keep.pdf"), pdf("drop.pdf")));
    const drop = added.data.attachments.find((a: { fileName: string }) => a.fileName === "drop.pdf");
    const dropRow = await SpecAttachment.findByPk(drop.id, { rejectOnEmpty: true });

    const res = await postAttachments(owner, spec.id, removeForm(drop.id));
    expect(res.status).toBe(200);
    expect(res.data.summary).toBe("Removed drop.pdf.");
    expect(res.data.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(["keep.pdf"]);
    expect(await SpecAttachment.findByPk(drop.id)).toBeNull();
    const keepRow = await SpecAttachment.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(await storedFiles()).not.toContain(dropRow.storageKey);
    expect(await storedFiles()).toContain(keepRow.storageKey);
    expect((await fetchFile(owner, spec.id, drop.id)).status).toBe(404);
  });

  it("refuses removing and adding with a 409 once the spec is published, and keeps the file", async () => {
    const { owner, spec } = await ownDraft();
    const added = await postAttachments(owner, spec.id, uploadForm(pdf()));
    const id = added.data.attachments[0].id as string;
    await spec.update({ status: "open", publishedAt: new Date() });
    const filesBefore = await storedFiles();

    const removal = await postAttachments(owner, spec.id, removeForm(id));
    expect(removal.status).toBe(409);
    expect(removal.data.errors[0].message).toMatch(/only be added or removed while the spec is a draft/);
    const upload = await postAttachments(owner, spec.id, uploadForm(pdf("late.pdf")));
    expect(upload.status).toBe(409);

    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(1);
    expect(await storedFiles()).toEqual(filesBefore);
  });
});

describe("deleting a draft's files", () => {
  it("removes every row and stored file of the owner's spec; another organisation gets a 404", async () => {
    const buyer = await makeMember("buyer");
    const spec = await draftOf(buyer);
    const other = await draftOf(buyer);
    const owner = await signedIn(buyer);
    await postAttachments(owner, spec.id, uploadForm(pdf("a.pdf"), png("b.png")));
    await postAttachments(owner, other.id, uploadForm(pdf("kept.pdf")));
    const stranger = await makeMember("buyer");
    await expect(removeAllAttachments(stranger, spec.id)).rejects.toMatchObject({ init: { status: 404 } });

    await removeAllAttachments(buyer, spec.id);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(0);
    const kept = await SpecAttachment.findOne({ where: { specId: other.id }, rejectOnEmpty: true });
    expect(await storedFiles()).toEqual((await SpecAttachment.findAll()).map((r) => r.storageKey).sort());
    expect(await storedFiles()).toContain(kept.storageKey);
  });
});

describe("a plain form post, without JavaScript", () => {
  it("redirects back to the page it came from, with what happened in the toast", async () => {
    const { owner, spec } = await ownDraft();
    const page = `http://127.0.0.1:3000/specs/${spec.id}/edit/quotation?from=review`;

    const ok = await postAttachments(owner, spec.id, uploadForm(pdf()), { Accept: "text/html", Referer: page });
    expect(ok.status).toBe(302);
    expect(ok.location).toBe(`/specs/${spec.id}/edit/quotation?from=review`);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(1);

    // Without a usable Referer it goes to the step that holds the uploads.
    const refused = await postAttachments(owner, spec.id, uploadForm(new File([], "blank.pdf")), {
      Accept: "text/html",
      Referer: "https://elsewhere.example/",
    });
    expect(refused.status).toBe(302);
    expect(refused.location).toBe(`/specs/${spec.id}/edit/quotation`);
    expect(refused.setCookie).toBeTruthy();
  });
});
