import { Form, Link, useNavigation } from "react-router";
import { formatBytes } from "~/components/attachment-uploader";
import { CautionsPanel } from "~/components/design-panels";
import { DesignReport } from "~/components/design-report";
import { Button, Card, Notice, STICKY_ACTION_BAR } from "~/components/ui";
import { formatDay, isIsoDay } from "~/content/dates";
import { MachineReport } from "~/components/machine-report";
import { REQUIREMENT_FIELDS, answerInWords, fieldApplies, type RequirementKey } from "~/content/requirement-fields";
import { axisFormValues, type Draft } from "~/content/spec-draft";
import type { FormStepKind, StepRef } from "~/content/spec-steps";
import type { MachineMotion } from "~/hydraulics";
import type { PublishedDesign } from "~/services/published-design";
import { stepFieldNames } from "~/schemas/spec-fields";
import type { AttachmentView } from "~/services/attachments.server";
import type { UnitSystem } from "~/units";

// The spec form's last step: the sized axis or machine, every answer in words (each axis on its
// own card, the cycle in words), the drawings, the cautions, and Publish.

export interface SpecReviewProps {
  spec: { id: string; revising: boolean; nextRevision: number; unitSystem: UnitSystem; completedSteps: string[] };
  draft: Draft;
  /** the machine's cycle by axis name (two axes or more) */
  sequence: MachineMotion[][] | null;
  steps: StepRef[];
  published: PublishedDesign | null;
  /** what keeps the answers from a design, each naming its axis */
  problems: string[];
  attachments: AttachmentView[];
  publishError: string | null;
}

interface AnswerCard {
  id: string;
  title: string;
  edit: string;
  rows: { name: string; label: string; value: string }[];
}

