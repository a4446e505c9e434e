// Where a job stands after the handover, and how late it is, in the words the job dashboard, an
// account's page and the job page share.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { OverdueBadge, afterHandoverWords } from "~/components/job-state";

const job = {
  stage: "handed_over" as const,
  acceptedAt: null,
  retainerPaidAt: "2026-11-02T10:00:00.000Z",
  balancePaidAt: null,
  totalCents: 1_000_000,
  retainerCents: 200_000,
};

describe("a job after the handover", () => {
  it("waits for the buyer's acceptance, then for the balance", () => {
    expect(afterHandoverWords(job)).toBe("Awaiting the buyer's acceptance, balance due");
    expect(afterHandoverWords({ ...job, acceptedAt: "2026-12-01T09:00:00.000Z" })).toBe("Accepted, balance due");
    expect(afterHandoverWords({ ...job, acceptedAt: "2026-12-01T09:00:00.000Z", balancePaidAt: "2026-12-02T09:00:00.000Z" })).toBe("Accepted, paid in full");
    // The buyer may pay on delivery, before accepting.
    expect(afterHandoverWords({ ...job, balancePaidAt: "2026-12-02T09:00:00.000Z" })).toBe("Awaiting the buyer's acceptance, paid in full");
  });

  it("owes no balance before the retainer, nor when the retainer was the whole price", () => {
    expect(afterHandoverWords({ ...job, retainerPaidAt: null })).toBe("Awaiting the buyer's acceptance");
    expect(afterHandoverWords({ ...job, retainerCents: job.totalCents })).toBe("Awaiting the buyer's acceptance, paid in full");
  });

  it("says nothing before the handover (a reported problem takes it back)", () => {
    expect(afterHandoverWords({ ...job, stage: "dispatched" })).toBeNull();
    expect(afterHandoverWords({ ...job, stage: "in_build" })).toBeNull();
  });
});

describe("an overdue job's badge", () => {
  it("says how many days late, or only that it is overdue where the day is not known", () => {
    expect(renderToStaticMarkup(<OverdueBadge daysLate={14} />)).toContain("14 days late");
    expect(renderToStaticMarkup(<OverdueBadge daysLate={1} />)).toContain("1 day late");
    expect(renderToStaticMarkup(<OverdueBadge daysLate={0} />)).toContain("Overdue");
  });
});
