import type { DataSource } from "typeorm";
import { loadConfig, type Config } from "./config";
import { createLogger } from "./logger";
import { systemClock, type Clock } from "./clock";
import { createSmtpMailer, type Mailer } from "./mail/mailer";
import { createDataSource } from "./db/data-source";
import type { AppContext } from "./http/context";
import Stripe from "stripe";

/** The official Stripe SDK; only host, port, protocol and keys differ between the local fake and Stripe. */
export function createStripe(config: Config): Stripe {
  return new Stripe(config.stripe.secretKey, { host: config.stripe.host, port: config.stripe.port, protocol: config.stripe.protocol, maxNetworkRetries: 1, timeout: 10000 });
}

/** Build the app's context; tests pass their own data source, clock or mailer. */
export function buildContext(over: Partial<{ config: Config; dataSource: DataSource; clock: Clock; mailer: Mailer; stripe: Stripe }> = {}): AppContext {
  const config = over.config ?? loadConfig();
  const logger = createLogger(config.logLevel, { pretty: config.logPretty });
  return {
    config,
    logger,
    clock: over.clock ?? systemClock,
    dataSource: over.dataSource ?? createDataSource(config.db),
    mailer: over.mailer ?? createSmtpMailer(config.smtpUrl, config.mailFromAddress, logger),
    stripe: over.stripe ?? createStripe(config),
  };
}
