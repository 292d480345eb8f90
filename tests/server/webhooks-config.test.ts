import path from "node:path";
import net from "node:net";
import { spawn } from "node:child_process";
import { LOCAL_FAKE_SECRET_KEY, LOCAL_FAKE_WEBHOOK_SECRET, isLoopbackHost, stripeSettings } from "../../server/config";

/**
 * Issue 8 item 2: the webhook secret and API key that ship in this repository are public, so anyone could sign
 * a webhook with them. They are accepted only while the server talks to the local Stripe fake (STRIPE_API_HOST
 * unset or a loopback address) and never with NODE_ENV=production; otherwise the server does not start.
 */
const ROOT = path.resolve(__dirname, "../..");

describe("Stripe settings", () => {
  it("uses the local values for the local fake outside production", () => {
    for (const env of [{}, { STRIPE_API_HOST: "127.0.0.1" }, { STRIPE_API_HOST: "localhost" }, { STRIPE_API_HOST: "::1" }, { NODE_ENV: "test" }]) {
      expect(stripeSettings(env)).toMatchObject({ webhookSecret: LOCAL_FAKE_WEBHOOK_SECRET, secretKey: LOCAL_FAKE_SECRET_KEY });
    }
  });

  it("refuses them in production, even against the local fake, and against any other host", () => {
    expect(() => stripeSettings({ NODE_ENV: "production" })).toThrow(/set STRIPE_WEBHOOK_SECRET and STRIPE_SECRET_KEY.*never with NODE_ENV=production/);
    expect(() => stripeSettings({ NODE_ENV: "production", STRIPE_SECRET_KEY: "sk_test_mine" })).toThrow(/set STRIPE_WEBHOOK_SECRET to/);
    expect(() => stripeSettings({ STRIPE_API_HOST: "api.stripe.com", STRIPE_API_PORT: "443", STRIPE_API_PROTOCOL: "https" })).toThrow(/STRIPE_API_HOST is api\.stripe\.com/);
    expect(() => stripeSettings({ STRIPE_API_HOST: "10.0.0.7", STRIPE_SECRET_KEY: "sk_test_mine" })).toThrow(/STRIPE_WEBHOOK_SECRET/);
    // Setting the published value explicitly is no better than leaving it unset.
    expect(() => stripeSettings({ NODE_ENV: "production", STRIPE_WEBHOOK_SECRET: LOCAL_FAKE_WEBHOOK_SECRET, STRIPE_SECRET_KEY: "sk_test_mine" })).toThrow(/STRIPE_WEBHOOK_SECRET/);
  });

  it("accepts explicit values anywhere, production against the local fake included", () => {
    expect(stripeSettings({ NODE_ENV: "production", STRIPE_WEBHOOK_SECRET: "whsec_mine", STRIPE_SECRET_KEY: "sk_test_mine" })).toMatchObject({ webhookSecret: "whsec_mine", secretKey: "sk_test_mine", host: "127.0.0.1" });
    expect(stripeSettings({ NODE_ENV: "production", STRIPE_API_HOST: "api.stripe.com", STRIPE_API_PORT: "443", STRIPE_API_PROTOCOL: "https", STRIPE_WEBHOOK_SECRET: "whsec_mine", STRIPE_SECRET_KEY: "sk_live_mine" })).toMatchObject({ host: "api.stripe.com", port: 443, protocol: "https" });
  });

  it("knows loopback addresses (RFC 6761 §6.3 localhost, 127.0.0.0/8, ::1)", () => {
    expect(["127.0.0.1", "127.1.2.3", "localhost", "LOCALHOST", "::1", "[::1]"].every(isLoopbackHost)).toBe(true);
    expect(["api.stripe.com", "10.0.0.1", "128.0.0.1", "localhost.evil.test", "0.0.0.0"].some(isLoopbackHost)).toBe(false);
  });

  it("reads the catch-up interval and session age", () => {
    expect(stripeSettings({ STRIPE_CATCH_UP_EVERY_MS: "1500", STRIPE_CATCH_UP_SESSION_AGE_MS: "0" })).toMatchObject({ catchUpEveryMs: 1500, catchUpSessionAgeMs: 0 });
    expect(() => stripeSettings({ STRIPE_CATCH_UP_EVERY_MS: "soon" })).toThrow(/STRIPE_CATCH_UP_EVERY_MS/);
  });
});

describe("the server process", () => {
  it("refuses to start in production without its own Stripe secret, with one message that says what to set", async () => {
    const port = await new Promise<number>((resolve) => { const s = net.createServer(); s.listen(0, "127.0.0.1", () => { const p = (s.address() as net.AddressInfo).port; s.close(() => resolve(p)); }); });
    const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", PORT: String(port), LOG_LEVEL: "warn", PANWISE_NO_JOBS: "1" };
    delete env.STRIPE_WEBHOOK_SECRET;
    delete env.STRIPE_SECRET_KEY;
    delete env.STRIPE_API_HOST;
    const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], { cwd: ROOT, env, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (out += d));
    const code = await new Promise<number | null>((resolve) => {
      const timer = setTimeout(() => { child.kill("SIGKILL"); resolve(null); }, 20000);
      child.once("exit", (c) => { clearTimeout(timer); resolve(c); });
    });
    expect({ code, listening: /listening/.test(out) }).toEqual({ code: 1, listening: false });
    expect(out).toMatch(/Stripe is not configured: set STRIPE_WEBHOOK_SECRET and STRIPE_SECRET_KEY/);
    expect(out.trim().split("\n")).toHaveLength(1);
  }, 30000);
});
