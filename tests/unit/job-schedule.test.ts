// A job's schedule is pure arithmetic over calendar days: tested here without a database.
import { describe, expect, it } from "vitest";
import { carriedTargets, isOverdue, stageOf, targetDates } from "~/services/job-schedule";

describe("job schedule", () => {
  it("gives each milestone the award day plus its share of the lead time; without a lead time only the retainer", () => {
    const targets = targetDates("2026-03-02", 10);
    expect(targets.retainer_received).toBe("2026-03-09");
    expect(targets.drawings_agreed).toBe("2026-03-16");
    const undated = targetDates("2026-03-02", null);
    expect(undated.retainer_received).toBe("2026-03-09");
    expect(undated.drawings_agreed).toBeNull();
  });

  it("names the furthest milestone reached as the stage, whatever the order given", () => {
    const at = new Date("2026-03-05T00:00:00Z");
    expect(
      stageOf([
        { key: "in_build", position: 2, reachedAt: at },
        { key: "drawings_agreed", position: 1, reachedAt: at },
      ]),
    ).toBe("in_build");
    expect(stageOf([{ key: "drawings_agreed", position: 1, reachedAt: null }])).toBeNull();
  });

  it("is overdue only past the target day and while not reached", () => {
    expect(isOverdue({ reachedAt: null, targetDate: "2026-03-01" }, "2026-03-02")).toBe(true);
    expect(isOverdue({ reachedAt: null, targetDate: "2026-03-02" }, "2026-03-02")).toBe(false);
    expect(isOverdue({ reachedAt: new Date(), targetDate: "2026-03-01" }, "2026-03-02")).toBe(false);
    expect(isOverdue({ reachedAt: null, targetDate: null }, "2026-03-02")).toBe(false);
  });

  it("carries along, by the same slip, the later targets a moved one would overtake, and stops at the first it does not", () => {
    const later = [
      { key: "in_build" as const, targetDate: "2026-04-01" },
      { key: "bench_tested" as const, targetDate: "2026-04-03" },
      { key: "dispatched" as const, targetDate: "2026-06-01" },
    ];
    // Moved 10 days later, from 25 Mar to 4 Apr: both April targets move 10 days, June stays.
    expect(carriedTargets(later, "2026-03-25", "2026-04-04")).toEqual([
      { key: "in_build", from: "2026-04-01", to: "2026-04-11" },
      { key: "bench_tested", from: "2026-04-03", to: "2026-04-13" },
    ]);
    // A slip smaller than the overtaking: never before the day just moved to.
    expect(carriedTargets([{ key: "in_build", targetDate: "2026-03-10" }], "2026-03-20", "2026-03-22")).toEqual([
      { key: "in_build", from: "2026-03-10", to: "2026-03-22" },
    ]);
    expect(carriedTargets(later, "2026-03-25", "2026-03-28")).toEqual([]);
  });
});
