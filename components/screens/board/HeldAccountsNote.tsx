import React from "react";
import { Notice } from "../../ui/FormError";
import type { BoardHeldDto } from "../../../shared/contracts/board";

/** One sentence per held account: which standing order is not made for this date, and why. */
export function heldAccountText(h: BoardHeldDto): string {
  return h.hold === "credit"
    ? `${h.accountName} is on credit hold (overdue invoices): its standing order is not made for this date unless they are paid before the cut-off.`
    : `${h.accountName} is paused by the bakery: its standing order is not made for this date until the account is started again.`;
}

/** The accounts a board leaves out because they are on hold, so nobody wonders where a regular went. */
export function HeldAccountsNote({ held }: { held: BoardHeldDto[] | undefined }) {
  if (!held?.length) return null;
  return <Notice tone="info" message={held.map(heldAccountText).join(" ")} testID="board-held" />;
}
