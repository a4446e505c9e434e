// Files in the object store seen from more than one app server, and from a server whose store is
// down. This test process is one server (route modules called in-process); the others are the
// production build served in their own processes. They share nothing but the database and the
// S3 fake: no disk, no memory.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as download from "~/routes/spec-attachment-download";
import { popToast } from "~/auth/session.server";
import { type Spec, SpecAttachment, type User } from "~/models/index.server";
import { PDF_BYTES, PNG_BYTES, downloadedBytes, draftOf, pdf, postAttachments, removeForm, uploadForm } from "../support/attachment-files";
import { makeMember } from "../support/factories";
import { sendAs, startAppAndStoreDown, type HttpApp } from "../support/http-app";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";
import { storedKeys } from "../support/stored-files";

const STORE_DOWN = /cannot reach its file store just now/;

let buyer: User;
let owner: Visitor;
let cookie: string;
let other: HttpApp;
let storeDown: HttpApp;

beforeAll(async () => {
  buyer = await makeMember("buyer");
  owner = await signedIn(buyer);
  cookie = owner.request("/").headers.get("Cookie")!;
  ({ app: other, storeDown } = await startAppAndStoreDown());
}, 240_000);

afterAll(async () => {
  await Promise.all([other?.close(), storeDown?.close()]);
});

const draft = () => draftOf(buyer);

/** Posts an attachments form to a served app, asking for JSON as the uploader does. */
const postForm = (app: HttpApp, spec: Spec, body: FormData, accept = "application/json") =>
  send(app, `/specs/${spec.id}/attachments`, { method: "POST", body, headers: { Accept: accept } });

/** A request to one of the served apps, as the owner's browser sends it (cookie, same origin). */
const send = (app: HttpApp, path: string, init: RequestInit = {}) => sendAs(app, cookie, path, init);

/** Uploads through this process, the first server. */
async function uploadHere(spec: Spec, file: File) {
  const res = await postAttachments(owner, spec.id, uploadForm(file));
  expect(res.status).toBe(200);
  return res.data.attachments.at(-1).id as string;
}

describe("two app servers sharing only the database and the object store", () => {
  it("downloads through another server a file stored through this one, with the same headers", async () => {
    const spec = await draft();
    const id = await uploadHere(spec, new File([PNG_BYTES], "valve block – rev C.png", { type: "image/png" }));

    const res = await send(other, `/specs/${spec.id}/attachments/${id}`);
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toBe("image/png");
    expect(res.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(res.headers.get("Content-Disposition")).toBe(
      `attachment; filename="valve block _ rev C.png"; filename*=UTF-8''valve%20block%20%E2%80%93%20rev%20C.png`,
    );
    expect(new Uint8Array(await res.arrayBuffer())).toEqual(PNG_BYTES);
  });

  it("downloads here a file uploaded through the other server, and the other server's removal deletes the object", async () => {
    const spec = await draft();
    const uploaded = await postForm(other, spec, uploadForm(pdf("frame.pdf")));
    expect(uploaded.status).toBe(200);
    const id = ((await uploaded.json()) as { attachments: { id: string }[] }).attachments[0].id;
    const row = await SpecAttachment.findByPk(id, { rejectOnEmpty: true });
    expect(await storedKeys()).toContain(row.storageKey);

    const request = owner.request(`/specs/${spec.id}/attachments/${id}`);
    expect(await downloadedBytes(download.loader, request, { specId: spec.id, attachmentId: id })).toEqual(PDF_BYTES);

    expect((await postForm(other, spec, removeForm(id))).status).toBe(200);
    expect(await storedKeys()).not.toContain(row.storageKey);
  });
});

describe("a server whose object store does not answer", () => {
  it("answers a download with a 503 that says so in words, not an error page with a stack", async () => {
    const spec = await draft();
    const id = await uploadHere(spec, pdf("frame.pdf"));

    const res = await send(storeDown, `/specs/${spec.id}/attachments/${id}`);
    expect(res.status).toBe(503);
    expect(res.headers.get("Retry-After")).toBe("60");
    expect(res.headers.get("Content-Type")).toBe("text/plain; charset=utf-8");
    const body = await res.text();
    expect(body).toBe("Tenderflow cannot reach its file store just now. Please try again in a few minutes.");
  });

  it("refuses an upload with a 503 saying nothing was attached, and keeps no row", async () => {
    const spec = await draft();
    const res = await postForm(storeDown, spec, uploadForm(pdf("frame.pdf")));
    expect(res.status).toBe(503);
    const answer = (await res.json()) as { errors: { message: string }[]; summary: string };
    expect(answer.errors).toEqual([{ fileName: null, message: expect.stringMatching(STORE_DOWN) }]);
    expect(answer.errors[0].message).toMatch(/Nothing was attached/);
    expect(await SpecAttachment.count({ where: { specId: spec.id } })).toBe(0);

    // Without JavaScript the form goes back to its page, the same words in the toast.
    const plain = await postForm(storeDown, spec, uploadForm(pdf("frame.pdf")), "text/html");
    expect(plain.status).toBe(302);
    expect((await popToast(owner.request("/"))).toast).toMatch(STORE_DOWN);
  });

  it("still removes a file (the row goes, the object stays as litter) and logs what it could not delete", async () => {
    const spec = await draft();
    const id = await uploadHere(spec, pdf("frame.pdf"));
    const row = await SpecAttachment.findByPk(id, { rejectOnEmpty: true });

    const res = await postForm(storeDown, spec, removeForm(id));
    expect(res.status).toBe(200);
    expect(await SpecAttachment.findByPk(id)).toBeNull();
    expect(storeDown.logs.join("")).toContain(`Could not delete stored file ${row.storageKey}`);
    expect(await storedKeys()).toContain(row.storageKey);
  });
});
