// A shop organisation reads no spec until an admin approves it: not the open-specs table, the
// spec page, its files, its questions, the bid form or the bill workbook, and publishing does not
// mail it. The admin approves or refuses (with a reason) and the shop is mailed either way.
import { beforeAll, describe, expect, it } from "vitest";
import * as openSpecs from "~/routes/open-specs";
import * as specPage from "~/routes/spec";
import * as download from "~/routes/spec-attachment-download";
import * as questionsRoute from "~/routes/spec-questions";
import * as bidRoute from "~/routes/spec-bid";
import * as billXlsx from "~/routes/spec-bill.xlsx";
import * as adminOrgs from "~/routes/admin.organisations";
import { Organisation, OutboxMail, Spec, SpecAttachment, User } from "~/models/index.server";
import { MAIL_PRIORITIES } from "~/services/mail.server";
import { bomOf } from "~/services/bids.server";
import { SPEC_ANSWERS, inDays, makeMember, makeOperatorUser, makePublishedSpec } from "../support/factories";
import { postAttachments } from "../support/attachment-files";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

let buyer: User;
let admin: User;
let adminVisitor: Visitor;
let spec: Spec;
let attachmentId: string;

/** A spec published with a drawing, through the app's own services and upload route. */
async function publishedWithDrawing(owner: User) {
  const { createDraft, saveStep, publish } = await import("~/services/specs.server");
  const draft = await createDraft(owner);
  const form = new FormData();
  form.set("intent", "upload");
  form.append("files", new File([new TextEncoder().encode("%PDF-1.7\n%%EOF\n")], "layout.pdf", { type: "application/pdf" }));
  const visitor = await signedIn(owner);
  const upload = await postAttachments(visitor, draft.id, form);
  expect(upload.status).toBeLessThan(400);
  for (const step of Object.keys(SPEC_ANSWERS) as (keyof typeof SPEC_ANSWERS)[]) {
    await saveStep(owner, draft.id, { step, answers: SPEC_ANSWERS[step] as Record<string, string>, complete: true });
  }
  return publish(owner, draft.id, { cautionsRead: true });
}

/** Every way a shop reads a spec, with its answer's status. */
async function whatTheShopReads(visitor: Visitor) {
  const bom = await bomOf(spec);
  const bidFields: Record<string, string> = { intent: "save", leadTimeWeeks: "8", validUntil: inDays(40) };
  bom.forEach((l, i) => {
    bidFields[`lines[${i}].key`] = l.key;
    bidFields[`lines[${i}].unitPrice`] = "10.00";
  });
  const list = await visitor.get(openSpecs.loader, "/open-specs");
  return {
    listed: list.data.specs.map((s: { id: string }) => s.id).includes(spec.id),
    specPage: (await visitor.get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id })).status,
    attachment: (await visitor.get(download.loader, `/specs/${spec.id}/attachments/${attachmentId}`, { specId: spec.id, attachmentId })).status,
    bill: (await visitor.get(billXlsx.loader, `/specs/${spec.id}/bill.xlsx`, { specId: spec.id })).status,
    bidForm: (await visitor.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id })).status,
    bid: (await visitor.post(bidRoute.action, `/specs/${spec.id}/bid`, bidFields, { specId: spec.id })).status,
    question: (await visitor.post(questionsRoute.action, `/specs/${spec.id}/questions`, { body: "Is the ram guided?" }, { specId: spec.id })).status,
  };
}

const NOTHING = { listed: false, specPage: 404, attachment: 404, bill: 404, bidForm: 404, bid: 404, question: 404 };

beforeAll(async () => {
  buyer = await makeMember("buyer");
  admin = await makeOperatorUser("admin");
  adminVisitor = await signedIn(admin);
  spec = await publishedWithDrawing(buyer);
  attachmentId = (await SpecAttachment.findOne({ where: { specId: spec.id }, rejectOnEmpty: true })).id;
});

