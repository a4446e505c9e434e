// The access policy as one table per kind of question, checked against real records: who may
// list which record (the where-clauses) and who may take which action (`can`). A row reads
// across the people below; Y allows, . refuses. Change the policy and this table together.
import { beforeAll, describe, expect, it } from "vitest";
import type { Model, ModelStatic, WhereOptions } from "sequelize";
import { Op } from "sequelize";
import {
  ACTIONS,
  accountsWhere,
  bidsWhere,
  can,
  findInScope,
  jobsWhere,
  organisationsWhere,
  paymentsWhere,
  specsWhere,
  viewerOf,
  type Action,
  type Viewer,
} from "~/auth/access-policy.server";
import { Bid, Job, Organisation, Payment, Spec, User } from "~/models/index.server";
import { createDraft, deleteDraft, publish, saveStep, startRevision } from "~/services/specs.server";
import { saveBid, withdrawBid } from "~/services/bids.server";
import { awardBid, canAwardNow } from "~/services/award.server";
import { answerQuestion, askQuestion } from "~/services/questions.server";
import { addManagerNote, addProgressNote, reachMilestones } from "~/services/job-progress.server";
import { newAttempt, paymentOfSession, requestRefund, startRetainerPayment } from "~/services/payments.server";
import { decideShop, shopsAwaitingApproval } from "~/services/shop-approval.server";
import { assignAccountManager, changeRole, listOrganisations, listUsers, setActive } from "~/services/admin.server";
import { mailNeedingAttention, sendAgain } from "~/services/outbox-admin.server";
import { inviteColleague } from "~/services/accounts.server";
import { inDays, makeJob, makeMember, makeOperatorUser, uniqueEmail } from "../support/factories";

// buyer: the records' buyer · other buyer: another buyer account · shop: the job's shop (approved)
// other shop: another approved shop · pending: a shop awaiting approval · manager: the buyer
// account's account manager · other mgr: manager of the other account · admin.
const PEOPLE = ["buyer", "other buyer", "shop", "other shop", "pending", "manager", "other mgr", "admin"] as const;
type Person = (typeof PEOPLE)[number];

//  scope     record              buyer  other   shop  other  pending  manager  other  admin
//                                       buyer         shop                     mgr
const LISTS = `
    specs     published-spec        Y      .      Y     Y      .        Y        .      Y
    specs     draft-spec            Y      .      .     .      .        .        .      .
    bids      offered-bid           Y      .      Y     .      .        .        .      .
    bids      draft-bid             .      .      .     Y      .        .        .      .
    jobs      job                   Y      .      Y     .      .        Y        .      Y
    payments  payment               Y      .      .     .      .        Y        .      Y
    accounts  buyer-account         .      .      .     .      .        Y        .      Y
    orgs      buyer-account         .      .      .     .      .        Y        .      Y
    orgs      job-shop              .      .      .     .      .        Y        .      Y
    orgs      quiet-shop            .      .      .     .      .        .        .      Y
    orgs      pending-shop          .      .      .     .      .        .        .      Y
    orgs      operator              .      .      .     .      .        .        .      Y
`;

