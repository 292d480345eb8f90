import React from "react";
import { z } from "zod";
import { View } from "react-native";
import { Card } from "../../ui/Card";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { useInvoicesQuery } from "../../api/invoices";
import { useSetTermsMutation } from "../../api/accountBilling";
import { PAYMENT_TERMS, PAYMENT_TERMS_LABELS, type PaymentTerms } from "../../../shared/billing";
import { useZodForm } from "../../forms/useZodForm";
import { billingStyles, money } from "./parts";
import { invoicesLabel } from "./InvoicesScreen";

/** An account's billing on its office page: what it owes, its invoices, and (owner) its payment terms. */
export function AccountBillingCard({ accountId, canChangeTerms, currentTerms }: { accountId: number; canChangeTerms: boolean; currentTerms?: PaymentTerms }) {
  const invoices = useInvoicesQuery({ accountId, sort: "newest" });
  const open = invoices.data?.invoices.filter((i) => i.amountDueCents > 0 && i.status !== "void") ?? [];
  const overdue = open.filter((i) => i.overdue);
  const newest = invoices.data?.invoices[0];
  const cur = newest?.currency ?? "USD";

  return (
    <Card title="Billing" testID="account-billing">
      {invoices.isPending ? (
        <AppText color="muted">Loading invoices…</AppText>
      ) : invoices.isError ? (
        <FormError message={`Invoices didn't load: ${messageOf(invoices.error)}`} testID="account-billing-error" />
      ) : invoices.data.invoices.length === 0 ? (
        <AppText color="muted" testID="account-billing-summary">
          No invoices yet.
        </AppText>
      ) : (
        <AppText testID="account-billing-summary" color={overdue.length ? "dangerInk" : "ink"}>
          {open.length === 0
            ? `${invoicesLabel(invoices.data.invoices.length)}, all paid.`
            : `${money(open.reduce((s, i) => s + i.amountDueCents, 0), cur)} owed on ${invoicesLabel(open.length)}${overdue.length ? `, ${overdue.length} overdue` : ""}.`}
        </AppText>
      )}
      <LinkButton href={`/office/invoices?accountId=${accountId}`} label="See its invoices" icon="file-text" variant="secondary" testID="account-invoices-link" />
      {currentTerms ? (
        <AppText testID="account-terms-current">
          Payment terms: {PAYMENT_TERMS_LABELS[currentTerms]}
        </AppText>
      ) : null}
      {canChangeTerms ? <TermsForm accountId={accountId} newestKind={newest?.kind} currentTerms={currentTerms} /> : null}
    </Card>
  );
}

const TERMS_SCHEMA = z.object({ terms: z.enum(PAYMENT_TERMS, { error: "Choose the terms first." }) });

function TermsForm({ accountId, newestKind, currentTerms }: { accountId: number; newestKind?: "order" | "statement"; currentTerms?: PaymentTerms }) {
  const mutation = useSetTermsMutation(accountId);
  // The one choice's message shows at the top of this small form, as a refusal from the server does.
  const form = useZodForm({ schema: TERMS_SCHEMA, initial: { terms: currentTerms ?? null }, fields: [], manyMessage: null });
  const save = () => void form.submit(({ terms }) => mutation.mutateAsync(terms));
  return (
    <View style={{ gap: 12 }} testID="account-terms">
      <AppText variant="label">Payment terms</AppText>
      <AppText variant="small" color="muted">
        {currentTerms
          ? "Changing terms applies to invoices issued from now on."
          : newestKind
          ? `Its newest invoice was ${newestKind === "order" ? "a per-delivery invoice paid by card" : "a weekly statement on net terms"}. Changing terms applies to invoices issued from now on.`
          : "Changing terms applies to invoices issued from now on."}
      </AppText>
      <ChoiceGroup<PaymentTerms> label="New terms" layout="list" value={form.values.terms} onChange={form.set("terms")} testID="account-terms-choice" choices={PAYMENT_TERMS.map((t) => ({ value: t, label: PAYMENT_TERMS_LABELS[t] }))} />
      {mutation.isSuccess ? <Notice message={`Payment terms are now: ${PAYMENT_TERMS_LABELS[mutation.data]}.`} testID="account-terms-saved" /> : null}
      <FormError message={form.formError} testID="account-terms-error" />
      <View style={billingStyles.buttons}>
        <Button label="Change terms" icon="check" variant="secondary" busy={form.submitting} onPress={save} testID="account-terms-save" />
      </View>
    </View>
  );
}