describe("a shop that has just signed up", () => {
  it("starts waiting for approval, whichever way its organisation is made", async () => {
    // Sign-up (through whichever confirmation) makes the organisation with the account service.
    const signedUp = await makeMember("shop", { pending: true });
    expect((await Organisation.findByPk(signedUp.organisationId, { rejectOnEmpty: true })).approval).toBe("pending");
    const made = await Organisation.create({ name: "Scripted shop", kind: "shop", region: null, accountManagerId: null });
    expect(made.approval).toBe("pending");
    const buyerOrg = await Organisation.create({ name: "Scripted builder", kind: "buyer", region: null, accountManagerId: null });
    expect(buyerOrg.approval).toBeNull();
  });

  it("reads no spec, and its home says it is waiting, until an admin approves it", async () => {
    const shop = await makeMember("shop", { pending: true, organisationName: "Quayside Hydraulics" });
    const visitor = await signedIn(shop);
    expect(await whatTheShopReads(visitor)).toEqual(NOTHING);
    const home = await visitor.get(openSpecs.loader, "/open-specs");
    expect(home.status).toBe(200);
    expect(home.data).toMatchObject({ total: 0, specs: [], approval: { approval: "pending", reason: null } });
    expect(await OutboxMail.count({ where: { to: shop.email } })).toBe(0);

    // Publishing another spec mails approved shops only.
    const approved = await makeMember("shop");
    const another = await makePublishedSpec(buyer, { machine: { title: "Clamp cylinder" } });
    const told = (to: string) => OutboxMail.count({ where: { to, subject: `New spec open for bids: ${another.title}` } });
    expect(await told(approved.email)).toBe(1);
    expect(await told(shop.email)).toBe(0);

    // The admin sees it waiting and approves it.
    const page = await adminVisitor.get(adminOrgs.loader, "/admin/organisations");
    expect(page.data.waiting.map((w: { name: string }) => w.name)).toContain("Quayside Hydraulics");
    const waiting = page.data.waiting.find((w: { name: string }) => w.name === "Quayside Hydraulics");
    expect(waiting.people).toEqual([{ name: shop.name, email: shop.email }]);
    const filtered = await adminVisitor.get(adminOrgs.loader, "/admin/organisations?approval=pending");
    expect(filtered.data.organisations.every((o: { approval: string }) => o.approval === "pending")).toBe(true);

    const res = await adminVisitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: shop.organisationId });
    expect(res.status).toBe(302);
    const organisation = await Organisation.findByPk(shop.organisationId, { rejectOnEmpty: true });
    expect([organisation.approval, organisation.approvalDecidedById]).toEqual(["approved", admin.id]);
    const mail = await OutboxMail.findOne({ where: { to: shop.email }, rejectOnEmpty: true });
    expect(mail.subject).toBe("Quayside Hydraulics is approved on Tenderflow");
    expect(mail.priority).toBe(MAIL_PRIORITIES.account);
    expect(mail.text).toContain("/open-specs");

    // Now it reads the spec, its drawing and its bill, and may ask and bid.
    const after = await whatTheShopReads(visitor);
    expect(after).toMatchObject({ listed: true, specPage: 200, attachment: 200, bill: 200, bidForm: 200 });
    expect(after.bid).toBe(302);
    expect(after.question).toBeLessThan(400);
    expect((await visitor.get(openSpecs.loader, "/open-specs")).data.approval.approval).toBe("approved");
    // Deciding twice changes nothing.
    const twice = await adminVisitor.post(adminOrgs.action, "/admin/organisations", {
      intent: "refuse",
      organisationId: shop.organisationId,
      reason: "Changed my mind",
    });
    expect(twice.status).toBe(400);
    expect((await organisation.reload()).approval).toBe("approved");
  });

  it("is refused only with a reason, which it is mailed and reads on its home", async () => {
    const shop = await makeMember("shop", { pending: true, organisationName: "Dockyard Trading" });
    const visitor = await signedIn(shop);
    for (const reason of [undefined, "", "   "]) {
      const fields: Record<string, string> = { intent: "refuse", organisationId: shop.organisationId };
      if (reason !== undefined) fields.reason = reason;
      const res = await adminVisitor.post(adminOrgs.action, "/admin/organisations", fields);
      expect(res.status).toBe(400);
      expect(res.data).toMatchObject({ error: "Say why the shop is refused; the shop reads it.", organisationId: shop.organisationId });
    }
    expect((await Organisation.findByPk(shop.organisationId, { rejectOnEmpty: true })).approval).toBe("pending");
    expect(await OutboxMail.count({ where: { to: shop.email } })).toBe(0);

    const reason = "We could not find a fluid-power business under this name.";
    const res = await adminVisitor.post(adminOrgs.action, "/admin/organisations", { intent: "refuse", organisationId: shop.organisationId, reason });
    expect(res.status).toBe(302);
    const mail = await OutboxMail.findOne({ where: { to: shop.email }, rejectOnEmpty: true });
    expect(mail.subject).toBe("Dockyard Trading was not approved on Tenderflow");
    expect(mail.text).toContain(reason);
    expect(mail.priority).toBe(MAIL_PRIORITIES.account);
    const home = await visitor.get(openSpecs.loader, "/open-specs");
    expect(home.data.approval).toMatchObject({ approval: "refused", reason });
    expect(await whatTheShopReads(visitor)).toEqual(NOTHING);
    // It no longer waits; an admin may still approve it later.
    expect((await adminVisitor.get(adminOrgs.loader, "/admin/organisations")).data.waiting.map((w: { id: string }) => w.id)).not.toContain(shop.organisationId);
    expect((await adminVisitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: shop.organisationId })).status).toBe(302);
    expect((await visitor.get(specPage.loader, `/specs/${spec.id}`, { specId: spec.id })).status).toBe(200);
  });

  it("cannot be approved by anyone but an admin", async () => {
    const shop = await makeMember("shop", { pending: true });
    const others = [buyer, await makeMember("shop"), shop, await makeOperatorUser("account_manager")];
    for (const user of others) {
      const visitor = await signedIn(user);
      const res = await visitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: shop.organisationId });
      expect(res.status).toBe(403);
    }
    expect((await Organisation.findByPk(shop.organisationId, { rejectOnEmpty: true })).approval).toBe("pending");
    // A forged or unknown organisation, or a buyer organisation, is not a shop to decide on.
    expect((await adminVisitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: "x" })).status).toBe(400);
    expect((await adminVisitor.post(adminOrgs.action, "/admin/organisations", { intent: "approve", organisationId: buyer.organisationId })).status).toBe(404);
  });
});
