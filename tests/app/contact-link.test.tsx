import { Linking } from "react-native";
import { fireEvent, render, screen } from "@testing-library/react-native";
import { ContactLink, contactUrl } from "../../components/ui/ContactLink";

// URL forms: RFC 3966 (tel: — visual separators such as spaces, dots, dashes and brackets are dropped, a leading
// + kept) and RFC 6068 (mailto:). Issue 12, contact.
describe("contactUrl", () => {
  it.each([
    ["(312) 555-0142", "tel:3125550142"],
    ["+1 312.555.0142", "tel:+13125550142"],
    ["+44 20 7946 0958", "tel:+442079460958"],
  ])("phone %p → %p", (value, url) => expect(contactUrl("phone", value)).toBe(url));

  it("e-mail addresses become mailto:, anything else no link", () => {
    expect(contactUrl("email", "orders@hollowbrook.test")).toBe("mailto:orders@hollowbrook.test");
    expect(contactUrl("email", "not an address")).toBeNull();
    expect(contactUrl("phone", "ask at the counter")).toBeNull();
  });
});

describe("ContactLink", () => {
  it("opens the phone app when tapped, and reads Not given when empty", () => {
    const open = jest.spyOn(Linking, "openURL").mockResolvedValue(true);
    render(<ContactLink kind="phone" value="(312) 555-0142" testID="phone" />);
    expect(screen.getByRole("link")).toHaveTextContent("(312) 555-0142");
    fireEvent.press(screen.getByTestId("phone-link"));
    expect(open).toHaveBeenCalledWith("tel:3125550142");
    screen.unmount();
    render(<ContactLink kind="email" value="" testID="mail" />);
    expect(screen.getByTestId("mail")).toHaveTextContent("Not given");
    expect(screen.queryByRole("link")).toBeNull();
  });
});
