import { startTestApp, type TestApp } from "./helpers/app";
import { REQUEST_ID_PATTERN, acceptedRequestId } from "../../server/http/request-id";

/**
 * Issue 11: request ids come from a valid incoming X-Request-Id or a random UUID (never a per-process counter),
 * are echoed in the X-Request-Id header, and every error body carries the same id as error.requestId.
 */
const UUID_V4 = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe("X-Request-Id", () => {
  it("an error answer carries requestId equal to the header, a fresh UUID each time", async () => {
    const a = await t.http().get("/api/no-such-route");
    const b = await t.http().get("/api/orders"); // signed out: 401
    for (const res of [a, b]) {
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(res.headers["x-request-id"]).toMatch(UUID_V4);
      expect(res.body.error.requestId).toBe(res.headers["x-request-id"]);
    }
    expect(a.headers["x-request-id"]).not.toBe(b.headers["x-request-id"]);
  });

  it("echoes a valid X-Request-Id the caller sent, in the header and the error body", async () => {
    const id = "lb-7f3a.91_c2-" + "x".repeat(114);
    expect(id).toHaveLength(128);
    const res = await t.http().post("/api/auth/sign-in").set("X-Request-Id", id).send({});
    expect(res.status).toBe(400);
    expect(res.headers["x-request-id"]).toBe(id);
    expect(res.body.error).toMatchObject({ code: "validation_failed", requestId: id });
    const ok = await t.http().get("/api/health").set("X-Request-Id", "abc-123");
    expect(ok.headers["x-request-id"]).toBe("abc-123");
  });

  it("replaces an invalid one (too long, or characters outside A–Z a–z 0–9 . _ -) with a new UUID", async () => {
    for (const bad of ["x".repeat(129), "id with spaces", "id;drop", "ünïcode", "a/b"]) {
      const res = await t.http().get("/api/nothing-here").set("X-Request-Id", bad);
      expect(res.headers["x-request-id"]).toMatch(UUID_V4);
      expect(res.body.error.requestId).toBe(res.headers["x-request-id"]);
    }
  });

  it("accepts exactly the documented pattern", () => {
    expect(["a", "A.b_c-9", "x".repeat(128)].every((v) => acceptedRequestId(v) === v)).toBe(true);
    expect(["", "x".repeat(129), "a b", "a\nb", "a:b"].map((v) => acceptedRequestId(v))).toEqual([null, null, null, null, null]);
    expect(acceptedRequestId(["first-id", "second"])).toBe("first-id");
    expect(acceptedRequestId(undefined)).toBeNull();
    expect(REQUEST_ID_PATTERN.source).toBe("^[A-Za-z0-9._-]{1,128}$");
  });
});
