/**
 * The order draft (components/ordering/draft.ts): one date's order as plain data, with no React — lines and
 * their checks, totals in cents, the shortfall to the account's minimum, dirty against the saved order, the
 * payloads it sends and what a failed save means.
 */
import {
  blockedReason,
  canSend,
  createInput,
  draftLines,
  goneLines,
  isDirty,
  orderValues,
  orderedQuantities,
  productCutoff,
  saveFailure,
  sentLines,
  summarizeDraft,
  updateInput,
  type DraftContext,
  type FailedSave,
} from "../../components/ordering/draft";
import type { CalendarDayDto, CalendarSettingsDto } from "../../shared/schemas/calendar";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { OrderDto } from "../../shared/schemas/orders";

const product = (p: Partial<ProductDto> & Pick<ProductDto, "id" | "name">): ProductDto =>
  ({ saleUnit: "loaf", saleUnitPlural: "loaves", priceCents: 1800, listPriceCents: 1800, minQuantity: 1, maxQuantity: 40, leadDays: null, ...p }) as ProductDto;

const ROLLS = product({ id: 101, name: "Dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls" });
const BUNS = product({ id: 102, name: "Burger buns", priceCents: 1600, listPriceCents: 1600, minQuantity: 2, maxQuantity: 5 });
/** Needs three days' notice where the bakery asks for one. */
const CAKE = product({ id: 103, name: "Layer cake", priceCents: 4500, listPriceCents: 4500, leadDays: 3 });
const PRODUCTS = [ROLLS, BUNS];

const SETTINGS = { timeZone: "America/Chicago", cutoffTime: "14:00", leadDays: 1 } as CalendarSettingsDto;
// Wed, Dec 3, 2025; the cut-off 2 PM Chicago the day before (CST, UTC−6).
const DAY = { date: "2025-12-03", cutoffAt: "2025-12-02T14:00:00.000-06:00" } as CalendarDayDto;
const DAY_CUTOFF = Date.parse(DAY.cutoffAt);
const NOW = Date.parse("2025-12-02T05:30:00.000-06:00");

const order = (o: Partial<OrderDto> = {}): OrderDto =>
  ({
    id: 501,
    poNumber: null,
    note: null,
    lines: [{ productId: 101, productName: "Dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", quantity: 3 }],
    cutoffAt: DAY.cutoffAt,
    ...o,
  }) as OrderDto;

const ctx = (c: Partial<DraftContext> = {}): DraftContext => ({ date: DAY.date, day: DAY, settings: SETTINGS, existing: null, now: NOW, ...c });

describe("lines and totals", () => {
  it("reads each typed quantity: blank is nothing, digits a quantity, anything else unreadable", () => {
    const lines = draftLines(PRODUCTS, { 101: " 3 ", 102: "x" }, ctx());
    expect(lines.map((l) => l.product.id)).toEqual([101, 102]);
    expect(lines[0].quantity).toBe(3);
    expect(lines[1].quantity).toBeNaN();
    expect(lines[1].problem).toBe("Enter a whole number.");
    expect(draftLines(PRODUCTS, {}, ctx()).every((l) => l.quantity === 0 && !l.problem)).toBe(true);
  });

  it("checks quantities against the product's bounds, in the server's words", () => {
    const [rolls, buns] = draftLines(PRODUCTS, { 101: "41", 102: "1" }, ctx());
    expect(rolls.problem).toBe("At most 40 trays of 15 rolls per order.");
    expect(buns.problem).toBe("At least 2 loaves per order.");
  });

  it("totals the chosen lines in cents and counts the problems", () => {
    const s = summarizeDraft(draftLines(PRODUCTS, { 101: "3", 102: "2" }, ctx()), 0, DAY.cutoffAt, NOW);
    expect(s.chosen.map((l) => l.product.id)).toEqual([101, 102]);
    expect(s.totalCents).toBe(3 * 1800 + 2 * 1600);
    expect(s.problems).toBe(0);
    expect(s.shortfallCents).toBe(0);
    const bad = summarizeDraft(draftLines(PRODUCTS, { 101: "3", 102: "9" }, ctx()), 0, DAY.cutoffAt, NOW);
    expect(bad.problems).toBe(1);
    // The line out of bounds still counts in the total the buyer sees.
    expect(bad.totalCents).toBe(3 * 1800 + 9 * 1600);
  });

  it("says how much is missing to the minimum, and nothing while nothing is chosen or once it is met", () => {
    const lines = (q: Record<number, string>) => draftLines(PRODUCTS, q, ctx());
    expect(summarizeDraft(lines({ 101: "2" }), 5000, DAY.cutoffAt, NOW).shortfallCents).toBe(5000 - 3600);
    expect(summarizeDraft(lines({}), 5000, DAY.cutoffAt, NOW).shortfallCents).toBe(0);
    expect(summarizeDraft(lines({ 101: "3" }), 5000, DAY.cutoffAt, NOW).shortfallCents).toBe(0);
    expect(summarizeDraft(lines({ 101: "3" }), 5400, DAY.cutoffAt, NOW).shortfallCents).toBe(0);
  });
});

