import type { MachineDesign } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { displayUnits } from "./circuit-diagram/format";
import { CycleChart } from "./cycle-chart";
import { pumpInWords } from "./design-panels";
import { machinePhaseName } from "./machine-report";
import { Card } from "./ui";
import type { MachineSizing } from "./use-machine-sizing";

// Beside the cycle step: the machine sized as the buyer chooses its cycle (use-machine-sizing.ts),
// so moving two axes together shows at once what it does to the shared power unit.

export function MachinePreview({ machine, problems, assumed, system }: MachineSizing & { assumed: string[]; system: UnitSystem }) {
  const u = displayUnits(system);
  return (
    <aside aria-label="The machine as saved" className="space-y-4 lg:sticky lg:top-4 lg:self-start">
      <Card className="!p-4">
        <h2 className="mb-1 font-semibold">The shared power unit</h2>
        {machine ? (
          <>
            <p className="mb-3 text-xs text-ink-600">
              Sized for the cycle as chosen here.
              {assumed.length ? ` Until you answer the duty step it assumes ${assumed.join(", ")}.` : ""}
            </p>
            <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm" data-machine-figures="">
              <Figure label="Pump" value={pumpInWords(machine, u)} />
              <Figure label="Pump flow" value={u.flow(machine.flowsLpm.pump)} />
              <Figure label="Relief setting" value={u.pressure(machine.pressuresBar.reliefSetting)} />
              <Figure label="Motor" value={u.power(machine.motor.ratedKw)} />
              <Figure label="Reservoir" value={u.volume(machine.reservoir.volumeL)} />
              {machine.heat.cycleS ? <Figure label="One cycle" value={`${machine.heat.cycleS.toFixed(1)} s`} /> : null}
            </dl>
            <ul className="mt-3 space-y-1 text-sm">
              {machine.axes.map((axis) => (
                <li key={axis.name}>
                  <span className="font-semibold">{axis.name}</span>: {u.boreRod(axis.cylinder.boreMm, axis.cylinder.rodMm, "metric")}, stroke{" "}
                  {u.length(axis.cylinder.strokeMm)}
                </li>
              ))}
            </ul>
          </>
        ) : (
          <div className="text-sm text-ink-600">
            <p>The machine is sized here once every axis is answered.</p>
            {problems.length ? (
              <ul className="mt-2 list-disc space-y-1 pl-5">
                {problems.slice(0, 6).map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            ) : null}
          </div>
        )}
      </Card>
    </aside>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs text-ink-600">{label}</dt>
      <dd className="font-semibold text-ink-900">{value}</dd>
    </div>
  );
}

/** The machine's cycle, phase by phase. */
export function MachineCyclePreview({ machine, system }: { machine: MachineDesign | null; system: UnitSystem }) {
  return machine ? <CycleChart cycle={machine.cycle} units={system} phaseName={machinePhaseName} drawnBy="Axes draw" /> : null;
}
