import { useEffect, useMemo, useState } from "react";
import { Form } from "react-router";
import type { Route } from "./+types/quick-sizing";
import { getOptionalUser } from "~/auth/permissions.server";
import { DesignReport, MachineReport } from "~/components/loaded-later";
import { MoreQuestions } from "~/components/more-questions";
import { RequirementInput } from "~/components/requirement-input";
import { Button, Card, Notice, PageHeader } from "~/components/ui";
import { AXIS_SIZING_URL, MACHINE_SIZING_URL, useLiveSizing } from "~/components/use-live-sizing";
import { MAX_AXES, isMachineDuty, nextAxisName, quickMachineInput, splitMachineErrors, type QuickAxis } from "~/content/quick-machine";
import {
  EXAMPLE_AXIS,
  REQUIREMENT_FIELDS,
  defaultFormValues,
  differsFromDefault,
  fieldApplies,
  fieldMessages,
  shownValues,
  toFormValues,
  toRequirementsInput,
  typedAnswers,
  typedToRequirementsInput,
  type FormValues,
  type RequirementKey,
} from "~/content/requirement-fields";
import { AXIS_QUESTIONS, type AxisQuestions } from "~/content/spec-steps";
import { RequirementsError, sizeCircuit, type Design, type MachineDesign } from "~/hydraulics";
import { UNIT_SYSTEMS, UNIT_SYSTEM_LABELS, type UnitSystem } from "~/units";

export const meta: Route.MetaFunction = () => [
  { title: "Quick sizing · Tenderflow" },
  { name: "description", content: "Size a preliminary hydraulic circuit for one axis, no account needed." },
];

// The spec form's questions, grouped as its steps group them.
const GROUPS: ({ title: string } & AxisQuestions)[] = [
  { title: "The axis", ...AXIS_QUESTIONS.machine },
  { title: "Load and motion", ...AXIS_QUESTIONS.motion },
  { title: "Duty and site", ...AXIS_QUESTIONS.duty },
];
const KEYS = GROUPS.flatMap((g) => [...g.keys, ...(g.more?.keys ?? [])]);

function size(values: FormValues, system: UnitSystem): { design: Design | null; fieldErrors: Record<string, string[]> } {
  try {
    return { design: sizeCircuit(toRequirementsInput(values, system)), fieldErrors: {} };
  } catch (error) {
    if (error instanceof RequirementsError) return { design: null, fieldErrors: error.fieldErrors };
    throw error;
  }
}

// Without JavaScript the form is a GET: the loader sizes what the address carries.
export async function loader({ request }: Route.LoaderArgs) {
  const params = new URL(request.url).searchParams;
  const user = await getOptionalUser(request);
  const asked = params.get("units");
  const system: UnitSystem = asked === "us" || asked === "metric" ? asked : (user?.unitSystem ?? "metric");
  const given = KEYS.some((k) => params.has(k));
  const values: FormValues = given
    ? Object.fromEntries(KEYS.filter((k) => params.has(k)).map((k) => [k, params.get(k) ?? ""]))
    : { ...defaultFormValues(system), ...toFormValues(EXAMPLE_AXIS, system) };
  return { system, values, ...size(values, system) };
}

