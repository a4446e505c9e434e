import { requirementsInWords } from "~/content/requirement-fields";
import { FORM_STEPS, ENGINE_KEYS_BY_STEP } from "~/content/spec-steps";
import type { Design } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { Card } from "./ui";

type AnswerRow = ReturnType<typeof requirementsInWords>[number];

// In the order the spec form asks them.
const ORDER: string[] = FORM_STEPS.flatMap((step) => ENGINE_KEYS_BY_STEP[step]);

/** Answers in the order the spec form asks them, so a report reads like the form that was filled. */
export const inFormOrder = (rows: AnswerRow[]) => rows.sort((a, b) => ORDER.indexOf(a.key) - ORDER.indexOf(b.key));

/** Answers as label and value pairs, for an axis's report and each axis of a machine's. */
export function Answers({ rows }: { rows: AnswerRow[] }) {
  return (
    <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[16rem_1fr]">
      {rows.map((r) => (
        <div key={r.key} className="contents">
          <dt className="text-ink-600">{r.label}</dt>
          <dd className="font-semibold">{r.value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** What the axis must do, as it was sized: every answer in words, in the reader's units. */
export function AxisRequirements({ requirements, units }: { requirements: Design["requirements"]; units: UnitSystem }) {
  return (
    <Card>
      <h2 className="mb-3 font-semibold">What the axis must do</h2>
      <Answers rows={inFormOrder(requirementsInWords(requirements, units))} />
    </Card>
  );
}
