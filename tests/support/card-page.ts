// The Stripe fake's hosted payment page as a buyer fills it in a browser, and a browser app with
// a card service of its own.
import type { Page } from "playwright-core";
import { startStripeFake, type StripeFake } from "../../fakes/stripe";
import { startBrowserApp, type BrowserApp } from "./browser";

/** Types a card (4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined) and presses Pay. */
export async function fillCard(page: Page, number: string) {
  await page.getByLabel("Card number").fill(number);
  await page.getByLabel("Expiry (MM / YY)").fill(`12 / ${(new Date().getFullYear() + 3) % 100}`);
  await page.getByLabel("Security code").fill("123");
  await page.getByRole("button", { name: /^Pay / }).click();
}

/**
 * A browser app with its own card service (a Stripe fake of its own, so the fake's webhooks reach
 * this app's server, not another test file's); closing the app closes both.
 */
export async function startBrowserAppWithCards(): Promise<BrowserApp & { cards: StripeFake }> {
  const cards = await startStripeFake({ webhookSecret: process.env.STRIPE_WEBHOOK_SECRET! });
  process.env.STRIPE_API_URL = cards.url;
  const app = await startBrowserApp();
  cards.setWebhookUrl(`${app.baseUrl}/webhooks/stripe`);
  return {
    ...app,
    cards,
    async close() {
      await app.close();
      await cards.close();
    },
  };
}
