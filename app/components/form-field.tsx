import { getInputProps, getSelectProps, getTextareaProps, type FieldMetadata } from "@conform-to/react";
import { useState } from "react";
import { useNavigation } from "react-router";
import { Button } from "./ui";

// Labelled fields with a plain hint or example and the error beside the field, wired for screen
// readers through Conform's ids (aria-invalid, aria-describedby). Every form of the app uses
// these, so a field looks and reads the same everywhere: label, hint, input, error. The hint
// comes before the input, where a first-time reader looks before typing.

const inputClass =
  "mt-1 block w-full rounded-md border-0 bg-white px-3 py-2 text-sm text-ink-900 shadow-sm ring-1 ring-ink-200 placeholder:text-ink-400 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600";

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

/** Any Conform field's metadata; the spec steps' fields are typed by name at run time. */
type Meta = FieldMetadata<string | undefined>;

function Labelled({ meta, label, hint, children }: BaseProps & { meta: Meta; children: React.ReactNode }) {
  return (
    <div>
      <label htmlFor={meta.id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      {hint ? (
        <p id={meta.descriptionId} className="text-sm text-ink-600">
          {hint}
        </p>
      ) : null}
      {children}
      <FieldErrors id={meta.errorId} errors={meta.errors} />
    </div>
  );
}

export function TextField({
  meta,
  label,
  hint,
  type = "text",
  ...rest
}: BaseProps & {
  meta: Meta;
  type?: "text" | "email" | "password" | "search" | "url" | "tel" | "number" | "date";
} & Omit<React.InputHTMLAttributes<HTMLInputElement>, "type" | "form">) {
  const props = getInputProps(meta, { type, ariaDescribedBy: hint ? meta.descriptionId : undefined });
  return (
    <Labelled meta={meta} label={label} hint={hint}>
      <input {...props} key={props.key} {...rest} className={inputClass} />
    </Labelled>
  );
}

export function TextAreaField({
  meta,
  label,
  hint,
  rows = 3,
  maxLength,
  ...rest
}: BaseProps & { meta: Meta } & Omit<React.TextareaHTMLAttributes<HTMLTextAreaElement>, "form">) {
  const props = getTextareaProps(meta, { ariaDescribedBy: hint ? meta.descriptionId : undefined });
  const [length, setLength] = useState(() => String(meta.initialValue ?? "").length);
  return (
    <Labelled meta={meta} label={label} hint={hint}>
      <textarea
        {...props}
        key={props.key}
        rows={rows}
        maxLength={maxLength}
        {...rest}
        onInput={(event) => setLength(event.currentTarget.value.length)}
        className={inputClass}
      />
      {/* How much room is left, said plainly; screen readers hear it once the box is left, not on every key. */}
      {maxLength ? (
        <p className={`mt-0.5 text-right text-xs ${length > maxLength * 0.9 ? "font-semibold text-signal-700" : "text-ink-400"}`} data-counter="">
          {length.toLocaleString("en-GB")} of {maxLength.toLocaleString("en-GB")} characters
        </p>
      ) : null}
    </Labelled>
  );
}

/** A choice from a short list; options are values shown as they are, or { value, label } pairs. */
export function SelectField({
  meta,
  label,
  hint,
  options,
  ...rest
}: BaseProps & {
  meta: Meta;
  options: readonly string[] | readonly { value: string; label: string }[];
} & Omit<React.SelectHTMLAttributes<HTMLSelectElement>, "form">) {
  const props = getSelectProps(meta, { ariaDescribedBy: hint ? meta.descriptionId : undefined });
  const pairs = options.map((o) => (typeof o === "string" ? { value: o, label: o } : o));
  return (
    <Labelled meta={meta} label={label} hint={hint}>
      <select {...props} key={props.key} {...rest} className={inputClass}>
        {pairs.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Labelled>
  );
}

/** A form's submit button, disabled while any submission is on its way (no double posts). */
export function SubmitButton({ children, disabled, ...rest }: React.ComponentProps<typeof Button>) {
  const navigation = useNavigation();
  return (
    <Button type="submit" {...rest} disabled={navigation.state === "submitting" || disabled}>
      {children}
    </Button>
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
