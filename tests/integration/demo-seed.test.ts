// The demo scenario `npm start` loads must obey the app's own rules: its offers add up, the
// buyer's comparison and the account manager's dashboard read it like any other data.
import { beforeAll, describe, expect, it } from "vitest";
import * as bidsRoute from "~/routes/spec-bids";
import * as jobsRoute from "~/routes/jobs";
import * as specPage from "~/routes/spec";
import * as paymentsRoute from "~/routes/payments";
import * as adminUsersRoute from "~/routes/admin.users";
import * as adminAuditRoute from "~/routes/admin.audit";
import * as accountRoute from "~/routes/account";
import { Bid, Job, JobEvent, OrderConfirmation, Organisation, Spec, SpecRevision, User, sequelize } from "~/models/index.server";
import { handoverPanelOf } from "~/services/job-handover.server";
import { balancePanelOf } from "~/services/balance.server";
import { readDraft, stepIdsOf } from "~/content/spec-draft";
import { billOf } from "~/services/published-design";
import { retainerCents } from "~/content/money";
import { offerTotals } from "~/content/offer-terms";
import { bomOf } from "~/services/bids.server";
import { DEMO_PASSWORD, seedDemo } from "../../db/seeds/demo";
import { signedIn } from "../support/sessions";

const signedInDemo = (email: string) => signedIn({ email }, DEMO_PASSWORD);

beforeAll(async () => {
  expect(await seedDemo(sequelize)).toBe(true);
});

