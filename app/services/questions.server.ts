import { Op, type Transaction } from "sequelize";
import { Bid, Organisation, Spec, SpecQuestion, User, sequelize } from "~/models/index.server";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { questionAnsweredMail, questionAskedMail } from "./mail-templates.server";
import { specFor, specForReader } from "./spec-access.server";
import { can, questionsWhere, viewerOf } from "~/auth/access-policy.server";
import { formatDay } from "~/content/dates";
import { takesBids } from "~/content/spec-status";

// Shops' questions on a spec and the buyer's answers.
//
// Who sees what: the buyer sees every question with the asking shop's name; a shop sees every
// answered question and its own unanswered ones, never another shop's name; operator staff who
// may read the spec (its account manager, admins) see every question, read only, without names.
// Shops ask while the spec is open for bids (status open, deadline ahead); the buyer answers, or
// edits an answer, while the spec is open.

export interface QuestionView {
  id: string;
  body: string;
  askedAt: string;
  /** Who asked, as this reader may know it: the shop's name (buyer only), "Your question", or "A shop asked". */
  askedBy: string;
  isOwn: boolean;
  answer: string | null;
  /** When the answer was given or last changed. */
  answeredAt: string | null;
}

export interface QuestionsPanel {
  questions: QuestionView[];
  /** This reader may ask a question now. */
  canAsk: boolean;
  /** This reader may answer (or change answers) now. */
  canAnswer: boolean;
  /** The reader is the buyer: the panel says that answers are shown to every shop. */
  isBuyer: boolean;
  /** Why questions are closed, when they are. */
  closedNote: string | null;
}

/** Open for questions: open for bids, deadline still ahead. */
const takesQuestions = (spec: Pick<Spec, "status" | "bidDeadline">, now = new Date()) => takesBids(spec, now);

function closedNote(spec: Pick<Spec, "status" | "bidDeadline">, now = new Date()): string | null {
  if (takesQuestions(spec, now)) return null;
  if (spec.status === "open" && spec.bidDeadline) {
    return `Bidding closed on ${formatDay(spec.bidDeadline)}, so this spec takes no new questions.`;
  }
  return "This spec is no longer open for bids, so it takes no new questions.";
}

/** The questions panel of a spec the user may read (a 404 otherwise). */
export async function questionsFor(user: User, specId: string | undefined, now = new Date()): Promise<QuestionsPanel> {
  const viewer = await viewerOf(user);
  const spec = await specForReader(user, specId);
  const isBuyer = can(viewer, "spec.seeAskers", spec);
  const rows = await SpecQuestion.findAll({
    where: { [Op.and]: [questionsWhere(viewer), { specId: spec.id }] },
    include: isBuyer ? [{ model: Organisation, as: "organisation", attributes: ["name"] }] : [],
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
  });
  const questions = rows.map((q): QuestionView => {
    // Only shops ask, so a question of the viewer's organisation is their shop's.
    const isOwn = q.organisationId === user.organisationId;
    const name = (q as SpecQuestion & { organisation?: Organisation }).organisation?.name;
    return {
      id: q.id,
      body: q.body,
      askedAt: q.createdAt.toISOString(),
      askedBy: isBuyer ? `${name ?? "A shop"} asked` : isOwn ? "Your question" : "A shop asked",
      isOwn,
      answer: q.answer,
      answeredAt: q.answeredAt?.toISOString() ?? null,
    };
  });
  return {
    questions,
    canAsk: can(viewer, "spec.askQuestion", spec) && takesQuestions(spec, now),
    canAnswer: can(viewer, "spec.answerQuestion", spec) && spec.status === "open",
    isBuyer,
    closedNote: closedNote(spec, now),
  };
}

/** How many questions wait for an answer on each of these specs, as far as the viewer may see them. */
export async function waitingQuestionCounts(user: User, specIds: string[]): Promise<Map<string, number>> {
  if (!specIds.length) return new Map();
  const viewer = await viewerOf(user);
  const rows = (await SpecQuestion.count({
    where: { [Op.and]: [questionsWhere(viewer), { specId: specIds, answer: null }] },
    group: ["specId"],
  })) as unknown as { specId: string; count: number }[];
  return new Map(rows.map((r) => [r.specId, Number(r.count)]));
}

const lockSpec = (specId: string, transaction: Transaction) => Spec.findByPk(specId, { lock: transaction.LOCK.SHARE, transaction, rejectOnEmpty: true });

/**
 * A shop asks a question on a spec open for bids. The buyer organisation's active users are
 * e-mailed in the same transaction.
 */
export async function askQuestion(user: User, specId: string | undefined, { body }: { body: string }): Promise<SpecQuestion> {
  const spec = await specFor(user, specId, "spec.askQuestion");
  return sequelize.transaction(async (transaction) => {
    // A share lock: closing or awarding the spec waits until this question is in, or the other way round.
    const locked = await lockSpec(spec.id, transaction);
    const closed = closedNote(locked);
    if (closed) throw new FieldErrors({ body: [closed] });
    const question = await SpecQuestion.create(
      { specId: locked.id, organisationId: user.organisationId, askedById: user.id, body, answer: null, answeredById: null, answeredAt: null },
      { transaction },
    );
    const shop = await Organisation.findByPk(user.organisationId, { transaction, rejectOnEmpty: true });
    const buyers = await User.findAll({ where: { organisationId: locked.organisationId, active: true }, transaction });
    for (const buyer of buyers) {
      const mail = questionAskedMail({ name: buyer.name, shopName: shop.name, specId: locked.id, specTitle: locked.title, question: body });
      await enqueueMail({ to: buyer.email, ...mail }, transaction);
    }
    return question;
  });
}

/**
 * The buyer answers a question on their own spec while it is open, or changes the answer. The
 * asker and the active users of every shop with a bid on the spec (any status) are e-mailed.
 * Returns how many people were told.
 */
export async function answerQuestion(user: User, specId: string | undefined, { questionId, answer }: { questionId: string | undefined; answer: string }) {
  const spec = await specFor(user, specId, "spec.answerQuestion");
  const id = requireId(questionId);
  return sequelize.transaction(async (transaction) => {
    const locked = await lockSpec(spec.id, transaction);
    const question = await SpecQuestion.findOne({ where: { id, specId: locked.id }, lock: transaction.LOCK.UPDATE, transaction });
    if (!question) notFound("No such question.");
    if (locked.status !== "open") throw new FieldErrors({ answer: ["This spec is no longer open, so its questions can no longer be answered."] });
    const edited = question.answer !== null;
    await question.update({ answer, answeredById: user.id, answeredAt: new Date() }, { transaction });

    const bidders = await Bid.findAll({ where: { specId: locked.id }, attributes: ["organisationId"], transaction });
    const recipients = await User.findAll({
      where: {
        active: true,
        // The asker and the people of every shop with a bid on the spec.
        [Op.or]: [{ id: question.askedById }, { organisationId: bidders.map((b) => b.organisationId) }],
      },
      order: [["email", "ASC"]],
      transaction,
    });
    for (const person of recipients) {
      const isAsker = person.id === question.askedById;
      const mail = questionAnsweredMail({ name: person.name, isAsker, edited, specId: locked.id, specTitle: locked.title, question: question.body, answer });
      await enqueueMail({ to: person.email, ...mail }, transaction);
    }
    return { question, edited, told: recipients.length };
  });
}
