import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { Stepper } from "../../ui/Stepper";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { ApiError, messageOf } from "../../api/client";
import { useBakeryQuery } from "../../api/bakery";
import { useBoardQuery, type BoardDto } from "../../api/board";
import { useConfirmDispatchMutation, type DispatchAdjustment } from "../../api/dispatch";
import { cleanDate, formatDay, formatDayLong } from "../../ordering/dates";
import { parseQuantity } from "../../ordering/quantities";
import { quantityText, saleUnitFor } from "../../../shared/quantity";
import { OrderStatusBadge } from "../ordering/parts";
import { ordersLabel } from "./OrdersBoardScreen";
import { colors, radii, space } from "../../theme";

/** A line marked short: the delivered quantity as typed, and why. */
interface Short {
  delivered: string;
  reason: string;
}

const lineKey = (orderId: number, productId: number) => `${orderId}-${productId}`;

/** The adjustments to send, or the problems per line ("<orderId>-<productId>" → message). */
export function dispatchAdjustments(board: BoardDto, shorts: Record<string, Short>): { ok: true; adjustments: DispatchAdjustment[] } | { ok: false; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const adjustments: DispatchAdjustment[] = [];
  for (const row of board.rows) {
    if (row.status !== "open" && row.status !== "locked") continue;
    for (const [pid, ordered] of Object.entries(row.quantities)) {
      const key = lineKey(row.orderId, Number(pid));
      const s = shorts[key];
      if (!s) continue;
      const q = parseQuantity(s.delivered);
      if (Number.isNaN(q)) problems[key] = "Enter a whole number.";
      else if (q >= ordered) problems[key] = `Less than the ${ordered} ordered, or untick "Short".`;
      else adjustments.push({ orderId: row.orderId, productId: Number(pid), deliveredQuantity: q, ...(s.reason.trim() ? { reason: s.reason.trim() } : {}) });
    }
  }
  if (Object.keys(problems).length) return { ok: false, problems };
  return { ok: true, adjustments };
}

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
      {!date ? (
        bakery.isError ? <ErrorState error={bakery.error} onRetry={() => bakery.refetch()} retrying={bakery.isFetching} testID="dispatch-error" /> : <LoadingState label="Loading the bakery's day…" />
      ) : board.isPending ? (
        <LoadingState label="Loading the orders…" testID="dispatch-loading" />
      ) : board.isError ? (
        <ErrorState error={board.error} title="The orders didn't load" onRetry={() => board.refetch()} retrying={board.isFetching} testID="dispatch-error" />
      ) : board.data.rows.length === 0 ? (
        <EmptyState icon="truck" title={`No orders for ${formatDay(date)}`} message="There is nothing to dispatch on this date." testID="dispatch-empty" />
      ) : (
        <DispatchForm key={date} date={date} board={board.data} />
      )}
    </Screen>
  );
}

