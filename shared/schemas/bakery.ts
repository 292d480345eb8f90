export interface BakeryDto {
  id: number;
  name: string;
  timeZone: string;
  currency: string;
  /** BCP 47 tag every date, time, number and amount is written in (shared/format.ts): "en-US", "en-GB"… */
  locale: string;
  email: string;
  phone: string;
  address: string;
  /** Today's date in the bakery's own time zone, YYYY-MM-DD, from the server's clock. */
  today: string;
  /** The server's current instant, ISO 8601 with the bakery's offset. */
  now: string;
}

export interface OfficeSummaryDto {
  users: { total: number; active: number; disabled: number; pendingInvitations: number };
  /** onHold = paused (by hand) + creditHold (overdue invoices). */
  accounts: { total: number; active: number; onHold: number; paused: number; creditHold: number; closed: number };
  /** The day's figures (server/bakery/overview.service.ts). */
  overview: OfficeOverviewDto;
}

/** Today's and tomorrow's orders, money owed and overdue, the next cut-off, failed mail. */
export interface OfficeOverviewDto {
  currency: string;
  /** Today, then tomorrow: orders not canceled, the units on them (trays, loaves, packs), their value. */
  days: { date: string; orders: number; units: number; totalCents: number }[];
  owedCents: number;
  overdueCents: number;
  overdueInvoices: number;
  /** The next delivery date still open for orders, and when it closes (ISO 8601 with the bakery's offset). */
  nextCutoff: { date: string; at: string } | null;
  /** Mail the outbox gave up on (of the kinds this role sees there). */
  failedMail: number;
}