export default function QuickSizing({ loaderData }: Route.ComponentProps) {
  const [system, setSystem] = useState<UnitSystem>(loaderData.system);
  // What the person typed, each answer in the system it was typed in: switching units shows
  // converted values but sizes the typed ones, so switching back and forth never drifts. The
  // first axis also holds the machine's duty answers, asked once.
  const [axes, setAxes] = useState<QuickAxis[]>(() => [{ key: 0, name: "Axis 1", typed: typedAnswers(loaderData.values, loaderData.system) }]);
  const machine = axes.length > 1;
  const values = useMemo(() => axes.map((a) => shownValues(a.typed, system)), [axes, system]);
  const input = useMemo(() => (machine ? quickMachineInput(axes, axes[0].typed) : typedToRequirementsInput(axes[0].typed)), [axes, machine]);
  const live = useLiveSizing<Design | MachineDesign>(
    input,
    { design: loaderData.design, fieldErrors: loaderData.fieldErrors },
    350,
    machine ? MACHINE_SIZING_URL : AXIS_SIZING_URL,
  );
  const design = live.design;
  const hasErrors = Object.keys(live.fieldErrors).length > 0;
  const errors = machine ? splitMachineErrors(live.fieldErrors, axes.length) : { axes: [live.fieldErrors], machine: live.fieldErrors };
  // Adding an axis needs the page's script; until it runs the form is the plain one-axis GET form.
  const [scripted, setScripted] = useState(false);
  useEffect(() => setScripted(true), []);

  const setTyped = (index: number, key: RequirementKey, text: string) =>
    setAxes((list) => list.map((a, i) => (i === index ? { ...a, typed: { ...a.typed, [key]: { text, system } } } : a)));
  const question = (index: number, key: RequirementKey) => (
    <RequirementInput
      key={key}
      field={REQUIREMENT_FIELDS[key]}
      value={values[index][key]}
      system={system}
      idPrefix={index === 0 ? "req" : `req-a${axes[index].key}`}
      name={index === 0 ? key : `a${axes[index].key}-${key}`}
      errors={fieldMessages(key, (isMachineDuty(key) ? errors.machine : errors.axes[index])?.[key], system)}
      onChange={(text) => setTyped(index, key, text)}
    />
  );
  const groupCard = (group: (typeof GROUPS)[number], index: number, keys: (k: RequirementKey) => boolean, startOpen: boolean) => (
    <Card key={group.title} className="space-y-4 !p-4">
      <h2 className="font-semibold text-ink-900">{machine && !group.keys.every(isMachineDuty) ? group.title.replace("The axis", "Mounting") : group.title}</h2>
      {group.keys.filter((key) => keys(key) && fieldApplies(key, values[index])).map((key) => question(index, key))}
      {group.more && group.more.keys.some(keys) ? (
        <MoreQuestions
          title={group.more.title}
          summary={group.more.summary}
          startOpen={startOpen}
          attention={group.more.keys.some((k) => (isMachineDuty(k) ? errors.machine : errors.axes[index])[k]?.length)}
        >
          {group.more.keys.filter((key) => keys(key) && fieldApplies(key, values[index])).map((key) => question(index, key))}
        </MoreQuestions>
      ) : null}
    </Card>
  );

  // The new axis appears above the button, out of sight on most screens: its name field takes the
  // focus (and so scrolls into view), ready to be named.
  const [justAdded, setJustAdded] = useState<number | null>(null);
  useEffect(() => {
    if (justAdded === null) return;
    const name = document.getElementById(`axis-${justAdded}-name`);
    if (name instanceof HTMLInputElement) {
      name.focus();
      name.select();
    }
  }, [justAdded]);
  const addAxis = () => {
    const key = Math.max(...axes.map((a) => a.key)) + 1;
    setAxes((list) => [...list, { key, name: nextAxisName(list), typed: { ...list[list.length - 1].typed } }]);
    setJustAdded(key);
  };
  // The first axis holds the machine's duty answers: a removed first axis hands them on.
  const removeAxis = (index: number) =>
    setAxes((list) => {
      const rest = list.filter((_, i) => i !== index);
      if (index !== 0) return rest;
      const duty = Object.fromEntries(Object.entries(list[0].typed).filter(([k]) => isMachineDuty(k)));
      return [{ ...rest[0], typed: { ...rest[0].typed, ...duty } }, ...rest.slice(1)];
    });
  const rename = (index: number, name: string) => setAxes((list) => list.map((a, i) => (i === index ? { ...a, name } : a)));

  const switchUnits = (next: UnitSystem) => setSystem(next);

  return (
    <>
      <PageHeader
        title="Quick sizing"
        lead={
          machine
            ? `Describe each axis of a machine of ${axes.length} axes and see them on one shared power unit. No account needed; nothing is saved.`
            : "Describe one hydraulic axis and see a preliminary circuit at once. No account needed; nothing is saved."
        }
      />
      <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
        <Form method="get" className="space-y-5" aria-label={machine ? "Machine requirements" : "Axis requirements"} onSubmit={(e) => e.preventDefault()}>
          <fieldset className="flex gap-1 rounded-lg bg-white p-1 ring-1 ring-ink-100">
            <legend className="sr-only">Units</legend>
            {UNIT_SYSTEMS.map((s) => (
              <label
                key={s}
                className="flex-1 cursor-pointer rounded-md px-2 py-1.5 text-center text-xs font-semibold text-ink-600 has-[:checked]:bg-flow-600 has-[:checked]:text-white"
              >
                <input type="radio" name="units" value={s} checked={system === s} onChange={() => switchUnits(s)} className="sr-only" />
                {UNIT_SYSTEM_LABELS[s]}
              </label>
            ))}
          </fieldset>
          {machine ? (
            <>
              {axes.map((axis, index) => (
                <AxisFieldset
                  key={axis.key}
                  axis={axis}
                  index={index}
                  nameErrors={[...(errors.axes[index].name ?? []), ...(errors.axes[index]._form ?? [])]}
                  onRename={(name) => rename(index, name)}
                  onRemove={() => removeAxis(index)}
                >
                  {GROUPS.filter((g) => g.title !== "Duty and site").map((g) =>
                    groupCard(g, index, () => true, Boolean(g.more && differsFromDefault(g.more.keys, values[index], system))),
                  )}
                  {/* an axis's own answers from the duty group (how long it holds its load) */}
                  {groupCard({ title: "Holding", keys: GROUPS[2].keys.filter((k) => !isMachineDuty(k)) }, index, () => true, false)}
                </AxisFieldset>
              ))}
              {/* the engine's default cycle (defaultSequence): said in words, as the spec's cycle step does */}
              <p className="text-sm text-ink-700" data-quick-cycle="">
                The axes move one at a time, in the order above: each extends and retracts before the next. A spec lets you say which axes move together.
              </p>
              {groupCard(
                { ...GROUPS[2], title: "Duty and site, for the whole machine" },
                0,
                isMachineDuty,
                Boolean(GROUPS[2].more && differsFromDefault(GROUPS[2].more.keys, values[0], system)),
              )}
            </>
          ) : (
            GROUPS.map((group) =>
              groupCard(group, 0, () => true, Boolean(group.more && differsFromDefault(group.more.keys, loaderData.values, loaderData.system))),
            )
          )}
          {scripted && axes.length < MAX_AXES ? (
            <Button type="button" tone="secondary" className="w-full" onClick={addAxis}>
              {machine ? "Add another axis" : "Add a second axis (a machine on one power unit)"}
            </Button>
          ) : null}
          <noscript>
            <button type="submit" className="w-full rounded-md bg-flow-600 px-4 py-2 font-semibold text-white">
              Size the circuit
            </button>
          </noscript>
        </Form>

        <div className="min-w-0 space-y-6" aria-live="polite" aria-busy={live.status === "sizing"}>
          {live.status === "failed" ? <Notice tone="bad">{live.message}</Notice> : null}
          {hasErrors ? (
            <Notice tone="warn">
              {live.message ?? (machine && errors.machine._form ? errors.machine._form.join(" ") : "Some answers need attention (marked beside the field).")}
              {design ? " The circuit below is from your last complete answers." : ""}
            </Notice>
          ) : null}
          {design && isMachineDesign(design) ? (
            <MachineReport design={design} units={system} updating={live.status === "sizing"} />
          ) : design ? (
            <DesignReport design={design} units={system} updating={live.status === "sizing"} />
          ) : (
            <Card>
              <p className="text-ink-600">
                {machine && live.status === "sizing" ? "Sizing the machine…" : "Answer the questions on the left and the circuit appears here."}
              </p>
            </Card>
          )}
        </div>
      </div>
    </>
  );
}

