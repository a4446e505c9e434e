import { getInputProps, getSelectProps, getTextareaProps, type FieldMetadata, type FormMetadata } from "@conform-to/react";
import { FieldErrors, SelectField, TextField } from "./form-field";
import { Button, Card, TableScroll } from "./ui";
import {
  EXTRA_ANSWER_LABELS,
  EXTRA_ANSWERS,
  EXTRA_KINDS,
  INCOTERMS_2020,
  INCOTERM_CODES,
  OFFER_LIMITS,
  retainerShareText,
  type ExtraKind,
} from "~/content/offer-terms";

// The bid form's parts beyond the bill: the work a shop sells with a power unit and its own
// lines, the delivery and payment terms, and an alternative circuit. Fields are Conform's, so
// errors sit beside them and what was typed survives a refusal.

// Typed by the form's values as the page starts them (text, as typed); the schema judges them.
type BidForm = FormMetadata;
type Meta = FieldMetadata<string | undefined>;
type TermsField = "incoterm" | "place" | "onDeliveryPercent" | "balanceDays" | "warrantyMonths" | "leadTimeWeeks" | "validUntil" | "validDays";
interface BidFields extends Record<TermsField | "alternativeDescription", Meta> {
  extras: FieldMetadata<{ kind: string; answer: string; price: string }[]>;
  ownLines: FieldMetadata<{ name: string; price: string }[]>;
  alternativeLines: FieldMetadata<{ name: string; quantity: string; price: string }[]>;
}

const cellInput =
  "block w-full rounded-md bg-white px-2 py-1 ring-1 ring-ink-200 focus:ring-2 focus:ring-flow-600 aria-[invalid=true]:ring-alarm-600 disabled:bg-ink-50 disabled:text-ink-400";

/** A price cell: right-aligned digits, as on the bill's lines. */
function PriceInput({ meta, label, disabled }: { meta: Meta; label: string; disabled?: boolean }) {
  return (
    <>
      <input
        {...getInputProps(meta, { type: "text" })}
        key={meta.key}
        aria-label={label}
        inputMode="decimal"
        placeholder="0.00"
        disabled={disabled}
        className={`${cellInput} min-w-24 text-right tabular-nums`}
      />
      <FieldErrors id={meta.errorId} errors={meta.errors} />
    </>
  );
}

