import { startStripeFake } from "./stripe-fake";

/**
 * `node --import tsx fakes/stripe/main.ts` — the Stripe fake on STRIPE_FAKE_PORT (12111), state in
 * STRIPE_FAKE_STATE (.data/stripe-fake.json), events POSTed to STRIPE_WEBHOOK_URL signed with
 * STRIPE_WEBHOOK_SECRET, optional automatic payouts every STRIPE_FAKE_PAYOUT_EVERY_MS.
 */
const port = Number(process.env.STRIPE_FAKE_PORT || 12111);
const stateFile = process.env.STRIPE_FAKE_STATE || ".data/stripe-fake.json";
const webhookUrl = process.env.STRIPE_WEBHOOK_URL || undefined;
// Without STRIPE_WEBHOOK_SECRET, sign with the secret Panwise's server/config.ts uses by default.
const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET || (webhookUrl ? "whsec_panwise_local_fake" : undefined);
const payoutEveryMs = Number(process.env.STRIPE_FAKE_PAYOUT_EVERY_MS || 0) || undefined;

if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`stripe fake: STRIPE_FAKE_PORT must be a port number, got ${process.env.STRIPE_FAKE_PORT}`);
  process.exit(2);
}

startStripeFake({ port, stateFile, webhookUrl, webhookSecret, payoutEveryMs, log: (m) => console.error(`stripe fake: ${m}`) })
  .then((fake) => {
    console.log(`stripe fake: API on ${fake.url}/v1 (use sk_test_... keys), hosted pages on ${fake.url}/pay/<session>, state in ${stateFile}`);
    console.log(
      webhookUrl
        ? `stripe fake: webhooks to ${webhookUrl}${process.env.STRIPE_WEBHOOK_SECRET ? "" : " signed with Panwise's default secret whsec_panwise_local_fake"}`
        : "stripe fake: no webhooks (set STRIPE_WEBHOOK_URL, and STRIPE_WEBHOOK_SECRET if not Panwise's default)",
    );
    let stopping = false;
    const stop = () => {
      if (stopping) return;
      stopping = true;
      fake.close().then(() => process.exit(0));
    };
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  })
  .catch((err: NodeJS.ErrnoException) => {
    console.error(err.code === "EADDRINUSE" ? `stripe fake: port ${port} is busy (${err.message}); set STRIPE_FAKE_PORT` : `stripe fake failed: ${err.message}`);
    process.exit(2);
  });
