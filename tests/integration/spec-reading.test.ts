// Reading a spec: what shops see of a published spec (quotation facts, drawings with working
// download links) and who else may read it (the account's manager, admins for published specs).
import { beforeAll, describe, expect, it } from "vitest";
import * as specPage from "~/routes/spec";
import * as download from "~/routes/spec-attachment-download";
import { Spec, type User } from "~/models/index.server";
import { createDraft, publish, saveStep } from "~/services/specs.server";
import { pdf, postAttachments, uploadForm } from "../support/attachment-files";
import { SPEC_ANSWERS, inDays, makeMember, makeOperatorUser } from "../support/factories";
import { makeManagerOf } from "../support/parties";
import { Visitor, call } from "../support/routes";
import { signedIn } from "../support/sessions";

const page = (who: Visitor, specId: string) => who.get(specPage.loader, `/specs/${specId}`, { specId });
const fetchFile = (who: Visitor, specId: string, attachmentId: string) =>
  call(download.loader, who.request(`/specs/${specId}/attachments/${attachmentId}`), { specId, attachmentId });

let buyer: User;
let owner: Visitor;
let published: Spec;
let draft: Spec;
let attachmentId: string;
const needed = inDays(120);

beforeAll(async () => {
  buyer = await makeMember("buyer");
  owner = await signedIn(buyer);
  // A draft with a drawing uploaded through the form, then published.
  published = await createDraft(buyer);
  const quotation = { ...SPEC_ANSWERS.quotation, dateNeeded: needed, notes: "Paint RAL 5015.\nAccess through a 2 m door." };
  for (const [step, answers] of Object.entries({ ...SPEC_ANSWERS, quotation }))
    await saveStep(buyer, published.id, { step: step as keyof typeof SPEC_ANSWERS, answers, complete: true });
  const form = uploadForm(pdf("Lift frame.pdf"));
  const uploaded = await postAttachments(owner, published.id, form);
  expect(uploaded.status).toBe(200);
  attachmentId = uploaded.data.attachments[0].id;
  published = await publish(buyer, published.id, { cautionsRead: true });
  draft = await createDraft(buyer);
});

describe("a published spec as a shop reads it", () => {
  it("shows the quotation facts of the revision and the drawings with links that download", async () => {
    const shop = await signedIn(await makeMember("shop"));
    const res = await page(shop, published.id);
    expect(res.status).toBe(200);
    // What the machine does, the supply and the fluid come first, in the buyer's words.
    expect(res.data.quotation).toEqual({
      purpose: "Presses sheet over a die.",
      supplyVoltage: "400 V three-phase",
      fluid: "ISO VG 46",
      unitsWanted: "2",
      dateNeeded: needed,
      deliveryRegion: "UK — West Midlands",
      currency: "GBP",
      retainerPercent: "20",
      notes: "Paint RAL 5015.\nAccess through a 2 m door.",
    });
    expect(res.data.attachments).toMatchObject([
      { id: attachmentId, fileName: "Lift frame.pdf", kindLabel: "PDF", downloadUrl: `/specs/${published.id}/attachments/${attachmentId}` },
    ]);
    expect(res.data.back).toEqual({ to: "/open-specs", label: "Open specs" });
    const file = await fetchFile(shop, published.id, attachmentId);
    expect(file.status).toBe(200);
    expect(file.headers.get("Content-Type")).toBe("application/pdf");
    expect(file.data).toContain("%PDF-1.7");
  });

  it("gives a buyer of another organisation 404 for the spec and its drawing", async () => {
    const stranger = await signedIn(await makeMember("buyer"));
    expect((await page(stranger, published.id)).status).toBe(404);
    expect((await fetchFile(stranger, published.id, attachmentId)).status).toBe(404);
  });
});

describe("operator staff reading specs", () => {
  it("lets an account manager read the published specs of the accounts assigned to them, not their drafts", async () => {
    const manager = await makeManagerOf(buyer);
    const visitor = await signedIn(manager);
    const res = await page(visitor, published.id);
    expect(res.status).toBe(200);
    expect(res.data.back).toEqual({ to: `/accounts/${buyer.organisationId}`, label: "The account" });
    expect(res.data.quotation.currency).toBe("GBP");
    expect((await fetchFile(visitor, published.id, attachmentId)).status).toBe(200);
    // A draft is the buyer's own until it is published.
    expect((await page(visitor, draft.id)).status).toBe(404);
  });

  it("gives an account manager of other accounts 404", async () => {
    const other = await signedIn(await makeOperatorUser("account_manager"));
    expect((await page(other, published.id)).status).toBe(404);
    expect((await fetchFile(other, published.id, attachmentId)).status).toBe(404);
    expect((await page(other, draft.id)).status).toBe(404);
  });

  it("lets an admin read any published spec, not a draft", async () => {
    const admin = await signedIn(await makeOperatorUser("admin"));
    expect((await page(admin, published.id)).status).toBe(200);
    expect((await page(admin, draft.id)).status).toBe(404);
    expect((await page(admin, "not-an-id")).status).toBe(404);
  });

  it("sends signed-out visitors to sign in", async () => {
    const res = await page(new Visitor(), published.id);
    expect(res.status).toBe(302);
    expect(res.location).toBe(`/sign-in?redirectTo=${encodeURIComponent(`/specs/${published.id}`)}`);
  });
});