//  action                  record             buyer  other   shop  other  pending  manager  other  admin
//                                                    buyer         shop                     mgr
const ACTS = `
    job.recordProgress      job                  .      .      Y     .      .        .        .      .
    job.writeManagerNote    job                  .      .      .     .      .        Y        .      Y
    job.readInternalNotes   job                  .      .      .     .      .        Y        .      Y
    job.seePayments         job                  Y      .      .     .      .        Y        .      Y
    job.payRetainer         job                  Y      .      .     .      .        .        .      .
    job.acceptHandover      job                  Y      .      .     .      .        .        .      .
    job.exchangeFiles       job                  Y      .      Y     .      .        .        .      .
    job.payBalance          job                  Y      .      .     .      .        .        .      .
    job.recordBankTransfer  job                  .      .      .     .      .        Y        .      Y
    payment.refund          payment              .      .      .     .      .        Y        .      Y
    spec.edit               published-spec       Y      .      .     .      .        .        .      .
    spec.compareBids        published-spec       Y      .      .     .      .        .        .      .
    spec.award              published-spec       Y      .      .     .      .        .        .      .
    spec.answerQuestion     published-spec       Y      .      .     .      .        .        .      .
    spec.seeAskers          published-spec       Y      .      .     .      .        .        .      .
    spec.bid                published-spec       .      .      Y     Y      .        .        .      .
    spec.bid                draft-spec           .      .      .     .      .        .        .      .
    spec.askQuestion        published-spec       .      .      Y     Y      .        .        .      .
    spec.seeBuyerName       published-spec       Y      .      .     .      .        Y        .      Y
    shop.decide             pending-shop         .      .      .     .      .        .        .      Y
    shop.decide             buyer-account        .      .      .     .      .        .        .      .
    team.invite             buyer-account        Y      .      .     .      .        .        .      .
    team.invite             operator             .      .      .     .      .        .        .      Y
    account.seeUnassigned   none                 .      .      .     .      .        Y        Y      Y
    account.writeNote       buyer-account        .      .      .     .      .        Y        .      Y
    organisation.editProfile buyer-account       Y      .      .     .      .        .        .      .
    organisation.editProfile job-shop            .      .      Y     .      .        .        .      .
    organisation.editProfile operator            .      .      .     .      .        .        .      Y
    platform.administer     none                 .      .      .     .      .        .        .      Y
    audit.read              none                 .      .      .     .      .        .        .      Y
`;

function parse(table: string) {
  return table
    .trim()
    .split("\n")
    .map((line) => {
      const [first, record, ...marks] = line.trim().split(/\s+/);
      expect(marks, line).toHaveLength(PEOPLE.length);
      return { first, record, allowed: new Set(PEOPLE.filter((_, i) => marks[i] === "Y")) };
    });
}

const viewers = {} as Record<Person, Viewer>;
const people = {} as Record<Person, User>;
const records = {} as Record<string, (Model & { id: string }) | null>;

beforeAll(async () => {
  const users: Record<Person, User> = Object.assign(people, {
    buyer: await makeMember("buyer"),
    "other buyer": await makeMember("buyer"),
    shop: await makeMember("shop"),
    "other shop": await makeMember("shop"),
    pending: await makeMember("shop", { pending: true }),
    manager: await makeOperatorUser("account_manager"),
    "other mgr": await makeOperatorUser("account_manager"),
    admin: await makeOperatorUser("admin"),
  });
  // Operator staff share one operator organisation, as in the product.
  await users.manager.update({ organisationId: users.admin.organisationId });
  await users["other mgr"].update({ organisationId: users.admin.organisationId });
  await Organisation.update({ accountManagerId: users.manager.id }, { where: { id: users.buyer.organisationId } });
  await Organisation.update({ accountManagerId: users["other mgr"].id }, { where: { id: users["other buyer"].organisationId } });
  for (const person of PEOPLE) viewers[person] = await viewerOf(users[person]);

  const { spec, bid, job } = await makeJob(users.buyer, users.shop);
  const draftBid = await Bid.create({
    specId: spec.id,
    organisationId: users["other shop"].organisationId,
    createdById: users["other shop"].id,
    specRevision: 1,
    currency: spec.currency,
    lines: [],
    units: 1,
    setTotalCents: 0,
    totalCents: 0,
    leadTimeWeeks: null,
    validUntil: inDays(30),
    submittedAt: null,
  });
  const payment = await Payment.create(newAttempt(job, users.buyer.id));
  Object.assign(records, {
    "published-spec": spec,
    "draft-spec": await createDraft(users.buyer),
    "offered-bid": bid,
    "draft-bid": draftBid,
    job,
    payment,
    "buyer-account": await Organisation.findByPk(users.buyer.organisationId),
    "pending-shop": await Organisation.findByPk(users.pending.organisationId),
    "job-shop": await Organisation.findByPk(users.shop.organisationId),
    "quiet-shop": await Organisation.findByPk(users["other shop"].organisationId),
    operator: await Organisation.findByPk(users.admin.organisationId),
    none: null,
  });
});

