import React from "react";
import { QueryStates } from "../../ui/QueryStates";
import type { EmptyStateProps } from "../../ui/States";
import { useBakeryQuery } from "../../api/bakery";
import { useBoardQuery, type BoardDto } from "../../api/board";
import { cleanDate, formatDay } from "../../ordering/dates";

/** The date a board screen shows (?date=, else the bakery's today once known) and its board. */
export function useBoardDate(asked: string | undefined) {
  const bakery = useBakeryQuery();
  const date = (asked && cleanDate(asked)) || bakery.data?.today || null;
  return { bakery, today: bakery.data?.today, date, board: useBoardQuery(date) };
}

export interface BoardStatesProps {
  loaded: ReturnType<typeof useBoardDate>;
  /** Prefix of the states' testIDs ("<testID>-loading", "-error", "-empty"). */
  testID: string;
  /** Shown when the date has no orders ("No orders for <date>" is its title). */
  empty: Omit<EmptyStateProps, "title" | "testID">;
  children: (board: BoardDto, date: string) => React.ReactNode;
}

/** Loading the bakery's day, then the date's orders (or why not, or that there are none), then the board. */
export function BoardStates({ loaded: { bakery, date, board }, testID, empty, children }: BoardStatesProps) {
  if (!date) {
    return (
      <QueryStates query={bakery} loadingLabel="Loading the bakery's day…" errorTestID={`${testID}-error`}>
        {() => null /* with the bakery's day known, the date is its today */}
      </QueryStates>
    );
  }
  return (
    <QueryStates
      query={board}
      loadingLabel="Loading the orders…"
      errorTitle="The orders didn't load"
      testID={testID}
      isEmpty={(b) => b.rows.length === 0}
      empty={{ ...empty, title: `No orders for ${formatDay(date)}` }}
    >
      {(b) => children(b, date)}
    </QueryStates>
  );
}