describe("cut-offs", () => {
  it("closes a product that needs more notice earlier: three days before at the bakery's cut-off time", () => {
    expect(productCutoff(DAY.date, DAY, ROLLS, SETTINGS)).toBe(DAY_CUTOFF);
    expect(productCutoff(DAY.date, DAY, CAKE, SETTINGS)).toBe(Date.parse("2025-11-30T14:00:00.000-06:00"));
    // Without the settings only the date's own cut-off is known.
    expect(productCutoff(DAY.date, DAY, CAKE, undefined)).toBe(DAY_CUTOFF);
  });

  it("marks a product past its cut-off as too late unless the saved order already has it", () => {
    const fresh = draftLines([ROLLS, CAKE], { 103: "1" }, ctx());
    expect(fresh[1].tooLate).toBe(true);
    const s = summarizeDraft(fresh, 0, DAY.cutoffAt, NOW);
    expect(s.problems).toBe(1);
    const withCake = order({ lines: [{ productId: 103, quantity: 1 } as OrderDto["lines"][number]] });
    expect(draftLines([ROLLS, CAKE], { 103: "1" }, ctx({ existing: withCake }))[1].tooLate).toBe(false);
  });

  it("counts down to the earliest cut-off still ahead among the chosen products", () => {
    const early = product({ id: 104, name: "Focaccia", leadDays: 2 });
    const now = Date.parse("2025-11-30T10:00:00.000-06:00");
    const lines = draftLines([ROLLS, early], { 101: "1", 104: "1" }, ctx({ now }));
    expect(summarizeDraft(lines, 0, DAY.cutoffAt, now).deadline).toBe(Date.parse("2025-12-01T14:00:00.000-06:00"));
    // Not chosen: the date's own cut-off.
    expect(summarizeDraft(draftLines([ROLLS, early], { 101: "1" }, ctx({ now })), 0, DAY.cutoffAt, now).deadline).toBe(DAY_CUTOFF);
  });
});

