// A shop's documents on its offer: uploaded on the spec drawings' rules (sniffed kinds, all or
// nothing, 10 on an offer), removed while the spec takes bids, and read by exactly the shop, the
// spec's buyer once the offer is made, the buyer's account manager and admins.
import { beforeAll, describe, expect, it } from "vitest";
import * as documentsRoute from "~/routes/spec-bid-documents";
import * as downloadRoute from "~/routes/offer-document-download";
import * as bidsRoute from "~/routes/spec-bids";
import { Bid, Organisation, sequelize, type Spec, type User } from "~/models/index.server";
import { BidDocument } from "~/models/bid.server";
import type { BomLine } from "~/hydraulics";
import { bomOf } from "~/services/bids.server";
import { makeMember, makeOperatorUser, makePublishedSpec } from "../support/factories";
import { bidFields, postBid } from "../support/bid-form";
import { call, type Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

const PDF = new TextEncoder().encode("%PDF-1.4\n% quotation Q-2291\n");
const DXF = new TextEncoder().encode("0\nSECTION\n2\nHEADER\n0\nENDSEC\n0\nEOF\n");
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]);

let buyer: User;
let shop: User;
let manager: User;
let spec: Spec;
let bom: BomLine[];

beforeAll(async () => {
  buyer = await makeMember("buyer");
  shop = await makeMember("shop", { organisationName: "Docwell Hydraulics" });
  manager = await makeOperatorUser("account_manager");
  await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
  spec = await makePublishedSpec(buyer);
  bom = await bomOf(spec);
});

function upload(visitor: Visitor, files: File[]) {
  const body = new FormData();
  for (const f of files) body.append("files", f);
  return call(documentsRoute.action, visitor.request(`/specs/${spec.id}/bid/documents`, { method: "POST", body }), { specId: spec.id });
}

const removal = (visitor: Visitor, documentId: string) =>
  call(documentsRoute.action, visitor.request(`/specs/${spec.id}/bid/documents`, { method: "POST", body: new URLSearchParams({ documentId }) }), {
    specId: spec.id,
  });

/** The document's bytes as `visitor` downloads them, or the refusal's status. */
async function download(visitor: Visitor, bidId: string, documentId: string): Promise<Uint8Array | number> {
  const request = visitor.request(`/specs/${spec.id}/bids/${bidId}/documents/${documentId}`);
  try {
    const response = await downloadRoute.loader({ request, params: { specId: spec.id, bidId, documentId }, context: {} } as Parameters<
      typeof downloadRoute.loader
    >[0]);
    return new Uint8Array(await response.arrayBuffer());
  } catch (thrown) {
    if (thrown instanceof Response) return thrown.status;
    if (thrown && typeof thrown === "object" && "init" in thrown) return (thrown as { init: { status: number } }).init.status;
    throw thrown;
  }
}

const count = (bidId: string) => BidDocument.count({ where: { bidId } });

