/**
 * Every React Query key of the app, rooted here and nowhere else: each resource's factory (`thingKeys.all`,
 * `.lists()`, `.list(params)`, `.detail(id)` …), so that every read and every invalidation of a resource is found
 * by one name, and a module can invalidate another's data without importing its hooks (no import cycles).
 * The resource modules re-export their factory (`import { orderKeys } from "./orders"` keeps working).
 * tests/shared/query-keys.test.ts fails on a key written out as an array literal anywhere in components/.
 *
 * Only types are imported here, so this module has no runtime dependencies.
 */
import type { z } from "zod";
import type { accountListQuerySchema } from "../../shared/schemas/accounts";
import type { calendarQuerySchema } from "../../shared/schemas/calendar";
import type { orderListQuerySchema } from "../../shared/schemas/orders";
import type { MailStatus } from "../../shared/schemas/outbox";
import type { userListQuerySchema } from "../../shared/schemas/users";
import type { InvoiceListParams } from "./invoices";

/** The list filters are the query schemas' own inputs (shared/schemas), so the client sends what the route parses. */
/**
 * What the client sends as a list's query: the route's schema input, where zod 4 types a coerced field's input
 * as `unknown` (it coerces anything) — a query parameter the app sends is a number or a string.
 */
type QueryParams<S extends z.ZodType> = { [K in keyof z.input<S>]: unknown extends z.input<S>[K] ? number | string | undefined : z.input<S>[K] };

export type AccountListParams = QueryParams<typeof accountListQuerySchema>;
export type OrderListParams = QueryParams<typeof orderListQuerySchema>;
export type UserListParams = QueryParams<typeof userListQuerySchema>;
/** from..to (at most 120 days); office users name the account, a buyer always gets their own. */
export type CalendarParams = QueryParams<typeof calendarQuerySchema>;

export interface ProductListParams {
  /** Include archived products (office only). */
  all?: boolean;
}

// ---- people and accounts -------------------------------------------------------------------------

export const authKeys = {
  all: ["auth"] as const,
  me: () => [...authKeys.all, "me"] as const,
  invitation: (token: string) => [...authKeys.all, "invitation", token] as const,
};

export const userKeys = {
  all: ["users"] as const,
  lists: () => [...userKeys.all, "list"] as const,
  list: (params: UserListParams = {}) => [...userKeys.lists(), { q: params.q ?? "" }] as const,
  detail: (id: number) => [...userKeys.all, "detail", id] as const,
};

export const invitationKeys = {
  all: ["invitations"] as const,
  list: () => [...invitationKeys.all, "list"] as const,
};

export const accountKeys = {
  all: ["accounts"] as const,
  lists: () => [...accountKeys.all, "list"] as const,
  list: (params: AccountListParams = {}) => [...accountKeys.lists(), { q: params.q ?? "", status: params.status ?? "" }] as const,
  details: () => [...accountKeys.all, "detail"] as const,
  detail: (id: number) => [...accountKeys.details(), id] as const,
  buyers: (id: number) => [...accountKeys.all, "buyers", id] as const,
};

export const officeKeys = {
  all: ["office"] as const,
  summary: () => [...officeKeys.all, "summary"] as const,
};

export const bakeryKeys = {
  all: ["bakery"] as const,
  detail: () => [...bakeryKeys.all, "detail"] as const,
};

// ---- catalog, calendar, orders -------------------------------------------------------------------

export const productKeys = {
  all: ["products"] as const,
  lists: () => [...productKeys.all, "list"] as const,
  list: (params: ProductListParams = {}) => [...productKeys.lists(), { all: !!params.all }] as const,
  details: () => [...productKeys.all, "detail"] as const,
  detail: (id: number) => [...productKeys.details(), id] as const,
};

export const priceListKeys = {
  all: ["priceLists"] as const,
  list: () => [...priceListKeys.all, "list"] as const,
};

export const calendarKeys = {
  all: ["calendar"] as const,
  days: (params: CalendarParams) => [...calendarKeys.all, "days", { from: params.from, to: params.to, accountId: params.accountId ?? 0 }] as const,
  settings: () => [...calendarKeys.all, "settings"] as const,
};

