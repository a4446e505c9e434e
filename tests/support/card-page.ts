// The Stripe fake's hosted payment page as a buyer fills it in a browser.
import type { Page } from "playwright-core";

/** Types a card (4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined) and presses Pay. */
export async function fillCard(page: Page, number: string) {
  await page.getByLabel("Card number").fill(number);
  await page.getByLabel("Expiry (MM / YY)").fill(`12 / ${(new Date().getFullYear() + 3) % 100}`);
  await page.getByLabel("Security code").fill("123");
  await page.getByRole("button", { name: /^Pay / }).click();
}