describe("the demo scenario", () => {
  it("seeds once", async () => {
    expect(await seedDemo(sequelize)).toBe(false);
  });

  it("prices every offer exactly as the app would, against the frozen bill", async () => {
    const bids = await Bid.findAll({ include: [{ model: Spec, as: "spec" }] });
    expect(bids.length).toBe(11);
    // Every submitted demo offer states its terms; one proposes an alternative circuit.
    expect(bids.filter((b) => b.offerTerms?.incoterm).length).toBe(11);
    expect(bids.filter((b) => b.alternativeCircuit).length).toBe(1);
    for (const bid of bids) {
      const spec = (bid as Bid & { spec: Spec }).spec;
      const bom = await bomOf(spec);
      expect(bid.lines.map((l) => l.key)).toEqual(bom.map((l) => l.key));
      // The bill × units plus the work beyond it and the shop's own lines, as the bid service adds them.
      const totals = offerTotals(
        bid.lines.map((l) => ({ quantity: l.quantity, unitPriceCents: l.unitPriceCents ?? 0 })),
        spec.unitsWanted ?? 1,
        bid.extras,
        bid.ownLines,
      );
      expect([bid.setTotalCents, bid.totalCents]).toEqual([totals.setTotalCents, totals.totalCents]);
    }
    for (const job of await Job.findAll({ include: [{ model: Bid, as: "bid" }] })) {
      expect(job.totalCents).toBe((job as Job & { bid: Bid }).bid.totalCents);
      expect(job.retainerCents).toBe(retainerCents(job.totalCents, job.retainerPercent));
      // The history's award row carries its amounts, as the award itself writes them.
      const awarded = await JobEvent.findOne({ where: { jobId: job.id, kind: "awarded" }, rejectOnEmpty: true });
      expect(awarded.detail).toMatchObject({ totalCents: job.totalCents, currency: job.currency, retainerCents: job.retainerCents });
    }
  });

  it("shows Priya the press offers with the cheapest complete one marked, and no drafts", async () => {
    const press = await Spec.findOne({ where: { title: "Panel press, main ram" }, rejectOnEmpty: true });
    const visitor = await signedInDemo("priya@kestrel-forming.test");
    const res = await visitor.get(bidsRoute.loader, `/specs/${press.id}/bids`, { specId: press.id });
    expect(res.status).toBe(200);
    const { columns, cheapestCompleteId } = res.data.comparison;
    expect(columns.map((c: { shop: string }) => c.shop)).toEqual(["Northgate Hydraulics", "Ironbridge Fluid Power"]);
    expect(cheapestCompleteId).toBe(columns[0].id);
    expect(columns[0].alternatives).toBe(1);
  });

  it("has a machine of two axes on one power unit, with offers priced line by line against the machine's bill", async () => {
    const cell = await Spec.findOne({ where: { title: "Hemming cell, clamp and hemming ram" }, rejectOnEmpty: true });
    const revision = await SpecRevision.findOne({ where: { specId: cell.id, number: 1 }, rejectOnEmpty: true });
    expect(revision.machine).not.toBeNull();
    expect(revision.axes.map((a) => a.name)).toEqual(["Clamp", "Hemming ram"]);
    expect(revision.machine!.sequence.map((step) => step.map((m) => `${m.axis} ${m.motion}`))).toEqual([
      ["Clamp extend"],
      ["Hemming ram extend"],
      ["Hemming ram retract"],
      ["Clamp retract"],
    ]);
    // The spec row's figures are the machine's, as publishing writes them.
    expect([cell.reliefSettingBar, cell.pumpFlowLpm]).toEqual([revision.machine!.pressuresBar.reliefSetting, revision.machine!.flowsLpm.pump]);
    // Its draft-layout answers read back as the form reads them: every step done.
    const { draft, completed } = readDraft(cell.answers, cell.completedSteps);
    expect(completed).toEqual(stepIdsOf(draft));
    const bill = billOf(revision).map((l) => l.key);
    expect(bill.some((key) => key.includes("Hemming ram"))).toBe(true);
    const offers = await Bid.findAll({ where: { specId: cell.id } });
    expect(offers).toHaveLength(2);
    for (const offer of offers) expect(offer.lines.map((l) => l.key)).toEqual(bill);
  });

  it("shows Aled the answered question, without the asker's name", async () => {
    const press = await Spec.findOne({ where: { title: "Panel press, main ram" }, rejectOnEmpty: true });
    const visitor = await signedInDemo("sofia@northgate-hyd.test");
    const res = await visitor.get(specPage.loader, `/specs/${press.id}`, { specId: press.id });
    expect(JSON.stringify(res.data.questions)).toContain("120 mm of clearance");
    expect(JSON.stringify(res.data.questions)).not.toContain("Ironbridge");
  });

  it("has a job handed over and waiting for Tom's acceptance, and one accepted with its balance paid by bank transfer", async () => {
    const tom = await User.findOne({ where: { email: "tom@marlow-decks.test" }, rejectOnEmpty: true });
    const byTitle = async (title: string) => (await Job.findOne({ include: [{ model: Spec, as: "spec", where: { title } }], rejectOnEmpty: true })).id;
    expect(await handoverPanelOf(tom, await byTitle("Dock leveller, lift cylinder"))).toMatchObject({ state: "awaiting", canAnswer: true });
    const closed = await byTitle("Tail lift, platform cylinder");
    expect(await handoverPanelOf(tom, closed)).toMatchObject({ state: "accepted", acceptedBy: "Tom Hadley" });
    expect(await balancePanelOf(tom, closed)).toMatchObject({ method: "bank_transfer", reference: "BACS MARLOW 0412", canPay: false });
  });

  it("keeps an order confirmation with each job, its money the job's and its shop the awarded one", async () => {
    for (const job of await Job.findAll({
      include: [
        { model: OrderConfirmation, as: "order" },
        { model: Organisation, as: "shopOrganisation" },
      ],
    })) {
      const order = (job.get("order") as OrderConfirmation).document;
      expect(order.number).toMatch(/^TF-\d{4}-\d{6}$/);
      expect(order).toMatchObject({ totalCents: job.totalCents, retainerCents: job.retainerCents, balanceCents: job.totalCents - job.retainerCents });
      expect(order.shop.name).toBe((job.get("shopOrganisation") as Organisation).name);
      expect(order.terms.length).toBeGreaterThan(0);
    }
  });

  it("gives Nadia the jobs of her accounts, the late lift table first", async () => {
    const visitor = await signedInDemo("nadia@tenderflow.test");
    const res = await visitor.get(jobsRoute.loader, "/jobs");
    expect(res.status).toBe(200);
    expect(res.data.jobs.map((j: { specTitle: string; overdue: boolean }) => [j.specTitle, j.overdue])).toEqual([
      ["Scissor lift table, main cylinder", true],
      ["Coil clamp, hold-down cylinder", false],
      ["Dock leveller, lift cylinder", false],
      ["Tail lift, platform cylinder", false],
    ]);
  });

  it("lists the lift table's paid retainer among Nadia's payments, matching its job", async () => {
    const visitor = await signedInDemo("nadia@tenderflow.test");
    const res = await visitor.get(paymentsRoute.loader, "/payments");
    expect(res.data.payments.map((p: { specTitle: string; status: string }) => [p.specTitle, p.status])).toEqual([
      ["Scissor lift table, main cylinder", "paid"],
      ["Dock leveller, lift cylinder", "paid"],
      ["Tail lift, platform cylinder", "paid"],
    ]);
    const job = await Job.findByPk(res.data.payments[0].jobId, { rejectOnEmpty: true });
    expect(job.retainerPaidAt).not.toBeNull();
    expect(res.data.payments[0].amountCents).toBe(job.retainerCents);
  });

  it("shows the operator's side: an unassigned new buyer, Kestrel's notes and profile, an audit log with history", async () => {
    const felix = await signedInDemo("felix@tenderflow.test");
    const home = await felix.get(adminUsersRoute.loader, "/admin/users");
    expect(home.data.unassigned.accounts.map((a: { name: string }) => a.name)).toEqual(["Penhallow Packaging Lines"]);
    const nadia = await signedInDemo("nadia@tenderflow.test");
    expect((await nadia.get(jobsRoute.loader, "/jobs")).data.unassigned.total).toBe(1);
    const kestrel = await Organisation.findOne({ where: { name: "Kestrel Forming Machines" }, rejectOnEmpty: true });
    const view = (await nadia.get(accountRoute.loader, `/accounts/${kestrel.id}`, { organisationId: kestrel.id })).data.account;
    expect(view.notes).toHaveLength(2);
    expect(view.profile.quoteContact.email).toBe("buying@kestrel-forming.test");
    expect(view.openSpecs.length).toBeGreaterThan(0);
    const audit = await felix.get(adminAuditRoute.loader, "/admin/audit?action=bid-awarded");
    expect(audit.data.total).toBe(await Job.count());
    expect((await felix.get(adminAuditRoute.loader, "/admin/audit?action=shop-approved")).data.total).toBe(3);
  });
});
