/**
 * The order a buyer is putting together for one delivery date, as plain data: its lines, their quantities and
 * checks, the total in cents, what is missing to the account's minimum, whether it says something other than
 * the saved order, and what a failed save means for it. No React: the order screen and its tests share it.
 */
import { cutoffFor, type CalendarSettings } from "../../shared/calendar";
import type { CalendarDayDto, CalendarSettingsDto } from "../../shared/schemas/calendar";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { OrderCreateInput, OrderDto, OrderUpdateInput } from "../../shared/schemas/orders";
import type { FieldErrors } from "../../shared/errors";
import { parseQuantity, quantityProblem, shortfall } from "./quantities";

/** One line as the API takes it. */
export type SentLine = { productId: number; quantity: number };

/** Quantities as typed, by product id. */
export type Quantities = Record<number, string>;

/** What the form holds: the typed quantities, the PO number and the note. */
export interface OrderValues {
  quantities: Quantities;
  poNumber: string;
  note: string;
}

/** The form's values for a saved order (or an empty form for no order). */
export function orderValues(order: OrderDto | null): OrderValues {
  return {
    quantities: Object.fromEntries((order?.lines ?? []).map((l) => [l.productId, String(l.quantity)])),
    poNumber: order?.poNumber ?? "",
    note: order?.note ?? "",
  };
}

/** The product's own cut-off for this date (products that need more notice close earlier), in ms. */
export function productCutoff(date: string, day: CalendarDayDto, product: Pick<ProductDto, "leadDays">, settings?: CalendarSettingsDto): number {
  const dayCutoff = Date.parse(day.cutoffAt);
  if (!settings || product.leadDays === null || product.leadDays <= settings.leadDays) return dayCutoff;
  const s: Pick<CalendarSettings, "timeZone" | "cutoffTime" | "leadDays"> = settings;
  return Math.min(dayCutoff, cutoffFor(date, s, product.leadDays).toMillis());
}

/** One product of the offer as a line of the draft. */
export interface DraftLine {
  product: ProductDto;
  /** The typed quantity: 0 for blank, NaN for anything but whole digits. */
  quantity: number;
  /** This product's cut-off for the date (ms). */
  cutoff: number;
  /** Past its own cut-off and not already on the saved order: it can't be added any more. */
  tooLate: boolean;
  /** Why the quantity can't be ordered (the product's limits), or null. */
  problem: string | null;
}

export interface DraftContext {
  date: string;
  day: CalendarDayDto;
  settings?: CalendarSettingsDto;
  /** The saved order this draft changes (null: a new order). */
  existing: OrderDto | null;
  now: number;
}

/** Every product on offer as a line, with its typed quantity and checks. */
export function draftLines(products: readonly ProductDto[], quantities: Quantities, ctx: DraftContext): DraftLine[] {
  return products.map((product) => {
    const quantity = parseQuantity(quantities[product.id] ?? "");
    const cutoff = productCutoff(ctx.date, ctx.day, product, ctx.settings);
    const inOrder = ctx.existing?.lines.some((l) => l.productId === product.id) ?? false;
    return { product, quantity, cutoff, tooLate: !inOrder && cutoff <= ctx.now, problem: quantityProblem(quantity, product) };
  });
}

/** A line the buyer is ordering: a whole number above nothing. */
export const isChosen = (line: Pick<DraftLine, "quantity">) => !Number.isNaN(line.quantity) && line.quantity > 0;

export interface DraftSummary {
  chosen: DraftLine[];
  totalCents: number;
  /** What is missing to the account's minimum (0 when met or nothing is chosen). */
  shortfallCents: number;
  /** Lines that can't be sent as they are: quantities out of bounds, and chosen products past their cut-off. */
  problems: number;
  /** The countdown's deadline (ms): the earliest cut-off among the chosen lines still ahead, else the date's. */
  deadline: number;
}

export function summarizeDraft(lines: readonly DraftLine[], minimumCents: number, baseDeadline: string, now: number): DraftSummary {
  const chosen = lines.filter(isChosen);
  const totalCents = chosen.reduce((s, l) => s + l.quantity * l.product.priceCents, 0);
  const late = chosen.filter((l) => l.tooLate).length;
  return {
    chosen,
    totalCents,
    shortfallCents: shortfall(totalCents, minimumCents),
    problems: lines.filter((l) => l.problem).length + late,
    deadline: chosen.reduce((min, l) => (l.cutoff > now && l.cutoff < min ? l.cutoff : min), Date.parse(baseDeadline)),
  };
}

/** Lines of the saved order whose product is no longer on offer (saving takes them off). */
export function goneLines(existing: OrderDto | null, products: readonly Pick<ProductDto, "id">[]): OrderDto["lines"] {
  const offered = new Set(products.map((p) => p.id));
  return (existing?.lines ?? []).filter((l) => !offered.has(l.productId));
}

/** The quantities a set of typed values orders, by product id (blank, zero and unreadable ones left out). */
export function orderedQuantities(quantities: Quantities): Record<number, number> {
  const out: Record<number, number> = {};
  for (const [id, text] of Object.entries(quantities)) {
    const q = parseQuantity(text);
    if (!Number.isNaN(q) && q > 0) out[Number(id)] = q;
  }
  return out;
}

function sameQuantities(a: Record<number, number>, b: Record<number, number>): boolean {
  const ka = Object.keys(a);
  return ka.length === Object.keys(b).length && ka.every((k) => a[Number(k)] === b[Number(k)]);
}

/**
 * Does the draft say something other than `saved` (the lines it would send, PO number or note, compared
 * trimmed), or does saving it take off products no longer offered (`goneCount`)?
 */
