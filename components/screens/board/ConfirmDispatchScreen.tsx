import React from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { formatDayLong } from "../../ordering/dates";
import { BoardStates, useBoardDate } from "./BoardStates";
import { DispatchForm } from "./DispatchForm";

/**
 * Confirm what went out on a delivery date (owner): every waiting order becomes delivered, a line that
 * went short says how many left and why (it becomes a credit), and card accounts are invoiced at once.
 */
export function ConfirmDispatchScreen({ date: asked }: { date?: string }) {
  const loaded = useBoardDate(asked);
  const { date } = loaded;

  return (
    <Screen testID="dispatch-screen">
      <TextLink href={date ? `/office/orders?date=${date}` : "/office/orders"} label="‹ Orders board" testID="dispatch-back" />
      <PageHeader overline="Record deliveries" title={date ? formatDayLong(date) : "Deliveries"} subtitle="Record what went out on the vans: each order is marked delivered. Note any line that went out short: the account is credited for it." testID="dispatch-title" />
      <BoardStates loaded={loaded} testID="dispatch" empty={{ icon: "truck", message: "There is nothing to dispatch on this date." }}>
        {(b, d) => <DispatchForm key={d} date={d} board={b} />}
      </BoardStates>
    </Screen>
  );
}
