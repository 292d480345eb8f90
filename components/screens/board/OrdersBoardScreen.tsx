import React, { useState } from "react";
import { Pressable, ScrollView, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { AppText, Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { downloadBoardCsv, useBoardQuery, type BoardDto } from "../../api/board";
import { useMaterialiseMutation } from "../../api/standing";
import { messageOf } from "../../api/client";
import { addDays, cleanDate, formatDay, formatDayLong, relativeDay } from "../../ordering/dates";
import { OrderStatusBadge, useMoney } from "../ordering/parts";
import { useIsWide } from "../../shell/useIsWide";
import { productsLabel } from "../../ordering/quantities";
import { quantityText, saleUnitFor } from "../../../shared/quantity";
import { colors, layout, radii, space } from "../../theme";

export interface OrdersBoardProps {
  /** Office: money, CSV export (owner, bookkeeper) and the owner's "make standing orders now". Baker: quantities only. */
  mode: "office" | "baker";
  /** YYYY-MM-DD from the address (?date=); the bakery's today when absent. */
  date?: string;
}

/** "3 orders" / "1 order". */
export const ordersLabel = (n: number) => (n === 1 ? "1 order" : `${n} orders`);

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
      {!date ? (
        bakery.isError ? (
          <ErrorState error={bakery.error} onRetry={() => bakery.refetch()} retrying={bakery.isFetching} testID="board-error" />
        ) : (
          <LoadingState label="Loading the bakery's day…" />
        )
      ) : board.isPending ? (
        <LoadingState label="Loading the orders…" testID="board-loading" />
      ) : board.isError ? (
        <ErrorState error={board.error} title="The orders didn't load" onRetry={() => board.refetch()} retrying={board.isFetching} testID="board-error" />
      ) : board.data.rows.length === 0 ? (
        <EmptyState icon="clipboard" title={`No orders for ${formatDay(date)}`} message="Orders placed for this date show here as they come in." testID="board-empty" />
      ) : (
        <BoardView board={board.data} showMoney={office} />
      )}
    </Screen>
  );
}

function DateSwitcher({ date, today, onChange }: { date: string; today?: string; onChange: (d: string) => void }) {
  return (
    <View style={styles.switcher} testID="board-date-switcher">
      <View style={styles.stepper}>
        <IconButton icon="chevron-left" label={`Previous day, ${formatDay(addDays(date, -1))}`} onPress={() => onChange(addDays(date, -1))} testID="board-prev" />
        <View style={styles.switcherDate}>
          <AppText variant="bodyStrong" align="center" testID="board-date">
            {formatDay(date)}
          </AppText>
        </View>
        <IconButton icon="chevron-right" label={`Next day, ${formatDay(addDays(date, 1))}`} onPress={() => onChange(addDays(date, 1))} testID="board-next" />
      </View>
      {today ? (
        <View style={styles.quick}>
          <Button label="Today" small variant={date === today ? "accent" : "secondary"} onPress={() => onChange(today)} testID="board-today" />
          <Button label="Tomorrow" small variant={date === addDays(today, 1) ? "accent" : "secondary"} onPress={() => onChange(addDays(today, 1))} testID="board-tomorrow" />
        </View>
      ) : null}
    </View>
  );
}

function IconButton({ icon, label, onPress, testID }: { icon: "chevron-left" | "chevron-right"; label: string; onPress: () => void; testID: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} testID={testID} style={({ pressed }) => [styles.iconButton, pressed && styles.iconPressed]}>
      <Feather name={icon} size={22} color={colors.ink} />
    </Pressable>
  );
}

