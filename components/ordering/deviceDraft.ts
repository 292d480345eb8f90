import { sessionStore, type KeyValueStore } from "../auth/storage";

/**
 * An order the buyer could not save (Panwise briefly unavailable, or the connection dropped), kept on this
 * device — localStorage on the web, memory elsewhere — per user, account and delivery date, so that leaving the
 * screen loses nothing. It is put back when the date is opened again and removed once the order is saved.
 */
export interface OrderDraft {
  /** Quantities as typed, by product id. */
  quantities: Record<number, string>;
  poNumber: string;
  note: string;
  /** The order it changes (null: a new order). */
  orderId: number | null;
  /** When it was kept (ISO 8601). */
  savedAt: string;
}

const PREFIX = "panwise.order-draft.v1.";
/** Drafts older than this are dropped when another is kept: the date has long passed its cut-off. */
const KEEP_MS = 30 * 24 * 60 * 60 * 1000;

export interface DraftOwner {
  userId: number;
  accountId: number;
}

export const draftKey = (owner: DraftOwner, date: string) => `${PREFIX}${owner.userId}.${owner.accountId}.${date}`;

function store(): KeyValueStore {
  return sessionStore();
}

function parseDraft(raw: string | null): OrderDraft | null {
  if (!raw) return null;
  try {
    const d = JSON.parse(raw) as Partial<OrderDraft>;
    if (!d || typeof d !== "object" || typeof d.quantities !== "object" || d.quantities === null) return null;
    const quantities: Record<number, string> = {};
    for (const [k, v] of Object.entries(d.quantities)) {
      if (/^\d+$/.test(k) && typeof v === "string" && v.length <= 6) quantities[Number(k)] = v;
    }
    return {
      quantities,
      poNumber: typeof d.poNumber === "string" ? d.poNumber.slice(0, 40) : "",
      note: typeof d.note === "string" ? d.note.slice(0, 500) : "",
      orderId: typeof d.orderId === "number" ? d.orderId : null,
      savedAt: typeof d.savedAt === "string" ? d.savedAt : new Date(0).toISOString(),
    };
  } catch {
    return null;
  }
}

export function readDraft(owner: DraftOwner, date: string): OrderDraft | null {
  try {
    return parseDraft(store().getItem(draftKey(owner, date)));
  } catch {
    return null;
  }
}

/** Drop kept drafts past KEEP_MS (only the web store can be listed; memory ones go with the page). */
function prune(now: number) {
  const ls = (globalThis as { localStorage?: Storage }).localStorage;
  if (!ls || store() !== ls) return;
  const stale: string[] = [];
  for (let i = 0; i < ls.length; i++) {
    const key = ls.key(i);
    if (!key?.startsWith(PREFIX)) continue;
    const d = parseDraft(ls.getItem(key));
    if (!d || now - Date.parse(d.savedAt) > KEEP_MS) stale.push(key);
  }
  stale.forEach((k) => ls.removeItem(k));
}

export function writeDraft(owner: DraftOwner, date: string, draft: Omit<OrderDraft, "savedAt">, now = Date.now()): void {
  try {
    prune(now);
    store().setItem(draftKey(owner, date), JSON.stringify({ ...draft, savedAt: new Date(now).toISOString() }));
  } catch {
    // Storage full or refused: the form still holds the order while the screen is open.
  }
}

export function clearDraft(owner: DraftOwner, date: string): void {
  try {
    store().removeItem(draftKey(owner, date));
  } catch {
    // Nothing to clear.
  }
}

/** Does the draft say the same as what the bakery has (so there is nothing left to send)? */
export function draftMatches(draft: OrderDraft, quantities: Record<number, string>, poNumber: string, note: string): boolean {
  const norm = (q: Record<number, string>) =>
    JSON.stringify(
      Object.entries(q)
        .map(([k, v]) => [Number(k), Number(v.trim() || "0")] as const)
        .filter(([, v]) => v > 0)
        .sort((a, b) => a[0] - b[0]),
    );
  return norm(draft.quantities) === norm(quantities) && draft.poNumber.trim() === poNumber.trim() && draft.note.trim() === note.trim();
}
