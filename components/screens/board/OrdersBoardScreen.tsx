import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { useSignedInUser } from "../../auth/useAuth";
import { formatDayLong, relativeDay } from "../../ordering/dates";
import { BoardStates, useBoardDate } from "./BoardStates";
import { BoardView } from "./BoardView";
import { DateSwitcher } from "./DateSwitcher";
import { OfficeActions } from "./OfficeActions";
import { HeldAccountsNote } from "./HeldAccountsNote";

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
  const loaded = useBoardDate(asked);
  const { today, date } = loaded;
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
      <HeldAccountsNote held={loaded.board.data?.held} />
      <BoardStates loaded={loaded} testID="board" empty={{ icon: "clipboard", message: "Orders placed for this date show here as they come in." }}>
        {(b) => <BoardView board={b} showMoney={office} />}
      </BoardStates>
    </Screen>
  );
}

