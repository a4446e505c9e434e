// Questions and answers on a spec: the lifecycle with every e-mail read from maildev, who sees
// which question and whose name, when questions close, and 404s for everyone else.
import { randomBytes } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import * as root from "~/root";
import * as specPage from "~/routes/spec";
import * as ask from "~/routes/spec-questions";
import * as answer from "~/routes/spec-question-answer";
import { Bid, OutboxMail, Spec, SpecQuestion, User } from "~/models/index.server";
import { hashPassword } from "~/services/accounts.server";
import { deliverDueMail } from "~/services/mail.server";
import { mailsTo, waitForMail } from "../support/mailbox";
import { PASSWORD, makeMember, makeOperatorUser, makePublishedSpec, uniqueEmail } from "../support/factories";
import { makeManagerOf } from "../support/parties";
import { Visitor } from "../support/routes";
import { signedIn } from "../support/sessions";

/** A second user in the same organisation. */
async function colleagueOf(user: User) {
  return User.create({
    organisationId: user.organisationId,
    email: uniqueEmail(`${user.role}-colleague`),
    name: `Colleague of ${user.name}`,
    passwordHash: await hashPassword(PASSWORD),
    role: user.role,
    lastSignInAt: null,
  });
}

const asking = (who: Visitor, specId: string, body: string) => who.post(ask.action, `/specs/${specId}/questions`, { body }, { specId });
const answering = (who: Visitor, specId: string, questionId: string, text: string) =>
  who.post(answer.action, `/specs/${specId}/questions/${questionId}/answer`, { answer: text }, { specId, questionId });
const page = (who: Visitor, specId: string) => who.get(specPage.loader, `/specs/${specId}`, { specId });

interface Q {
  id: string;
  body: string;
  askedBy: string;
  isOwn: boolean;
  answer: string | null;
}
const questionsOn = async (who: Visitor, specId: string) => {
  const res = await page(who, specId);
  expect(res.status).toBe(200);
  return res.data.questions.questions as Q[];
};

/** Sends the outbox and returns the subjects that arrived for `address` mentioning `about`. */
async function subjectsTo(address: string, about: string) {
  await deliverDueMail(100);
  return (await mailsTo(address)).map((m) => m.subject).filter((s) => s.includes(about));
}

let buyer: User;
let buyerColleague: User;
let shopA: User;
let shopAName: string;
let shopB: User;
let shopC: User;
let manager: User;
let spec: Spec;
let v: Record<"buyer" | "shopA" | "shopB" | "shopC" | "manager", Visitor>;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Harrowgate Presswerk" });
  buyerColleague = await colleagueOf(buyer);
  shopAName = `Ostrava Fluidtech ${randomBytes(2).toString("hex")}`;
  shopA = await makeMember("shop", { organisationName: shopAName });
  shopB = await makeMember("shop", { organisationName: "Brackwater Hydraulik" });
  shopC = await makeMember("shop", { organisationName: "Cinderford Power Units" });
  manager = await makeManagerOf(buyer);
  spec = await makePublishedSpec(buyer, { machine: { title: "Coil car lift" } });
  v = {
    buyer: await signedIn(buyer),
    shopA: await signedIn(shopA),
    shopB: await signedIn(shopB),
    shopC: await signedIn(shopC),
    manager: await signedIn(manager),
  };
});

