import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { ApiError } from "../../api/client";
import type { BoardDto } from "../../api/board";
import { useConfirmDispatchMutation } from "../../api/dispatch";
import { useZodForm } from "../../forms/useZodForm";
import { formatDay } from "../../ordering/dates";
import { ordersLabel } from "../../ordering/quantities";
import {
  dispatchAdjustments,
  dispatchInputSchema,
  dispatchResultText,
  dispatchSummary,
  isWaiting,
  lineKey,
  lineProblemsFrom,
  toggleShort,
  type Short,
  type Shorts,
} from "../../ordering/dispatch";
import { OrderStatusBadge } from "../ordering/OrderStatusBadge";
import { space } from "../../theme";
import { DispatchLine } from "./DispatchLine";

const SHORT_LINES_MESSAGE = "Some short lines need attention.";

/** Every waiting order with its lines to mark short, the button that records them, and the orders already delivered. */
export function DispatchForm({ date, board }: { date: string; board: BoardDto }) {
  const confirm = useConfirmDispatchMutation(date);
  const form = useZodForm<{ shorts: Shorts }, typeof dispatchInputSchema>({
    schema: dispatchInputSchema,
    initial: { shorts: {} },
    // The schema checks the adjustments the lines make (submit checks the lines themselves first).
    toInput: (v) => {
      const checked = dispatchAdjustments(board, v.shorts);
      return { adjustments: checked.ok ? checked.adjustments : [] };
    },
  });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const { shorts } = form.values;
  const products = new Map(board.products.map((p) => [p.id, p]));
  const waiting = board.rows.filter(isWaiting);
  const delivered = board.rows.filter((r) => r.status === "delivered");

  const update = (key: string, patch: Partial<Short>) => form.setValue("shorts", { ...shorts, [key]: { ...shorts[key], ...patch } });

  const submit = async () => {
    if (form.submitting) return;
    const checked = dispatchAdjustments(board, shorts);
    if (!checked.ok) {
      setProblems(checked.problems);
      form.setFormError(SHORT_LINES_MESSAGE);
      return;
    }
    setProblems({});
    await form.submit(async () => {
      try {
        await confirm.mutateAsync(checked.adjustments);
      } catch (err) {
        if (err instanceof ApiError && err.fields) setProblems(lineProblemsFrom(err.fields, checked.adjustments));
        throw err;
      }
      form.reset({ shorts: {} });
    });
  };

  return (
    <>
      {confirm.data ? <Notice testID="dispatch-result" message={dispatchResultText(confirm.data)} /> : null}
      {waiting.length === 0 ? (
        <EmptyState icon="check-circle" title="Everything is delivered" message={`All ${ordersLabel(delivered.length)} for ${formatDay(date)} are confirmed.`} testID="dispatch-all-done" />
      ) : (
        <>
          <AppText color="muted" testID="dispatch-summary">
            {dispatchSummary(waiting.length, Object.keys(shorts).length)}
          </AppText>
          <View style={styles.list}>
            {waiting.map((row) => (
              <Card key={row.orderId} title={row.accountName} action={<OrderStatusBadge status={row.status} />} testID={`dispatch-order-${row.orderId}`}>
                {row.poNumber ? <AppText variant="small" color="muted">{`PO ${row.poNumber}`}</AppText> : null}
                {Object.entries(row.quantities)
                  .filter(([, q]) => q > 0)
                  .map(([pid, ordered]) => {
                    const key = lineKey(row.orderId, Number(pid));
                    return (
                      <DispatchLine
                        key={key}
                        lineKey={key}
                        accountName={row.accountName}
                        ordered={ordered}
                        product={products.get(Number(pid))}
                        short={shorts[key]}
                        problem={problems[key]}
                        onToggle={() => form.setValue("shorts", toggleShort(shorts, key, ordered))}
                        onChange={(patch) => update(key, patch)}
                      />
                    );
                  })}
              </Card>
            ))}
          </View>
          <FormError message={form.formError} testID="dispatch-form-error" />
          <Button label="Record deliveries" icon="truck" busy={confirm.isPending} onPress={() => void submit()} testID="dispatch-confirm" />
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
  doneRow: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: 44 },
});