describe("dirty against the saved order", () => {
  const saved = orderValues(order({ poNumber: "PO-7", note: "Back door" }));
  const draft = (q: Record<number, string>, po = "PO-7", note = "Back door") => ({
    lines: sentLines(summarizeDraft(draftLines(PRODUCTS, q, ctx()), 0, DAY.cutoffAt, NOW).chosen),
    poNumber: po,
    note,
  });

  it("starts from the saved order's values", () => {
    expect(saved).toEqual({ quantities: { 101: "3" }, poNumber: "PO-7", note: "Back door" });
    expect(orderValues(null)).toEqual({ quantities: {}, poNumber: "", note: "" });
  });

  it("is clean as loaded, dirty when a quantity, the PO number or the note changes, and clean again when changed back", () => {
    expect(isDirty(draft({ 101: "3" }), saved)).toBe(false);
    expect(isDirty(draft({ 101: "4" }), saved)).toBe(true);
    expect(isDirty(draft({ 101: "3", 102: "2" }), saved)).toBe(true);
    expect(isDirty(draft({ 101: "3" }, "PO-8"), saved)).toBe(true);
    expect(isDirty(draft({ 101: "3" }, "PO-7", "Front door"), saved)).toBe(true);
    expect(isDirty(draft({ 101: "4" }), saved)).toBe(true);
    expect(isDirty(draft({ 101: "3" }), saved)).toBe(false);
  });

  it("ignores blank and zero lines and white space around the PO number and note", () => {
    expect(isDirty(draft({ 101: "3", 102: "" }, " PO-7 ", "Back door  "), saved)).toBe(false);
    expect(isDirty(draft({ 101: "3", 102: "0" }), saved)).toBe(false);
  });

  it("is dirty while saving would take off products no longer offered", () => {
    const withGone = order({ lines: [...order().lines, { productId: 999, productName: "Rye", quantity: 1 } as OrderDto["lines"][number]] });
    const gone = goneLines(withGone, PRODUCTS);
    expect(gone.map((l) => l.productId)).toEqual([999]);
    expect(isDirty(draft({ 101: "3" }, "", ""), orderValues(withGone), gone.length)).toBe(true);
  });

  it("reads typed quantities as the numbers they order", () => {
    expect(orderedQuantities({ 101: "3", 102: "", 103: "0", 104: "2x" })).toEqual({ 101: 3 });
  });
});

describe("sending", () => {
  const summary = (q: Record<number, string>, minimum = 0) => summarizeDraft(draftLines(PRODUCTS, q, ctx()), minimum, DAY.cutoffAt, NOW);

  it("sends a new order only when something is chosen, nothing is wrong and the minimum is met", () => {
    const open = { locked: false, existing: false, dirty: true };
    expect(canSend(summary({ 101: "3" }), open)).toBe(true);
    expect(canSend(summary({}), open)).toBe(false);
    expect(canSend(summary({ 101: "3", 102: "9" }), open)).toBe(false);
    expect(canSend(summary({ 101: "1" }, 5000), open)).toBe(false);
    expect(canSend(summary({ 101: "3" }), { ...open, locked: true })).toBe(false);
  });

  it("saves a saved order only when it changed", () => {
    expect(canSend(summary({ 101: "3" }), { locked: false, existing: true, dirty: false })).toBe(false);
    expect(canSend(summary({ 101: "3" }), { locked: false, existing: true, dirty: true })).toBe(true);
  });

  it("says why the button is off", () => {
    expect(blockedReason({ locked: false, chosen: 0, problems: 0, existing: false })).toBe("Choose at least one product.");
    expect(blockedReason({ locked: false, chosen: 0, problems: 0, existing: true })).toBe("To call off this delivery, use “Cancel this order” below.");
    expect(blockedReason({ locked: false, chosen: 2, problems: 1, existing: false })).toBe("Fix the quantities marked in red first.");
    expect(blockedReason({ locked: true, chosen: 0, problems: 1, existing: false })).toBeNull();
    expect(blockedReason({ locked: false, chosen: 2, problems: 0, existing: false })).toBeNull();
  });

  it("leaves an empty PO number and note out of a new order and clears them on a saved one", () => {
    const lines = sentLines(summary({ 102: "2", 101: "3" }).chosen);
    expect(lines).toEqual([
      { productId: 101, quantity: 3 },
      { productId: 102, quantity: 2 },
    ]);
    expect(createInput(DAY.date, lines, { poNumber: "  ", note: "" })).toEqual({ deliveryDate: "2025-12-03", lines });
    expect(createInput(DAY.date, lines, { poNumber: " PO-1 ", note: " Side door " })).toEqual({ deliveryDate: "2025-12-03", lines, poNumber: "PO-1", note: "Side door" });
    expect(updateInput(lines, { poNumber: "", note: " " })).toEqual({ lines, poNumber: "", note: "" });
  });
});

