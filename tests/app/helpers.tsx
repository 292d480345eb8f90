import React from "react";
import { Slot } from "expo-router";
import { renderRouter, screen, waitFor, type RenderRouterOptions } from "expo-router/testing-library";
import { QueryClient } from "@tanstack/react-query";
import { AppProviders } from "../../components/AppProviders";
import { writeSession } from "../../components/auth/storage";
import type { SessionUser } from "../../shared/schemas/auth";
import type { AccountDto } from "../../shared/schemas/accounts";
import type { UserDto, InvitationDto } from "../../shared/schemas/users";
import type { BakeryDto, OfficeSummaryDto } from "../../shared/schemas/bakery";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { CalendarDayDto, CalendarSettingsDto } from "../../shared/schemas/calendar";
import type { OrderDto, StandingOrderDto } from "../../shared/schemas/orders";
import { suggestPlural } from "../../shared/quantity";

// ---- People and data shaped like the API's answers ----

export const OWNER: SessionUser = { id: 1, email: "owner@hollowbrook.test", name: "Rosalind Hart", role: "owner", accountId: null };
export const BAKER: SessionUser = { id: 2, email: "baker@hollowbrook.test", name: "Tomas Lindqvist", role: "baker", accountId: null };
export const BOOKKEEPER: SessionUser = { id: 3, email: "books@hollowbrook.test", name: "Priya Natarajan", role: "bookkeeper", accountId: null };
export const BUYER: SessionUser = { id: 4, email: "buyer@tidewater.test", name: "Marisol Okafor", role: "buyer", accountId: 11 };

export function account(overrides: Partial<AccountDto> = {}): AccountDto {
  return {
    id: 11,
    businessName: "Tidewater Café",
    deliveryAddress: "14 Harbor Row, Back door",
    contactName: "Marisol Okafor",
    contactPhone: "+1 555 0101",
    billingEmail: "accounts@tidewater.test",
    status: "active",
    notes: "",
    paymentTerms: "card",
    creditHold: false,
    buyerCount: 1,
    createdAt: "2025-11-01T10:00:00.000Z",
    updatedAt: "2025-11-20T10:00:00.000Z",
    ...overrides,
  };
}

export function userDto(overrides: Partial<UserDto> = {}): UserDto {
  return {
    id: 1,
    email: OWNER.email,
    name: OWNER.name,
    role: "owner",
    accountId: null,
    accountName: null,
    disabled: false,
    lastSignInAt: "2025-12-01T14:00:00.000Z",
    createdAt: "2025-10-01T10:00:00.000Z",
    ...overrides,
  };
}

export function invitationDto(overrides: Partial<InvitationDto> = {}): InvitationDto {
  return {
    id: 71,
    email: "new.baker@hollowbrook.test",
    role: "baker",
    accountId: null,
    accountName: null,
    expiresAt: "2025-12-05T10:00:00.000Z",
    createdAt: "2025-12-02T10:00:00.000Z",
    expired: false,
    ...overrides,
  };
}

export const BAKERY: BakeryDto = {
  id: 1,
  name: "Hollowbrook Bakehouse",
  timeZone: "America/Chicago",
  currency: "USD",
  locale: "en-US",
  email: "hello@hollowbrook.test",
  phone: "+1 555 0100",
  address: "2 Mill Lane, Hollowbrook",
  today: "2025-12-02",
  now: "2025-12-02T05:30:00.000-06:00",
};

export const SUMMARY: OfficeSummaryDto = {
  users: { total: 7, active: 6, disabled: 1, pendingInvitations: 2 },
  accounts: { total: 4, active: 2, onHold: 1, paused: 1, creditHold: 0, closed: 1 },
  overview: {
    currency: "USD",
    days: [{ date: "2025-12-02", orders: 3, units: 14, totalCents: 25200 }, { date: "2025-12-03", orders: 2, units: 9, totalCents: 16200 }],
    owedCents: 42175, overdueCents: 12000, overdueInvoices: 1,
    nextCutoff: { date: "2025-12-03", at: "2025-12-02T14:00:00.000-06:00" },
    failedMail: 1,
  },
};

// ---- A fake API behind global.fetch ----

export interface FakeRequest {
  method: string;
  path: string;
  query: Record<string, string>;
  body: unknown;
  headers: Record<string, string>;
}
export interface FakeReply {
  status?: number;
  body?: unknown;
}
export type Route = FakeReply | ((req: FakeRequest, params: Record<string, string>) => FakeReply | Promise<FakeReply>);

