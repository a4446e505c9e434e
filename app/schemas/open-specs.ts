import { z } from "zod";
import { todayUtc } from "~/content/dates";

// The search parameters of the open-specs table. Pressure and flow are typed in the shop's own
// unit system (the service converts them); a value that does not parse is reported beside its
// field and left out of the search, so the rest of the query still applies and nothing typed is lost.

/** The orders the table sorts in, each with the words its choice shows, in the order shown. */
export const OPEN_SPEC_SORT_LABELS = {
  deadline: "Closing soonest",
  newest: "Newest first",
  title: "Title, A to Z",
  pressure: "Relief setting, lowest first",
  flow: "Pump flow, lowest first",
} as const;
export type OpenSpecSort = keyof typeof OPEN_SPEC_SORT_LABELS;
export const OPEN_SPEC_SORTS = Object.keys(OPEN_SPEC_SORT_LABELS) as [OpenSpecSort, ...OpenSpecSort[]];

export const OPEN_SPECS_PAGE_SIZE = 25;

/** The parameters the table reads, in the order its filter form shows them. */
const OPEN_SPEC_PARAMS = ["q", "region", "deadline", "pressureMin", "pressureMax", "flowMin", "flowMax", "sort", "page"] as const;
export type OpenSpecParam = (typeof OPEN_SPEC_PARAMS)[number];

const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

const text = (max: number, what: string) => z.preprocess(blankToUndefined, z.string().trim().max(max, `${what} can be at most ${max} characters.`).optional());

const bound = (what: string, example: string) =>
  z.preprocess(
    (v) => {
      const blank = blankToUndefined(v);
      return typeof blank === "string" ? Number(blank.trim()) : blank;
    },
    z
      .number({ error: `${what}: enter a number with digits and a decimal point, for example ${example}.` })
      .finite(`${what}: enter a number with digits and a decimal point, for example ${example}.`)
      .min(0, `${what} cannot be negative.`)
      .max(1_000_000, `${what} is far larger than any hydraulic axis.`)
      .optional(),
  );

const openSpecsQuerySchema = z
  .object({
    q: text(100, "The title search"),
    region: text(80, "The region"),
    deadline: z.preprocess(
      blankToUndefined,
      z.iso
        .date({ error: "Bids until: choose a date (year-month-day)." })
        .refine((d) => d >= todayUtc(), "Bids until: choose today or a later day; every open spec closes after now.")
        .optional(),
    ),
    pressureMin: bound("Lowest relief setting", "100"),
    pressureMax: bound("Highest relief setting", "250"),
    flowMin: bound("Lowest pump flow", "10"),
    flowMax: bound("Highest pump flow", "60"),
    sort: z.preprocess(
      blankToUndefined,
      z.enum(OPEN_SPEC_SORTS, { error: "That sort order is not one of the choices; the table shows the specs closing soonest first." }).optional(),
    ),
    page: z.preprocess(
      (v) => {
        const blank = blankToUndefined(v);
        return typeof blank === "string" ? Number(blank) : blank;
      },
      z
        .number({ error: "The page number must be a whole number from 1 on." })
        .int("The page number must be a whole number from 1 on.")
        .min(1, "The page number must be a whole number from 1 on.")
        .max(100_000, "The page number must be a whole number from 1 on.")
        .optional(),
    ),
  })
  .superRefine((v, ctx) => {
    if (v.pressureMin !== undefined && v.pressureMax !== undefined && v.pressureMax < v.pressureMin) {
      ctx.addIssue({ code: "custom", path: ["pressureMax"], message: "The highest relief setting is below the lowest one." });
    }
    if (v.flowMin !== undefined && v.flowMax !== undefined && v.flowMax < v.flowMin) {
      ctx.addIssue({ code: "custom", path: ["flowMax"], message: "The highest pump flow is below the lowest one." });
    }
  });

export type OpenSpecsQuery = z.output<typeof openSpecsQuerySchema>;

export interface ReadQuery {
  query: OpenSpecsQuery;
  /** One message per parameter that was left out of the search. */
  problems: Partial<Record<OpenSpecParam, string>>;
  /** What was typed, to show again in the form. */
  typed: Partial<Record<OpenSpecParam, string>>;
}

/** Reads the table's search parameters; each bad one is reported and dropped, the rest apply. */
export function readOpenSpecsQuery(params: URLSearchParams): ReadQuery {
  const typed: ReadQuery["typed"] = {};
  for (const key of OPEN_SPEC_PARAMS) {
    const value = params.get(key);
    if (value !== null) typed[key] = value;
  }
  const problems: ReadQuery["problems"] = {};
  let input: Record<string, string> = { ...typed };
  // Each round drops at least one bad parameter, so this ends after at most one round per parameter.
  for (;;) {
    const parsed = openSpecsQuerySchema.safeParse(input);
    if (parsed.success) return { query: parsed.data, problems, typed };
    let dropped = false;
    for (const issue of parsed.error.issues) {
      const key = issue.path[0] as OpenSpecParam | undefined;
      if (key === undefined || !(key in input)) continue;
      problems[key] ??= issue.message;
      delete input[key];
      dropped = true;
    }
    if (!dropped) input = {};
  }
}
