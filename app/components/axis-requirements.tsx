import { requirementsInWords } from "~/content/requirement-fields";
import { FORM_STEPS, ENGINE_KEYS_BY_STEP } from "~/content/spec-steps";
import type { Design } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { Card } from "./ui";

// In the order the spec form asks them.
const ORDER: string[] = FORM_STEPS.flatMap((step) => ENGINE_KEYS_BY_STEP[step]);

/** What the axis must do, as it was sized: every answer in words, in the reader's units. */
export function AxisRequirements({ requirements, units }: { requirements: Design["requirements"]; units: UnitSystem }) {
  const rows = requirementsInWords(requirements, units).sort((a, b) => ORDER.indexOf(a.key) - ORDER.indexOf(b.key));
  return (
    <Card>
      <h2 className="mb-3 font-semibold">What the axis must do</h2>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[16rem_1fr]">
        {rows.map((r) => (
          <div key={r.key} className="contents">
            <dt className="text-ink-600">{r.label}</dt>
            <dd className="font-semibold">{r.value}</dd>
          </div>
        ))}
      </dl>
    </Card>
  );
}