const isMachineDesign = (d: Design | MachineDesign): d is MachineDesign => "axes" in d && Array.isArray(d.axes);

/** One axis of a machine: its name (which labels it in the results and the diagram), its questions, and a way to remove it. */
function AxisFieldset({
  axis,
  index,
  nameErrors,
  onRename,
  onRemove,
  children,
}: {
  axis: QuickAxis;
  index: number;
  nameErrors: string[];
  onRename: (name: string) => void;
  onRemove: () => void;
  children: React.ReactNode;
}) {
  const id = `axis-${axis.key}-name`;
  return (
    <fieldset className="space-y-3 rounded-lg border border-ink-200 p-3" data-quick-axis={index + 1}>
      <legend className="px-1 text-sm font-semibold text-ink-900">
        Axis {index + 1}
        {axis.name.trim() && axis.name.trim() !== `Axis ${index + 1}` ? `: ${axis.name.trim()}` : ""}
      </legend>
      <div>
        <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
          Name of axis {index + 1}
        </label>
        <input
          id={id}
          value={axis.name}
          maxLength={60}
          onChange={(e) => onRename(e.target.value)}
          aria-invalid={nameErrors.length > 0 || undefined}
          aria-describedby={nameErrors.length ? `${id}-error` : undefined}
          className="mt-1 block w-full rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
        />
        {nameErrors.length ? (
          <p id={`${id}-error`} className="mt-1 text-xs font-semibold text-alarm-600">
            {nameErrors.join(" ")}
          </p>
        ) : null}
      </div>
      {children}
      <Button type="button" tone="quiet" onClick={onRemove}>
        Remove {axis.name.trim() || `axis ${index + 1}`}
      </Button>
    </fieldset>
  );
}
