import { getInputProps, getSelectProps, type FieldMetadata } from "@conform-to/react";

// Labelled fields with a plain hint or example and the error beside the field, wired for screen
// readers through Conform's ids (aria-invalid, aria-describedby).

const inputClass =
  "mt-1 block w-full rounded-md border-0 bg-white px-3 py-2 text-ink-900 shadow-sm ring-1 ring-ink-200 placeholder:text-ink-400 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600";

export function FieldErrors({ id, errors }: { id: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <p id={id} className="mt-1 text-sm font-semibold text-alarm-600">
      {errors.join(" ")}
    </p>
  );
}

interface BaseProps {
  label: string;
  hint?: React.ReactNode;
}

export function TextField({
  meta,
  label,
  hint,
  type = "text",
  ...rest
}: BaseProps & {
  meta: FieldMetadata<string | undefined>;
  type?: "text" | "email" | "password" | "search" | "url" | "tel" | "number" | "date";
} & Omit<React.InputHTMLAttributes<HTMLInputElement>, "type" | "form">) {
  const props = getInputProps(meta, { type, ariaDescribedBy: hint ? meta.descriptionId : undefined });
  return (
    <div>
      <label htmlFor={meta.id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <input {...props} key={props.key} {...rest} className={inputClass} />
      {hint ? (
        <p id={meta.descriptionId} className="mt-1 text-sm text-ink-600">
          {hint}
        </p>
      ) : null}
      <FieldErrors id={meta.errorId} errors={meta.errors} />
    </div>
  );
}

export function SelectField({
  meta,
  label,
  hint,
  options,
  ...rest
}: BaseProps & {
  meta: FieldMetadata<string | undefined>;
  options: { value: string; label: string }[];
} & Omit<React.SelectHTMLAttributes<HTMLSelectElement>, "form">) {
  const props = getSelectProps(meta, { ariaDescribedBy: hint ? meta.descriptionId : undefined });
  return (
    <div>
      <label htmlFor={meta.id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <select {...props} key={props.key} {...rest} className={inputClass}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {hint ? (
        <p id={meta.descriptionId} className="mt-1 text-sm text-ink-600">
          {hint}
        </p>
      ) : null}
      <FieldErrors id={meta.errorId} errors={meta.errors} />
    </div>
  );
}

/** A form-level message (e.g. "wrong password"), announced to screen readers. */
export function FormErrors({ id, errors }: { id?: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <div id={id} role="alert" className="rounded-md bg-alarm-50 px-4 py-3 text-sm font-semibold text-alarm-600 ring-1 ring-alarm-600/30">
      {errors.join(" ")}
    </div>
  );
}
