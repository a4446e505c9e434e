import { type Order, type Transaction, type WhereOptions } from "sequelize";
import { ENGINE_VERSION, RequirementsError, sizeCircuit, sizeMachine } from "~/hydraulics";
import { toRequirementsInput } from "~/content/requirement-fields";
import { machineInput, machineProblems } from "~/content/machine-input";
import {
  AXIS_LIMITS,
  AXIS_STEP_KINDS,
  axisFormValues,
  axisStepId,
  copyName,
  cycleAnswers,
  cycleField,
  freshAxisName,
  newAxisId,
  readDraft,
  stepIdsOf,
  writeDraft,
  type Draft,
  type DraftAxis,
} from "~/content/spec-draft";
import { TEXT_MAX, quotationSchema } from "~/schemas/spec";
import { specSteps } from "~/content/spec-steps";
import { Spec, SpecRevision, User, sequelize } from "~/models/index.server";
import type { SpecStatus } from "~/models/spec.server";
import type { UnitSystem } from "~/units";
import { FieldErrors } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { specPublishedMail, specRevisedMail } from "./mail-templates.server";
import { removeAllAttachments } from "./attachments.server";
import { headlineFigures, publishedDesignOf, type PublishedDesign } from "./published-design";
import { readOnce } from "./render-cache.server";
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

/** The draft in a spec's answers, with its completed steps (reads drafts saved before machines too). */
export const draftOf = (spec: Spec) => readDraft(spec.answers, spec.completedSteps);

/** A draft, or a published spec the buyer is revising, can be edited in the form. */
export const isEditable = (spec: Spec) => spec.status === "draft" || (spec.status === "open" && spec.revising);

/** Locks the buyer's editable spec for a change, read again: another tab may have published it since. */
async function lockedEditable(user: User, specId: string | undefined, transaction: Transaction) {
  const locked = await specOfOwner(user, specId, { transaction, lock: true });
  if (!isEditable(locked))
    throw new FieldErrors({ "": ["This spec was published meanwhile, perhaps from another tab; a published spec is changed by revising it."] });
  return locked;
}

/** Stores a draft and its completed steps, in step order; the spec's title follows the machine step. */
function storeDraft(spec: Spec, draft: Draft, completed: Iterable<string>, transaction: Transaction) {
  const done = new Set(completed);
  const title = draft.machine.title?.trim() ? draft.machine.title.trim().slice(0, TEXT_MAX.title) : spec.title;
  return spec.update({ answers: writeDraft(draft), completedSteps: stepIdsOf(draft).filter((s) => done.has(s)), title }, { transaction });
}

/**
 * Saves one step's answers as typed: `step` is a step id ("machine", "<axis>-motion", "cycle",
 * "duty", "quotation"). `complete` marks the step done (its answers passed the step's schema); a
 * step left with Back keeps what was typed but stays incomplete. A step of the layout before
 * machines ("motion", or "machine" with the mounting answers) is saved onto the first axis.
 */
export async function saveStep(
  user: User,
  specId: string | undefined,
  { step, answers, complete }: { step: string; answers: Record<string, string>; complete: boolean },
): Promise<Spec> {
  return sequelize.transaction(async (transaction) => {
    const locked = await lockedEditable(user, specId, transaction);
    const { draft, completed } = draftOf(locked);
    const stored = writeDraft(draft);
    // The machine step posts the axes' names but not the list of axes: that stays as stored.
    stored[step] = step === "machine" ? { ...stored.machine, ...answers } : answers;
    const done = new Set(completed);
    if (complete) done.add(step);
    else done.delete(step);
    const next = readDraft(stored, [...done]);
    return storeDraft(locked, next.draft, next.completed, transaction);
  });
}

export type AxisChange = { op: "add" } | { op: "duplicate" | "remove" | "up" | "down"; axisId: string };

/**
 * Adds, duplicates, removes or moves an axis, saving the machine step's answers as typed with it
 * (`complete` as the machine step's schema judged them), so nothing typed is lost. A change of
 * the axes asks for another look at the cycle; moving one does not.
 */
