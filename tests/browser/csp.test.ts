import { BASE_URL, PHONE, close, launch, newPage, signIn } from "./browser";

/**
 * The exported page under the server's real Content-Security-Policy (script-src 'self', no 'unsafe-inline';
 * W3C CSP Level 3): the page served has no inline script, and Chromium reports no CSP violation while a
 * buyer signs in and the home screen renders. (The unit test of dist/index.html is skipped when the export
 * has not been built yet, as in npm test's Jest stage; this one always runs against the built app.)
 */
jest.setTimeout(120_000);
beforeAll(() => launch());
afterAll(() => close());

it("serves the app with script-src 'self' and nothing inline", async () => {
  const res = await fetch(`${BASE_URL}/sign-in`);
  const csp = res.headers.get("content-security-policy") || "";
  const scriptSrc = csp.split(";").map((d) => d.trim()).find((d) => d.startsWith("script-src"));
  expect(scriptSrc).toBe("script-src 'self'");
  const html = await res.text();
  const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)];
  expect(scripts.length).toBeGreaterThan(0);
  for (const [, attrs, body] of scripts) {
    expect(attrs).toMatch(/\bsrc="\/[^"]+"/);
    expect(body.trim()).toBe("");
  }
  expect(html).not.toMatch(/\son[a-z]+\s*=/i);
});

it("signs a buyer in at 390 px with no CSP violation reported by Chromium", async () => {
  const { page, context } = await newPage(PHONE);
  const violations: string[] = [];
  page.on("console", (m) => { if (/Content Security Policy|Refused to (execute|load|apply)/i.test(m.text())) violations.push(m.text()); });
  page.on("pageerror", (e) => violations.push(`page error: ${e.message}`));
  await signIn(page, "buyer@tidewater.test");
  await page.getByTestId("buyer-home-title").waitFor();
  expect(violations).toEqual([]);
  await context.close();
});
