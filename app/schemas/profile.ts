import { z } from "zod";

// A company profile, edited in settings by the organisation's own people: shown to shops on open
// specs (the region), beside a shop's offer and on the order confirmation. Every field may be
// left empty; what is typed is bounded and shaped.

export const PROFILE_LIMITS = { address: 300, region: 80, taxNumber: 40, contactName: 120, contactPhone: 40 } as const;

// Conform's parseWithZod reads an empty field as missing, so "optional" is "may be left empty".
const optional = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, `Keep ${what} under ${max + 1} characters.`)
    .optional();

export const profileSchema = z.object({
  address: optional(PROFILE_LIMITS.address, "the address"),
  region: optional(PROFILE_LIMITS.region, "the region"),
  taxNumber: optional(PROFILE_LIMITS.taxNumber, "the tax number").refine(
    (v) => v === undefined || /^[A-Za-z0-9][A-Za-z0-9 .\-/]*$/.test(v),
    "A tax number has letters, digits, spaces, dots, dashes or slashes, e.g. GB 123 4567 89.",
  ),
  quoteContactName: optional(PROFILE_LIMITS.contactName, "the name"),
  quoteContactEmail: z
    .string()
    .trim()
    .max(254, "That e-mail address is too long.")
    .pipe(z.email("Enter an e-mail address like quotes@company.com."))
    .optional(),
  quoteContactPhone: optional(PROFILE_LIMITS.contactPhone, "the phone number").refine(
    (v) => v === undefined || /^\+?[0-9 ()\-/]{5,}$/.test(v),
    "Enter a phone number with digits, e.g. +44 121 496 0000.",
  ),
});

export type ProfileInput = z.output<typeof profileSchema>;