describe("a question from its asking to its answer", () => {
  it("mails the buyer organisation, hides the question from other shops until answered, then tells the asker and the bidders", async () => {
    const body = "May the power unit stand 8 m away from the lift, on the mezzanine?";
    const asked = await asking(v.shopA, spec.id, body);
    expect(asked.status).toBe(302);
    expect(asked.location).toBe(`/specs/${spec.id}#questions`);
    const toast = await v.shopA.get(root.loader, `/specs/${spec.id}`);
    expect(toast.data.toast).toMatch(/Question sent/);
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(question).toMatchObject({ body, organisationId: shopA.organisationId, askedById: shopA.id, answer: null });

    // Both users of the buyer organisation are told, with the shop's name and the question.
    await deliverDueMail(100);
    for (const person of [buyer, buyerColleague]) {
      const mail = await waitForMail(person.email, "New question on your spec: Coil car lift");
      expect(mail.text).toContain(body);
      expect(mail.text).toContain(shopAName);
      expect(mail.text).toContain(`/specs/${spec.id}#questions`);
    }

    // Before the answer: the asker and the buyer see it, other shops don't.
    expect(await questionsOn(v.shopA, spec.id)).toMatchObject([{ id: question.id, askedBy: "Your question", isOwn: true, answer: null }]);
    expect(await questionsOn(v.buyer, spec.id)).toMatchObject([{ id: question.id, askedBy: `${shopAName} asked`, isOwn: false }]);
    expect(await questionsOn(v.shopB, spec.id)).toEqual([]);
    expect(await questionsOn(v.shopC, spec.id)).toEqual([]);
    // The account manager sees every question, read only and without the shop's name.
    const managed = await page(v.manager, spec.id);
    expect(managed.data.questions).toMatchObject({ canAsk: false, canAnswer: false, questions: [{ id: question.id, askedBy: "A shop asked" }] });
    expect(JSON.stringify(managed.data)).not.toContain(shopAName);
    const buyerPanel = (await page(v.buyer, spec.id)).data.questions;
    expect(buyerPanel).toMatchObject({ canAsk: false, canAnswer: true, isBuyer: true });

    // Shop B has a bid (a draft is enough); shop C has none.
    await Bid.create({
      specId: spec.id,
      organisationId: shopB.organisationId,
      createdById: shopB.id,
      specRevision: 1,
      currency: "GBP",
      leadTimeWeeks: null,
      validUntil: null,
      submittedAt: null,
    });
    const shopBColleague = await colleagueOf(shopB);

    const reply = "Yes, up to 10 m; the pressure line may run along the mezzanine rail.";
    const answered = await answering(v.buyer, spec.id, question.id, reply);
    expect(answered.status).toBe(302);
    expect(answered.location).toBe(`/specs/${spec.id}#questions`);
    expect((await v.buyer.get(root.loader, `/specs/${spec.id}`)).data.toast).toMatch(/Answer published.*3 people/);
    await question.reload();
    expect(question).toMatchObject({ answer: reply, answeredById: buyer.id });
    expect(question.answeredAt).toBeInstanceOf(Date);

    await deliverDueMail(100);
    const toAsker = await waitForMail(shopA.email, "Question answered: Coil car lift");
    expect(toAsker.text).toContain("your question");
    expect(toAsker.text).toContain(reply);
    for (const bidder of [shopB, shopBColleague]) {
      const mail = await waitForMail(bidder.email, "Question answered: Coil car lift");
      expect(mail.text).toContain(body);
      expect(mail.text).toContain(reply);
      expect(mail.text).not.toContain(shopAName);
    }
    expect(await subjectsTo(shopC.email, "Question answered")).toEqual([]);
    expect(await subjectsTo(buyer.email, "Question answered")).toEqual([]);

    // After the answer every shop sees it; only the asker knows it as theirs, no shop sees the name.
    for (const other of [v.shopB, v.shopC]) {
      const res = await page(other, spec.id);
      expect(res.data.questions.questions).toMatchObject([{ id: question.id, askedBy: "A shop asked", isOwn: false, answer: reply }]);
      expect(JSON.stringify(res.data)).not.toContain(shopAName);
    }
    expect(await questionsOn(v.shopA, spec.id)).toMatchObject([{ askedBy: "Your question", isOwn: true, answer: reply }]);

    // Changing the answer tells the same people again.
    const changed = "Yes, up to 12 m with a 1¼ in pressure line.";
    expect((await answering(v.buyer, spec.id, question.id, changed)).status).toBe(302);
    await deliverDueMail(100);
    for (const person of [shopA, shopB, shopBColleague]) {
      expect((await waitForMail(person.email, "Answer updated: Coil car lift")).text).toContain(changed);
    }
    expect(await questionsOn(v.shopC, spec.id)).toMatchObject([{ answer: changed }]);
  });

  it("shows a shop its own unanswered question but never another shop's", async () => {
    const fresh = await makePublishedSpec(buyer, { machine: { title: "Tilting deck, two questions" } });
    expect((await asking(v.shopA, fresh.id, "Is the deck painted by you or by us?")).status).toBe(302);
    expect((await asking(v.shopB, fresh.id, "Which PLC drives the valves?")).status).toBe(302);
    expect((await questionsOn(v.shopA, fresh.id)).map((q) => [q.body, q.askedBy])).toEqual([["Is the deck painted by you or by us?", "Your question"]]);
    expect((await questionsOn(v.shopB, fresh.id)).map((q) => [q.body, q.askedBy])).toEqual([["Which PLC drives the valves?", "Your question"]]);
    expect(await questionsOn(v.shopC, fresh.id)).toEqual([]);
    expect((await questionsOn(v.buyer, fresh.id)).map((q) => q.askedBy)).toEqual([`${shopAName} asked`, "Brackwater Hydraulik asked"]);
    expect(JSON.stringify((await page(v.shopB, fresh.id)).data)).not.toContain(shopAName);
  });
});

