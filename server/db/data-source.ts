import "reflect-metadata";
import path from "node:path";
import { DataSource } from "typeorm";
import { entities } from "./entities";
import { loadConfig } from "../config";

type DbSettings = ReturnType<typeof loadConfig>["db"];

/** The one way to build a DataSource: the server, the CLI and the tests all call this. */
export function createDataSource(db: DbSettings = loadConfig().db): DataSource {
  return new DataSource({
    type: "mariadb",
    host: db.host,
    port: db.port,
    username: db.user,
    password: db.password,
    database: db.database,
    charset: "utf8mb4_unicode_ci",
    timezone: "Z",
    dateStrings: ["DATE"],
    entities,
    migrations: [path.join(__dirname, "migrations", "*.{ts,js}")],
    migrationsTableName: "migrations",
    synchronize: false,
    migrationsRun: false,
    logging: false,
    extra: { connectionLimit: Number(process.env.DB_POOL_SIZE || 10) },
  });
}

/** Default export for the TypeORM CLI (`npm run migration:generate`). */
const dataSource = createDataSource();
export default dataSource;
