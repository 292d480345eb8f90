import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { invoiceDetail, invoiceDto } from "./billing-fixtures";
import type { BillingSettingsDto } from "../../components/api/billingSettings";

/** Issue 12, "the bookkeeper chases payment": reminders by hand, for every overdue invoice, and on a schedule. */
const SETTINGS: BillingSettingsDto = { salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14, paymentInstructions: "", remindersOn: false };

describe("payment reminders", () => {
  it("the bookkeeper sends a reminder from an overdue invoice, and the invoice lists it", async () => {
    signedInAs(BOOKKEEPER);
    let reminded = false;
    const reminder = { id: 7, invoiceId: 41, stage: "manual" as const, sentById: 3, at: "2025-12-02T16:00:00.000Z" };
    const api = mockApi({
      ...sessionRoutes(BOOKKEEPER),
      "GET /api/invoices/:id": () => ({ body: invoiceDetail({ overdue: true }, { reminders: reminded ? [reminder] : [] }) }),
      "POST /api/invoices/:id/reminders": () => {
        reminded = true;
        return { status: 201, body: { reminder } };
      },
    });
    renderApp("/office/invoices/41");
    expect(await screen.findByTestId("invoice-no-reminders")).toHaveTextContent("No reminders sent yet.");
    fireEvent.press(screen.getByTestId("invoice-remind"));
    expect(await screen.findByTestId("invoice-remind-done")).toHaveTextContent(/Reminder queued for Tidewater Café's billing e-mail\./);
    expect(api.callsTo("POST", "/api/invoices/41/reminders")).toHaveLength(1);
    expect(await screen.findByTestId("reminder-7")).toHaveTextContent(/Sent by hand/);
  });

  it("reminds all overdue from the invoices list and says which went out and which were left out", async () => {
    signedInAs(OWNER);
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/invoices": { body: { invoices: [invoiceDto({ overdue: true })], totals: { count: 1, totalCents: 5873, paidCents: 0, dueCents: 5873 } } },
      "GET /api/accounts": { body: { accounts: [] } },
      "POST /api/invoices/reminders": { body: { sent: ["HB-2025-00041"], skipped: ["HB-2025-00040"] } },
    });
    renderApp("/office/invoices");
    fireEvent.press(await screen.findByTestId("remind-all"));
    expect(await screen.findByText("Reminders queued for HB-2025-00041. Left out (reminded today already): HB-2025-00040.")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/invoices/reminders")).toHaveLength(1);
  });

  it("the bookkeeper turns the reminder schedule on in billing settings", async () => {
    signedInAs(BOOKKEEPER);
    let on = false;
    const api = mockApi({
      ...sessionRoutes(BOOKKEEPER),
      "GET /api/settings/billing": () => ({ body: { settings: { ...SETTINGS, remindersOn: on } } }),
      "PUT /api/settings/billing/reminders": (req: { body: unknown }) => {
        on = (req.body as { on: boolean }).on;
        return { body: { settings: { ...SETTINGS, remindersOn: on } } };
      },
    });
    renderApp("/office/money/settings");
    const tick = await screen.findByTestId("reminders-on");
    expect(screen.getByTestId("reminders-card")).toHaveTextContent(/3 days before due, on the due date and 7 days overdue/);
    fireEvent.press(tick);
    await waitFor(() => expect(api.callsTo("PUT", "/api/settings/billing/reminders")[0]?.body).toEqual({ on: true }));
    await waitFor(() => expect(screen.getByTestId("reminders-on")).toBeChecked());
  });
});
