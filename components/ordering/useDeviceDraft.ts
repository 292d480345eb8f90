import { useState } from "react";
import type { OrderDto } from "../../shared/schemas/orders";
import { clearDraft, draftMatches, readDraft, writeDraft, type DraftOwner, type OrderDraft } from "./deviceDraft";
import { orderValues, type OrderValues } from "./draft";

/** A draft kept on this device for the date, unless it says what the bakery already has (then it is dropped). */
function restorableDraft(owner: DraftOwner | null, date: string, existing: OrderDto | null, closed: boolean): OrderDraft | null {
  if (!owner) return null;
  const draft = readDraft(owner, date);
  if (!draft) return null;
  const saved = orderValues(existing);
  if (closed || (existing && draftMatches(draft, saved.quantities, saved.poNumber, saved.note))) {
    clearDraft(owner, date);
    return null;
  }
  return draft;
}

export interface DeviceDraft {
  /** The order kept on this device that the form starts from (it didn't reach the bakery), or null. */
  restored: OrderDraft | null;
  /** Keep these values on the device (a save that didn't get through). */
  keep: (values: OrderValues) => void;
  /** The order was saved or canceled: nothing left to keep. */
  drop: () => void;
}

/** The device-kept draft of one date's order, read once when the form opens (closed dates drop it). */
export function useDeviceDraft(owner: DraftOwner | null, date: string, existing: OrderDto | null, closed: boolean): DeviceDraft {
  const [restored, setRestored] = useState(() => restorableDraft(owner, date, existing, closed));
  return {
    restored,
    keep: (values) => {
      if (owner) writeDraft(owner, date, { quantities: values.quantities, poNumber: values.poNumber, note: values.note, orderId: existing?.id ?? null });
    },
    drop: () => {
      if (owner) clearDraft(owner, date);
      setRestored(null);
    },
  };
}
