import type { DataSource } from "typeorm";
import { loadConfig, type Config } from "./config";
import { createLogger } from "./logger";
import { systemClock, type Clock } from "./clock";
import { createSmtpMailer, type Mailer } from "./mail/mailer";
import { createDataSource } from "./db/data-source";
import type { AppContext } from "./http/context";

/** Build the app's context; tests pass their own data source, clock or mailer. */
export function buildContext(over: Partial<{ config: Config; dataSource: DataSource; clock: Clock; mailer: Mailer }> = {}): AppContext {
  const config = over.config ?? loadConfig();
  const logger = createLogger(config.logLevel);
  return {
    config,
    logger,
    clock: over.clock ?? systemClock,
    dataSource: over.dataSource ?? createDataSource(config.db),
    mailer: over.mailer ?? createSmtpMailer(config.smtpUrl, config.mailFromAddress, logger),
  };
}
