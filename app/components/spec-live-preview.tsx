import { useMemo } from "react";
import { CircuitDiagram } from "~/components/circuit-diagram";
import { KeySizes } from "~/components/design-panels";
import { Card } from "~/components/ui";
import { useLiveSizing } from "~/components/use-live-sizing";
import {
  EXAMPLE_AXIS,
  REQUIREMENT_FIELDS,
  answerInWords,
  toFormValues,
  toRequirementsInput,
  type FormValues,
  type RequirementKey,
} from "~/content/requirement-fields";
import { ENGINE_KEYS_BY_STEP } from "~/content/spec-steps";
import type { UnitSystem } from "~/units";

// An axis's motion step sizes that axis alone as the buyer types, beside the questions; in a
// machine the shared power unit is sized on the cycle step and in the review.

/** Later steps not answered yet are taken from the example axis, and the preview says so. */
const PREVIEW_FALLBACK_KEYS = ENGINE_KEYS_BY_STEP.duty.filter((k) => k in EXAMPLE_AXIS);

/** An assumed value after its label: units where the label does not already name them ("cycles per hour 60"). */
function assumedValue(key: RequirementKey, value: string | undefined, system: UnitSystem) {
  const f = REQUIREMENT_FIELDS[key];
  return f.kind === "number" && !f.quantity ? (value ?? "") : answerInWords(key, value, system);
}

export function SpecLivePreview({
  values,
  system,
  axisName,
  inMachine = false,
}: {
  values: FormValues;
  system: UnitSystem;
  axisName?: string;
  inMachine?: boolean;
}) {
  const fallback = useMemo(() => toFormValues(EXAMPLE_AXIS, system), [system]);
  const assumed = PREVIEW_FALLBACK_KEYS.filter((k) => !values[k]);
  const input = useMemo(() => {
    const filled = { ...values };
    for (const k of PREVIEW_FALLBACK_KEYS) if (!filled[k]) filled[k] = fallback[k];
    return toRequirementsInput(filled, system);
  }, [values, system, fallback]);
  const live = useLiveSizing(input, { design: null, fieldErrors: {} }, 400);
  return (
    <aside aria-label="Live preview" aria-live="polite" className="space-y-4 lg:sticky lg:top-4 lg:self-start">
      <Card className="!p-4">
        <h2 className="mb-2 font-semibold">{axisName ? `Preliminary circuit of “${axisName}” alone` : "Preliminary circuit"}</h2>
        {live.design ? (
          <>
            <CircuitDiagram design={live.design} units={system} />
            <div className="mt-3">
              <KeySizes design={live.design} units={system} />
            </div>
            {inMachine ? (
              <p className="mt-2 text-xs text-ink-600">
                The pump, motor and tank here are what this axis would need alone; the machine&apos;s one power unit is sized on the cycle step.
              </p>
            ) : null}
            {assumed.length ? (
              <p className="mt-2 text-xs text-ink-600">
                Until you answer the duty step, the preview assumes{" "}
                {assumed.map((k) => `${REQUIREMENT_FIELDS[k].label.toLowerCase()} ${assumedValue(k, fallback[k], system)}`).join(", ")}.
              </p>
            ) : null}
          </>
        ) : (
          <p className="text-sm text-ink-600">{live.status === "sizing" ? "Sizing…" : "Fill in the load, stroke and speeds and the circuit appears here."}</p>
        )}
      </Card>
    </aside>
  );
}
