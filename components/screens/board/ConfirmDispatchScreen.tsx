import React from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { QueryStates } from "../../ui/QueryStates";
import { useBakeryQuery } from "../../api/bakery";
import { useBoardQuery } from "../../api/board";
import { cleanDate, formatDay, formatDayLong } from "../../ordering/dates";
import { DispatchForm } from "./DispatchForm";

/**
 * Confirm what went out on a delivery date (owner): every waiting order becomes delivered, a line that
 * went short says how many left and why (it becomes a credit), and card accounts are invoiced at once.
 */
export function ConfirmDispatchScreen({ date: asked }: { date?: string }) {
  const bakery = useBakeryQuery();
  const date = (asked && cleanDate(asked)) || bakery.data?.today || null;
  const board = useBoardQuery(date);

  return (
    <Screen testID="dispatch-screen">
      <TextLink href={date ? `/office/orders?date=${date}` : "/office/orders"} label="‹ Orders board" testID="dispatch-back" />
      <PageHeader overline="Record deliveries" title={date ? formatDayLong(date) : "Deliveries"} subtitle="Record what went out on the vans: each order is marked delivered. Note any line that went out short: the account is credited for it." testID="dispatch-title" />
      {date ? (
        <QueryStates
          query={board}
          loadingLabel="Loading the orders…"
          errorTitle="The orders didn't load"
          testID="dispatch"
          isEmpty={(b) => b.rows.length === 0}
          empty={{ icon: "truck", title: `No orders for ${formatDay(date)}`, message: "There is nothing to dispatch on this date." }}
        >
          {(b) => <DispatchForm key={date} date={date} board={b} />}
        </QueryStates>
      ) : (
        <QueryStates query={bakery} loadingLabel="Loading the bakery's day…" errorTestID="dispatch-error">
          {() => null /* with the bakery's day known, the date is its today */}
        </QueryStates>
      )}
    </Screen>
  );
}
