// The bid form's terms as a shop fills them in a browser, shared by the browser tests that bid.
import type { Page } from "playwright-core";
import { inDays } from "./factories";

/** Lead time, validity and the structured terms: ex works Leeds by default, 30 days net, a year's warranty. */
export async function fillOfferTerms(page: Page, leadWeeks: string, terms: { incoterm?: string; place?: string } = {}) {
  await page.getByLabel("Delivery terms (Incoterms 2020)").selectOption(terms.incoterm ?? "EXW");
  await page.getByLabel(/^Place: the named/).fill(terms.place ?? "Leeds works");
  await page.getByLabel("Rest: days after invoice").fill("30");
  await page.getByLabel("Warranty (months)").fill("12");
  await page.getByLabel("Lead time (weeks)").fill(leadWeeks);
  await page.getByLabel("Until", { exact: true }).fill(inDays(45));
}
