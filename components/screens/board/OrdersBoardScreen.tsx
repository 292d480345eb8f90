import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { QueryStates } from "../../ui/QueryStates";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { useBoardQuery } from "../../api/board";
import { cleanDate, formatDay, formatDayLong, relativeDay } from "../../ordering/dates";
import { BoardView } from "./BoardView";
import { DateSwitcher } from "./DateSwitcher";
import { OfficeActions } from "./OfficeActions";

export interface OrdersBoardProps {
  /** Office: money, CSV export (owner, bookkeeper) and the owner's "make standing orders now". Baker: quantities only. */
  mode: "office" | "baker";
  /** YYYY-MM-DD from the address (?date=); the bakery's today when absent. */
  date?: string;
}

/** The orders board for a delivery date: what to bake in total, and who gets what. */
export function OrdersBoardScreen({ mode, date: asked }: OrdersBoardProps) {
  const user = useSignedInUser();
  const router = useRouter();
  const bakery = useBakeryQuery();
  const today = bakery.data?.today;
  const date = (asked && cleanDate(asked)) || today || null;
  const board = useBoardQuery(date);
  const isOwner = user.role === "owner";
  const office = mode === "office";

  const go = (d: string) => router.setParams({ date: d });

  return (
    <Screen testID="board-screen">
      <PageHeader
        overline={office ? "Orders board" : "What to bake"}
        title={date ? formatDayLong(date) : "Orders"}
        subtitle={date && today && relativeDay(date, today) ? `${relativeDay(date, today)}'s deliveries` : "Deliveries for this date"}
        testID="board-title"
      />
      {date ? <DateSwitcher date={date} today={today} onChange={go} /> : null}
      {office && date ? <OfficeActions date={date} isOwner={isOwner} /> : null}
      {date ? (
        <QueryStates
          query={board}
          loadingLabel="Loading the orders…"
          errorTitle="The orders didn't load"
          testID="board"
          isEmpty={(b) => b.rows.length === 0}
          empty={{ icon: "clipboard", title: `No orders for ${formatDay(date)}`, message: "Orders placed for this date show here as they come in." }}
        >
          {(b) => <BoardView board={b} showMoney={office} />}
        </QueryStates>
      ) : (
        <QueryStates query={bakery} loadingLabel="Loading the bakery's day…" errorTestID="board-error">
          {() => null /* with the bakery's day known, the date is its today */}
        </QueryStates>
      )}
    </Screen>
  );
}

