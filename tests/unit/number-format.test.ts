// Numbers and money as the app writes them (app/content/number-format.ts), each formatter made
// once: checked against what Intl writes with a formatter of its own (CLDR's en-GB data).
import { describe, expect, it } from "vitest";
import { formatCurrency, formatNumber } from "~/content/number-format";
import { formatMoney } from "~/content/money";
import { spelledMoney } from "~/content/refund";
import { countOf } from "~/content/count";

describe("shared formatters", () => {
  it("write numbers with en-GB grouping and at most the decimals asked for", () => {
    expect(formatNumber(12500.25, 2)).toBe("12,500.25");
    expect(formatNumber(12500.25, 0)).toBe("12,500");
    expect(formatNumber(0.5, 3)).toBe("0.5");
  });

  it("write money in each currency as Intl's own currency formatter does, one formatter per currency and style", () => {
    for (const currency of ["EUR", "GBP", "USD", "CHF", "SEK", "PLN"]) {
      const own = new Intl.NumberFormat("en-GB", { style: "currency", currency });
      const coded = new Intl.NumberFormat("en-GB", { style: "currency", currency, currencyDisplay: "code" });
      expect(formatCurrency(1234.5, currency)).toBe(own.format(1234.5));
      expect(formatMoney(123456, currency)).toBe(own.format(1234.56));
      expect(spelledMoney(125000, currency)).toBe(coded.format(1250).replace(/\u00a0/g, " "));
    }
    expect(formatMoney(123456, "EUR")).toBe("€1,234.56");
    expect(spelledMoney(125000, "EUR")).toBe("EUR 1,250.00");
    // A second currency after the first gets its own formatter, not the first one's.
    expect(formatMoney(100, "GBP")).toBe("£1.00");
  });

  it("count with the noun, grouped as toLocaleString groups", () => {
    expect(countOf(1, "user")).toBe("1 user");
    expect(countOf(1204, "user")).toBe("1,204 users");
    expect(countOf(2, "quantity", "quantities")).toBe("2 quantities");
  });
});
