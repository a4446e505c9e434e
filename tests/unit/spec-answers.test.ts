// The spec form's own rules for dates and lengths, the same on every path (Next, Back, revise).
import { describe, expect, it } from "vitest";
import { addDays, isoDay } from "~/content/dates";
import { quotationSchema, typedStepAnswers } from "~/schemas/spec";

const today = isoDay(new Date());
const quotation = (dates: { bidDeadline?: string; dateNeeded?: string }) =>
  quotationSchema.safeParse({
    unitsWanted: "1",
    deliveryRegion: "Somewhere",
    currency: "EUR",
    retainerPercent: "10",
    bidDeadline: addDays(today, 14),
    dateNeeded: addDays(today, 60),
    ...dates,
  });
const problems = (result: ReturnType<typeof quotation>) =>
  result.success ? {} : Object.fromEntries(result.error.issues.map((i) => [i.path.join("."), i.message]));

describe("quotation dates", () => {
  it("take real calendar days only", () => {
    expect(problems(quotation({ bidDeadline: "2099-13-45" }))).toHaveProperty("bidDeadline");
    // 30 February used to be stored and published as 2 March.
    expect(problems(quotation({ bidDeadline: "2099-02-30" }))).toHaveProperty("bidDeadline");
    expect(problems(quotation({ dateNeeded: "2099-02-29" }))).toHaveProperty("dateNeeded");
    expect(quotation({ bidDeadline: "2096-02-29", dateNeeded: "2096-03-01" }).success).toBe(true);
  });

  it("want the units after the deadline, and never in the past", () => {
    expect(problems(quotation({ dateNeeded: addDays(today, 7) }))).toMatchObject({ dateNeeded: "The date needed must be after the bid deadline." });
    expect(problems(quotation({ bidDeadline: addDays(today, -3), dateNeeded: addDays(today, -1) }))).toMatchObject({
      bidDeadline: "The bid deadline must be after today.",
      dateNeeded: "The date needed must be after today.",
    });
  });
});

describe("what a step keeps", () => {
  const posted = (fields: Record<string, string>) => new URLSearchParams(fields);

  it("reports an answer longer than its field takes, whichever button was pressed", () => {
    const axes = [{ id: "axis01", name: "Main ram" }];
    const { tooLongErrors } = typedStepAnswers("machine", posted({ title: "x".repeat(1_000_000), purpose: "ok", "name-axis01": "y".repeat(81) }), {
      axes,
      others: [],
    });
    expect(tooLongErrors).toEqual({ title: ["Keep it under 121 characters."], "name-axis01": ["Keep it under 81 characters."] });
    const numbers = typedStepAnswers("motion", posted({ massKg: "9".repeat(41) }), { axes, others: [{ orientation: "vertical" }] });
    expect(numbers.tooLongErrors).toHaveProperty("massKg");
  });

  it("keeps axis fields that do not apply to the orientation empty", () => {
    const { typed } = typedStepAnswers("mounting", posted({ orientation: "horizontal", rodDirection: "a".repeat(5_000), inclineDeg: "45" }), {
      axes: [{ id: "axis01", name: "Lift" }],
      others: [],
    });
    expect(typed.rodDirection).toBe("");
    expect(typed.inclineDeg).toBe("");
    expect(typed.orientation).toBe("horizontal");
  });
});
