import { accountInputSchema } from "../../shared/schemas/accounts";
import { invitationAcceptSchema, signInSchema } from "../../shared/schemas/auth";
import { invitationCreateSchema } from "../../shared/schemas/users";
import { fieldErrorsFrom, PASSWORD_MIN_LENGTH } from "../../shared/schemas/common";
import { homeAreaFor } from "../../shared/roles";

describe("shared schemas (used by the server and the forms)", () => {
  it("normalises e-mail addresses to lower case and trims them", () => {
    expect(signInSchema.parse({ email: "  Owner@Hollowbrook.TEST ", password: "x" }).email).toBe("owner@hollowbrook.test");
  });

  it("requires passwords of at least 10 characters", () => {
    expect(PASSWORD_MIN_LENGTH).toBe(10);
    const r = invitationAcceptSchema.safeParse({ token: "abcdefghijkl", password: "123456789", name: "A" });
    expect(r.success).toBe(false);
    if (!r.success) expect(fieldErrorsFrom(r.error)).toEqual({ password: "Use at least 10 characters." });
    expect(invitationAcceptSchema.safeParse({ token: "abcdefghijkl", password: "1234567890", name: "A" }).success).toBe(true);
  });

  it("ties buyers, and only buyers, to an account", () => {
    expect(invitationCreateSchema.safeParse({ email: "a@b.test", role: "buyer" }).success).toBe(false);
    expect(invitationCreateSchema.safeParse({ email: "a@b.test", role: "buyer", accountId: 3 }).success).toBe(true);
    expect(invitationCreateSchema.safeParse({ email: "a@b.test", role: "baker", accountId: 3 }).success).toBe(false);
  });

  it("keys field errors by path", () => {
    const r = accountInputSchema.safeParse({ businessName: "", deliveryAddress: "x", billingEmail: "bad" });
    expect(r.success).toBe(false);
    if (!r.success) expect(Object.keys(fieldErrorsFrom(r.error)).sort()).toEqual(["billingEmail", "businessName"]);
  });

  it("sends each role to its own home area", () => {
    expect([homeAreaFor("buyer"), homeAreaFor("baker"), homeAreaFor("owner"), homeAreaFor("bookkeeper")]).toEqual(["buyer", "baker", "office", "office"]);
  });
});
