import express from "express";
import request from "supertest";
import mysql from "mysql2/promise";
import net from "node:net";
import { QueryFailedError } from "typeorm";
import { isDatabaseUnavailable } from "../../server/db/retry";
import { errorHandler } from "../../server/http/errors";
import { createDataSource } from "../../server/db/data-source";
import { loadConfig } from "../../server/config";

/**
 * Which failures mean "the database is unreachable" (a 503 with Retry-After) rather than a bug (a 500).
 * The errors are the real ones mysql2 and TypeORM throw — a port nobody listens on, a connection the server
 * kills, a pool already ended — except ER_CON_COUNT_ERROR, whose shape (code, errno 1040, sqlState 08004,
 * fatal) is written from memory of mysql2's server-error packets: the shared MariaDB is not to be exhausted.
 */

const db = loadConfig().db;
// An empty throw-away database on the shared MariaDB (the test runner drops leftovers by prefix).
const scratch = `${process.env.TEST_DB_PREFIX || "panwise_t"}_rel_${process.pid}`;
beforeAll(async () => {
  const admin = await mysql.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password });
  await admin.query(`CREATE DATABASE IF NOT EXISTS \`${scratch}\``);
  await admin.end();
});
afterAll(async () => {
  const admin = await mysql.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password });
  await admin.query(`DROP DATABASE IF EXISTS \`${scratch}\``);
  await admin.end();
});

async function closedPort(): Promise<number> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

async function caught(work: () => Promise<unknown>): Promise<unknown> {
  try {
    await work();
  } catch (err) {
    return err;
  }
  throw new Error("expected a failure");
}

describe("a database that cannot be reached", () => {
  it("is recognised in every shape mysql2 and TypeORM give it", async () => {
    const port = await closedPort();
    // mysql2 pool, nobody listening: ECONNREFUSED.
    const pool = mysql.createPool({ host: "127.0.0.1", port, user: "x", password: "x", connectTimeout: 2000 });
    const refused = await caught(() => pool.query("SELECT 1"));
    expect((refused as { code?: string }).code).toBe("ECONNREFUSED");
    expect(isDatabaseUnavailable(refused)).toBe(true);
    await pool.end();
    // ...and the same pool once ended: "Pool is closed."
    const closed = await caught(() => pool.query("SELECT 1"));
    expect(String((closed as Error).message)).toMatch(/Pool is closed/);
    expect(isDatabaseUnavailable(closed)).toBe(true);

    // TypeORM's DataSource, nobody listening.
    const ds = createDataSource({ ...db, port, database: "panwise_none" });
    const typeormRefused = await caught(() => ds.initialize());
    expect(isDatabaseUnavailable(typeormRefused)).toBe(true);

    // A connection the server kills mid-query (MariaDB KILL): through TypeORM's QueryFailedError.
    const live = createDataSource({ ...db, database: scratch });
    await live.initialize();
    const runner = live.createQueryRunner();
    await runner.connect();
    const [{ id }] = await runner.query("SELECT CONNECTION_ID() AS id");
    const sleeping = caught(() => runner.query("SELECT SLEEP(20)"));
    await new Promise((r) => setTimeout(r, 200));
    const killer = await mysql.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password });
    await killer.query(`KILL ${Number(id)}`);
    await killer.end();
    const killed = await sleeping;
    expect(killed).toBeInstanceOf(QueryFailedError);
    expect(isDatabaseUnavailable(killed)).toBe(true);
    // The next command on that dead connection.
    const after = await caught(() => runner.query("SELECT 1"));
    expect(isDatabaseUnavailable(after)).toBe(true);
    await runner.release().catch(() => undefined);
    // The pool itself carries on with a fresh connection.
    await expect(live.query("SELECT 1 AS one")).resolves.toEqual([{ one: 1 }]);
    await live.destroy();
    // A destroyed DataSource.
    const gone = await caught(() => live.query("SELECT 1"));
    expect(isDatabaseUnavailable(gone)).toBe(true);

    // Too many connections (from memory: mysql2 turns the server's error packet into code/errno/sqlState, fatal in the handshake).
    const tooMany = Object.assign(new Error("Too many connections"), { code: "ER_CON_COUNT_ERROR", errno: 1040, sqlState: "08004", fatal: true });
    expect(isDatabaseUnavailable(tooMany)).toBe(true);
    expect(isDatabaseUnavailable(new QueryFailedError("SELECT 1", [], tooMany))).toBe(true);
  }, 30_000);

  it("is not confused with a query that is wrong, or with another service being down", async () => {
    const live = createDataSource({ ...db, database: scratch });
    await live.initialize();
    const syntax = await caught(() => live.query("SELEKT 1"));
    const duplicate = Object.assign(new Error("Duplicate entry"), { code: "ER_DUP_ENTRY", errno: 1062, sqlState: "23000" });
    await live.destroy();
    expect(isDatabaseUnavailable(syntax)).toBe(false);
    expect(isDatabaseUnavailable(new QueryFailedError("INSERT", [], duplicate))).toBe(false);
    // The mail server or Stripe refusing a connection is not the database (no mysql2 or TypeORM marks on it).
    expect(isDatabaseUnavailable(Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:1025"), { code: "ECONNREFUSED", syscall: "connect" }))).toBe(false);
    expect(isDatabaseUnavailable(Object.assign(new Error("An error occurred with our connection to Stripe."), { type: "StripeConnectionError" }))).toBe(false);
    expect(isDatabaseUnavailable(new Error("boom"))).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
  });
});

describe("the API while the database is unreachable", () => {
  async function appThrowing(err: unknown) {
    const app = express();
    const api = express.Router();
    api.all("/{*splat}", () => {
      throw err;
    });
    app.use("/api", api, errorHandler);
    return app;
  }

  it("answers 503 service_unavailable with Retry-After, a buyer's words for order writes, and no stack", async () => {
    const pool = mysql.createPool({ host: "127.0.0.1", port: await closedPort(), user: "x", password: "x" });
    const refused = await caught(() => pool.query("SELECT 1"));
    await pool.end();
    const app = await appThrowing(refused);

    const order = await request(app).post("/api/orders").send({});
    expect(order.status).toBe(503);
    expect(order.headers["retry-after"]).toBe("5");
    expect(order.body).toEqual({ error: { code: "service_unavailable", message: "Ordering is briefly unavailable; nothing was saved; try again in a moment." } });

    const change = await request(app).patch("/api/orders/12").send({});
    expect(change.body.error.message).toMatch(/^Ordering is briefly unavailable; nothing was saved/);
    const standing = await request(app).put("/api/standing-orders/3").send({});
    expect(standing.body.error.message).toMatch(/^Ordering is briefly unavailable/);

    const read = await request(app).get("/api/orders?date=2026-06-11");
    expect(read.status).toBe(503);
    expect(read.headers["retry-after"]).toBe("5");
    expect(read.body).toEqual({ error: { code: "service_unavailable", message: "Panwise is briefly unavailable; try again in a moment." } });
    const other = await request(app).post("/api/invoices/4/send").send({});
    expect(other.body.error.message).toBe("Panwise is briefly unavailable; try again in a moment.");
  });

  it("still answers 500 internal_error for a bug", async () => {
    const res = await request(await appThrowing(new TypeError("x is undefined"))).get("/api/bakery");
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe("internal_error");
    expect(res.headers["retry-after"]).toBeUndefined();
  });
});