describe("documents on an offer", () => {
  it("are uploaded all or none, read by the right people only, shown beside the offer and removed while bids are taken", async () => {
    const visitor = await signedIn(shop);
    // Nothing to attach to before the bid is saved: the bid page says so beside the upload field.
    const early = await upload(visitor, [new File([PDF], "quotation.pdf")]);
    expect(early.status).toBe(400);
    expect(early.data).toMatchObject({ form: "offer-documents", errors: { files: [expect.stringMatching(/Save your bid first/)] } });
    expect(await BidDocument.count()).toBe(0);

    expect((await postBid(visitor, spec.id, { intent: "save", ...bidFields(bom, () => "100") })).status).toBe(302);
    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: shop.organisationId }, rejectOnEmpty: true });

    // A photo saved as .pdf spoils the whole upload.
    const mixed = await upload(visitor, [new File([PDF], "quotation.pdf"), new File([PNG], "datasheet.pdf")]);
    expect(mixed.status).toBe(400);
    expect(mixed.data.errors.files.join(" ")).toMatch(/datasheet\.pdf: .*Nothing was uploaded/);
    expect(await count(bid.id)).toBe(0);

    const sent = await upload(visitor, [new File([PDF], "Quotation Q-2291.pdf"), new File([DXF], "manifold.dxf")]);
    expect(sent.status).toBe(302);
    const rows = await BidDocument.findAll({ where: { bidId: bid.id } });
    expect(rows.map((r) => [r.fileName, r.contentType]).sort()).toEqual([
      ["Quotation Q-2291.pdf", "application/pdf"],
      ["manifold.dxf", "image/vnd.dxf"],
    ]);
    const quotation = rows.find((r) => r.fileName.endsWith(".pdf"))!;
    const drawing = rows.find((r) => r.fileName.endsWith(".dxf"))!;

    // A draft's documents are the shop's alone.
    expect(await download(visitor, bid.id, quotation.id)).toEqual(PDF);
    expect(await download(await signedIn(buyer), bid.id, quotation.id)).toBe(404);

    expect((await postBid(visitor, spec.id, { intent: "submit", ...bidFields(bom, () => "100") })).status).toBe(302);
    const admin = await makeOperatorUser("admin");
    const otherManager = await makeOperatorUser("account_manager");
    const otherShop = await makeMember("shop");
    const otherBuyer = await makeMember("buyer");
    for (const reader of [buyer, manager, admin, shop]) expect(await download(await signedIn(reader), bid.id, quotation.id)).toEqual(PDF);
    for (const stranger of [otherManager, otherShop, otherBuyer]) expect(await download(await signedIn(stranger), bid.id, quotation.id)).toBe(404);
    // A document asked for under another bid is not found either.
    const rival = await makeMember("shop");
    await postBid(await signedIn(rival), spec.id, { intent: "submit", ...bidFields(bom, () => "120") });
    const rivalBid = await Bid.findOne({ where: { specId: spec.id, organisationId: rival.organisationId }, rejectOnEmpty: true });
    expect(await download(await signedIn(buyer), rivalBid.id, quotation.id)).toBe(404);

    // The buyer sees them beside the offer.
    const compared = await (await signedIn(buyer)).get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    expect(compared.data.documents[bid.id].map((d: { fileName: string }) => d.fileName).sort()).toEqual(["Quotation Q-2291.pdf", "manifold.dxf"]);
    expect(compared.data.documents[rivalBid.id]).toEqual([]);
    expect(compared.data.documents[bid.id].find((d: { id: string }) => d.id === quotation.id).downloadUrl).toBe(
      `/specs/${spec.id}/bids/${bid.id}/documents/${quotation.id}`,
    );

    // Ten on an offer: nine more are one too many, and none of them is attached.
    const nine = Array.from({ length: 9 }, (_, i) => new File([PDF], `sheet-${i}.pdf`));
    expect((await upload(visitor, nine.slice(0, 6))).status).toBe(302);
    expect(await count(bid.id)).toBe(8);
    const over = await upload(visitor, nine.slice(6));
    expect(over.status).toBe(400);
    expect(over.data.errors.files[0]).toMatch(/at most 10 documents; only 2 more fit/);
    expect(await count(bid.id)).toBe(8);

    // Another shop cannot remove the shop's document; the shop can.
    expect((await removal(await signedIn(otherShop), quotation.id)).status).toBe(400);
    expect(await count(bid.id)).toBe(8);
    expect((await removal(visitor, quotation.id)).status).toBe(302);
    expect(await count(bid.id)).toBe(7);
    expect(await download(await signedIn(buyer), bid.id, quotation.id)).toBe(404);

    // After the deadline the documents are fixed.
    await sequelize.query("UPDATE specs SET bid_deadline = now() - interval '1 second' WHERE id = :id", { replacements: { id: spec.id } });
    expect((await removal(visitor, drawing.id)).data.errors.files[0]).toMatch(/no longer takes bids/);
    expect((await upload(visitor, [new File([PDF], "late.pdf")])).status).toBe(400);
    expect(await count(bid.id)).toBe(7);
  });
});
