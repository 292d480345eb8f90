import { fireEvent, screen } from "expo-router/testing-library";
import { OWNER, account, apiError, invitationDto, mockApi, renderApp, sessionRoutes, signedInAs, userDto } from "./helpers";

function routes(extra = {}) {
  return {
    ...sessionRoutes(OWNER),
    "GET /api/accounts": { body: { accounts: [account(), account({ id: 12, businessName: "Juniper Table", status: "on_hold" }), account({ id: 13, businessName: "Old Pier Kiosk", status: "closed" })] } },
    "GET /api/users": { body: { users: [userDto()] } },
    "GET /api/invitations": { body: { invitations: [] } },
    ...extra,
  };
}

describe("invite form", () => {
  beforeEach(() => signedInAs(OWNER));

  it("asks for an e-mail and a role", async () => {
    const api = mockApi(routes());
    renderApp("/office/people/invite");
    fireEvent.press(await screen.findByText("Send invitation"));
    expect(await screen.findByText("Enter an e-mail address.")).toBeOnTheScreen();
    expect(screen.getByText("Choose one of: owner, baker, bookkeeper, buyer.")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/invitations")).toHaveLength(0);
  });

  it("describes the bookkeeper by the work: invoices and payments (issue 10)", async () => {
    mockApi(routes());
    renderApp("/office/people/invite");
    expect(await screen.findByTestId("invite-role-bookkeeper")).toHaveTextContent(/invoices.*payments/);
  });

  it("requires a customer account for a buyer, offering only open accounts", async () => {
    const api = mockApi(routes({ "POST /api/invitations": { status: 201, body: { invitation: invitationDto({ email: "cafe@tidewater.test", role: "buyer", accountId: 11 }) } } }));
    const app = renderApp("/office/people/invite");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "cafe@tidewater.test");
    fireEvent.press(screen.getByTestId("invite-role-buyer"));
    expect(await screen.findByTestId("invite-account-11")).toBeOnTheScreen();
    expect(screen.getByTestId("invite-account-12")).toBeOnTheScreen();
    expect(screen.queryByTestId("invite-account-13")).toBeNull();

    fireEvent.press(screen.getByText("Send invitation"));
    expect(await screen.findByText("Choose the customer account this buyer orders for.")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/invitations")).toHaveLength(0);

    fireEvent.press(screen.getByTestId("invite-account-11"));
    fireEvent.press(screen.getByText("Send invitation"));
    expect(await screen.findByTestId("invited-notice")).toHaveTextContent(/Invitation sent to cafe@tidewater\.test/);
    expect(app.getPathname()).toBe("/office/people");
    expect(api.callsTo("POST", "/api/invitations")[0].body).toEqual({ email: "cafe@tidewater.test", role: "buyer", accountId: 11 });
  });

  it("sends no account for staff roles", async () => {
    const api = mockApi(routes({ "POST /api/invitations": { status: 201, body: { invitation: invitationDto() } } }));
    renderApp("/office/people/invite");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "new.baker@hollowbrook.test");
    fireEvent.changeText(screen.getByLabelText("Name"), "Ada Baker");
    fireEvent.press(screen.getByTestId("invite-role-baker"));
    fireEvent.press(screen.getByText("Send invitation"));
    expect(await screen.findByTestId("invited-notice")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/invitations")[0].body).toEqual({ email: "new.baker@hollowbrook.test", role: "baker", name: "Ada Baker" });
  });

  it("shows the server's field error next to the e-mail", async () => {
    mockApi(
      routes({
        "POST /api/invitations": apiError(409, "user_exists", "There is already a sign-in for this e-mail.", { email: "There is already a sign-in for this e-mail." }),
      }),
    );
    renderApp("/office/people/invite");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "owner@hollowbrook.test");
    fireEvent.press(screen.getByTestId("invite-role-owner"));
    fireEvent.press(screen.getByText("Send invitation"));
    expect(await screen.findByTestId("invite-email-error")).toHaveTextContent(/already a sign-in/);
    expect(screen.queryByTestId("invite-error")).toBeNull();
  });

  it("shows other server errors at the top", async () => {
    mockApi(routes({ "POST /api/invitations": apiError(503, "mail_unavailable", "The invitation could not be e-mailed just now. Nothing was sent; try again in a minute.") }));
    renderApp("/office/people/invite");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "x@hollowbrook.test");
    fireEvent.press(screen.getByTestId("invite-role-bookkeeper"));
    fireEvent.press(screen.getByText("Send invitation"));
    expect(await screen.findByTestId("invite-error")).toHaveTextContent(/could not be e-mailed/);
  });
});