/** Assembly, wiring, … each priced, included or not offered (open until the shop answers); then the shop's own lines. */
export function OfferExtrasFields({ form, fields, currency }: { form: BidForm; fields: BidFields; currency: string }) {
  const extras = fields.extras.getFieldList();
  const ownLines = fields.ownLines.getFieldList();
  return (
    <Card>
      <h2 className="mb-1 text-lg font-semibold">Work beyond the bill</h2>
      <p className="mb-4 text-sm text-ink-600">
        What you would do besides supplying the parts, each once for the whole order ({currency}). The buyer compares offers on the work every offer covers, and
        sees what yours leaves out.
      </p>
      <TableScroll label="Work beyond the bill">
        <table className="w-full text-left text-sm">
          <thead className="text-ink-600">
            <tr>
              <th scope="col" className="py-2 pr-3">
                Work
              </th>
              <th scope="col">Your answer and price ({currency})</th>
            </tr>
          </thead>
          <tbody>
            {extras.map((extra) => {
              const f = extra.getFieldset();
              const kind = f.kind.initialValue as ExtraKind;
              return (
                <tr key={extra.key} className="border-t border-ink-100 align-top" data-extra={kind}>
                  <td className="py-2 pr-3 font-semibold text-ink-900">
                    <input {...getInputProps(f.kind, { type: "hidden" })} key={f.kind.key} />
                    <label htmlFor={f.answer.id}>{EXTRA_KINDS[kind]}</label>
                  </td>
                  {/* On a phone the answer and its price stack, so neither is cut short. */}
                  <td className="grid gap-2 py-2 sm:grid-cols-[minmax(9rem,1fr)_10rem]">
                    <div>
                      <select {...getSelectProps(f.answer)} key={f.answer.key} className={cellInput}>
                        <option value="">Choose an answer</option>
                        {EXTRA_ANSWERS.map((a) => (
                          <option key={a} value={a}>
                            {EXTRA_ANSWER_LABELS[a]}
                          </option>
                        ))}
                      </select>
                      <FieldErrors id={f.answer.errorId} errors={f.answer.errors} />
                    </div>
                    <div>
                      <PriceInput meta={f.price} label={`Price of ${EXTRA_KINDS[kind].toLowerCase()}`} disabled={f.answer.value !== "priced"} />
                    </div>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </TableScroll>
      <FieldErrors id={fields.extras.errorId} errors={fields.extras.errors} />

      <h3 className="mb-1 mt-6 font-semibold">Lines of your own</h3>
      <p className="mb-2 text-sm text-ink-600">
        Anything else you quote (a spare-parts kit, a site survey), up to {OFFER_LIMITS.ownLines}. Price 0 for something included.
      </p>
      <ul className="space-y-2">
        {ownLines.map((line, i) => {
          const f = line.getFieldset();
          return (
            <li key={line.key} className="grid grid-cols-[1fr_auto] items-start gap-2 sm:grid-cols-[1fr_8rem_auto]" data-own-line={i}>
              <div className="col-span-2 sm:col-span-1">
                <input
                  {...getInputProps(f.name, { type: "text" })}
                  key={f.name.key}
                  aria-label={`Line ${i + 1}: what it is`}
                  placeholder="What it is"
                  className={cellInput}
                />
                <FieldErrors id={f.name.errorId} errors={f.name.errors} />
              </div>
              <div>
                <PriceInput meta={f.price} label={`Line ${i + 1}: price`} />
              </div>
              <Button type="submit" tone="secondary" {...form.remove.getButtonProps({ name: fields.ownLines.name, index: i })}>
                Remove
              </Button>
            </li>
          );
        })}
      </ul>
      <FieldErrors id={fields.ownLines.errorId} errors={fields.ownLines.errors} />
      {ownLines.length < OFFER_LIMITS.ownLines ? (
        <Button
          type="submit"
          tone="secondary"
          className="mt-2"
          {...form.insert.getButtonProps({ name: fields.ownLines.name, defaultValue: { name: "", price: "" } })}
        >
          Add a line of your own
        </Button>
      ) : null}
    </Card>
  );
}

const INCOTERM_OPTIONS = [{ value: "", label: "Choose…" }, ...INCOTERM_CODES.map((code) => ({ value: code, label: `${code} – ${INCOTERMS_2020[code].name}` }))];

/** Delivery (an Incoterms 2020 rule and its place), payment, warranty, lead time and validity. */
export function OfferTermsFields({ fields, retainerPercent }: { fields: BidFields; retainerPercent: string | null }) {
  const rule = fields.incoterm.value as keyof typeof INCOTERMS_2020 | undefined;
  return (
    <Card>
      <h2 className="mb-4 text-lg font-semibold">Terms</h2>
      <div className="grid gap-5 sm:grid-cols-2">
        <SelectField
          meta={fields.incoterm}
          label="Delivery terms (Incoterms 2020)"
          options={INCOTERM_OPTIONS}
          hint="The ICC's rule for who carries and insures the goods."
        />
        <TextField
          meta={fields.place}
          label={rule && INCOTERMS_2020[rule] ? `Place: the ${INCOTERMS_2020[rule].place}` : "Named place"}
          hint="A town, works or port, e.g. Sheffield works."
          maxLength={OFFER_LIMITS.place}
        />
        <fieldset className="sm:col-span-2">
          <legend className="text-sm font-semibold text-ink-800">Payment</legend>
          <p className="text-sm text-ink-600">
            The share with the order is the spec's retainer, set by the buyer; state the share on delivery and the days after invoice for the rest.
          </p>
          {/* Read-only: the one share the portal collects, so the offer's terms and the job's retainer agree. */}
          <p className="mt-2 text-sm font-semibold text-ink-800" data-retainer-share="">
            {retainerShareText(Number(retainerPercent ?? 0))}
          </p>
          <div className="mt-2 grid gap-4 sm:grid-cols-2">
            <TextField meta={fields.onDeliveryPercent} label="On delivery (%)" inputMode="numeric" />
            <TextField meta={fields.balanceDays} label="Rest: days after invoice" inputMode="numeric" />
          </div>
        </fieldset>
        <TextField meta={fields.warrantyMonths} label="Warranty (months)" hint="0 for none." inputMode="numeric" />
        <TextField
          meta={fields.leadTimeWeeks}
          label="Lead time (weeks)"
          hint="From the award to dispatch, e.g. 12; the job's milestones are planned over it."
          inputMode="numeric"
        />
        <fieldset className="sm:col-span-2">
          <legend className="text-sm font-semibold text-ink-800">Offer valid</legend>
          <p className="text-sm text-ink-600">Until a date, or for a number of days from today; at least until the bid deadline.</p>
          <div className="mt-2 grid gap-4 sm:grid-cols-2">
            <TextField meta={fields.validUntil} type="date" label="Until" />
            <TextField meta={fields.validDays} label="Or for days" inputMode="numeric" />
          </div>
        </fieldset>
      </div>
    </Card>
  );
}

/** A different circuit proposed as a whole: what it is and its own priced bill. */
export function AlternativeCircuitFields({ form, fields, currency, units }: { form: BidForm; fields: BidFields; currency: string; units: number }) {
  const lines = fields.alternativeLines.getFieldList();
  return (
    <Card>
      <h2 className="mb-1 text-lg font-semibold">An alternative circuit (optional)</h2>
      <p className="mb-4 text-sm text-ink-600">
        If you would build the machine another way, describe it and price its own bill. The buyer sees it beside your offer, marked as an alternative; it is not
        ranked against the like-for-like prices. Quantities are for one set; {units === 1 ? "one unit is" : `${units} units are`} wanted.
      </p>
      <label htmlFor={fields.alternativeDescription.id} className="block text-sm font-semibold text-ink-800">
        What you propose instead
      </label>
      <textarea
        {...getTextareaProps(fields.alternativeDescription)}
        key={fields.alternativeDescription.key}
        rows={3}
        maxLength={OFFER_LIMITS.description}
        placeholder="e.g. one load-sensing pump for both axes instead of two fixed pumps, and why"
        className={`${cellInput} mt-1 px-3 py-2`}
      />
      <FieldErrors id={fields.alternativeDescription.errorId} errors={fields.alternativeDescription.errors} />
      <ul className="mt-4 space-y-2">
        {lines.map((line, i) => {
          const f = line.getFieldset();
          return (
            <li key={line.key} className="grid grid-cols-[4.5rem_1fr_auto] items-start gap-2 sm:grid-cols-[1fr_4.5rem_8rem_auto]" data-alternative-line={i}>
              <div className="col-span-3 sm:col-span-1">
                <input
                  {...getInputProps(f.name, { type: "text" })}
                  key={f.name.key}
                  aria-label={`Alternative line ${i + 1}: part`}
                  placeholder="Part"
                  className={cellInput}
                />
                <FieldErrors id={f.name.errorId} errors={f.name.errors} />
              </div>
              <div>
                <input
                  {...getInputProps(f.quantity, { type: "text" })}
                  key={f.quantity.key}
                  aria-label={`Alternative line ${i + 1}: quantity`}
                  inputMode="numeric"
                  placeholder="Qty"
                  className={`${cellInput} text-right`}
                />
                <FieldErrors id={f.quantity.errorId} errors={f.quantity.errors} />
              </div>
              <div>
                <PriceInput meta={f.price} label={`Alternative line ${i + 1}: unit price (${currency})`} />
              </div>
              <Button type="submit" tone="secondary" {...form.remove.getButtonProps({ name: fields.alternativeLines.name, index: i })}>
                Remove
              </Button>
            </li>
          );
        })}
      </ul>
      <FieldErrors id={fields.alternativeLines.errorId} errors={fields.alternativeLines.errors} />
      {lines.length < OFFER_LIMITS.alternativeLines ? (
        <Button
          type="submit"
          tone="secondary"
          className="mt-2"
          {...form.insert.getButtonProps({ name: fields.alternativeLines.name, defaultValue: { name: "", quantity: "", price: "" } })}
        >
          Add a part to the alternative
        </Button>
      ) : null}
    </Card>
  );
}
