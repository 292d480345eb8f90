import { z } from "zod";
import { accountInputSchema } from "../../shared/schemas/accounts";
import { invitationAcceptSchema, signInSchema } from "../../shared/schemas/auth";
import { invitationCreateSchema } from "../../shared/schemas/users";
import { fieldErrorsFrom, isRepetitiveOrSequential, passwordLength, PASSWORD_MIN_LENGTH, PASSWORD_PATTERN } from "../../shared/schemas/common";
import { homeAreaFor } from "../../shared/roles";

describe("shared schemas (used by the server and the forms)", () => {
  it("normalises e-mail addresses to lower case and trims them", () => {
    expect(signInSchema.parse({ email: "  Owner@Hollowbrook.TEST ", password: "x" }).email).toBe("owner@hollowbrook.test");
  });

  it("follows OWASP ASVS 4.0.3 V2.1 for new passwords: 12 to 128 characters, runs of spaces count once, no repeats or runs", () => {
    expect(PASSWORD_MIN_LENGTH).toBe(12); // V2.1.1
    const passwordError = (password: string) => {
      const r = invitationAcceptSchema.safeParse({ token: "abcdefghijkl", password, name: "A" });
      return r.success ? null : fieldErrorsFrom(r.error).password ?? null;
    };
    expect(passwordError("12345678901")).toBe("Use at least 12 characters.");
    expect(passwordError("aaaaaaaaaa")).toBe("Use at least 12 characters.");
    expect(passwordError(" ".repeat(10))).toBe("Use at least 12 characters.");
    expect(passwordError("rye  and  oat")).toBe("Use at least 12 characters."); // 13 typed, 11 once spaces are combined
    expect(passwordError("aaaaaaaaaaaa")).toBe(PASSWORD_PATTERN); // NIST SP 800-63B §5.1.1.2
    expect(passwordError("abababababab")).toBe(PASSWORD_PATTERN);
    expect(passwordError("123456789012")).toBe(PASSWORD_PATTERN);
    expect(passwordError("zyxwvutsrqpo")).toBe(PASSWORD_PATTERN);
    expect(passwordError("x".repeat(129))).toBe("Use at most 128 characters."); // V2.1.2
    expect(passwordError("rye and oats")).toBeNull();
    expect(passwordError("panwise-demo")).toBeNull(); // the demo password
    expect(passwordError("pão de queijo 🧀")).toBeNull(); // any Unicode (V2.1.4), no composition rules (V2.1.9)
    expect(passwordError("q".repeat(64) + "r".repeat(64))).toBeNull();
    expect(passwordLength("a  b   c")).toBe(5);
    expect(isRepetitiveOrSequential("correct horse battery")).toBe(false);
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

describe("zod 4 messages (the schemas' own words survive the upgrade from zod 3)", () => {
  const errorsOf = (schema: { safeParse: (v: unknown) => { success: boolean; error?: unknown } }, value: unknown) => {
    const r = schema.safeParse(value);
    return r.success ? {} : fieldErrorsFrom(r.error as never);
  };
  it("a missing field with its own message says it; one without says \"Required.\"", () => {
    expect(errorsOf(signInSchema, { password: "x" }).email).toBe("Enter an e-mail address.");
    expect(errorsOf(signInSchema, { email: 5, password: "x" }).email).toBe("Enter an e-mail address.");
    expect(errorsOf(invitationAcceptSchema, { password: "correct horse battery staple", name: "A" }).token).toBe("The link is missing its token.");
    expect(errorsOf(z.object({ note: z.string() }), {}).note).toBe("Required.");
  });
  it("enum messages given as the schema's error (zod 3's errorMap) still read as written", () => {
    expect(errorsOf(invitationCreateSchema, { email: "a@b.test", role: "chef" }).role).toBe("Choose one of: owner, baker, bookkeeper, buyer.");
    expect(errorsOf(accountInputSchema, { businessName: "A", deliveryAddress: "B", billingEmail: "a@b.test", status: "sleeping" }).status).toBe("Choose active, on hold or closed.");
  });
});
