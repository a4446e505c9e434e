import { displayValue, fieldUnit, type RequirementField } from "~/content/requirement-fields";
import type { UnitSystem } from "~/units";

// One question about the axis: label, plain help, an example in the person's units, the error
// beside it. Used by the quick-sizing page (controlled, with onChange) and the spec form
// (uncontrolled: the form owns the values) alike.

export function RequirementInput({
  field,
  value,
  system,
  errors,
  onChange,
  idPrefix = "req",
  name = field.key,
}: {
  field: RequirementField;
  value: string | undefined;
  system: UnitSystem;
  errors?: string[];
  onChange?: (value: string) => void;
  idPrefix?: string;
  /** The control's form name: each axis of a machine needs its own, or their radio buttons would be one group. */
  name?: string;
}) {
  const id = `${idPrefix}-${field.key}`;
  const helpId = `${id}-help`;
  const errorId = `${id}-error`;
  const invalid = Boolean(errors?.length);
  const describedBy = invalid ? `${helpId} ${errorId}` : helpId;

  if (field.kind === "choice") {
    const asCards = field.options.length <= 4 && field.options.some((o) => o.hint);
    if (!asCards) {
      return (
        <div>
          <LabelAndHelp id={id} helpId={helpId} field={field} />
          <select
            id={id}
            name={name}
            {...valueProps<HTMLSelectElement>(value, onChange)}
            aria-invalid={invalid || undefined}
            aria-describedby={describedBy}
            className="mt-1 block w-full rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
          >
            {field.emptyLabel ? <option value="">{field.emptyLabel}</option> : value ? null : <option value="">Choose…</option>}
            {field.options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
          <Errors id={errorId} errors={errors} />
        </div>
      );
    }
    return (
      <fieldset aria-describedby={describedBy}>
        <legend className="text-sm font-semibold text-ink-800">{field.label}</legend>
        <p id={helpId} className="text-xs text-ink-600">
          {field.help}
        </p>
        <div className="mt-1 grid gap-1.5">
          {/* An optional choice offers its blank answer ("Let the sizing choose") as a choice of its own. */}
          {[...(field.emptyLabel ? [{ value: "", label: field.emptyLabel, hint: undefined }] : []), ...field.options].map((o) => (
            <label
              key={o.value}
              className="flex cursor-pointer items-start gap-2 rounded-md bg-white px-3 py-2 text-sm ring-1 ring-ink-200 has-[:checked]:bg-flow-50 has-[:checked]:ring-2 has-[:checked]:ring-flow-600"
            >
              <input
                type="radio"
                name={name}
                value={o.value}
                {...(onChange ? { checked: (value ?? "") === o.value, onChange: () => onChange(o.value) } : { defaultChecked: (value ?? "") === o.value })}
                className="mt-1 accent-flow-600"
              />
              <span>
                <span className="block font-semibold">{o.label}</span>
                {o.hint ? <span className="block text-xs text-ink-600">{o.hint}</span> : null}
              </span>
            </label>
          ))}
        </div>
        <Errors id={errorId} errors={errors} />
      </fieldset>
    );
  }

  const unit = fieldUnit(field, system);
  return (
    <div>
      <LabelAndHelp id={id} helpId={helpId} field={field}>
        {" "}
        <span className="text-ink-400">
          Example: {displayValue(field, field.example, system)}
          {unit ? ` ${unit}` : ""}
        </span>
      </LabelAndHelp>
      <div className="mt-1 flex rounded-md bg-white ring-1 ring-ink-200 focus-within:ring-2 focus-within:ring-flow-600 has-[[aria-invalid=true]]:ring-alarm-600">
        <input
          id={id}
          name={name}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          {...valueProps<HTMLInputElement>(value, onChange)}
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          className="w-full min-w-0 rounded-md border-0 bg-transparent px-3 py-2 text-sm outline-none"
        />
        {unit ? <span className="flex items-center whitespace-nowrap pr-3 text-sm text-ink-600">{unit}</span> : null}
      </div>
      <Errors id={errorId} errors={errors} />
    </div>
  );
}

/** Controlled where the page keeps the values (quick sizing), uncontrolled where the form owns them. */
function valueProps<E extends HTMLInputElement | HTMLSelectElement>(value: string | undefined, onChange?: (value: string) => void) {
  return onChange ? { value: value ?? "", onChange: (e: React.ChangeEvent<E>) => onChange(e.target.value) } : { defaultValue: value ?? "" };
}

/** The question's label and its plain help (which the control names in aria-describedby). */
function LabelAndHelp({ id, helpId, field, children }: { id: string; helpId: string; field: RequirementField; children?: React.ReactNode }) {
  return (
    <>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {field.label}
      </label>
      <p id={helpId} className="text-xs text-ink-600">
        {field.help}
        {children}
      </p>
    </>
  );
}

function Errors({ id, errors }: { id: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <p id={id} className="mt-1 text-xs font-semibold text-alarm-600">
      {errors.join(" ")}
    </p>
  );
}
