import { useRef, useState } from "react";
import { useCancelOrderMutation, useCreateOrderMutation, useUpdateOrderMutation } from "../api/orders";
import { ApiError } from "../api/client";
import type { ZodForm } from "../forms/useZodForm";
import { quantityText } from "../../shared/quantity";
import type { CalendarDayDto } from "../../shared/schemas/calendar";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { OrderDto } from "../../shared/schemas/orders";
import { formatDay, formatDayLong } from "./dates";
import { createInput, saveFailure, updateInput, type OrderValues, type SentLine } from "./draft";
import { IdempotencyKeeper } from "./idempotency";
import type { DeviceDraft } from "./useDeviceDraft";

export type OrderNotice = { text: string; tone: "success" | "info" };

export interface OrderSubmitOptions {
  form: ZodForm<OrderValues, unknown>;
  date: string;
  day: CalendarDayDto;
  products: readonly ProductDto[];
  /** The saved order being changed (null: placing a new one). */
  existing: OrderDto | null;
  deviceDraft: DeviceDraft;
  money: (cents: number) => string;
  now: number;
  onNotice: (notice: OrderNotice | null) => void;
  /** The server already has an order for this date (another device, or the bakery). */
  onExists: () => void;
}

export interface OrderSubmit {
  /** Send these lines with the form's PO number and note: POST for a new order, PATCH for a saved one. */
  submit: (lines: SentLine[]) => Promise<void>;
  /** Cancel the saved order; resolves false when that failed. */
  cancel: () => Promise<boolean>;
  /** The server's messages for product lines, by product id (cleared as the line is changed). */
  lineErrors: Record<number, string>;
  clearLineError: (productId: number) => void;
  /** The server's words when it refused because ordering has closed. */
  serverClosed: string | null;
  /** The order was placed: the page is about to show the saved order; no second submission meanwhile. */
  placed: boolean;
  saving: boolean;
  cancelling: boolean;
}

const closedCodes = (err: unknown): err is ApiError => err instanceof ApiError && (err.code === "cutoff_passed" || err.code === "order_closed");

/**
 * Saving and canceling one date's order: one Idempotency-Key per attempt at placing it (a retry of the same
 * order reuses it), the device-kept draft when nothing reached the bakery, and the server's answer split into
 * the closed date, line errors, PO number and note errors (through the form) and the top message.
 */
export function useOrderSubmit({ form, date, day, products, existing, deviceDraft, money, now, onNotice, onExists }: OrderSubmitOptions): OrderSubmit {
  const create = useCreateOrderMutation();
  const update = useUpdateOrderMutation(existing?.id ?? 0);
  const cancelMutation = useCancelOrderMutation(existing?.id ?? 0);
  const keeper = useRef(new IdempotencyKeeper()).current;
  const [lineErrors, setLineErrors] = useState<Record<number, string>>({});
  const [serverClosed, setServerClosed] = useState<string | null>(null);
  const [placed, setPlaced] = useState(false);

  const send = async (lines: SentLine[]) => {
    const values = form.values;
    if (existing) {
      const o = await update.mutateAsync(updateInput(lines, values));
      deviceDraft.drop();
      onNotice({ text: `Changes saved. Your order for ${formatDay(date)} is now ${money(o.totalCents)}.`, tone: "success" });
      return;
    }
    const input = createInput(date, lines, values);
    const o = await create.mutateAsync({ input, idempotencyKey: keeper.keyFor(input) });
    keeper.reset();
    deviceDraft.drop();
    setPlaced(true);
    onNotice({ text: `Order placed for ${formatDayLong(date)}: ${o.lines.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ")}, ${money(o.totalCents)}.`, tone: "success" });
  };

  /** After the form has put PO number and note errors beside their fields: what else the failure means. */
  const failed = (err: unknown, lines: SentLine[]) => {
    if (!(err instanceof ApiError)) return;
    const failure = saveFailure(err, { sent: lines, products, isNew: !existing, day, now });
    switch (failure.kind) {
      case "transient":
        deviceDraft.keep(form.values);
        form.setFormError(failure.message);
        return;
      case "closed":
        setServerClosed(failure.message);
        form.setFormError(null);
        return;
      case "notice":
        form.setFormError(failure.message);
        return;
      case "exists":
        form.setFormError(null);
        onExists();
        return;
      case "fields":
        setLineErrors(failure.lineErrors);
        form.setFormError(failure.formError);
        return;
      case "other":
        return;
    }
  };

  const submit = async (lines: SentLine[]) => {
    setLineErrors({});
    onNotice(null);
    let failure: unknown = null;
    const ok = await form.submit(async () => {
      try {
        await send(lines);
      } catch (err) {
        failure = err;
        throw err;
      }
    });
    if (!ok && failure) failed(failure, lines);
  };

  const cancel = async (): Promise<boolean> => {
    form.setFormError(null);
    try {
      await cancelMutation.mutateAsync();
    } catch (err) {
      if (closedCodes(err)) setServerClosed(err.message);
      else form.fail(err);
      return false;
    }
    deviceDraft.drop();
    onNotice({ text: `Your order for ${formatDayLong(date)} is canceled. You can still order for this date until the cut-off.`, tone: "info" });
    return true;
  };

  return {
    submit,
    cancel,
    lineErrors,
    clearLineError: (productId) =>
      setLineErrors((e) => {
        if (!e[productId]) return e;
        const { [productId]: _dropped, ...rest } = e;
        return rest;
      }),
    serverClosed,
    placed,
    saving: create.isPending || update.isPending,
    cancelling: cancelMutation.isPending,
  };
}
