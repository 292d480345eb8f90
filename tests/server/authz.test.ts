import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, type TestApp } from "./helpers/app";
import { listApiRoutes } from "../../server/app";
import { ROLES, type Role } from "../../shared/roles";

/**
 * The route-by-role table. Every API route must be listed here (the first test fails for a new
 * route that is not), with the roles allowed to use it; "public" routes need no sign-in.
 * Everyone else must get 403 (signed in) or 401 (signed out): deny by default.
 */
const ALL: Role[] = [...ROLES];
const TABLE: Record<string, Role[] | "public"> = {
  "GET /api/health": "public",
  "POST /api/auth/sign-in": "public",
  "GET /api/auth/me": ALL,
  "POST /api/auth/sign-out": ALL, // ends the token it is called with: the case below signs that role in again
  "POST /api/auth/password-reset": "public",
  "POST /api/auth/password-reset/confirm": "public",
  "GET /api/auth/invitations/:token": "public",
  "POST /api/auth/invitations/accept": "public",
  "GET /api/bakery": ALL,
  "GET /api/office/summary": ["owner", "bookkeeper"],
  "GET /api/users": ["owner"],
  "GET /api/users/:id": ["owner"],
  "PATCH /api/users/:id": ["owner"],
  "GET /api/invitations": ["owner"],
  "POST /api/invitations": ["owner"],
  "DELETE /api/invitations/:id": ["owner"],
  "POST /api/invitations/:id/resend": ["owner"],
  "GET /api/accounts": ["owner", "bookkeeper"],
  "GET /api/accounts/:id/buyers": ["owner", "bookkeeper"],
  "GET /api/accounts/:id": ["owner", "bookkeeper", "buyer"],
  "POST /api/accounts": ["owner"],
  "PATCH /api/accounts/:id": ["owner"],
  "GET /api/accounts/:id/delivery": ["owner", "bookkeeper", "buyer"],
  "PUT /api/accounts/:id/delivery": ["owner"],
  "GET /api/products": ALL,
  "GET /api/products/:id": ALL,
  "POST /api/products": ["owner"],
  "PATCH /api/products/:id": ["owner"],
  "POST /api/products/:id/archive": ["owner"],
  "PUT /api/products/:id/photo": ["owner"],
  "GET /api/price-lists": ["owner"],
  "POST /api/price-lists": ["owner"],
  "PUT /api/price-lists/:id": ["owner"],
  "DELETE /api/price-lists/:id": ["owner"],
  "GET /api/uploads/:file": "public",
  "GET /api/settings/calendar": ALL,
  "PUT /api/settings/calendar": ["owner"],
  "GET /api/calendar": ALL,
  "GET /api/orders/board": ["owner", "bookkeeper", "baker"],
  "GET /api/orders/board.csv": ["owner", "bookkeeper", "baker"],
  "GET /api/orders": ["buyer", "owner", "bookkeeper", "baker"],
  "GET /api/orders/:id": ["buyer", "owner", "bookkeeper", "baker"],
  "POST /api/orders": ["buyer", "owner", "bookkeeper"],
  "PATCH /api/orders/:id": ["buyer", "owner", "bookkeeper"],
  "DELETE /api/orders/:id": ["buyer", "owner", "bookkeeper"],
  "GET /api/standing-orders": ["buyer", "owner", "bookkeeper"],
  "PUT /api/standing-orders": ["buyer", "owner"],
  "POST /api/standing-orders/materialise": ["owner"],
  "GET /api/calendar-feed": ["buyer", "owner"],
  "POST /api/calendar-feed": ["buyer", "owner"],
  "DELETE /api/calendar-feed": ["buyer", "owner"],
  "GET /api/feeds/:file": "public",
  "GET /api/ingredients": ["owner", "baker"],
  "POST /api/ingredients": ["owner", "baker"],
  "PUT /api/ingredients/:id": ["owner", "baker"],
  "GET /api/formulas": ["owner", "baker"],
  "GET /api/formulas/:id": ["owner", "baker"],
  "GET /api/formulas/:id/history": ["owner", "baker"],
  "POST /api/formulas": ["owner", "baker"],
  "PUT /api/formulas/:id": ["owner", "baker"],
  "GET /api/production/settings": ["owner", "baker"],
  "PUT /api/production/settings": ["owner"],
  "GET /api/production/next-day": ["owner", "baker"],
  "GET /api/production/plan": ["owner", "baker"],
  "GET /api/production/plan.pdf": ["owner", "baker"],
  "POST /api/production/plan/recalculate": ["owner", "baker"],
  "PUT /api/production/bake-days/:date": ["owner", "baker"],
  "POST /api/production/bake-days/:date/progress": ["owner", "baker"],
  "GET /api/production/forecast": ["owner", "baker"],
  "GET /api/production/forecast.csv": ["owner", "baker"],
  "GET /api/outbox": ["owner", "bookkeeper"],
  "POST /api/outbox/:id/resend": ["owner", "bookkeeper"],
  "POST /api/webhooks/stripe": "public",
  "POST /api/deliveries/:date/confirm": ["owner", "baker"],
  "GET /api/invoices": ["owner", "bookkeeper", "buyer"],
  "POST /api/invoices/statements": ["owner", "bookkeeper"],
  "POST /api/invoices/reminders": ["owner", "bookkeeper"],
  "POST /api/invoices/:id/reminders": ["owner", "bookkeeper"],
  "GET /api/invoices/:id": ["owner", "bookkeeper", "buyer"],
  "GET /api/invoices/:id/pdf": ["owner", "bookkeeper", "buyer"],
  "POST /api/invoices/:id/checkout": ["owner", "bookkeeper", "buyer"],
  "POST /api/invoices/:id/payments": ["owner", "bookkeeper"],
  "POST /api/invoices/:id/credit-notes": ["owner", "bookkeeper"],
  "POST /api/invoices/:id/overpayment-refund": ["owner", "bookkeeper"],
  "GET /api/payouts": ["owner", "bookkeeper"],
  "GET /api/payouts/:id": ["owner", "bookkeeper"],
  "POST /api/payouts/:id/reconcile": ["owner", "bookkeeper"],
  "POST /api/payouts/:id/undo-reconcile": ["owner", "bookkeeper"],
  "GET /api/reports/aging": ["owner", "bookkeeper"],
  "GET /api/reports/exports/:file": ["owner", "bookkeeper"],
  "GET /api/settings/billing": ALL,
  "PUT /api/settings/billing": ["owner"],
  "PUT /api/settings/billing/reminders": ["owner", "bookkeeper"],
  "PUT /api/accounts/:id/terms": ["owner"],
  "GET /api/accounts/:id/certificates": ["owner", "bookkeeper", "buyer"],
  "POST /api/accounts/:id/certificates": ["owner", "buyer"],
  "POST /api/certificates/:id/review": ["owner"],
  "GET /api/certificates/:id/file": ["owner", "bookkeeper", "buyer"],
};

