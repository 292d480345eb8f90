import fs from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

export const BASE_URL = process.env.BASE_URL || "http://127.0.0.1:8080";
export const MAIL_URL = process.env.MAIL_URL || "http://127.0.0.1:8025";
export const DEMO_PASSWORD = "panwise-demo";
export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 800 };
const SHOTS = path.resolve(__dirname, "..", "..", "test-artifacts", "screenshots");

let browser: Browser | null = null;

/** Debian's Chromium, headless, with the flags this machine needs (no browser download); Playwright gives it a fresh temporary profile. */
export async function launch(): Promise<Browser> {
  browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
      "--disable-component-update", "--disable-sync"],
  });
  return browser;
}

export async function close() {
  await browser?.close();
}

export async function newPage(viewport: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page }> {
  if (!browser) throw new Error("launch() first");
  const context = await browser.newContext({ viewport, deviceScaleFactor: 1 });
  const page = await context.newPage();
  page.setDefaultTimeout(20000);
  return { context, page };
}

export async function shot(page: Page, name: string) {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`), fullPage: true });
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** Poll the mail fake for the newest message to an address. */
export async function latestMailTo(to: string, timeoutMs = 15000): Promise<{ id: number; subject: string; text: string; html: string | null }> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await fetch(`${MAIL_URL}/api/messages?to=${encodeURIComponent(to)}`);
    const body = (await res.json()) as { messages: { id: number; subject: string; text: string; html: string | null }[] };
    if (body.messages.length) return body.messages[0];
    if (Date.now() > until) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
