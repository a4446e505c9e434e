// The bid form's terms as a shop fills them in a browser, shared by the browser tests that bid.
import { expect } from "vitest";
import type { Page } from "playwright-core";
import { hydrated } from "./browser";
import { inDays } from "./factories";

/**
 * Lead time, validity and the structured terms: ex works Leeds by default, 30 days net, a year's
 * warranty; every kind of work beyond the bill not answered yet is answered "not offered".
 */
export async function fillOfferTerms(page: Page, leadWeeks: string, terms: { incoterm?: string; place?: string } = {}) {
  const answers = page.locator("tr[data-extra] select");
  for (let i = 0; i < (await answers.count()); i++) if ((await answers.nth(i).inputValue()) === "") await answers.nth(i).selectOption("not_offered");
  await page.getByLabel("Delivery terms (Incoterms 2020)").selectOption(terms.incoterm ?? "EXW");
  await page.getByLabel(/^Place: the named/).fill(terms.place ?? "Leeds works");
  await page.getByLabel("Rest: days after invoice").fill("30");
  await page.getByLabel("Warranty (months)").fill("12");
  await page.getByLabel("Lead time (weeks)").fill(leadWeeks);
  await page.getByLabel("Until", { exact: true }).fill(inDays(45));
}

/**
 * Types a unit price on every line of the bill, `priceOf(i)` on line i, once more than `atLeast`
 * lines are there (a client-side navigation commits its URL just before the form renders).
 * Returns how many lines the bill has.
 */
export async function priceEveryLine(page: Page, atLeast: number, priceOf: (line: number) => string) {
  const prices = page.locator('input[name$=".unitPrice"]');
  await expect.poll(() => prices.count()).toBeGreaterThan(atLeast);
  const count = await prices.count();
  for (let i = 0; i < count; i++) await prices.nth(i).fill(priceOf(i));
  return count;
}

/** The buyer goes from the spec's page to its offers by "Compare and award", as a buyer does. */
export async function openComparison(page: Page, specId: string) {
  await page.goto(`/specs/${specId}`);
  await page.getByRole("link", { name: "Compare and award" }).click();
  await page.waitForURL(`**/specs/${specId}/bids`);
  await hydrated(page);
}