export function apiError(status: number, code: string, message: string, fields?: Record<string, string>): FakeReply {
  return { status, body: { error: { code, message, ...(fields ? { fields } : {}) } } };
}

/**
 * Answer fetch from a table of "METHOD /api/path" routes (":name" matches a segment).
 * Unknown routes answer 404 like the real server. Returns the requests it saw.
 */
export function mockApi(routes: Record<string, Route>) {
  const calls: FakeRequest[] = [];
  const table = Object.entries(routes).map(([key, route]) => {
    const [method, pattern] = key.split(" ");
    const names: string[] = [];
    const re = new RegExp(`^${pattern.replace(/:[a-zA-Z]+/g, (m) => (names.push(m.slice(1)), "([^/]+)"))}$`);
    return { method, re, names, route };
  });
  const fetchMock = jest.fn(async (input: string, init: { method?: string; body?: string; headers?: Record<string, string> } = {}) => {
    const url = new URL(String(input), "http://panwise.test");
    const req: FakeRequest = {
      method: (init.method ?? "GET").toUpperCase(),
      path: url.pathname,
      query: Object.fromEntries(url.searchParams.entries()),
      body: init.body ? JSON.parse(init.body) : undefined,
      headers: init.headers ?? {},
    };
    calls.push(req);
    let reply: FakeReply = apiError(404, "route_not_found", `No API route ${req.method} ${req.path}.`);
    for (const row of table) {
      const m = row.method === req.method ? row.re.exec(req.path) : null;
      if (!m) continue;
      const params = Object.fromEntries(row.names.map((n, i) => [n, decodeURIComponent(m[i + 1])]));
      reply = typeof row.route === "function" ? await row.route(req, params) : row.route;
      break;
    }
    const status = reply.status ?? 200;
    const text = reply.body === undefined ? "" : JSON.stringify(reply.body);
    return { ok: status >= 200 && status < 300, status, text: async () => text, json: async () => JSON.parse(text) };
  });
  (globalThis as { fetch?: unknown }).fetch = fetchMock;
  return { calls, fetchMock, callsTo: (method: string, path: string) => calls.filter((c) => c.method === method && c.path === path) };
}

/** Routes every signed-in start needs: the token check, and the bakery. */
export function sessionRoutes(user: SessionUser): Record<string, Route> {
  return {
    "GET /api/auth/me": { body: { user } },
    "GET /api/bakery": { body: { bakery: BAKERY } },
  };
}

export function signedInAs(user: SessionUser, token = `token-for-${user.id}`) {
  writeSession({ token, user });
}

// ---- Rendering the real app/ routes ----

export function testQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: false, gcTime: Infinity, staleTime: 0 },
      mutations: { retry: false, gcTime: Infinity },
    },
  });
}

/** Render the app's own route files at a URL, with a test QueryClient in place of the real root layout. */
export function renderApp(initialUrl: string, options: RenderRouterOptions = {}) {
  const queryClient = testQueryClient();
  function TestRoot() {
    return (
      <AppProviders queryClient={queryClient}>
        <Slot />
      </AppProviders>
    );
  }
  const result = renderRouter({ appDir: "app", overrides: { _layout: TestRoot } }, { initialUrl, ...options });
  return Object.assign(result, { queryClient });
}

/** Wait until nothing with this testID is on the screen (with a short failure message: formatting a whole tree is slow). */
export async function waitForGone(testID: string) {
  await waitFor(() => {
    if (screen.queryByTestId(testID)) throw new Error(`"${testID}" is still on the screen`);
  });
}

/** Wait until nothing with this label is on the screen. */
export async function waitForLabelGone(label: string) {
  await waitFor(() => {
    if (screen.queryByLabelText(label)) throw new Error(`"${label}" is still on the screen`);
  });
}

// ---- Ordering: products, calendar days, orders (shaped like the API's answers) ----


