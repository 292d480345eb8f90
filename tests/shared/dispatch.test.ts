/**
 * Recording a delivery date's dispatch (components/ordering/dispatch.ts): lines marked short, the adjustments
 * they send and their checks, the server's line errors put back, and the words of the summary and result.
 */
import {
  dispatchAdjustments,
  dispatchInputSchema,
  dispatchResultText,
  dispatchSummary,
  lineKey,
  lineProblemsFrom,
  toggleShort,
} from "../../components/ordering/dispatch";
import type { BoardDto } from "../../components/api/board";

const BOARD: BoardDto = {
  date: "2025-12-02",
  products: [
    { id: 101, name: "Dinner rolls", saleUnit: "tray", saleUnitPlural: "trays", total: 7 },
    { id: 102, name: "Burger buns", saleUnit: "pack", saleUnitPlural: "packs", total: 4 },
  ],
  rows: [
    { accountId: 12, accountName: "Juniper Table", orderId: 902, status: "locked", poNumber: "JT-9", quantities: { 101: 4, 102: 4 }, totalCents: 13600 },
    { accountId: 11, accountName: "Tidewater Café", orderId: 901, status: "open", poNumber: null, quantities: { 101: 3 }, totalCents: 4860 },
    { accountId: 13, accountName: "North Pier Coffee", orderId: 903, status: "delivered", poNumber: null, quantities: { 101: 2 }, totalCents: 3600 },
  ],
  totalCents: 22060,
  held: [],
};

describe("short lines", () => {
  it("starts a short line at one fewer than ordered, and takes it off again", () => {
    const on = toggleShort({}, lineKey(902, 101), 4);
    expect(on).toEqual({ "902-101": { delivered: "3", reason: "" } });
    expect(toggleShort(on, "902-101", 4)).toEqual({});
    expect(toggleShort({}, "901-101", 0)).toEqual({ "901-101": { delivered: "0", reason: "" } });
  });

  it("sends what went out and why, for waiting orders only", () => {
    const checked = dispatchAdjustments(BOARD, {
      "902-102": { delivered: "0", reason: "  Dropped the tray " },
      "901-101": { delivered: "2", reason: "" },
      // Delivered already: never adjusted here.
      "903-101": { delivered: "1", reason: "" },
    });
    expect(checked).toEqual({
      ok: true,
      adjustments: [
        { orderId: 902, productId: 102, deliveredQuantity: 0, reason: "Dropped the tray" },
        { orderId: 901, productId: 101, deliveredQuantity: 2 },
      ],
    });
    expect(dispatchAdjustments(BOARD, {})).toEqual({ ok: true, adjustments: [] });
  });

  it("refuses a short line that isn't short or isn't a number", () => {
    expect(dispatchAdjustments(BOARD, { "902-101": { delivered: "4", reason: "" }, "901-101": { delivered: "two", reason: "" } })).toEqual({
      ok: false,
      problems: { "902-101": 'Less than the 4 ordered, or untick "Short".', "901-101": "Enter a whole number." },
    });
  });

  it("checks the adjustments with the server's rules", () => {
    expect(dispatchInputSchema.safeParse({ adjustments: [{ orderId: 902, productId: 102, deliveredQuantity: 0 }] }).success).toBe(true);
    expect(dispatchInputSchema.safeParse({ adjustments: [{ orderId: 902, productId: 102, deliveredQuantity: -1 }] }).success).toBe(false);
    expect(dispatchInputSchema.safeParse({ adjustments: [{ orderId: 902, productId: 102, deliveredQuantity: 1, reason: "x".repeat(201) }] }).success).toBe(false);
  });
});

describe("the server's answer", () => {
  const sent = [
    { orderId: 902, productId: 102, deliveredQuantity: 0 },
    { orderId: 901, productId: 101, deliveredQuantity: 2 },
  ];

  it("puts each error on the line sent at that place", () => {
    expect(lineProblemsFrom({ "adjustments.1.orderId": "Not waiting.", "adjustments.0.deliveredQuantity": "Too many.", "adjustments.9.orderId": "Gone.", adjustments: "Too many lines." }, sent)).toEqual({
      "901-101": "Not waiting.",
      "902-102": "Too many.",
    });
  });

  it("says what is to record and what was recorded", () => {
    expect(dispatchSummary(2, 0)).toBe("2 orders to record · everything as ordered.");
    expect(dispatchSummary(1, 1)).toBe("1 order to record · 1 line short.");
    expect(dispatchSummary(3, 2)).toBe("3 orders to record · 2 lines short.");
    expect(dispatchResultText({ delivered: 2, invoices: ["HB-2025-00060", "HB-2025-00061"] })).toBe("2 orders marked delivered. Invoiced at once (card accounts): HB-2025-00060, HB-2025-00061.");
    expect(dispatchResultText({ delivered: 1, invoices: [] })).toBe("1 order marked delivered. No card invoices were due; accounts on terms get their weekly statement.");
  });
});