function OfficeActions({ date, isOwner }: { date: string; isOwner: boolean }) {
  const materialise = useMaterialiseMutation();
  const [csvBusy, setCsvBusy] = useState(false);
  const [csvError, setCsvError] = useState<string | null>(null);
  const csv = async () => {
    setCsvError(null);
    setCsvBusy(true);
    try {
      await downloadBoardCsv(date);
    } catch (err) {
      setCsvError(messageOf(err));
    } finally {
      setCsvBusy(false);
    }
  };
  const r = materialise.data;
  return (
    <View style={styles.actionsWrap}>
      <View style={styles.actions}>
        <Button label="Download CSV" icon="download" variant="secondary" busy={csvBusy} onPress={csv} testID="board-csv" />
        {isOwner ? (
          <Button label="Make standing orders now" icon="repeat" variant="secondary" busy={materialise.isPending} onPress={() => materialise.mutate()} testID="materialise" />
        ) : null}
        {isOwner ? <LinkButton href={`/office/dispatch?date=${date}`} label="Record deliveries" icon="truck" variant="secondary" testID="board-confirm-dispatch" /> : null}
      </View>
      <FormError message={csvError} testID="board-csv-error" />
      <FormError message={materialise.isError ? messageOf(materialise.error) : null} testID="materialise-error" />
      {r ? (
        <Notice
          testID="materialise-result"
          message={
            r.created + r.updated + r.cancelled === 0
              ? "Standing orders checked: every order was already up to date."
              : `Standing orders made: ${r.created} new, ${r.updated} updated, ${r.cancelled} canceled.`
          }
        />
      ) : null}
    </View>
  );
}