export function SpecReview({ spec, draft, sequence, steps, published, problems, attachments, publishError }: SpecReviewProps) {
  const navigation = useNavigation();
  const incomplete = steps.filter((s) => s.kind !== "review" && !spec.completedSteps.includes(s.id));
  const system = spec.unitSystem;
  const rowsOf = (kind: FormStepKind, answers: Record<string, string | undefined>, deciding: Record<string, string | undefined>) =>
    stepFieldNames(kind)
      .map((name) => ({ name, ...shownAnswer(name, answers, deciding, system) }))
      .filter((a): a is { name: string; label: string; value: string } => Boolean(a.value));
  const cards: AnswerCard[] = [
    {
      id: "machine",
      title: "The machine",
      edit: "machine",
      rows: [
        ...rowsOf("machine", draft.machine, {}),
        { name: "axes", label: draft.axes.length === 1 ? "Axis" : `Axes (${draft.axes.length})`, value: draft.axes.map((a) => a.name).join(", ") },
      ],
    },
    ...draft.axes.map((axis) => {
      const all = axisFormValues(draft, axis);
      return {
        id: axis.id,
        title: axis.name,
        edit: `${axis.id}-mounting`,
        rows: [...rowsOf("mounting", axis.mounting, all), ...rowsOf("motion", axis.motion, all)],
      };
    }),
    ...(sequence ? [{ id: "cycle", title: "Cycle", edit: "cycle", rows: [{ name: "cycle", label: "In order", value: sequenceInWords(sequence) }] }] : []),
    { id: "duty", title: "Duty and site", edit: "duty", rows: rowsOf("duty", draft.duty, {}) },
    { id: "quotation", title: "Quotation", edit: "quotation", rows: rowsOf("quotation", draft.quotation, {}) },
  ];
  return (
    <div className="space-y-6">
      {publishError ? <Notice tone="bad">{publishError}</Notice> : null}
      {incomplete.length ? (
        <Notice tone="warn">
          Still to complete:{" "}
          {incomplete.map((s, i) => (
            <span key={s.id}>
              {i ? ", " : ""}
              <Link className="font-semibold underline" to={`/specs/${spec.id}/edit/${s.id}`}>
                {s.axis ? `${s.axis.name}: ${s.title.toLowerCase()}` : s.title}
              </Link>
            </span>
          ))}
          .
        </Notice>
      ) : null}
      {!published && !incomplete.length && problems.length ? (
        <Notice tone="bad">
          The answers cannot be sized yet:
          <ul className="mt-1 list-disc pl-5">
            {problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {published?.kind === "axis" ? (
        <DesignReport design={published.design} units={system} componentsTitle="Components shops will price" cautions={false} />
      ) : null}
      {published?.kind === "machine" ? (
        <MachineReport design={published.design} units={system} componentsTitle="Components shops will price" cautions={false} />
      ) : null}
      <section aria-labelledby="answers-heading" className="space-y-3">
        <h2 id="answers-heading" className="font-semibold">
          Your answers, step by step
        </h2>
        <div className="grid gap-4 md:grid-cols-2">
          {cards.map((card, index) => (
            <Card key={card.id} className="!p-4">
              <div className="mb-2 flex items-baseline justify-between gap-3 border-b border-ink-100 pb-2">
                <h3 className="text-sm font-semibold text-ink-900 [overflow-wrap:anywhere]">
                  <span className="mr-1.5 text-ink-400">{index + 1}</span>
                  {card.title}
                </h3>
                <Link
                  className="shrink-0 text-sm font-semibold text-flow-700 hover:underline"
                  to={`/specs/${spec.id}/edit/${card.edit}`}
                  aria-label={`Edit ${card.title}`}
                >
                  Edit
                </Link>
              </div>
              {card.rows.length ? (
                <dl className="space-y-1.5 text-sm">
                  {card.rows.map(({ name, label, value }) => (
                    <div key={name}>
                      <dt className="text-xs text-ink-600">{label}</dt>
                      <dd className="font-semibold text-ink-900 [overflow-wrap:anywhere]">{value}</dd>
                    </div>
                  ))}
                </dl>
              ) : (
                <p className="text-sm text-ink-600">Nothing answered yet.</p>
              )}
            </Card>
          ))}
        </div>
      </section>
      <Card>
        <h2 className="mb-3 font-semibold">Drawings and photos</h2>
        {attachments.length ? (
          <ul className="text-sm">
            {attachments.map((a) => (
              <li key={a.id}>
                <a className="text-flow-700 hover:underline" href={a.downloadUrl}>
                  {a.fileName}
                </a>{" "}
                · {a.kindLabel} · {formatBytes(a.sizeBytes)}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-600">
            None attached.{" "}
            <Link className="text-flow-700 hover:underline" to={`/specs/${spec.id}/edit/quotation`}>
              Add drawings or photos
            </Link>
          </p>
        )}
      </Card>
      <div id="cautions">
        <CautionsPanel />
      </div>
      {/* Publishing stays in view while the buyer reads: the bar sticks to the bottom of the window. */}
      <Form method="post" aria-label="Publish" className={STICKY_ACTION_BAR}>
        <label className="flex max-w-xl items-start gap-2 text-sm">
          <input type="checkbox" name="cautionsRead" className="mt-1 accent-flow-600" required />
          <span>
            I have read the{" "}
            <a className="text-flow-700 underline" href="#cautions">
              cautions
            </a>{" "}
            and understand that this circuit is a preliminary design for quotation.
          </span>
        </label>
        <Button type="submit" name="intent" value="publish" disabled={!published || incomplete.length > 0 || navigation.state === "submitting"}>
          {spec.revising ? `Publish revision ${spec.nextRevision}` : "Publish for bids"}
        </Button>
      </Form>
    </div>
  );
}

/** Labels of the answers that are not axis requirements (those carry their own). */
const SPEC_ANSWER_LABELS: Record<string, string> = {
  title: "Title",
  purpose: "What the machine does",
  supplyVoltage: "Mains voltage",
  fluid: "Hydraulic fluid",
  unitsWanted: "Units wanted",
  bidDeadline: "Bid deadline",
  dateNeeded: "Date needed",
  deliveryRegion: "Delivery region",
  currency: "Currency",
  retainerPercent: "Retainer",
  notes: "Notes",
};

/** "Clamp extends, then Main ram extends, …": the machine's cycle as the engine takes it, in words. */
function sequenceInWords(sequence: MachineMotion[][]): string {
  const phrase = (m: MachineMotion) => `${m.axis} ${m.motion === "extend" ? "extends" : "retracts"}`;
  return `${sequence.map((step) => step.map(phrase).join(" together with ")).join(", then ")}.`;
}

/** One answer of the review in words: a choice by its label, a number with its unit. */
function shownAnswer(
  name: string,
  answers: Record<string, string | undefined>,
  deciding: Record<string, string | undefined>,
  system: UnitSystem,
): { label: string; value: string | null } {
  if (name in REQUIREMENT_FIELDS) {
    const key = name as RequirementKey;
    return { label: REQUIREMENT_FIELDS[key].label, value: fieldApplies(key, deciding) ? answerInWords(key, answers[key], system) : null };
  }
  const label = SPEC_ANSWER_LABELS[name] ?? name;
  const value = answers[name]?.trim();
  if (!value) return { label, value: null };
  if ((name === "bidDeadline" || name === "dateNeeded") && isIsoDay(value)) return { label, value: formatDay(value) };
  return { label, value: name === "retainerPercent" ? `${value} %` : value };
}
