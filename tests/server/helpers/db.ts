import crypto from "node:crypto";
import type { DataSource } from "typeorm";
import mysql from "mysql2/promise";
import { createDataSource } from "../../../server/db/data-source";
import { loadConfig } from "../../../server/config";

/**
 * Each test file gets its own throw-away database on the private MariaDB, with every migration run,
 * so files never see each other's rows. The test runner drops leftovers by prefix at the end.
 */
export async function createTestDatabase(): Promise<{ dataSource: DataSource; name: string; drop(): Promise<void> }> {
  const base = loadConfig().db;
  const prefix = process.env.TEST_DB_PREFIX || "panwise_t";
  const name = `${prefix}_${process.env.JEST_WORKER_ID ?? "0"}_${crypto.randomBytes(4).toString("hex")}`;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  const dataSource = createDataSource({ ...base, database: name });
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: "each" });
  return {
    dataSource,
    name,
    async drop() {
      await dataSource.destroy().catch(() => undefined);
      await admin.query(`DROP DATABASE IF EXISTS \`${name}\``).catch(() => undefined);
      await admin.end();
    },
  };
}
