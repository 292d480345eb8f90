import React from "react";
import { Badge, type BadgeTone } from "../../ui/Badge";
import { ORDER_STATUS_LABELS, type OrderStatus } from "../../../shared/schemas/orders";

const ORDER_TONE: Record<OrderStatus, BadgeTone> = { open: "sage", locked: "neutral", delivered: "neutral", cancelled: "danger" };
const BUYER_STATUS_LABEL: Record<OrderStatus, string> = { open: "Order placed", locked: ORDER_STATUS_LABELS.locked, delivered: ORDER_STATUS_LABELS.delivered, cancelled: ORDER_STATUS_LABELS.cancelled };

/** The words the buyer reads for an order's status (the badge's label), for a screen reader too. */
export const buyerStatusLabel = (status: string): string => BUYER_STATUS_LABEL[(status in ORDER_TONE ? status : "open") as OrderStatus];

export function OrderStatusBadge({ status, testID }: { status: string; testID?: string }) {
  const s = (status in ORDER_TONE ? status : "open") as OrderStatus;
  return <Badge label={buyerStatusLabel(s)} tone={ORDER_TONE[s]} testID={testID} />;
}