export const feedKeys = {
  all: ["calendarFeed"] as const,
  /** accountId 0: the signed-in buyer's own account. */
  detail: (accountId?: number) => [...feedKeys.all, accountId ?? 0] as const,
};

export const deliveryKeys = {
  all: ["delivery"] as const,
  detail: (accountId: number) => [...deliveryKeys.all, accountId] as const,
};

export const orderKeys = {
  all: ["orders"] as const,
  lists: () => [...orderKeys.all, "list"] as const,
  list: (params: OrderListParams = {}) => [...orderKeys.lists(), { from: params.from ?? "", to: params.to ?? "", accountId: params.accountId ?? 0, status: params.status ?? "" }] as const,
  details: () => [...orderKeys.all, "detail"] as const,
  detail: (id: number) => [...orderKeys.details(), id] as const,
};

export const standingKeys = {
  all: ["standingOrders"] as const,
  /** accountId 0: the signed-in buyer's own. */
  detail: (accountId?: number) => [...standingKeys.all, accountId ?? 0] as const,
};

export const boardKeys = {
  all: ["board"] as const,
  detail: (date: string) => [...boardKeys.all, date] as const,
};

// ---- production ----------------------------------------------------------------------------------

export const productionKeys = {
  all: ["production"] as const,
  nextDay: () => [...productionKeys.all, "next-day"] as const,
  plans: () => [...productionKeys.all, "plan"] as const,
  plan: (date: string) => [...productionKeys.plans(), date] as const,
  /** Every forecast, whatever its first day. */
  forecasts: () => [...productionKeys.all, "forecast"] as const,
  forecast: (from: string) => [...productionKeys.forecasts(), from] as const,
  settings: () => [...productionKeys.all, "settings"] as const,
};

export const formulaKeys = {
  all: ["formulas"] as const,
  lists: () => [...formulaKeys.all, "list"] as const,
  details: () => [...formulaKeys.all, "detail"] as const,
  /** version 0 = the current one. */
  detail: (id: number, version = 0) => [...formulaKeys.details(), id, version] as const,
  history: (id: number) => [...formulaKeys.all, "history", id] as const,
};

export const ingredientKeys = {
  all: ["ingredients"] as const,
  list: () => [...ingredientKeys.all, "list"] as const,
};

// ---- money and mail ------------------------------------------------------------------------------

export const invoiceKeys = {
  all: ["invoices"] as const,
  lists: () => [...invoiceKeys.all, "list"] as const,
  list: (p: InvoiceListParams = {}) =>
    [...invoiceKeys.lists(), { status: p.status ?? "", accountId: p.accountId ?? 0, from: p.from ?? "", to: p.to ?? "", overdue: !!p.overdue, q: p.q ?? "", sort: p.sort ?? "newest" }] as const,
  details: () => [...invoiceKeys.all, "detail"] as const,
  detail: (id: number) => [...invoiceKeys.details(), id] as const,
};

export const payoutKeys = {
  all: ["payouts"] as const,
  list: () => [...payoutKeys.all, "list"] as const,
  detail: (id: string) => [...payoutKeys.all, "detail", id] as const,
};

export const reportKeys = {
  all: ["reports"] as const,
  aging: () => [...reportKeys.all, "aging"] as const,
};

export const accountBillingKeys = {
  all: ["accountBilling"] as const,
  certificates: (accountId: number) => [...accountBillingKeys.all, "certificates", accountId] as const,
};

export const billingSettingsKeys = {
  all: ["billingSettings"] as const,
  detail: () => [...billingSettingsKeys.all, "detail"] as const,
};

export const outboxKeys = {
  all: ["outbox"] as const,
  list: (status?: MailStatus) => [...outboxKeys.all, "list", status ?? ""] as const,
};

/** Every factory by name (the query-keys test walks them). */
export const ALL_KEY_FACTORIES = {
  authKeys, userKeys, invitationKeys, accountKeys, officeKeys, bakeryKeys,
  productKeys, priceListKeys, calendarKeys, feedKeys, deliveryKeys, orderKeys, standingKeys, boardKeys,
  productionKeys, formulaKeys, ingredientKeys,
  invoiceKeys, payoutKeys, reportKeys, accountBillingKeys, billingSettingsKeys, outboxKeys,
};