export function isDirty(draft: { lines: readonly SentLine[]; poNumber: string; note: string }, saved: OrderValues, goneCount = 0): boolean {
  const sending = Object.fromEntries(draft.lines.map((l) => [l.productId, l.quantity]));
  return (
    goneCount > 0 ||
    !sameQuantities(sending, orderedQuantities(saved.quantities)) ||
    draft.poNumber.trim() !== saved.poNumber.trim() ||
    draft.note.trim() !== saved.note.trim()
  );
}

/** Why the submit button is off, in the buyer's words (null when it isn't, or the minimum hint says why). */
export function blockedReason(p: { locked: boolean; chosen: number; problems: number; existing: boolean }): string | null {
  if (p.locked) return null;
  if (p.chosen === 0) return p.existing ? "To call off this delivery, use “Cancel this order” below." : "Choose at least one product.";
  if (p.problems > 0) return "Fix the quantities marked in red first.";
  return null;
}

/** Can the draft be sent: open, something chosen, nothing wrong, the minimum met and (for a saved order) changed. */
export function canSend(summary: DraftSummary, p: { locked: boolean; existing: boolean; dirty: boolean }): boolean {
  return !p.locked && summary.chosen.length > 0 && summary.problems === 0 && summary.shortfallCents === 0 && (!p.existing || p.dirty);
}

/** The lines a submission sends, in the offer's order. */
export const sentLines = (chosen: readonly DraftLine[]): SentLine[] => chosen.map((l) => ({ productId: l.product.id, quantity: l.quantity }));

/** POST /api/orders: an empty PO number or note is left out. */
export function createInput(date: string, lines: SentLine[], values: Pick<OrderValues, "poNumber" | "note">): OrderCreateInput {
  const po = values.poNumber.trim();
  const note = values.note.trim();
  return { deliveryDate: date, lines, ...(po ? { poNumber: po } : {}), ...(note ? { note } : {}) };
}

/** PATCH /api/orders/:id: every part sent, an empty PO number or note clears it. */
export function updateInput(lines: SentLine[], values: Pick<OrderValues, "poNumber" | "note">): OrderUpdateInput {
  return { lines, poNumber: values.poNumber.trim(), note: values.note.trim() };
}

/** A failed save, as the API answered it (status 0: no answer). */
export interface FailedSave {
  status: number;
  code: string;
  message: string;
  fields?: FieldErrors;
  details: Record<string, unknown>;
}

/** What a failed save means for the draft. */
export type SaveFailure =
  /** Nothing reached the bakery: keep the draft on the device and offer to send it again. */
  | { kind: "transient"; message: string }
  /** The date is closed (cut-off, not orderable, order locked): the form locks with the server's words. */
  | { kind: "closed"; message: string }
  /** Products that need more notice are past their cut-off while the date is still open. */
  | { kind: "notice"; message: string }
  /** Another device or the bakery placed an order for this date meanwhile. */
  | { kind: "exists" }
  /** Field errors: by product line, and the top message. PO number and note errors go beside their fields. */
  | { kind: "fields"; lineErrors: Record<number, string>; formError: string | null }
  /** Anything else: its message at the top. */
  | { kind: "other"; message: string };

export interface FailureContext {
  /** The lines as sent (the server names them by index). */
  sent: readonly SentLine[];
  products: readonly Pick<ProductDto, "id" | "name">[];
  /** A new order (no saved one): only then can a product's longer notice be the reason. */
  isNew: boolean;
  day: Pick<CalendarDayDto, "cutoffAt">;
  now: number;
}

const CLOSED_CODES = ["cutoff_passed", "date_not_orderable", "order_closed"];

export function saveFailure(err: FailedSave, ctx: FailureContext): SaveFailure {
  if (err.status === 0 || err.status >= 500) {
    return {
      kind: "transient",
      message:
        err.code === "network_error"
          ? `${err.message} Nothing was lost: your order is kept on this device; press the button again to send it.`
          : `${err.message} Your order is kept on this device: press the button again to send it.`,
    };
  }
  if (CLOSED_CODES.includes(err.code)) {
    const at = typeof err.details.cutoffAt === "string" ? Date.parse(err.details.cutoffAt) : Number.NaN;
    const dayCutoff = Date.parse(ctx.day.cutoffAt);
    if (err.code === "cutoff_passed" && ctx.isNew && at < dayCutoff && dayCutoff - ctx.now > 0) {
      return { kind: "notice", message: `${err.message} Some products need more notice: take them off to order the rest.` };
    }
    return { kind: "closed", message: err.message };
  }
  if (err.code === "order_exists") return { kind: "exists" };
  if (!err.fields) return { kind: "other", message: err.message };
  const lineErrors: Record<number, string> = {};
  let rest = 0;
  for (const [key, message] of Object.entries(err.fields)) {
    const m = /^lines\.(\d+)\.(quantity|productId)$/.exec(key);
    const line = m ? ctx.sent[Number(m[1])] : undefined;
    if (line) lineErrors[line.productId] = message;
    else if (key !== "poNumber" && key !== "note") rest++;
  }
  const named = Object.keys(lineErrors)
    .map((id) => ctx.products.find((p) => p.id === Number(id))?.name)
    .filter(Boolean);
  const formError = rest
    ? err.message
    : named.length === 1
      ? `Check ${named[0]}: ${Object.values(lineErrors)[0]}`
      : named.length > 1
        ? "Some products need attention: see the ones marked in red."
        : null;
  return { kind: "fields", lineErrors, formError };
}
