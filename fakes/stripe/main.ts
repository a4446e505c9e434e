// Runs the Stripe fake on its own: `tsx fakes/stripe/main.ts`, configured by environment.
import { startStripeFake } from "./index";

const secret = process.env.STRIPE_WEBHOOK_SECRET;
if (!secret) {
  console.error("STRIPE_WEBHOOK_SECRET is not set (the whsec_… secret the app verifies webhooks with).");
  process.exit(1);
}

const fake = await startStripeFake({
  port: Number(process.env.STRIPE_FAKE_PORT ?? 12111),
  webhookUrl: process.env.STRIPE_WEBHOOK_URL || undefined,
  webhookSecret: secret,
  publicUrl: process.env.STRIPE_FAKE_PUBLIC_URL || undefined,
  secretKey: process.env.STRIPE_SECRET_KEY || undefined,
  log: process.env.STRIPE_FAKE_QUIET ? undefined : (line) => console.log(line),
});
console.log(`Stripe fake on ${fake.url}, webhooks to ${process.env.STRIPE_WEBHOOK_URL || "(nowhere: events are only kept)"}`);

const stop = async () => {
  await fake.close();
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
