import { type Order, type WhereOptions } from "sequelize";
import { ENGINE_VERSION, RequirementsError, sizeCircuit, type Design } from "~/hydraulics";
import { toRequirementsInput, type FormValues } from "~/content/requirement-fields";
import { FORM_STEPS, type FormStepId } from "~/content/spec-steps";
import { quotationSchema } from "~/schemas/spec";
import { Spec, SpecRevision, User, sequelize } from "~/models/index.server";
import type { SpecStatus } from "~/models/spec.server";
import { FieldErrors } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { specPublishedMail, specRevisedMail } from "./mail-templates.server";
import { removeAllAttachments } from "./attachments.server";
import { shopPeopleToTell, specOfOwner } from "./spec-access.server";

// Specs of a buyer organisation: drafts saved step by step, then published as revisions.

export async function createDraft(user: User) {
  return Spec.create({
    organisationId: user.organisationId,
    createdById: user.id,
    unitSystem: user.unitSystem,
    bidDeadline: null,
    retainerPercent: null,
    deliveryRegion: null,
    publishedAt: null,
  });
}

/** Every answer of every step, flat, as typed. */
export function allAnswers(spec: Spec): FormValues {
  return Object.assign({}, ...Object.values(spec.answers ?? {}));
}

/**
 * Saves one step's answers. `complete` marks the step done (its answers passed the step's
 * schema); a step left with Back keeps what was typed but stays incomplete.
 */
/** A draft, or a published spec the buyer is revising, can be edited in the form. */
export const isEditable = (spec: Spec) => spec.status === "draft" || (spec.status === "open" && spec.revising);

export async function saveStep(
  user: User,
  specId: string | undefined,
  { step, answers, complete }: { step: FormStepId; answers: Record<string, string>; complete: boolean },
): Promise<Spec> {
  return sequelize.transaction(async (transaction) => {
    // Locked and read again: another tab may have published the spec since this one loaded it.
    const locked = await specOfOwner(user, specId, { transaction, lock: true });
    if (!isEditable(locked))
      throw new FieldErrors({ "": ["This spec was published meanwhile, perhaps from another tab; a published spec is changed by revising it."] });
    const completed = new Set(locked.completedSteps);
    if (complete) completed.add(step);
    else completed.delete(step);
    const title = step === "machine" && answers.title ? answers.title.trim().slice(0, 120) : locked.title;
    return locked.update(
      { answers: { ...locked.answers, [step]: answers }, completedSteps: FORM_STEPS.filter((s) => completed.has(s)), title },
      { transaction },
    );
  });
}

/** Deletes one of the buyer's drafts with its files; returns the deleted spec (for its title). */
export async function deleteDraft(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await specOfOwner(user, specId);
  if (spec.status !== "draft") throw new FieldErrors({ "": ["Only drafts can be deleted."] });
  // Files first: the rows go with the spec, the files on storage would be left behind.
  await removeAllAttachments(user, spec.id);
  await spec.destroy();
  return spec;
}

/** The preliminary design of a draft's answers, or the problems that keep it from one. */
export function designOf(spec: Spec): { design: Design | null; fieldErrors: Record<string, string[]> } {
  try {
    return { design: sizeCircuit(toRequirementsInput(allAnswers(spec), spec.unitSystem)), fieldErrors: {} };
  } catch (error) {
    if (error instanceof RequirementsError) return { design: null, fieldErrors: error.fieldErrors };
    throw error;
  }
}

export const SPEC_SORTS = {
  updated: [["updatedAt", "DESC"]],
  deadline: [["bidDeadline", "ASC NULLS LAST"]],
  title: [["title", "ASC"]],
} satisfies Record<string, Order>;
export type SpecSort = keyof typeof SPEC_SORTS;

export async function listSpecs(user: User, query: { status?: SpecStatus; sort?: SpecSort }) {
  const where: WhereOptions = { organisationId: user.organisationId, ...(query.status ? { status: query.status } : {}) };
  return Spec.findAll({
    where,
    order: [...SPEC_SORTS[query.sort ?? "updated"], ["id", "ASC"]],
    limit: 200,
  });
}

/**
 * Publishes a completed draft: freezes requirements and design into revision 1, opens it for
 * bids until its deadline, and queues an e-mail to every active shop user, all in one transaction.
 */
export async function publish(user: User, specId: string | undefined, { cautionsRead }: { cautionsRead: boolean }): Promise<Spec> {
  const spec = await specOfOwner(user, specId);
  if (!isEditable(spec)) throw new FieldErrors({ "": ["This spec is already published."] });
  const missing = FORM_STEPS.filter((s) => !spec.completedSteps.includes(s));
  if (missing.length) throw new FieldErrors({ "": [`Complete every step first (${missing.join(", ")}).`] });
  if (!cautionsRead) throw new FieldErrors({ cautionsRead: ["Confirm that you have read the cautions."] });
  const quotation = quotationSchema.safeParse(spec.answers.quotation ?? {});
  if (!quotation.success) throw new FieldErrors({ "": ["The quotation step needs another look (the bid deadline may have passed)."] });
  const { design, fieldErrors } = designOf(spec);
  if (!design) throw new FieldErrors({ "": [`The axis could not be sized: ${Object.keys(fieldErrors).join(", ")}.`] });

  await sequelize.transaction(async (transaction) => {
    // Lock the draft so two clicks on Publish make one revision.
    const locked = await Spec.findByPk(spec.id, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
    if (!isEditable(locked)) throw new FieldErrors({ "": ["This spec is already published."] });
    const isRevision = locked.status === "open";
    const number = locked.currentRevision + 1;
    await SpecRevision.create(
      {
        specId: spec.id,
        number,
        axes: [{ name: "Axis 1", requirements: design.requirements, design }],
        answers: locked.answers,
        unitSystem: locked.unitSystem,
        engineVersion: ENGINE_VERSION,
        createdById: user.id,
      },
      { transaction },
    );
    const deadline = new Date(`${quotation.data.bidDeadline}T23:59:59Z`);
    await locked.update(
      {
        status: "open",
        currentRevision: number,
        revising: false,
        publishedAt: isRevision ? locked.publishedAt : new Date(),
        bidDeadline: deadline,
        retainerPercent: String(quotation.data.retainerPercent),
        deliveryRegion: quotation.data.deliveryRegion,
        currency: quotation.data.currency,
        unitsWanted: quotation.data.unitsWanted,
        reliefSettingBar: design.pressuresBar.reliefSetting,
        pumpFlowLpm: design.flowsLpm.pump,
      },
      { transaction },
    );
    // Only shops approved to read specs hear of one.
    const shops = await shopPeopleToTell(transaction);
    for (const shop of shops) {
      const facts = { shopName: shop.name, specId: locked.id, specTitle: locked.title, bidDeadline: quotation.data.bidDeadline };
      const mail = isRevision
        ? specRevisedMail({ ...facts, revision: number })
        : specPublishedMail({ ...facts, deliveryRegion: quotation.data.deliveryRegion });
      await enqueueMail({ to: shop.email, ...mail, priority: "announcement" }, transaction);
    }
  });
  return spec.reload();
}

/** Starts revising a published spec; shops keep the current revision until the next is published. */
export async function startRevision(user: User, specId: string | undefined): Promise<Spec> {
  const spec = await specOfOwner(user, specId);
  if (spec.status !== "open") throw new FieldErrors({ "": ["Only a spec open for bids can be revised."] });
  return spec.revising ? spec : spec.update({ revising: true });
}

export async function revisionsOf(spec: Spec) {
  return SpecRevision.findAll({ where: { specId: spec.id }, order: [["number", "DESC"]] });
}
