import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, SUMMARY, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";

/** Issue 12, "the overview page says something": the day's figures, each a link to its screen. */
const routes = (user: typeof OWNER) => ({ ...sessionRoutes(user), "GET /api/office/summary": { body: { summary: SUMMARY } } });

describe("office overview", () => {
  it("shows today's and tomorrow's orders, what is owed and overdue, the next cut-off and failed mail", async () => {
    signedInAs(OWNER);
    mockApi(routes(OWNER));
    renderApp("/office");
    expect(await screen.findByTestId("overview-today")).toHaveTextContent(/3.*Today's orders.*14 units · \$252\.00/);
    expect(screen.getByTestId("overview-tomorrow")).toHaveTextContent(/2.*Tomorrow's orders.*9 units · \$162\.00/);
    expect(screen.getByTestId("overview-owed")).toHaveTextContent(/\$421\.75.*Owed to the bakery/);
    expect(screen.getByTestId("overview-overdue")).toHaveTextContent(/\$120\.00.*Overdue.*1 invoice/);
    expect(screen.getByTestId("overview-cutoff")).toHaveTextContent(/Tue, Dec 2, 2:00 PM.*Next cut-off.*For Wed, Dec 3/);
    expect(screen.getByTestId("overview-mail")).toHaveTextContent(/1.*E-mail not sent.*Send it again from the outbox/);
  });

  it("each figure opens its screen: the overdue invoices, tomorrow's board", async () => {
    signedInAs(BOOKKEEPER);
    const api = mockApi({
      ...routes(BOOKKEEPER),
      "GET /api/invoices": { body: { invoices: [], totals: { count: 0, totalCents: 0, paidCents: 0, dueCents: 0 } } },
      "GET /api/accounts": { body: { accounts: [] } },
    });
    const app = renderApp("/office");
    fireEvent.press(await screen.findByTestId("overview-overdue"));
    await waitFor(() => expect(app.getPathname()).toBe("/office/invoices"));
    await waitFor(() => expect(api.callsTo("GET", "/api/invoices").some((c) => c.query.overdue === "1")).toBe(true));
  });
});