export function product(overrides: Partial<ProductDto> = {}): ProductDto {
  return {
    id: 101,
    name: "Milk-bread dinner rolls",
    description: "Soft pull-apart rolls.",
    photoUrl: null,
    photoThumbUrl: null,
    saleUnit: "tray of 15 rolls",
    saleUnitPlural: suggestPlural(overrides.saleUnit ?? "tray of 15 rolls"),
    piecesPerUnit: 15,
    pieceGrams: 67,
    panName: "9×13 in pan",
    panLengthMm: 330,
    panWidthMm: 229,
    unitsPerPan: 1,
    listPriceCents: 1800,
    priceCents: 1800,
    minQuantity: 1,
    maxQuantity: 40,
    leadDays: null,
    allergens: ["gluten", "wheat", "egg", "milk"],
    derivedAllergens: [],
    addedAllergens: ["gluten", "wheat", "egg", "milk"],
    allergenSources: { gluten: ["Added by the bakery"], wheat: ["Added by the bakery"], egg: ["Added by the bakery"], milk: ["Added by the bakery"] },
    mayContain: "sesame",
    active: true,
    formulaId: null,
    formulaName: null,
    boughtIn: true,
    bakeTempC: null,
    bakeMinutes: null,
    coolMinutes: null,
    formulaBake: null,
    bake: { bakeTempC: null, bakeMinutes: null, coolMinutes: null },
    components: [],
    ...overrides,
  };
}

export const PRODUCTS: ProductDto[] = [
  product(),
  product({ id: 102, name: "Brioche burger buns", saleUnit: "pack of 8 buns", listPriceCents: 1600, priceCents: 1600, minQuantity: 2, maxQuantity: 5, mayContain: "" }),
];

export const SETTINGS: CalendarSettingsDto = {
  timeZone: "America/Chicago",
  locale: "en-US",
  deliveryWeekdays: [2, 3, 4, 5, 6],
  cutoffTime: "14:00",
  leadDays: 1,
  horizonDays: 28,
  closures: [{ date: "2025-12-25", note: "Christmas" }],
};

export function calendarDay(overrides: Partial<CalendarDayDto> = {}): CalendarDayDto {
  return {
    date: "2025-12-03",
    weekday: 3,
    orderable: true,
    reason: null,
    reasonText: null,
    cutoffAt: "2025-12-02T14:00:00.000-06:00",
    order: null,
    ...overrides,
  };
}

export function orderDto(overrides: Partial<OrderDto> = {}): OrderDto {
  return {
    id: 501,
    accountId: 11,
    accountName: "Tidewater Café",
    deliveryDate: "2025-12-03",
    status: "open",
    poNumber: null,
    note: null,
    lines: [{ productId: 101, productName: "Milk-bread dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", quantity: 3, unitPriceCents: 1800, lineTotalCents: 5400, allergens: ["gluten", "wheat", "egg", "milk"], mayContain: "sesame" }],
    totalCents: 5400,
    cutoffAt: "2025-12-02T14:00:00.000-06:00",
    source: "one_off",
    editedByHand: false,
    cutoffOverride: null,
    createdAt: "2025-12-01T10:00:00.000Z",
    updatedAt: "2025-12-01T10:00:00.000Z",
    ...overrides,
  };
}

export function standingDto(overrides: Partial<StandingOrderDto> = {}): StandingOrderDto {
  return {
    accountId: 11,
    startDate: "2025-12-01",
    endDate: null,
    intervalWeeks: 1,
    skipDates: [],
    lines: [{ productId: 101, weekday: 2, quantity: 2 }],
    active: true,
    rrule: "DTSTART:20251201T000000Z\nRRULE:FREQ=WEEKLY;INTERVAL=1;BYDAY=TU;WKST=MO",
    upcoming: [
      { date: "2025-12-09", orderId: 601, editedByHand: false, status: "open", plan: "ordered", planText: "Order made", skippable: true },
      { date: "2025-12-16", orderId: 602, editedByHand: true, status: "open", plan: "ordered", planText: "Order made", skippable: true },
    ],
    ...overrides,
  };
}

/** Routes a buyer's ordering screens read, with one calendar day. */
export function buyerOrderingRoutes(day: CalendarDayDto, extra: Record<string, Route> = {}): Record<string, Route> {
  return {
    ...sessionRoutes(BUYER),
    "GET /api/accounts/:id": { body: { account: account() } },
    "GET /api/accounts/:id/delivery": { body: { delivery: { routeWeekdays: [2, 3, 4], minimumOrderCents: 5000, priceListId: null } } },
    "GET /api/settings/calendar": { body: { settings: SETTINGS } },
    "GET /api/products": { body: { products: PRODUCTS } },
    "GET /api/calendar": { body: { days: [day] } },
    ...extra,
  };
}
