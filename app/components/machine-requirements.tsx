import { requirementsInWords } from "~/content/requirement-fields";
import { stepInWords } from "~/content/machine-words";
import { MACHINE_DUTY_FIELDS, type MachineDesign } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { Answers, inFormOrder } from "./axis-requirements";
import { Card } from "./ui";

const DUTY = new Set<string>(MACHINE_DUTY_FIELDS);

/**
 * What a machine must do, as it was sized: the duty once, the cycle in words, then each axis's
 * own answers under its name, in the reader's units.
 */
export function MachineRequirements({ design, units }: { design: Omit<MachineDesign, "bom" | "trail">; units: UnitSystem }) {
  const duty = inFormOrder(requirementsInWords(design.requirements as Parameters<typeof requirementsInWords>[0], units).filter((r) => DUTY.has(r.key)));
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
          <Answers rows={inFormOrder(requirementsInWords(axis.requirements, units).filter((r) => !DUTY.has(r.key)))} />
        </section>
      ))}
    </Card>
  );
}