describe("refused questions and answers", () => {
  it("returns the problem with status 400 and stores nothing for an empty or too long text", async () => {
    const before = await SpecQuestion.count();
    const empty = await asking(v.shopA, spec.id, "   ");
    expect(empty.status).toBe(400);
    expect(empty.data.result.error.body).toEqual(["Write your question first."]);
    const long = await asking(v.shopA, spec.id, "x".repeat(2001));
    expect(long.status).toBe(400);
    expect(long.data.result.error.body[0]).toMatch(/2000 characters or fewer/);
    // What was typed comes back with the refusal, so nothing is lost.
    expect(long.data.result.initialValue.body).toBe("x".repeat(2001));
    expect(await SpecQuestion.count()).toBe(before);
    expect((await asking(v.shopA, spec.id, "y".repeat(2000))).status).toBe(302);

    const question = await SpecQuestion.findOne({ where: { specId: spec.id, body: "y".repeat(2000) }, rejectOnEmpty: true });
    const blank = await answering(v.buyer, spec.id, question.id, "");
    expect(blank.status).toBe(400);
    expect(blank.data.result.error.answer).toEqual(["Write the answer first."]);
    expect((await question.reload()).answer).toBeNull();
  });

  it("closes questions when bidding ends; the buyer may still answer while the spec is open, not after", async () => {
    const closing = await makePublishedSpec(buyer, { machine: { title: "Clamp for the press brake" } });
    expect((await asking(v.shopC, closing.id, "Is a manual pump for emergencies wanted?")).status).toBe(302);
    const question = await SpecQuestion.findOne({ where: { specId: closing.id }, rejectOnEmpty: true });
    await closing.update({ bidDeadline: new Date(Date.now() - 60_000) });

    const late = await asking(v.shopC, closing.id, "And a pressure gauge?");
    expect(late.status).toBe(400);
    expect(late.data.result.error.body[0]).toMatch(/Bidding closed on .*takes no new questions/);
    expect(await SpecQuestion.count({ where: { specId: closing.id } })).toBe(1);
    expect((await page(v.shopC, closing.id)).data.questions).toMatchObject({ canAsk: false, closedNote: expect.stringMatching(/takes no new questions/) });

    expect((await answering(v.buyer, closing.id, question.id, "No, the plant has its own.")).status).toBe(302);
    await closing.update({ status: "closed" });
    const refused = await answering(v.buyer, closing.id, question.id, "Changed my mind.");
    expect(refused.status).toBe(400);
    expect(refused.data.result.error.answer[0]).toMatch(/no longer open/);
    expect((await question.reload()).answer).toBe("No, the plant has its own.");
    expect((await asking(v.shopC, closing.id, "Still there?")).data.result.error.body[0]).toMatch(/no longer open for bids/);
    expect((await page(v.buyer, closing.id)).data.questions.canAnswer).toBe(false);
  });
});

