import React, { useState } from "react";
import { View } from "react-native";
import { useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { Badge } from "../../ui/Badge";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { ApiError, messageOf } from "../../api/client";
import { useReconcilePayoutMutation, useUndoReconcileMutation, type PayoutDetailDto } from "../../api/payouts";
import { userKeys, usersApi } from "../../api/users";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { useZodForm } from "../../forms/useZodForm";
import { billingStyles } from "./parts";
import { space } from "../../theme";

const NOTE = z.object({ note: z.string().trim() });
const FORCED_NOTE = z.object({ note: z.string().trim().min(1, "Say why it is fine although it doesn't match.") });

/** "Rosalind Hart" for the owner (who can read the people list), "you", or a neutral stand-in. */
function useStaffName(id: number | null): string {
  const me = useSignedInUser();
  const users = useQuery({ queryKey: userKeys.list({}), queryFn: () => usersApi.list({}), enabled: me.role === "owner" && !!id && id !== me.id });
  if (!id) return "someone in the office";
  if (id === me.id) return `you (${me.name})`;
  return users.data?.find((u) => u.id === id)?.name ?? "another office user";
}

/** Marking a payout reconciled; one that doesn't match needs a note saying why it is fine. */
export function ReconcileCard({ detail: d }: { detail: PayoutDetailDto }) {
  const mutation = useReconcilePayoutMutation(d.payout.id);
  const timeZone = useBakeryTimeZone();
  const who = useStaffName(d.reconciled?.byId ?? null);
  const [forcing, setForcing] = useState(false);
  const form = useZodForm({ schema: forcing ? FORCED_NOTE : NOTE, initial: { note: "" }, manyMessage: null });
  const err = mutation.error;
  const unmatchedRefusal = err instanceof ApiError && err.code === "payout_unmatched";
  const clean = d.unmatched === 0 && d.netMatchesPayout;

  if (d.reconciled) {
    return (
      <Card title="Reconciled" action={<Badge label="Done" tone="sage" />} testID="payout-reconciled">
        <AppText testID="payout-reconciled-by">{`Marked reconciled by ${who} on ${formatDateTime(d.reconciled.at, timeZone)}.`}</AppText>
        {d.reconciled.note ? (
          <AppText color="muted" testID="payout-reconciled-note">
            {`Note: ${d.reconciled.note}`}
          </AppText>
        ) : null}
        <UndoReconcile payoutId={d.payout.id} />
        <ReconcileHistory detail={d} />
      </Card>
    );
  }

  // Only "Reconcile" shows until the server refuses an unmatched payout; then only "Mark reconciled anyway".
  const reconcile = () =>
    void form.submit(async ({ note }) => {
      try {
        await mutation.mutateAsync({ note, ...(forcing ? { force: true } : {}) });
      } catch (e) {
        if (e instanceof ApiError && e.code === "payout_unmatched") setForcing(true);
        throw e;
      }
    });

  return (
    <Card title="Reconcile" testID="payout-reconcile-card">
      <AppText color="muted">
        {clean ? "Every transaction matches an invoice and the net is what the bank received." : "Check the transactions in red first. If they are explained, mark the payout reconciled anyway with a note."}
      </AppText>
      <FormError message={unmatchedRefusal && forcing ? null : form.formError} testID="reconcile-error" />
      {forcing ? <FormError message={unmatchedRefusal ? messageOf(err) : "This payout doesn't match Panwise's records."} testID="reconcile-refused" /> : null}
      <TextField
        label="Note"
        optional={!forcing}
        hint={forcing ? "Needed: what explains the difference." : "For the records, e.g. the bank statement line."}
        {...form.text("note")}
        multiline
        maxLength={300}
        testID="reconcile-note"
      />
      <ReconcileHistory detail={d} />
      <View style={billingStyles.buttons}>
        {forcing ? (
          <>
            <Button label="Mark reconciled anyway" icon="check-square" variant="danger" busy={form.submitting} onPress={reconcile} testID="reconcile-force" />
            <Button
              label="Not yet"
              variant="ghost"
              onPress={() => {
                setForcing(false);
                mutation.reset();
                form.setFormError(null);
              }}
              testID="reconcile-cancel"
            />
          </>
        ) : (
          <Button label="Reconcile" icon="check" variant="accent" busy={form.submitting} onPress={reconcile} testID="reconcile" />
        )}
      </View>
    </Card>
  );
}

const REASON = z.object({ reason: z.string().trim().min(3, "Say why the reconciliation is undone (at least 3 characters).").max(300, "The reason can be at most 300 characters.") });

/** Undo a reconciliation (marked by mistake, or the bank line turned out different): a reason is needed and kept. */
function UndoReconcile({ payoutId }: { payoutId: string }) {
  const undo = useUndoReconcileMutation(payoutId);
  const [open, setOpen] = useState(false);
  const form = useZodForm({ schema: REASON, initial: { reason: "" }, manyMessage: null });
  if (!open) return <Button label="Undo reconciliation" icon="rotate-ccw" variant="ghost" onPress={() => setOpen(true)} testID="reconcile-undo" />;
  return (
    <View style={{ gap: space.sm }} testID="reconcile-undo-form">
      <TextField label="Why undo it" {...form.text("reason")} maxLength={300} testID="reconcile-undo-reason" />
      <View style={billingStyles.buttons}>
        <Button label="Yes, undo" icon="rotate-ccw" variant="danger" busy={form.submitting} onPress={() => void form.submit(({ reason }) => undo.mutateAsync(reason))} testID="reconcile-undo-confirm" />
        <Button label="Keep it reconciled" variant="ghost" onPress={() => setOpen(false)} />
      </View>
      <FormError message={form.formError} testID="reconcile-undo-error" />
    </View>
  );
}

/** Every reconcile and undo of this payout, oldest first. */
function ReconcileHistory({ detail: d }: { detail: PayoutDetailDto }) {
  const timeZone = useBakeryTimeZone();
  const history = d.history ?? [];
  if (history.length === 0) return null;
  return (
    <View testID="reconcile-history">
      <AppText variant="label">History</AppText>
      {history.map((h, i) => (
        <AppText key={i} variant="small" color="muted" testID={`reconcile-history-${i}`}>
          {`${formatDateTime(h.at, timeZone)}: ${h.action === "reconciled" ? "reconciled" : "undone"} by ${h.byName ?? "an office user"}${h.note ? ` — ${h.note}` : ""}`}
        </AppText>
      ))}
    </View>
  );
}