function BoardView({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const wide = useIsWide();
  const money = useMoney();
  return (
    <>
      <Card title="To bake in total" testID="board-totals">
        <View style={styles.tiles}>
          {board.products.map((p) => (
            <View key={p.id} style={styles.tile} testID={`board-total-${p.id}`} accessible accessibilityLabel={`${p.name}: ${quantityText(p.total, p)}`}>
              <AppText variant="display" style={styles.big}>
                {String(p.total)}
              </AppText>
              <AppText variant="bodyStrong">{p.name}</AppText>
              <AppText variant="small" color="muted">
                {saleUnitFor(p.total, p)}
              </AppText>
            </View>
          ))}
        </View>
        <AppText color="muted" testID="board-grand-total">
          {`${ordersLabel(board.rows.length)} · ${productsLabel(board.products.length)}${showMoney ? ` · ${money(board.totalCents)}` : ""}`}
        </AppText>
      </Card>
      <Heading level={2}>By account</Heading>
      {wide ? <BoardTable board={board} showMoney={showMoney} /> : <BoardCards board={board} showMoney={showMoney} />}
    </>
  );
}

const ACCOUNT_W = 200;
const STATUS_W = 150;
const PO_W = 110;
const QTY_W = 96;
const TOTAL_W = 110;

function BoardTable({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  return (
    <ScrollView horizontal style={styles.tableScroll} contentContainerStyle={styles.tableContent}>
      <View style={styles.table} testID="board-table" role="table">
        <View style={[styles.tr, styles.th]} role="row">
          <Cell w={ACCOUNT_W} header>
            Account
          </Cell>
          <Cell w={STATUS_W} header>
            Status
          </Cell>
          <Cell w={PO_W} header>
            PO
          </Cell>
          {board.products.map((p) => (
            <Cell key={p.id} w={QTY_W} header right>
              {p.name}
            </Cell>
          ))}
          {showMoney ? (
            <Cell w={TOTAL_W} header right>
              Total
            </Cell>
          ) : null}
        </View>
        {board.rows.map((r) => (
          <View key={r.orderId} style={[styles.tr, styles.divider]} role="row" testID={`board-row-${r.orderId}`}>
            <Cell w={ACCOUNT_W} strong>
              {r.accountName}
            </Cell>
            <View style={[styles.td, { width: STATUS_W }]} role="cell">
              <OrderStatusBadge status={r.status} />
            </View>
            <Cell w={PO_W}>{r.poNumber ?? "—"}</Cell>
            {board.products.map((p) => (
              <Cell key={p.id} w={QTY_W} right muted={!r.quantities[p.id]}>
                {r.quantities[p.id] ? String(r.quantities[p.id]) : "–"}
              </Cell>
            ))}
            {showMoney ? (
              <Cell w={TOTAL_W} right>
                {money(r.totalCents)}
              </Cell>
            ) : null}
          </View>
        ))}
        <View style={[styles.tr, styles.totalRow]} role="row" testID="board-total-row">
          <Cell w={ACCOUNT_W} strong>
            Total
          </Cell>
          <Cell w={STATUS_W}>{ordersLabel(board.rows.length)}</Cell>
          <Cell w={PO_W}> </Cell>
          {board.products.map((p) => (
            <Cell key={p.id} w={QTY_W} right strong>
              {String(p.total)}
            </Cell>
          ))}
          {showMoney ? (
            <Cell w={TOTAL_W} right strong>
              {money(board.totalCents)}
            </Cell>
          ) : null}
        </View>
      </View>
    </ScrollView>
  );
}

function Cell({ w, children, header, right, strong, muted }: { w: number; children: React.ReactNode; header?: boolean; right?: boolean; strong?: boolean; muted?: boolean }) {
  const grow = w === ACCOUNT_W;
  return (
    <View style={[styles.td, grow ? { minWidth: w, flexGrow: 1, flexBasis: w } : { width: w }, right && styles.right]} role={header ? "columnheader" : "cell"}>
      <AppText variant={header ? "caption" : strong ? "bodyStrong" : "body"} color={header || muted ? "muted" : "ink"} align={right ? "right" : undefined}>
        {children}
      </AppText>
    </View>
  );
}

function BoardCards({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  const names = new Map(board.products.map((p) => [p.id, p]));
  const lineName = (p: BoardDto["products"][number] | undefined, q: number) => (p ? `${p.name} (${saleUnitFor(q, p)})` : "Product");
  return (
    <View style={styles.cards} testID="board-list">
      {board.rows.map((r) => (
        <View key={r.orderId} style={styles.card} testID={`board-row-${r.orderId}`}>
          <View style={styles.cardTop}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {r.accountName}
            </AppText>
            <OrderStatusBadge status={r.status} />
          </View>
          {r.poNumber ? <AppText variant="small" color="muted">{`PO ${r.poNumber}`}</AppText> : null}
          <View>
            {Object.entries(r.quantities)
              .filter(([, q]) => q > 0)
              .map(([id, q]) => (
                <View key={id} style={styles.line}>
                  <AppText variant="bodyStrong" style={styles.qty}>
                    {String(q)}
                  </AppText>
                  <AppText style={styles.flex}>{lineName(names.get(Number(id)), q)}</AppText>
                </View>
              ))}
          </View>
          {showMoney ? (
            <AppText variant="label" align="right">
              {money(r.totalCents)}
            </AppText>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  switcher: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  stepper: { flexDirection: "row", alignItems: "center", gap: space.xs },
  switcherDate: { minWidth: 104, paddingHorizontal: space.xs },
  iconButton: {
    width: layout.minTouch,
    height: layout.minTouch,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  iconPressed: { backgroundColor: colors.sunken },
  quick: { flexDirection: "row", gap: space.xs },
  actionsWrap: { gap: space.sm },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  tiles: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  tile: { flexGrow: 1, flexBasis: 150, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  big: { fontSize: 40, lineHeight: 46 },
  tableScroll: { flexGrow: 0 },
  tableContent: { flexGrow: 1 },
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, overflow: "hidden", flexGrow: 1 },
  tr: { flexDirection: "row", alignItems: "center", minHeight: layout.minTouch + 8, paddingHorizontal: space.sm },
  th: { backgroundColor: colors.sunken, minHeight: layout.minTouch },
  td: { paddingHorizontal: space.sm, paddingVertical: space.sm, justifyContent: "center" },
  right: { alignItems: "flex-end" },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  totalRow: { borderTopWidth: 2, borderTopColor: colors.inputBorder, backgroundColor: colors.sunken },
  cards: { gap: space.sm },
  card: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: space.lg, gap: space.xs },
  cardTop: { flexDirection: "row", alignItems: "center", gap: space.sm },
  line: { flexDirection: "row", alignItems: "baseline", gap: space.sm, paddingVertical: 2 },
  qty: { minWidth: 32, textAlign: "right" },
});