let t: TestApp;
const tokens: Partial<Record<Role, string>> = {};
const people: Partial<Record<Role, { email: string }>> = {};
let accountId = 0;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds);
  const account = await makeAccount(t.ds);
  accountId = account.id;
  for (const role of ROLES) {
    people[role] = await makeUser(t.ds, role, role === "buyer" ? { accountId } : {});
    tokens[role] = await tokenFor(t, people[role]!);
  }
});
afterAll(() => t.close());

it("lists every API route in the table (and nothing that does not exist)", () => {
  const routes = listApiRoutes(t.ctx).sort();
  expect(routes.filter((r) => !(r in TABLE))).toEqual([]);
  expect(Object.keys(TABLE).filter((r) => !routes.includes(r))).toEqual([]);
});

const cases = Object.entries(TABLE).flatMap(([route, allowed]) =>
  [...ROLES, "anonymous" as const].map((who) => ({ route, allowed, who })),
);

it.each(cases)("$route as $who", async ({ route, allowed, who }) => {
  const [method, pattern] = route.split(" ");
  // Use the buyer's own account id so that "allowed" buyer routes are really allowed.
  const path = pattern.replace(":id", String(accountId)).replace(":token", "not-a-real-token-value");
  let req = t.http()[method.toLowerCase() as "get" | "post" | "patch" | "delete"](path);
  if (who !== "anonymous") req = req.set("Authorization", `Bearer ${tokens[who]}`);
  const res = await req.send({});
  if (route === "POST /api/auth/sign-out" && who !== "anonymous") tokens[who] = await tokenFor(t, people[who]!);
  if (allowed === "public" || (who !== "anonymous" && allowed.includes(who))) {
    expect([401, 403]).not.toContain(res.status);
  } else if (who === "anonymous") {
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("unauthorized");
  } else {
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
  }
});