const SCOPES: Record<string, { model: ModelStatic<Model>; where: (v: Viewer) => WhereOptions }> = {
  specs: { model: Spec, where: specsWhere },
  bids: { model: Bid, where: bidsWhere },
  jobs: { model: Job, where: jobsWhere },
  payments: { model: Payment, where: paymentsWhere },
  accounts: { model: Organisation, where: accountsWhere },
  orgs: { model: Organisation, where: organisationsWhere },
};

describe("who may list which record", () => {
  it.each(parse(LISTS))("$first: $record", async ({ first, record, allowed }) => {
    const { model, where } = SCOPES[first];
    const id = records[record]!.id;
    const seen = new Set<Person>();
    for (const person of PEOPLE) {
      if ((await model.count({ where: { [Op.and]: [where(viewers[person]), { id }] } })) === 1) seen.add(person);
    }
    expect([...seen]).toEqual([...allowed]);
  });
});

describe("who may take which action", () => {
  const rows = parse(ACTS);

  it("names every action of the policy", () => {
    expect(new Set(rows.map((r) => r.first))).toEqual(new Set(ACTIONS));
  });

  it.each(rows)("$first on $record", ({ first, record, allowed }) => {
    const seen = PEOPLE.filter((person) => can(viewers[person], first as Action, records[record] as never));
    expect(seen).toEqual([...allowed]);
  });
});

describe("what pages are told the viewer may do", () => {
  it("offers the award to the spec's buyer while it is open, to nobody else and not after", async () => {
    const spec = records["published-spec"] as Spec;
    expect(await canAwardNow(people.buyer, spec)).toBe(true);
    for (const person of ["other buyer", "shop", "manager", "admin"] as const) expect(await canAwardNow(people[person], spec)).toBe(false);
    expect(await canAwardNow(people.buyer, { organisationId: spec.organisationId, status: "awarded" })).toBe(false);
  });
});

describe("loading inside a scope", () => {
  it("shows a retainer payment's return page to its buyer, never to the job's shop", async () => {
    const payment = records.payment as Payment;
    await payment.update({ checkoutSessionId: "cs_matrix_return" });
    expect((await paymentOfSession(people.buyer, payment.jobId, "cs_matrix_return")).payment.id).toBe(payment.id);
    await expect(paymentOfSession(people.shop, payment.jobId, "cs_matrix_return")).rejects.toMatchObject({ init: { status: 404 } });
  });

  it("answers the record to its reader and 404 to anyone else, or for a malformed id", async () => {
    const job = records.job!;
    expect((await findInScope(Job, jobsWhere(viewers.shop), job.id, { missing: "No such job." })).id).toBe(job.id);
    for (const id of [job.id, "not-an-id", undefined]) {
      const refused = await findInScope(Job, jobsWhere(viewers["other shop"]), id, { missing: "No such job." }).catch((e) => e);
      expect(refused.init?.status).toBe(404);
    }
  });
});

