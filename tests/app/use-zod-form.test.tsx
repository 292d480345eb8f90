/**
 * The one form hook (components/forms/useZodForm.ts): checked by the same zod schema as the server, the
 * server's field errors beside their fields, anything else on top, one submit at a time, dirty against
 * the last save. The schema here is the shared account schema the API parses.
 */
import { act, renderHook } from "@testing-library/react-native";
import { z } from "zod";
import { useZodForm, MANY_FIELDS_MESSAGE } from "../../components/forms/useZodForm";
import { ApiError } from "../../components/api/client";
import { accountInputSchema } from "../../shared/schemas/accounts";

const initial = { businessName: "", deliveryAddress: "", contactName: "", contactPhone: "", billingEmail: "", status: "active" as const, notes: "" };

test("a failed check shows each field's message and sends nothing", async () => {
  const { result } = renderHook(() => useZodForm({ schema: accountInputSchema, initial }));
  const send = jest.fn();
  let ok = true;
  await act(async () => {
    ok = await result.current.submit(send);
  });
  expect(ok).toBe(false);
  expect(send).not.toHaveBeenCalled();
  expect(result.current.errors.businessName).toBeTruthy();
  expect(result.current.errors.billingEmail).toBeTruthy();
  expect(result.current.formError).toBe(MANY_FIELDS_MESSAGE);
});

test("the parsed data is sent; saved and clean afterwards, dirty again after an edit and back", async () => {
  const { result } = renderHook(() => useZodForm({ schema: accountInputSchema, initial }));
  act(() => result.current.patch({ businessName: "  Tidewater Café ", deliveryAddress: "12 Pier Road", billingEmail: "ap@tidewater.test" }));
  expect(result.current.dirty).toBe(true);
  const send = jest.fn(async () => undefined);
  await act(async () => {
    await result.current.submit(send);
  });
  expect(send).toHaveBeenCalledTimes(1);
  expect((send.mock.calls[0] as unknown[])[0]).toMatchObject({ businessName: "Tidewater Café" });
  expect(result.current.saved).toBe(true);
  expect(result.current.dirty).toBe(false);
  act(() => result.current.setValue("notes", "Back door"));
  expect(result.current.saved).toBe(false);
  expect(result.current.dirty).toBe(true);
  act(() => result.current.setValue("notes", ""));
  expect(result.current.dirty).toBe(false);
});

test("a server error: named fields go beside them, others to the top", async () => {
  const { result } = renderHook(() => useZodForm({ schema: accountInputSchema, initial: { ...initial, businessName: "A", deliveryAddress: "B", billingEmail: "a@b.test" } }));
  const err = new ApiError(400, "validation_failed", "Check the highlighted fields.", { businessName: "Taken.", somethingElse: "Not on this form." });
  await act(async () => {
    await result.current.submit(async () => {
      throw err;
    });
  });
  expect(result.current.errors).toEqual({ businessName: "Taken." });
  expect(result.current.formError).toBe("Check the highlighted fields.");
  expect(result.current.saved).toBe(false);
});

test("one submit at a time", async () => {
  const { result } = renderHook(() => useZodForm({ schema: z.object({ n: z.string() }), initial: { n: "1" } }));
  let release: () => void = () => undefined;
  const send = jest.fn(() => new Promise<void>((r) => (release = r)));
  let second: Promise<boolean> = Promise.resolve(true);
  await act(async () => {
    const first = result.current.submit(send);
    second = result.current.submit(send);
    release();
    await first;
  });
  expect(await second).toBe(false);
  expect(send).toHaveBeenCalledTimes(1);
});

test("toInput turns text inputs into what the schema parses", async () => {
  const schema = z.object({ creditHoldDays: z.number().int().min(1, "At least 1 day.") });
  const { result } = renderHook(() => useZodForm({ schema, initial: { creditHoldDays: "0" }, toInput: (v) => ({ creditHoldDays: Number(v.creditHoldDays) }) }));
  await act(async () => {
    await result.current.submit(jest.fn());
  });
  expect(result.current.errors.creditHoldDays).toBe("At least 1 day.");
  expect(result.current.formError).toBeNull();
});

test("a check's message for a field the form does not show goes to the top", async () => {
  const schema = z.object({ token: z.string().min(1, "This link is missing its code."), password: z.string().min(3, "Too short.") });
  const { result } = renderHook(() => useZodForm({ schema, initial: { password: "" }, toInput: (v) => ({ ...v, token: "" }), fields: ["password"], manyMessage: null }));
  await act(async () => {
    await result.current.submit(jest.fn());
  });
  expect(result.current.errors.password).toBe("Too short.");
  expect(result.current.formError).toBe("This link is missing its code.");
});

test("fields may be a test: rows of a list keep their server errors beside them", async () => {
  const schema = z.object({ lines: z.array(z.object({ quantity: z.string() })) });
  const { result } = renderHook(() => useZodForm({ schema, initial: { lines: [{ quantity: "1" }] }, fields: (name) => name === "lines" || name.startsWith("lines.") }));
  const err = new ApiError(400, "validation_failed", "Check the highlighted fields.", { "lines.0.quantity": "At least 1." });
  await act(async () => {
    await result.current.submit(async () => {
      throw err;
    });
  });
  expect(result.current.errors).toEqual({ "lines.0.quantity": "At least 1." });
  expect(result.current.formError).toBeNull();
});

test("errorMessage words a rejected request's top message; setErrors and a reset keeping saved", async () => {
  const schema = z.object({ role: z.string() });
  const { result } = renderHook(() => useZodForm({ schema, initial: { role: "owner" }, errorMessage: (e) => (e instanceof ApiError && e.code === "last_owner" ? "Make someone else an owner first." : "Other.") }));
  await act(async () => {
    await result.current.submit(async () => {
      throw new ApiError(409, "last_owner", "");
    });
  });
  expect(result.current.formError).toBe("Make someone else an owner first.");
  act(() => result.current.setErrors({ role: "Choose a role." }));
  expect(result.current.errors.role).toBe("Choose a role.");
  await act(async () => {
    await result.current.submit(async () => undefined);
  });
  expect(result.current.saved).toBe(true);
  act(() => result.current.reset({ role: "baker" }, { keepSaved: true }));
  expect(result.current.saved).toBe(true);
  expect(result.current.dirty).toBe(false);
  act(() => result.current.reset({ role: "owner" }));
  expect(result.current.saved).toBe(false);
});
