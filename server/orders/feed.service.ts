import crypto from "node:crypto";
import { MoreThanOrEqual, Not } from "typeorm";
import ical, { escape as icalEscape } from "ical-generator";
import type { AppContext } from "../http/context";
import { notFound } from "../http/errors";
import { CustomerAccount } from "../accounts/account.entity";
import { Order } from "./order.entity";
import { orderDtos } from "./orders.service";
import { getBakery } from "../bakery/bakery.service";
import { addDays, localToday } from "../../shared/calendar";
import { formatMoney } from "../../shared/money";
import { productsText, quantityText } from "../../shared/quantity";
import { ORDER_STATUS_LABELS } from "../../shared/schemas/orders";
import type { CalendarFeedDto } from "../../shared/contracts/feed";

/** Lines count different sale units (trays, loaves), so the summary counts products, never adds them up. */

export const feedUrl = (ctx: AppContext, token: string) => `${ctx.config.publicUrl}/api/feeds/${token}.ics`;

export async function getFeed(ctx: AppContext, accountId: number): Promise<CalendarFeedDto> {
  const a = await ctx.dataSource.getRepository(CustomerAccount).findOneBy({ id: accountId });
  if (!a) throw notFound("That account");
  return { url: a.feedToken ? feedUrl(ctx, a.feedToken) : null };
}

/** A new unguessable token: the old URL stops working at once. */
export async function rotateFeed(ctx: AppContext, accountId: number): Promise<{ url: string }> {
  const token = crypto.randomBytes(24).toString("base64url");
  await ctx.dataSource.getRepository(CustomerAccount).update({ id: accountId }, { feedToken: token });
  return { url: feedUrl(ctx, token) };
}

export async function revokeFeed(ctx: AppContext, accountId: number): Promise<void> {
  await ctx.dataSource.getRepository(CustomerAccount).update({ id: accountId }, { feedToken: null });
}

/**
 * RFC 5545 §3.3.11 TEXT may hold no CONTROL characters except HTAB (and line breaks, written as "\n").
 * Names are refused with them at the door (shared/schemas/accounts.ts); this drops any that older rows
 * or other fields still carry, and turns CR, CRLF and the Unicode line separators into plain line breaks,
 * which ical-generator then escapes.
 */
export function feedText(s: string): string {
  return s.replace(/\r\n?|[\u2028\u2029\u0085]/g, "\n").replace(/[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/g, "");
}

/** RFC 5545 calendar of the account's deliveries from a week ago on: one all-day event per delivery. */
export async function renderFeed(ctx: AppContext, token: string): Promise<string> {
  if (!/^[A-Za-z0-9_-]{20,64}$/.test(token)) throw notFound("That calendar");
  const account = await ctx.dataSource.getRepository(CustomerAccount).findOneBy({ feedToken: token });
  if (!account) throw notFound("That calendar");
  const bakery = await getBakery(ctx);
  const from = addDays(localToday(ctx.clock.now(), bakery.timeZone), -7);
  const orders = await ctx.dataSource.getRepository(Order).find({ where: { accountId: account.id, deliveryDate: MoreThanOrEqual(from), status: Not("cancelled") }, order: { deliveryDate: "ASC" } });
  const dtos = await orderDtos(ctx, orders);
  // ical-generator 10 writes the calendar name (NAME, X-WR-CALNAME) as given, so it goes through the
  // library's own TEXT escape here; SUMMARY, DESCRIPTION and LOCATION it escapes itself. No calendar
  // time zone: every event is an all-day DATE, and with one set the library writes DTSTAMP as floating
  // local time, while RFC 5545 §3.8.7.2 requires DTSTAMP in UTC ("…Z").
  const cal = ical({ name: icalEscape(feedText(`${bakery.name} deliveries — ${account.businessName}`), false), prodId: { company: "Panwise", product: "deliveries", language: "EN" } });
  for (const o of dtos) {
    const start = new Date(`${o.deliveryDate}T00:00:00Z`);
    cal.createEvent({
      id: `order-${o.id}@panwise`,
      start,
      end: new Date(start.getTime() + 24 * 3600 * 1000),
      allDay: true,
      summary: feedText(`${bakery.name} delivery (${productsText(o.lines.length)})`),
      description: feedText([...o.lines.map((l) => `${l.productName} — ${quantityText(l.quantity, l)}`), `Total ${formatMoney(o.totalCents, bakery.currency, bakery.locale)}`, `Status: ${ORDER_STATUS_LABELS[o.status]}`].join("\n")),
      location: feedText(account.deliveryAddress),
      stamp: o.updatedAt ? new Date(o.updatedAt) : ctx.clock.now(),
    });
  }
  return cal.toString();
}