function DispatchForm({ date, board }: { date: string; board: BoardDto }) {
  const confirm = useConfirmDispatchMutation(date);
  const [shorts, setShorts] = useState<Record<string, Short>>({});
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const products = new Map(board.products.map((p) => [p.id, p]));
  const waiting = board.rows.filter((r) => r.status === "open" || r.status === "locked");
  const delivered = board.rows.filter((r) => r.status === "delivered");
  const shortCount = Object.keys(shorts).length;

  const toggle = (key: string, ordered: number) =>
    setShorts((s) => {
      const next = { ...s };
      if (next[key]) delete next[key];
      else next[key] = { delivered: String(Math.max(0, ordered - 1)), reason: "" };
      return next;
    });
  const update = (key: string, patch: Partial<Short>) => setShorts((s) => ({ ...s, [key]: { ...s[key], ...patch } }));

  const submit = () => {
    if (confirm.isPending) return;
    setFormError(null);
    const checked = dispatchAdjustments(board, shorts);
    if (!checked.ok) {
      setProblems(checked.problems);
      setFormError("Some short lines need attention.");
      return;
    }
    setProblems({});
    confirm.mutate(checked.adjustments, {
      onSuccess: () => setShorts({}),
      onError: (err) => {
        // The server names lines by their place in the list it was sent ("adjustments.2.deliveredQuantity").
        if (err instanceof ApiError && err.fields) {
          const mapped: Record<string, string> = {};
          for (const [k, m] of Object.entries(err.fields)) {
            const i = Number(/^adjustments\.(\d+)\./.exec(k)?.[1]);
            const a = Number.isInteger(i) ? checked.adjustments[i] : undefined;
            if (a) mapped[lineKey(a.orderId, a.productId)] = m;
          }
          setProblems(mapped);
        }
        setFormError(messageOf(err));
      },
    });
  };

  const r = confirm.data;
  return (
    <>
      {r ? (
        <Notice
          testID="dispatch-result"
          message={`${r.delivered === 1 ? "1 order" : `${r.delivered} orders`} marked delivered.${r.invoices.length ? ` Invoiced at once (card accounts): ${r.invoices.join(", ")}.` : " No card invoices were due; accounts on terms get their weekly statement."}`}
        />
      ) : null}
      {waiting.length === 0 ? (
        <EmptyState icon="check-circle" title="Everything is delivered" message={`All ${ordersLabel(delivered.length)} for ${formatDay(date)} are confirmed.`} testID="dispatch-all-done" />
      ) : (
        <>
          <AppText color="muted" testID="dispatch-summary">
            {`${ordersLabel(waiting.length)} to record${shortCount ? ` · ${shortCount === 1 ? "1 line" : `${shortCount} lines`} short` : " · everything as ordered"}.`}
          </AppText>
          <View style={styles.list}>
            {waiting.map((row) => (
              <Card key={row.orderId} title={row.accountName} action={<OrderStatusBadge status={row.status} />} testID={`dispatch-order-${row.orderId}`}>
                {row.poNumber ? <AppText variant="small" color="muted">{`PO ${row.poNumber}`}</AppText> : null}
                {Object.entries(row.quantities)
                  .filter(([, q]) => q > 0)
                  .map(([pid, ordered]) => {
                    const key = lineKey(row.orderId, Number(pid));
                    const p = products.get(Number(pid));
                    const s = shorts[key];
                    const name = p ? `${p.name} (${saleUnitFor(ordered, p)})` : "Product";
                    return (
                      <View key={key} style={[styles.line, s && styles.lineShort]} testID={`dispatch-line-${key}`}>
                        <View style={styles.lineTop}>
                          <AppText variant="bodyStrong" style={styles.qty}>
                            {String(ordered)}
                          </AppText>
                          <AppText style={styles.flex}>{name}</AppText>
                          <Button
                            label={s ? "Short ✓" : "Short"}
                            small
                            variant={s ? "accent" : "secondary"}
                            accessibilityLabel={s ? `${name} for ${row.accountName} is marked short; press to deliver it in full` : `Mark ${name} for ${row.accountName} as short`}
                            accessibilityState={{ selected: !!s }}
                            onPress={() => toggle(key, ordered)}
                            testID={`dispatch-short-${key}`}
                          />
                        </View>
                        {s ? (
                          <View style={styles.shortForm}>
                            <View style={styles.stepperWrap}>
                              <AppText variant="label">Delivered</AppText>
                              <Stepper value={s.delivered} onChange={(t) => update(key, { delivered: t })} min={0} max={Math.max(0, ordered - 1)} label={`${name} delivered to ${row.accountName}`} invalid={!!problems[key]} testID={`dispatch-qty-${key}`} />
                              <AppText variant="small" color="muted">{`of ${p ? quantityText(ordered, p) : ordered}`}</AppText>
                            </View>
                            <TextField label="Why" optional placeholder="Burnt batch, ran out, damaged…" value={s.reason} onChangeText={(t) => update(key, { reason: t })} testID={`dispatch-reason-${key}`} maxLength={200} />
                            {problems[key] ? (
                              <AppText variant="small" color="dangerInk" testID={`dispatch-problem-${key}`}>
                                {problems[key]}
                              </AppText>
                            ) : null}
                          </View>
                        ) : null}
                      </View>
                    );
                  })}
              </Card>
            ))}
          </View>
          <FormError message={formError} testID="dispatch-form-error" />
          <Button label="Record deliveries" icon="truck" busy={confirm.isPending} onPress={submit} testID="dispatch-confirm" />
        </>
      )}
      {delivered.length ? (
        <Card title="Already delivered" testID="dispatch-delivered">
          {delivered.map((row) => (
            <View key={row.orderId} style={styles.doneRow} testID={`dispatch-delivered-${row.orderId}`}>
              <AppText variant="bodyStrong" style={styles.flex}>
                {row.accountName}
              </AppText>
              <OrderStatusBadge status={row.status} />
            </View>
          ))}
        </Card>
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  list: { gap: space.md },
  line: { gap: space.sm, paddingVertical: space.sm, paddingHorizontal: space.sm, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
  lineShort: { backgroundColor: colors.page, borderColor: colors.inputBorder },
  lineTop: { flexDirection: "row", alignItems: "center", gap: space.sm },
  qty: { minWidth: 32, textAlign: "right" },
  shortForm: { gap: space.sm, paddingLeft: space.xl },
  stepperWrap: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm },
  doneRow: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: 44 },
});
