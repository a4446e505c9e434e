// The buyer's spec steps as a buyer fills them in a browser.
import type { Page } from "playwright-core";
import { inDays } from "./factories";

/** The quotation step's dates and place: bids close in two weeks, the unit is needed in ten. */
export async function fillQuotationStep(page: Page, deliveryRegion: string) {
  await page.getByLabel("Bid deadline").fill(inDays(14));
  await page.getByLabel("Date needed").fill(inDays(70));
  await page.getByLabel("Delivery region").fill(deliveryRegion);
}