describe("what a failed save means", () => {
  const sent = [
    { productId: 101, quantity: 3 },
    { productId: 102, quantity: 2 },
  ];
  const fctx = { sent, products: PRODUCTS, isNew: true, day: DAY, now: NOW };
  const err = (e: Partial<FailedSave>): FailedSave => ({ status: 400, code: "validation_failed", message: "Check the order.", details: {}, ...e });

  it("keeps the order on the device when nothing reached the bakery", () => {
    expect(saveFailure(err({ status: 0, code: "network_error", message: "Panwise can't be reached right now." }), fctx)).toEqual({
      kind: "transient",
      message: "Panwise can't be reached right now. Nothing was lost: your order is kept on this device; press the button again to send it.",
    });
    expect(saveFailure(err({ status: 503, code: "unavailable", message: "Panwise is briefly unavailable." }), fctx)).toEqual({
      kind: "transient",
      message: "Panwise is briefly unavailable. Your order is kept on this device: press the button again to send it.",
    });
  });

  it("locks the form when the date has closed, unless only products needing more notice are late", () => {
    expect(saveFailure(err({ status: 409, code: "cutoff_passed", message: "The cut-off has passed." }), fctx)).toEqual({ kind: "closed", message: "The cut-off has passed." });
    expect(saveFailure(err({ status: 409, code: "order_closed", message: "Locked." }), fctx).kind).toBe("closed");
    const early = err({ status: 409, code: "cutoff_passed", message: "Layer cake needs three days' notice.", details: { cutoffAt: "2025-11-30T14:00:00.000-06:00" } });
    expect(saveFailure(early, fctx)).toEqual({ kind: "notice", message: "Layer cake needs three days' notice. Some products need more notice: take them off to order the rest." });
    // Changing a saved order, or once the date itself has closed: closed.
    expect(saveFailure(early, { ...fctx, isNew: false }).kind).toBe("closed");
    expect(saveFailure(early, { ...fctx, now: DAY_CUTOFF + 1 }).kind).toBe("closed");
  });

  it("opens the order another device placed", () => {
    expect(saveFailure(err({ status: 409, code: "order_exists" }), fctx)).toEqual({ kind: "exists" });
  });

  it("puts line errors on the product the server names by index, with one top message", () => {
    expect(saveFailure(err({ fields: { "lines.1.quantity": "At most 5 per order." } }), fctx)).toEqual({
      kind: "fields",
      lineErrors: { 102: "At most 5 per order." },
      formError: "Check Burger buns: At most 5 per order.",
    });
    expect(saveFailure(err({ fields: { "lines.0.quantity": "Too many.", "lines.1.productId": "Not offered." } }), fctx)).toEqual({
      kind: "fields",
      lineErrors: { 101: "Too many.", 102: "Not offered." },
      formError: "Some products need attention: see the ones marked in red.",
    });
    // PO number and note errors go beside their fields (the form shows them): no top message.
    expect(saveFailure(err({ fields: { poNumber: "Use at most 40 characters." } }), fctx)).toEqual({ kind: "fields", lineErrors: {}, formError: null });
    // Anything the form has no place for: the server's message on top.
    expect(saveFailure(err({ fields: { "lines.0.quantity": "Too many.", deliveryDate: "Not a date." } }), fctx)).toEqual({
      kind: "fields",
      lineErrors: { 101: "Too many." },
      formError: "Check the order.",
    });
    // An index past what was sent names no line.
    expect(saveFailure(err({ fields: { "lines.5.quantity": "Too many." } }), fctx)).toEqual({ kind: "fields", lineErrors: {}, formError: "Check the order." });
  });

  it("shows any other refusal's message", () => {
    expect(saveFailure(err({ status: 403, code: "account_on_hold", message: "This account is on hold." }), fctx)).toEqual({ kind: "other", message: "This account is on hold." });
  });
});
