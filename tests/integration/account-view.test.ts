// The account manager's view of a buyer account: open specs with bids received and deadlines
// (days past when passed), jobs with days late, payments, who to contact, and notes kept on the
// account (added and edited, with who and when). Other managers get 404, buyers 403.
import { beforeAll, describe, expect, it } from "vitest";
import * as account from "~/routes/account";
import { AccountNote } from "~/models/account-note.server";
import { JobMilestone, Organisation, Payment, Spec, type User } from "~/models/index.server";
import { newAttempt } from "~/services/payments.server";
import { reachMilestones } from "~/services/job-progress.server";
import { recordBankTransfer } from "~/services/balance.server";
import { addDays, todayUtc } from "~/content/dates";
import { makeJob, makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import type { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

let buyer: User;
let manager: User;
let managerVisitor: Visitor;
const page = (visitor: Visitor, organisationId = buyer.organisationId) => visitor.get(account.loader, `/accounts/${organisationId}`, { organisationId });
const note = (visitor: Visitor, fields: Record<string, string>, organisationId = buyer.organisationId) =>
  visitor.post(account.action, `/accounts/${organisationId}`, fields, { organisationId });

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Tremayne Balers" });
  manager = await makeOperatorUser("account_manager");
  managerVisitor = await signedIn(manager);
  await Organisation.update(
    { accountManagerId: manager.id, quoteContactName: "Lowenna Tremayne", quoteContactEmail: "buying@tremayne.test" },
    { where: { id: buyer.organisationId } },
  );
});

describe("the account view", () => {
  it("shows open specs with bids and days past the deadline, late jobs, payments and who to contact", async () => {
    const shop = await makeMember("shop");
    const quiet = await makePublishedSpec(buyer, { machine: { title: "Baler ram, no bids yet" } });
    const offered = await makePublishedSpec(buyer, { machine: { title: "Baler door with offers" } });
    await makeSubmittedBid(offered, shop);
    // The deadline of the quiet one passed three days ago.
    await Spec.update({ bidDeadline: new Date(`${addDays(todayUtc(), -3)}T23:59:59Z`) }, { where: { id: quiet.id } });
    const { job } = await makeJob(buyer, shop, { title: "Late baler" });
    await JobMilestone.update({ targetDate: addDays(todayUtc(), -4) }, { where: { jobId: job.id, reachedAt: null } });
    await Payment.create(newAttempt(job, buyer.id));

    const res = await page(managerVisitor);
    expect(res.status).toBe(200);
    const view = res.data.account;
    expect(view.openSpecs.find((s: { id: string }) => s.id === quiet.id)).toMatchObject({ bids: 0, daysLate: 3 });
    expect(view.openSpecs.find((s: { id: string }) => s.id === offered.id)).toMatchObject({ bids: 1, daysLate: 0 });
    expect(res.data.organisation.jobs.recent.find((j: { id: string }) => j.id === job.id).daysLate).toBe(4);
    expect(view.payments).toEqual([expect.objectContaining({ jobId: job.id, status: "pending", specTitle: "Late baler" })]);
    expect(view.profile.quoteContact).toEqual({ name: "Lowenna Tremayne", email: "buying@tremayne.test", phone: null });
  });

  it("lists each payment as the retainer or the balance, and a balance recorded by bank transfer among them", async () => {
    const shop = await makeMember("shop");
    const { job } = await makeJob(buyer, shop, { title: "Baler paid by transfer" });
    await Payment.create({ ...newAttempt(job, buyer.id), status: "paid", paidAt: new Date(Date.now() - 86_400_000) });
    await job.update({ retainerPaidAt: new Date(Date.now() - 86_400_000) });
    await reachMilestones(shop, job.id, { milestone: "handed_over", note: "" });
    await recordBankTransfer(manager, job.id, { reference: "BACS TREMAYNE 0107", paidOn: todayUtc() });

    const ofJob = (await page(managerVisitor)).data.account.payments.filter((p: { jobId: string }) => p.jobId === job.id);
    // Newest first: the transfer, then the card's retainer.
    expect(ofJob).toEqual([
      expect.objectContaining({ purpose: "balance", byTransfer: true, status: "paid", amountCents: job.totalCents - job.retainerCents }),
      expect.objectContaining({ purpose: "retainer", byTransfer: false, status: "paid", amountCents: job.retainerCents }),
    ]);
  });

  it("keeps notes with who wrote and who edited them, refuses an empty one and keeps what was typed", async () => {
    expect((await note(managerVisitor, { intent: "add-note", body: "Wants commissioning in March; call before quoting." })).status).toBe(302);
    const saved = await AccountNote.findOne({ where: { organisationId: buyer.organisationId }, rejectOnEmpty: true });
    expect(saved).toMatchObject({ authorId: manager.id, editedById: null });

    const admin = await makeOperatorUser("admin");
    const adminVisitor = await signedIn(admin);
    expect((await note(adminVisitor, { intent: "edit-note", noteId: saved.id, body: "Commissioning moved to April." })).status).toBe(302);
    const notes = (await page(managerVisitor)).data.account.notes;
    expect(notes).toEqual([expect.objectContaining({ body: "Commissioning moved to April.", author: manager.name, editedBy: admin.name })]);

    const empty = await note(managerVisitor, { intent: "add-note", body: "   " });
    expect(empty.status).toBe(400);
    expect(empty.data.result.error.body).toEqual(["Write the note first."]);
    const long = await note(managerVisitor, { intent: "edit-note", noteId: saved.id, body: "x".repeat(2001) });
    expect(long.status).toBe(400);
    expect(long.data).toMatchObject({ noteId: saved.id, result: { initialValue: { body: "x".repeat(2001) } } });
    expect(await AccountNote.count({ where: { organisationId: buyer.organisationId } })).toBe(1);
  });

  it("is for the account's managers: another manager gets 404, a buyer 403, a note of another account 404", async () => {
    const other = await signedIn(await makeOperatorUser("account_manager"));
    expect((await page(other)).status).toBe(404);
    expect((await note(other, { intent: "add-note", body: "Not mine" })).status).toBe(404);
    expect((await note(await signedIn(buyer), { intent: "add-note", body: "Let me in" })).status).toBe(403);
    // A note id of another account is not found on this one.
    const elsewhere = await makeMember("buyer");
    await Organisation.update({ accountManagerId: manager.id }, { where: { id: elsewhere.organisationId } });
    const theirs = await AccountNote.create({ organisationId: elsewhere.organisationId, body: "Theirs", authorId: manager.id, editedById: null });
    expect((await note(managerVisitor, { intent: "edit-note", noteId: theirs.id, body: "Changed" })).status).toBe(404);
    expect((await theirs.reload()).body).toBe("Theirs");
    // A shop's organisation page (the manager builds with it) has no account view.
    const shop = await makeMember("shop");
    await makeJob(buyer, shop);
    const shopPage = await page(managerVisitor, shop.organisationId);
    expect(shopPage.status).toBe(200);
    expect(shopPage.data.account).toBeNull();
    expect((await note(managerVisitor, { intent: "add-note", body: "On a shop" }, shop.organisationId)).status).toBe(404);
  });
});
