/**
 * One home for "today", for how a day is written, and for "taking bids": pages, e-mails,
 * workbooks, schemas and services all ask these, so they are held here once.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { formatDay, todayUtc } from "~/content/dates";
import { shownSpecStatus, takesBids } from "~/content/spec-status";

afterEach(() => vi.useRealTimers());

describe("today and days", () => {
  it("takes today as the UTC calendar day, whatever the server's zone", () => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date("2031-06-30T23:30:00-05:00")); // already 1 July in UTC
    expect(todayUtc()).toBe("2031-07-01");
  });

  it("writes a day one way, from a calendar day, a timestamp or a Date", () => {
    expect(formatDay("2031-07-01")).toBe("1 Jul 2031");
    expect(formatDay("2031-07-01T23:59:59.000Z")).toBe("1 Jul 2031");
    expect(formatDay(new Date("2031-07-01T00:00:00Z"))).toBe("1 Jul 2031");
  });
});

describe("taking bids", () => {
  const now = new Date("2031-07-01T12:00:00Z");
  it("holds while the spec is open and its deadline is still ahead, not at the deadline itself", () => {
    expect(takesBids({ status: "open", bidDeadline: new Date("2031-07-01T12:00:01Z") }, now)).toBe(true);
    expect(takesBids({ status: "open", bidDeadline: "2031-07-01T12:00:00Z" }, now)).toBe(false);
    expect(takesBids({ status: "open", bidDeadline: null }, now)).toBe(false);
    for (const status of ["draft", "closed", "awarded", "withdrawn"]) {
      expect(takesBids({ status, bidDeadline: new Date("2031-08-01T00:00:00Z") }, now)).toBe(false);
    }
  });

  it("shows an open spec past its deadline as bidding closed", () => {
    expect(shownSpecStatus("open", "2031-06-30T23:59:59Z", now)).toBe("closed");
    expect(shownSpecStatus("open", "2031-07-02T23:59:59Z", now)).toBe("open");
    expect(shownSpecStatus("awarded", "2031-06-30T23:59:59Z", now)).toBe("awarded");
  });
});
