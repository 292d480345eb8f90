import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { Writable } from "node:stream";
import pino from "pino";
import request from "supertest";
import { startTestApp, makeBakery, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { createApp } from "../../server/app";

/**
 * Issue 8 items 12 (malformed percent-encoding) and 13 (headers). Sources: CSP Level 3 §6.1.1 (script-src),
 * RFC 9111 §5.2.2.5 (no-store), OWASP REST Security Cheat Sheet ("Security headers": Cache-Control no-store
 * for sensitive data), W3C Permissions Policy, RFC 3986 §2.1 (percent-encoding: "%" and two hex digits).
 */
let t: TestApp;
let app: ReturnType<typeof createApp>;
let owner: string;
const logLines: { level: number; msg?: string }[] = [];
const webDist = fs.mkdtempSync(path.join(os.tmpdir(), "panwise-headers-"));

beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds);
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  // The same app with a logger we can read, and a web export of our own (an index page and a script file).
  const sink = new Writable({ write(chunk, _enc, cb) { for (const l of String(chunk).split("\n").filter(Boolean)) logLines.push(JSON.parse(l)); cb(); } });
  fs.writeFileSync(path.join(webDist, "index.html"), "<!DOCTYPE html><html><body><div id=\"root\"></div><script src=\"/app.js\" defer></script></body></html>");
  fs.writeFileSync(path.join(webDist, "app.js"), "console.log(1)");
  app = createApp({ ...t.ctx, config: { ...t.ctx.config, webDist }, logger: pino({ level: "trace" }, sink) as unknown as typeof t.ctx.logger });
}, 60_000);
afterAll(async () => {
  fs.rmSync(webDist, { recursive: true, force: true });
  await t.close();
});

const directive = (csp: string, name: string) => csp.split(";").map((d) => d.trim()).find((d) => d.startsWith(`${name} `)) ?? "";

describe("Content-Security-Policy", () => {
  it("allows scripts from the app's own origin only: no 'unsafe-inline'", async () => {
    const res = await request(app).get("/");
    const csp = res.headers["content-security-policy"];
    expect(directive(csp, "script-src")).toBe("script-src 'self'");
    expect(directive(csp, "default-src")).toBe("default-src 'self'");
  });

  const exported = path.join(__dirname, "../../dist/index.html");
  (fs.existsSync(exported) ? it : it.skip)("the exported page (dist/index.html) has no inline script for that policy to block", () => {
    const html = fs.readFileSync(exported, "utf8");
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc="\/[^"]+"/);
      expect(body.trim()).toBe("");
    }
    expect(html).not.toMatch(/\son[a-z]+\s*=/i); // no inline event handlers
    expect(html).not.toMatch(/javascript:/i);
  });
});

describe("Cache-Control on the API", () => {
  it("is no-store on API answers with personal or money data, errors included", async () => {
    const calls: [string, () => request.Test][] = [
      ["GET /api/orders", () => request(app).get("/api/orders").set(auth(owner))],
      ["GET /api/invoices", () => request(app).get("/api/invoices").set(auth(owner))],
      ["GET /api/auth/me", () => request(app).get("/api/auth/me").set(auth(owner))],
      ["POST /api/auth/sign-in (refused)", () => request(app).post("/api/auth/sign-in").send({ email: "nobody@x.test", password: "wrong password!" })],
      ["GET /api/orders signed out", () => request(app).get("/api/orders")],
      ["GET /api/no-such-route", () => request(app).get("/api/no-such-route").set(auth(owner))],
      ["GET /api/orders/board (400)", () => request(app).get("/api/orders/board?date=9999-12-31").set(auth(owner))],
      ["GET /api/health", () => request(app).get("/api/health")],
    ];
    for (const [name, send] of calls) {
      const res = await send();
      expect({ name, cacheControl: res.headers["cache-control"] }).toEqual({ name, cacheControl: "no-store" });
    }
  });

  it("leaves the web app's own files cacheable", async () => {
    const page = await request(app).get("/some/screen");
    expect(page.status).toBe(200);
    expect(page.headers["cache-control"]).toBe("no-cache");
    const script = await request(app).get("/app.js");
    expect(script.status).toBe(200);
    expect(script.headers["cache-control"]).toMatch(/max-age=3600/);
  });
});

describe("Permissions-Policy", () => {
  it("switches off camera, microphone, geolocation and payment on the page and the API", async () => {
    for (const res of [await request(app).get("/"), await request(app).get("/api/health")]) {
      const policy = String(res.headers["permissions-policy"]);
      for (const feature of ["camera", "microphone", "geolocation", "payment"]) expect(policy).toContain(`${feature}=()`);
      // Structured Field Dictionary (RFC 8941 §3.2): members "key=value" separated by ", ".
      expect(policy).toMatch(/^[a-z-]+=\(\)(, [a-z-]+=\(\))*$/);
    }
  });
});

describe("malformed percent-encoding in a path", () => {
  it.each(["/api/auth/invitations/%", "/api/orders/%E0%A4%A", "/api/invoices/%ZZ", "/api/feeds/%C0%AF.ics"])("%s → 400 bad_request, no error-level log", async (url) => {
    logLines.length = 0;
    const res = await request(app).get(url).set(auth(owner));
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: "bad_request", message: "The address contains a malformed percent-encoding (such as a lone %).", requestId: res.headers["x-request-id"] } });
    expect(JSON.stringify(res.body)).not.toMatch(/URIError|at .*\.(ts|js):\d+/);
    expect(logLines.length).toBeGreaterThan(0); // the request was logged …
    expect(logLines.filter((l) => l.level >= 50)).toEqual([]); // … but not at error (50) or fatal (60)
  });
});
