import { Form, Link, useNavigation } from "react-router";
import { formatBytes } from "~/components/attachment-uploader";
import { CautionsPanel } from "~/components/design-panels";
import { DesignReport } from "~/components/design-report";
import { Button, Card, Notice } from "~/components/ui";
import { formatDay, isIsoDay } from "~/content/dates";
import { REQUIREMENT_FIELDS, answerInWords, fieldApplies, type FormValues, type RequirementKey } from "~/content/requirement-fields";
import { SPEC_STEPS, type FormStepId } from "~/content/spec-steps";
import type { Design } from "~/hydraulics";
import { stepFieldNames } from "~/schemas/spec";
import type { AttachmentView } from "~/services/attachments.server";
import type { UnitSystem } from "~/units";

// The spec form's last step: the sized circuit, every answer in words, the drawings, the
// cautions, and Publish.

export interface SpecReviewProps {
  spec: { id: string; revising: boolean; nextRevision: number; unitSystem: UnitSystem; completedSteps: string[] };
  answers: FormValues & Record<string, string | undefined>;
  design: Design | null;
  attachments: AttachmentView[];
  publishError: string | null;
}

export function SpecReview({ spec, answers, design, attachments, publishError }: SpecReviewProps) {
  const navigation = useNavigation();
  const incomplete = SPEC_STEPS.filter((s) => s.id !== "review" && !spec.completedSteps.includes(s.id));
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
                {s.title}
              </Link>
            </span>
          ))}
          .
        </Notice>
      ) : null}
      {design ? <DesignReport design={design} units={spec.unitSystem} componentsTitle="Components shops will price" cautions={false} /> : null}
      <section aria-labelledby="answers-heading" className="space-y-3">
        <h2 id="answers-heading" className="font-semibold">
          Your answers, step by step
        </h2>
        <div className="grid gap-4 md:grid-cols-2">
          {SPEC_STEPS.filter((s) => s.id !== "review").map((s, index) => {
            const rows = stepFieldNames(s.id as FormStepId)
              .map((name) => ({ name, ...shownAnswer(name, answers, spec.unitSystem) }))
              .filter((a) => a.value);
            return (
              <Card key={s.id} className="!p-4">
                <div className="mb-2 flex items-baseline justify-between gap-3 border-b border-ink-100 pb-2">
                  <h3 className="text-sm font-semibold text-ink-900">
                    <span className="mr-1.5 text-ink-400">{index + 1}</span>
                    {s.title}
                  </h3>
                  <Link
                    className="shrink-0 text-sm font-semibold text-flow-700 hover:underline"
                    to={`/specs/${spec.id}/edit/${s.id}`}
                    aria-label={`Edit ${s.title.toLowerCase()}`}
                  >
                    Edit
                  </Link>
                </div>
                {rows.length ? (
                  <dl className="space-y-1.5 text-sm">
                    {rows.map(({ name, label, value }) => (
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
            );
          })}
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
      <Form
        method="post"
        aria-label="Publish"
        className="sticky bottom-0 z-10 -mx-2 flex flex-wrap items-center justify-between gap-3 rounded-t-lg bg-white/95 px-4 py-3 shadow-[0_-4px_12px_rgba(0,0,0,0.08)] ring-1 ring-ink-100 backdrop-blur"
      >
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
        <Button type="submit" name="intent" value="publish" disabled={!design || incomplete.length > 0 || navigation.state === "submitting"}>
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

/** One answer of the review in words: a choice by its label, a number with its unit. */
function shownAnswer(name: string, answers: FormValues & Record<string, string | undefined>, system: UnitSystem): { label: string; value: string | null } {
  if (name in REQUIREMENT_FIELDS) {
    const key = name as RequirementKey;
    return { label: REQUIREMENT_FIELDS[key].label, value: fieldApplies(key, answers) ? answerInWords(key, answers[key], system) : null };
  }
  const label = SPEC_ANSWER_LABELS[name] ?? name;
  const value = answers[name]?.trim();
  if (!value) return { label, value: null };
  if ((name === "bidDeadline" || name === "dateNeeded") && isIsoDay(value)) return { label, value: formatDay(value) };
  return { label, value: name === "retainerPercent" ? `${value} %` : value };
}
