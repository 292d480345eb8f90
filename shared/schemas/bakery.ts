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
}