// Commands take (viewer, id, input) and authorise inside, whoever calls them: the person refused
// here gets the policy's answer (404 where the record is not theirs to know, 403 otherwise) and
// nothing changes.
describe("services refuse the wrong person themselves", () => {
  const id = (name: string) => records[name]!.id;
  const COMMANDS: [string, Person, 403 | 404, () => Promise<unknown>][] = [
    [
      "saveStep: another buyer",
      "other buyer",
      404,
      () => saveStep(people["other buyer"], id("draft-spec"), { step: "machine", answers: { title: "Taken over" }, complete: false }),
    ],
    ["publish: a shop", "shop", 404, () => publish(people.shop, id("published-spec"), { cautionsRead: true })],
    ["startRevision: the account's manager", "manager", 404, () => startRevision(people.manager, id("published-spec"))],
    ["deleteDraft: another buyer", "other buyer", 404, () => deleteDraft(people["other buyer"], id("draft-spec"))],
    ["saveBid: the buyer", "buyer", 404, () => saveBid(people.buyer, id("published-spec"), { intent: "save", lines: [] })],
    ["saveBid: a pending shop", "pending", 404, () => saveBid(people.pending, id("published-spec"), { intent: "save", lines: [] })],
    ["withdrawBid: an admin", "admin", 404, () => withdrawBid(people.admin, id("published-spec"))],
    ["awardBid: the shop", "shop", 404, () => awardBid(people.shop, id("published-spec"), { bidId: id("offered-bid") })],
    ["askQuestion: the buyer", "buyer", 404, () => askQuestion(people.buyer, id("published-spec"), { body: "Why?" })],
    ["answerQuestion: a shop", "other shop", 404, () => answerQuestion(people["other shop"], id("published-spec"), { questionId: id("job"), answer: "No." })],
    ["reachMilestones: the buyer", "buyer", 403, () => reachMilestones(people.buyer, id("job"), { milestone: "drawings_agreed", note: "" })],
    ["addProgressNote: another shop", "other shop", 404, () => addProgressNote(people["other shop"], id("job"), { body: "Hello" })],
    ["addManagerNote: the shop", "shop", 403, () => addManagerNote(people.shop, id("job"), { body: "Internal" })],
    ["addManagerNote: another account's manager", "other mgr", 404, () => addManagerNote(people["other mgr"], id("job"), { body: "Internal" })],
    ["startRetainerPayment: the account's manager", "manager", 403, () => startRetainerPayment(people.manager, id("job"))],
    ["requestRefund: the buyer", "buyer", 403, () => requestRefund(people.buyer, id("payment"), { amountCents: 100, reason: "Mine" })],
    [
      "requestRefund: another account's manager",
      "other mgr",
      404,
      () => requestRefund(people["other mgr"], id("payment"), { amountCents: 100, reason: "Not mine" }),
    ],
    ["decideShop: an account manager", "manager", 403, () => decideShop(people.manager, id("pending-shop"), { decision: "approve" })],
    [
      "assignAccountManager: an account manager",
      "manager",
      403,
      () => assignAccountManager(people.manager, id("buyer-account"), { managerId: people.manager.id }),
    ],
    ["changeRole: an account manager", "manager", 403, () => changeRole(people.manager, people.manager.id, "admin")],
    ["setActive: a buyer", "buyer", 403, () => setActive(people.buyer, people["other buyer"].id, false)],
    ["sendAgain: an account manager", "manager", 403, () => sendAgain(people.manager, id("job"))],
    ["inviteColleague into the operator: an account manager", "manager", 403, () => inviteColleague(people.manager, uniqueEmail("staff"), "admin")],
    // The administration's reads, too, whoever calls them.
    ["listUsers: an account manager", "manager", 403, () => listUsers(people.manager, {})],
    ["listOrganisations: a buyer", "buyer", 403, () => listOrganisations(people.buyer, {})],
    ["shopsAwaitingApproval: a shop", "shop", 403, () => shopsAwaitingApproval(people.shop)],
    ["mailNeedingAttention: an account manager", "manager", 403, () => mailNeedingAttention(people.manager, "failed")],
  ];

  it.each(COMMANDS)("%s", async (_name, _person, status, command) => {
    await expect(command()).rejects.toMatchObject({ init: { status } });
  });

  it("left every record as it was", async () => {
    const draft = await Spec.findByPk(id("draft-spec"), { rejectOnEmpty: true });
    expect(draft.title).not.toBe("Taken over");
    expect((await Spec.findByPk(id("published-spec"), { rejectOnEmpty: true })).status).toBe("open");
    expect((await Organisation.findByPk(id("pending-shop"), { rejectOnEmpty: true })).approval).toBe("pending");
    expect((await User.findByPk(people.manager.id, { rejectOnEmpty: true })).role).toBe("account_manager");
    expect((await User.findByPk(people["other buyer"].id, { rejectOnEmpty: true })).active).toBe(true);
  });
});