export async function changeAxes(
  user: User,
  specId: string | undefined,
  { change, machine, complete }: { change: AxisChange; machine: Record<string, string>; complete: boolean },
): Promise<{ spec: Spec; axisId: string | null }> {
  return sequelize.transaction(async (transaction) => {
    const locked = await lockedEditable(user, specId, transaction);
    const stored = writeDraft(draftOf(locked).draft);
    stored.machine = { ...stored.machine, ...machine };
    const { draft, completed } = readDraft(stored, draftOf(locked).completed);
    const done = new Set(completed);
    if (complete) done.add("machine");
    else done.delete("machine");
    const axes = draft.axes;
    const index = change.op === "add" ? -1 : axes.findIndex((a) => a.id === change.axisId);
    if (change.op !== "add" && index < 0) throw new FieldErrors({ "": ["That axis is no longer in this spec; the page now shows the axes it has."] });
    let axisId: string | null = null;
    if (change.op === "add" || change.op === "duplicate") {
      if (axes.length >= AXIS_LIMITS.max) throw new FieldErrors({ "": [`A machine has at most ${AXIS_LIMITS.max} axes.`] });
      const id = newAxisId(axes.map((a) => a.id));
      const source = axes[index];
      const axis: DraftAxis = source
        ? { id, name: copyName(source.name, axes), mounting: { ...source.mounting }, motion: { ...source.motion } }
        : { id, name: freshAxisName(axes), mounting: {}, motion: {} };
      axes.splice(source ? index + 1 : axes.length, 0, axis);
      if (source) for (const kind of AXIS_STEP_KINDS) if (done.has(axisStepId(source.id, kind))) done.add(axisStepId(id, kind));
      // A copy moves after the others until the buyer places it.
      if (Object.keys(draft.cycle).length) draft.cycle = cycleAnswers(draft);
      done.delete("cycle");
      axisId = id;
    } else if (change.op === "remove") {
      if (axes.length <= AXIS_LIMITS.min) throw new FieldErrors({ "": ["A machine keeps at least one axis: change this one instead."] });
      const [gone] = axes.splice(index, 1);
      delete draft.cycle[cycleField(gone.id, "extend")];
      delete draft.cycle[cycleField(gone.id, "retract")];
      done.delete("cycle");
    } else {
      const to = change.op === "up" ? index - 1 : index + 1;
      if (to >= 0 && to < axes.length) [axes[index], axes[to]] = [axes[to], axes[index]];
    }
    const spec = await storeDraft(locked, draft, done, transaction);
    return { spec, axisId };
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

export interface DraftDesign {
  published: PublishedDesign | null;
  /** what keeps the draft from a design, each naming its axis or step */
  problems: string[];
}

/** The preliminary design of a draft's answers: one axis sized alone, or the machine; or the problems that keep it from one. */
export function designOf(spec: Spec): DraftDesign {
  const { draft } = draftOf(spec);
  const system = spec.unitSystem as UnitSystem;
  try {
    if (draft.axes.length === 1)
      return { published: { kind: "axis", design: sizeCircuit(toRequirementsInput(axisFormValues(draft, draft.axes[0]), system)) }, problems: [] };
    return { published: { kind: "machine", design: sizeMachine(machineInput(draft, system)) }, problems: [] };
  } catch (error) {
    if (error instanceof RequirementsError) return { published: null, problems: machineProblems(draft, error.fieldErrors) };
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
 * Publishes a completed draft: freezes requirements and design into the next revision, opens it
 * for bids until its deadline, and queues an e-mail to every approved shop, all in one
 * transaction. One axis is published as before (`machine` null); a machine of several axes keeps
 * its MachineDesign in `machine` and, per axis, its requirements with its entry of that design.
 */
export async function publish(user: User, specId: string | undefined, { cautionsRead }: { cautionsRead: boolean }): Promise<Spec> {
  const spec = await specOfOwner(user, specId);
  if (!isEditable(spec)) throw new FieldErrors({ "": ["This spec is already published."] });
  const { draft, completed } = draftOf(spec);
  const steps = specSteps(draft.axes);
  const missing = steps.filter((s) => s.kind !== "review" && !completed.includes(s.id));
  if (missing.length)
    throw new FieldErrors({ "": [`Complete every step first (${missing.map((s) => (s.axis ? `${s.axis.name}: ${s.title}` : s.title)).join(", ")}).`] });
  if (!cautionsRead) throw new FieldErrors({ cautionsRead: ["Confirm that you have read the cautions."] });
  const quotation = quotationSchema.safeParse(draft.quotation);
  if (!quotation.success) throw new FieldErrors({ "": ["The quotation step needs another look (the bid deadline may have passed)."] });
  const { published, problems } = designOf(spec);
  if (!published) throw new FieldErrors({ "": [`The machine could not be sized. ${problems.join(" ")}`] });
  const axes =
    published.kind === "machine"
      ? published.design.axes.map((axis) => ({ name: axis.name, requirements: axis.requirements, design: axis }))
      : [{ name: draft.axes[0].name.trim() || "Axis 1", requirements: published.design.requirements, design: published.design }];

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
        axes,
        machine: published.kind === "machine" ? published.design : null,
        answers: writeDraft(readDraft(locked.answers, locked.completedSteps).draft),
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
        ...headlineFigures(published),
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

/** A spec's revisions, newest first, without their designs: a page lists them all but shows one (designOfRevision). */
export async function revisionsOf(spec: Spec) {
  return SpecRevision.findAll({ where: { specId: spec.id }, attributes: { exclude: ["axes", "machine"] }, order: [["number", "DESC"]] });
}

/**
 * The design a revision was published with. A revision never changes once written, so each
 * worker reads and parses it once (the render cache), not on every view of its page.
 */
export function designOfRevision(revision: Pick<SpecRevision, "id"> | null | undefined): Promise<PublishedDesign | null> {
  if (!revision) return Promise.resolve(null);
  return readOnce(`revision:${revision.id}:design`, async () => {
    const row = await SpecRevision.findByPk(revision.id, { attributes: ["id", "axes", "machine"], rejectOnEmpty: true });
    // Shared by every request this worker serves: frozen, so no reader can change it for the next.
    return deepFreeze(publishedDesignOf(row));
  });
}

function deepFreeze<T>(value: T): T {
  if (value && typeof value === "object" && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}
