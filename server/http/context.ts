import type { DataSource } from "typeorm";
import type { Clock } from "../clock";
import type { Config } from "../config";
import type { Logger } from "../logger";
import type { Mailer } from "../mail/mailer";
import type Stripe from "stripe";

/** Everything a request handler or job needs, built once and passed down (no globals). */
export interface AppContext {
  config: Config;
  dataSource: DataSource;
  clock: Clock;
  logger: Logger;
  mailer: Mailer;
  stripe: Stripe;
  /** Ask the mail worker to run soon (set by the server process; absent in tests, which flush by hand). */
  kickOutbox?: () => void;
}