describe("who may ask, answer and read", () => {
  it("gives a buyer of another organisation 404 on the spec and on answering", async () => {
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, order: [["createdAt", "ASC"]], rejectOnEmpty: true });
    const stranger = await signedIn(await makeMember("buyer"));
    expect((await page(stranger, spec.id)).status).toBe(404);
    expect((await answering(stranger, spec.id, question.id, "Not mine to answer.")).status).toBe(404);
    expect((await question.reload()).answer).not.toBe("Not mine to answer.");
  });

  it("gives an account manager of another account 404, and lets the account's manager read only", async () => {
    const other = await signedIn(await makeOperatorUser("account_manager"));
    expect((await page(other, spec.id)).status).toBe(404);
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect((await answering(v.manager, spec.id, question.id, "Operator says yes.")).status).toBe(403);
    expect((await asking(v.manager, spec.id, "Operator asks.")).status).toBe(403);
  });

  it("lets only shops ask and only the spec's buyer answer", async () => {
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect((await asking(v.buyer, spec.id, "Asking my own spec?")).status).toBe(403);
    expect((await answering(v.shopB, spec.id, question.id, "A shop answering.")).status).toBe(403);
    const draft = await Spec.create({
      organisationId: buyer.organisationId,
      createdById: buyer.id,
      title: "Unpublished press",
      bidDeadline: null,
      retainerPercent: null,
      deliveryRegion: null,
      publishedAt: null,
    });
    expect((await asking(v.shopA, draft.id, "Can I see this?")).status).toBe(404);
    expect(await SpecQuestion.count({ where: { specId: draft.id } })).toBe(0);
  });

  it("answers forged and malformed ids with 404", async () => {
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const missing = "00000000-0000-4000-8000-000000000000";
    expect((await asking(v.shopA, "not-an-id", "Hello?")).status).toBe(404);
    expect((await asking(v.shopA, missing, "Hello?")).status).toBe(404);
    expect((await answering(v.buyer, spec.id, "1; drop table spec_questions", "Hi")).status).toBe(404);
    expect((await answering(v.buyer, spec.id, missing, "Hi")).status).toBe(404);
    expect((await answering(v.buyer, "nope", question.id, "Hi")).status).toBe(404);
    // A real question, but of another spec of the same buyer.
    const second = await makePublishedSpec(buyer, { machine: { title: "Second spec" } });
    expect((await answering(v.buyer, second.id, question.id, "Hi")).status).toBe(404);
    expect((await question.reload()).answer).not.toBe("Hi");
  });

  it("sends signed-out visitors to sign in", async () => {
    const question = await SpecQuestion.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    const before = await OutboxMail.count();
    const asked = await asking(new Visitor(), spec.id, "Anonymous?");
    expect(asked.status).toBe(302);
    expect(asked.location).toMatch(/^\/sign-in\?redirectTo=/);
    const answered = await answering(new Visitor(), spec.id, question.id, "Anonymous.");
    expect(answered.location).toMatch(/^\/sign-in\?redirectTo=/);
    expect(await OutboxMail.count()).toBe(before);
  });
});

describe("questions waiting for the buyer", () => {
  it("are counted on the buyer's list of specs until answered, and never for a shop's questions it may not see", async () => {
    const specsPage = await import("~/routes/specs");
    const owner = await makeMember("buyer");
    const published = await makePublishedSpec(owner, { machine: { title: "Waiting-question press" } });
    const shop = await signedIn(await makeMember("shop"));
    const buyerVisitor = await signedIn(owner);
    const listed = async () => {
      const res = await buyerVisitor.get(specsPage.loader, "/specs");
      expect(res.status).toBe(200);
      return (res.data.specs as { id: string; waitingQuestions: number }[]).find((s) => s.id === published.id)!;
    };
    expect((await listed()).waitingQuestions).toBe(0);
    expect((await asking(shop, published.id, "Is the cylinder painted?")).status).toBe(302);
    expect((await asking(shop, published.id, "Which hose fittings?")).status).toBe(302);
    expect((await listed()).waitingQuestions).toBe(2);
    const [first] = await SpecQuestion.findAll({ where: { specId: published.id }, order: [["createdAt", "ASC"]] });
    expect((await answering(buyerVisitor, published.id, first.id, "Yes, RAL 5015.")).status).toBe(302);
    expect((await listed()).waitingQuestions).toBe(1);
  });
});
