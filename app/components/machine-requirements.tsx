import { requirementsInWords } from "~/content/requirement-fields";
import { FORM_STEPS, ENGINE_KEYS_BY_STEP } from "~/content/spec-steps";
import { stepInWords } from "~/content/machine-words";
import { MACHINE_DUTY_FIELDS, type MachineDesign } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { Card } from "./ui";

// In the order the spec form asks them.
const ORDER: string[] = FORM_STEPS.flatMap((step) => ENGINE_KEYS_BY_STEP[step]);
const DUTY = new Set<string>(MACHINE_DUTY_FIELDS);

function Answers({ rows }: { rows: { key: string; label: string; value: string }[] }) {
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

/**
 * What a machine must do, as it was sized: the duty once, the cycle in words, then each axis's
 * own answers under its name, in the reader's units.
 */
export function MachineRequirements({ design, units }: { design: MachineDesign; units: UnitSystem }) {
  const sorted = (rows: ReturnType<typeof requirementsInWords>) => rows.sort((a, b) => ORDER.indexOf(a.key) - ORDER.indexOf(b.key));
  const duty = sorted(requirementsInWords(design.requirements as Parameters<typeof requirementsInWords>[0], units).filter((r) => DUTY.has(r.key)));
  return (
    <Card>
      <h2 className="mb-3 font-semibold">What the machine must do</h2>
      <section aria-labelledby="machine-duty-title" data-machine-duty="">
        <h3 id="machine-duty-title" className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-600">
          Duty, for the whole machine
        </h3>
        <Answers rows={duty} />
        <h3 className="mt-4 mb-2 text-sm font-semibold uppercase tracking-wide text-ink-600">The cycle</h3>
        <ol className="list-decimal space-y-1 pl-5 text-sm" data-machine-sequence="">
          {design.sequence.map((step, i) => (
            <li key={i}>{stepInWords(step)}</li>
          ))}
        </ol>
      </section>
      {design.axes.map((axis, i) => (
        <section key={axis.name} aria-labelledby={`axis-${i + 1}-asks`} data-axis-requirements={axis.name} className="mt-5 border-t border-ink-100 pt-4">
          <h3 id={`axis-${i + 1}-asks`} className="mb-2 font-semibold text-ink-900">
            <span className="mr-2 text-ink-400">{i + 1}</span>
            {axis.name}
          </h3>
          <Answers rows={sorted(requirementsInWords(axis.requirements, units).filter((r) => !DUTY.has(r.key)))} />
        </section>
      ))}
    </Card>
  );
}
