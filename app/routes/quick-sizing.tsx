import { useMemo, useState } from "react";
import { Form } from "react-router";
import type { Route } from "./+types/quick-sizing";
import { getOptionalUser } from "~/auth/permissions.server";
import { DesignReport } from "~/components/design-report";
import { MoreQuestions } from "~/components/more-questions";
import { RequirementInput } from "~/components/requirement-input";
import { Card, Notice, PageHeader } from "~/components/ui";
import { useLiveSizing } from "~/components/use-live-sizing";
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
import { RequirementsError, sizeCircuit, type Design } from "~/hydraulics";
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
  // converted values but sizes the typed ones, so switching back and forth never drifts.
  const [typed, setTyped] = useState(() => typedAnswers(loaderData.values, loaderData.system));
  const values = useMemo(() => shownValues(typed, system), [typed, system]);
  const input = useMemo(() => typedToRequirementsInput(typed), [typed]);
  const live = useLiveSizing(input, { design: loaderData.design, fieldErrors: loaderData.fieldErrors });
  const design = live.design;
  const hasErrors = Object.keys(live.fieldErrors).length > 0;

  const question = (key: RequirementKey) => (
    <RequirementInput
      key={key}
      field={REQUIREMENT_FIELDS[key]}
      value={values[key]}
      system={system}
      errors={fieldMessages(key, live.fieldErrors[key], system)}
      onChange={(text) => setTyped((t) => ({ ...t, [key]: { text, system } }))}
    />
  );

  const switchUnits = (next: UnitSystem) => setSystem(next);

  return (
    <>
      <PageHeader title="Quick sizing" lead="Describe one hydraulic axis and see a preliminary circuit at once. No account needed; nothing is saved." />
      <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
        <Form method="get" className="space-y-5" aria-label="Axis requirements" onSubmit={(e) => e.preventDefault()}>
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
          {GROUPS.map((group) => (
            <Card key={group.title} className="space-y-4 !p-4">
              <h2 className="font-semibold text-ink-900">{group.title}</h2>
              {group.keys.filter((key) => fieldApplies(key, values)).map(question)}
              {group.more ? (
                <MoreQuestions
                  title={group.more.title}
                  summary={group.more.summary}
                  startOpen={differsFromDefault(group.more.keys, loaderData.values, loaderData.system)}
                  attention={group.more.keys.some((k) => live.fieldErrors[k]?.length)}
                >
                  {group.more.keys.filter((key) => fieldApplies(key, values)).map(question)}
                </MoreQuestions>
              ) : null}
            </Card>
          ))}
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
              {live.message ?? "Some answers need attention (marked beside the field)."}
              {design ? " The circuit below is from your last complete answers." : ""}
            </Notice>
          ) : null}
          {design ? (
            <DesignReport design={design} units={system} updating={live.status === "sizing"} />
          ) : (
            <Card>
              <p className="text-ink-600">Answer the questions on the left and the circuit appears here.</p>
            </Card>
          )}
        </div>
      </div>
    </>
  );
}
