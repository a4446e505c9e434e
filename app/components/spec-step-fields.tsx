import type { useForm } from "@conform-to/react";
import { SelectField, TextAreaField, TextField } from "~/components/form-field";
import { Button, Card } from "~/components/ui";
import { CURRENCIES } from "~/content/money";
import { AXIS_LIMITS, axisNameField, cycleField, cycleInWords, cycleSteps } from "~/content/spec-draft";
import { TEXT_MAX, type StepContext } from "~/schemas/spec-fields";

// The questions of one step only (the machine's axes, the cycle, the quotation), loaded with
// that step (components/loaded-later.tsx) rather than with every step of the spec form.

export type Answers = Record<string, string | undefined>;
export type Fields = ReturnType<typeof useForm<Answers, Record<string, unknown>>>[1];

/** The machine step's list of axes: each named here, moved, copied or removed by its buttons (which save what was typed). */
export function AxesFields({ fields, axes }: { fields: Fields; axes: StepContext["axes"] }) {
  const full = axes.length >= AXIS_LIMITS.max;
  return (
    <Card className="space-y-4">
      <div id="axes">
        <h2 className="font-semibold">Axes</h2>
        <p className="text-sm text-ink-600">
          One axis for each cylinder the power unit moves, e.g. a clamp and a main ram. Each is asked about on its own steps; the duty and site are asked once
          for the whole machine. From {AXIS_LIMITS.min} to {AXIS_LIMITS.max} axes.
        </p>
      </div>
      <ol className="space-y-3">
        {axes.map((axis, i) => {
          const meta = fields[axisNameField(axis.id)];
          return (
            <li key={axis.id} className="rounded-md p-3 ring-1 ring-ink-100">
              <TextField
                meta={meta}
                label={`Axis ${i + 1} name`}
                hint={i === 0 ? "What the shop floor calls it: “Clamp”, “Main ram”, “Ejector”." : undefined}
                maxLength={AXIS_LIMITS.nameMax}
              />
              <div className="mt-2 flex flex-wrap gap-2">
                {[
                  { op: "up", label: "↑ Up", says: `Move ${axis.name} up`, off: i === 0 },
                  { op: "down", label: "↓ Down", says: `Move ${axis.name} down`, off: i === axes.length - 1 },
                  { op: "duplicate", label: "Duplicate", says: `Duplicate ${axis.name}`, off: full },
                  { op: "remove", label: "Remove", says: `Remove ${axis.name}`, off: axes.length <= AXIS_LIMITS.min },
                ].map(({ op, label, says, off }) => (
                  <Button key={op} type="submit" name="intent" value={`${op}:${axis.id}`} tone="secondary" formNoValidate disabled={off} aria-label={says}>
                    {label}
                  </Button>
                ))}
              </div>
            </li>
          );
        })}
      </ol>
      <div>
        <Button type="submit" name="intent" value="add" tone="secondary" formNoValidate disabled={full}>
          + Add an axis
        </Button>
        {full ? <p className="mt-1 text-xs text-ink-600">A machine has at most {AXIS_LIMITS.max} axes.</p> : null}
      </div>
    </Card>
  );
}

/** The cycle step: each axis's extension and retraction given a step; the same step means together. */
export function CycleFields({ fields, axes, values }: { fields: Fields; axes: StepContext["axes"]; values: Answers | undefined }) {
  const count = 2 * axes.length;
  const options = Array.from({ length: count }, (_, i) => ({ value: String(i + 1), label: `Step ${i + 1}` }));
  const shown = Object.fromEntries(
    axes.flatMap((a) =>
      (["extend", "retract"] as const).map((m) => [
        cycleField(a.id, m),
        String(values?.[cycleField(a.id, m)] ?? fields[cycleField(a.id, m)].initialValue ?? ""),
      ]),
    ),
  );
  const words = cycleInWords(axes, cycleSteps(axes, shown));
  return (
    <>
      <p className="text-sm text-ink-600">
        Give each motion the step of the cycle it runs in. Motions in the same step move together; the pump is sized for what they draw at once. One after
        another is the usual way and needs the smallest pump.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        {axes.map((axis) => (
          <fieldset key={axis.id} className="space-y-3 rounded-md p-3 ring-1 ring-ink-100">
            <legend className="px-1 text-sm font-semibold text-ink-900">{axis.name}</legend>
            <SelectField meta={fields[cycleField(axis.id, "extend")]} label="Extends in" options={options} />
            <SelectField meta={fields[cycleField(axis.id, "retract")]} label="Retracts in" options={options} />
          </fieldset>
        ))}
      </div>
      <div className="rounded-md bg-flow-50 p-3 text-sm" aria-live="polite">
        <p className="text-xs font-semibold text-ink-600">The cycle in words</p>
        <p className="font-semibold text-ink-900">{words}</p>
      </div>
    </>
  );
}

export function QuotationFields({ fields }: { fields: Fields }) {
  return (
    <>
      <TextField meta={fields.unitsWanted} label="Units wanted" hint="How many identical axes shops should quote for." inputMode="numeric" />
      <TextField meta={fields.bidDeadline} label="Bid deadline" hint="The last day shops can bid. Example: three weeks from today." type="date" />
      <TextField meta={fields.dateNeeded} label="Date needed" hint="When the units must be delivered." type="date" />
      <TextField
        meta={fields.deliveryRegion}
        label="Delivery region"
        hint={`Where the units go, e.g. “UK — West Midlands”. At most ${TEXT_MAX.deliveryRegion} characters.`}
        maxLength={TEXT_MAX.deliveryRegion}
      />
      <SelectField
        meta={fields.currency}
        label="Currency of the bids"
        hint="Every shop prices its bid in this currency, so bids compare directly."
        options={CURRENCIES}
      />
      <TextField
        meta={fields.retainerPercent}
        label="Retainer for the chosen shop (%)"
        hint="The share of the awarded price you pay up front by card when you award. 20 % is usual."
        inputMode="decimal"
      />
      <TextAreaField
        meta={fields.notes}
        label="Notes for the shops"
        hint={`Anything else: paint, standards your plant follows, access for installation. Optional. At most ${TEXT_MAX.notes} characters.`}
        maxLength={TEXT_MAX.notes}
      />
    </>
  );
}
