import React, { useEffect, useState } from "react";
import { ActivityIndicator, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { LinkButton } from "../../ui/LinkButton";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { EmptyState, LoadingState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { AppText, Heading } from "../../ui/Text";
import { useAuth } from "../../auth/useAuth";
import { homePathFor } from "../../auth/homePath";
import { AppShell } from "../../shell/AppShell";
import { ApiError } from "../../api/client";
import { useInvoiceQuery, type InvoiceDetailDto } from "../../api/invoices";
import { useQueryClient } from "@tanstack/react-query";
import { accountKeys, useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { SignInScreen } from "../auth/SignInScreen";
import { METHOD_LABELS, day, money } from "./parts";
import { PayByCard } from "./PayByCard";
import { colors, radii, space } from "../../theme";

/** How often the page asks whether the payment has landed, and when it stops asking. */
export const POLL_MS = 1500;
export const GIVE_UP_MS = 60_000;

export const PROCESSING_TEXT = "Payment processing — this takes a few seconds";
export const TIMEOUT_TEXT = "We haven't heard from the card processor yet; the invoice will update when they confirm.";

export interface PayReturnProps {
  invoiceId: number;
  /** The hosted page sends the person back with cancelled=1 when they gave up. */
  cancelled: boolean;
}

/** True once nothing is owed any more (the webhook recorded the payment). */
export function isSettled(d: InvoiceDetailDto | undefined): boolean {
  return !!d && (d.invoice.status !== "open" || d.invoice.amountDueCents === 0);
}

/**
 * Where the card processor's hosted page sends the payer back. Signed out: sign in here and carry on.
 * Then poll the invoice until the payment is recorded (or the page stops waiting after a minute).
 */
export function PayReturnScreen(props: PayReturnProps) {
  const { status, user } = useAuth();
  if (status === "loading") {
    return (
      <View style={styles.plain}>
        <LoadingState label="Checking your sign-in…" />
      </View>
    );
  }
  // Signing in here keeps this address, so the page carries on once the session exists.
  if (!user) return <SignInScreen />;
  if (user.role === "baker") {
    return (
      <AppShell area="baker">
        <Screen narrow testID="pay-return">
          <EmptyState icon="lock" title="Invoices are for the office and the account's buyers" message="Ask the office about this payment." testID="pay-not-yours" />
          <TextLink href={homePathFor(user.role)} label="Back to the bake day" />
        </Screen>
      </AppShell>
    );
  }
  return (
    <AppShell area={user.role === "buyer" ? "buyer" : "office"}>
      <PayReturnBody {...props} office={user.role !== "buyer"} />
    </AppShell>
  );
}

/**
 * After a late invoice is paid: whether the account can order again (the payment lifts a credit hold once
 * nothing else is overdue). The account is asked again once the payment has landed.
 */
function OrderingAgain({ accountId }: { accountId: number }) {
  const qc = useQueryClient();
  useEffect(() => void qc.invalidateQueries({ queryKey: accountKeys.detail(accountId) }), [qc, accountId]);
  const account = useAccountQuery(accountId);
  if (!account.data || account.isFetching) return null;
  const a = account.data;
  if (a.status === "active") {
    return (
      <View style={[styles.banner, styles.bannerPaid]} testID="pay-ordering-open">
        <Feather name="shopping-bag" size={20} color={colors.sageInk} />
        <AppText variant="bodyStrong" color="sageInk" style={styles.flex}>
          Ordering is open again: nothing is overdue on your account.
        </AppText>
      </View>
    );
  }
  if (a.status === "on_hold" && a.creditHold) {
    return (
      <AppText color="dangerInk" testID="pay-still-held">
        Your account is still on credit hold: other invoices are overdue. Pay them under Invoices and ordering opens again.
      </AppText>
    );
  }
  return null;
}

function PayReturnBody({ invoiceId, cancelled, office }: PayReturnProps & { office: boolean }) {
  const valid = Number.isInteger(invoiceId) && invoiceId > 0;
  const [gaveUp, setGaveUp] = useState(false);
  const detail = useInvoiceQuery(valid ? invoiceId : null, {
    refetchInterval: (d) => (!cancelled && !gaveUp && !isSettled(d) ? POLL_MS : false),
  });
  const settled = isSettled(detail.data);
  const bakery = useBakeryQuery();
  useEffect(() => {
    if (cancelled || settled || gaveUp) return;
    const t = setTimeout(() => setGaveUp(true), GIVE_UP_MS);
    return () => clearTimeout(t);
  }, [cancelled, settled, gaveUp]);

  const base = office ? "/office/invoices" : "/buyer/invoices";
  const backLinks = (
    <View style={styles.links}>
      {valid ? <LinkButton href={`${base}/${invoiceId}`} label="See the invoice" icon="file-text" variant="secondary" testID="pay-see-invoice" /> : null}
      <LinkButton href={base} label="Back to invoices" icon="list" variant="ghost" testID="pay-back-invoices" />
    </View>
  );

  if (!valid || (detail.isError && detail.error instanceof ApiError && detail.error.status === 404)) {
    return (
      <Screen narrow testID="pay-return">
        <EmptyState icon="help-circle" title="We couldn't find that invoice" message="The link may be incomplete. Your invoices are all listed under Invoices." testID="pay-not-found" />
        {backLinks}
      </Screen>
    );
  }

  const result = (d: InvoiceDetailDto) => {
    const inv = d.invoice;
    const receipt = [...d.payments].reverse().find((p) => p.method === "card") ?? d.payments[d.payments.length - 1];

    let body: React.ReactNode;
    if (settled) {
      body = (
        <Card testID="pay-paid-card">
          <View style={[styles.banner, styles.bannerPaid]}>
            <Feather name="check-circle" size={28} color={colors.sageInk} />
            <Heading level={2} color="sageInk" testID="pay-paid">
              Paid
            </Heading>
          </View>
          <AppText>{`Thank you. Invoice ${inv.number} is paid; a receipt is on its way to the billing e-mail.`}</AppText>
          {!office && inv.dueDate < (bakery.data?.today ?? "") ? <OrderingAgain accountId={inv.accountId} /> : null}
          {receipt ? (
            <View testID="pay-receipt">
              <DetailList
                items={[
                  { label: "Amount", value: money(receipt.amountCents, inv.currency), testID: "pay-receipt-amount" },
                  { label: "Date", value: day(receipt.receivedOn), testID: "pay-receipt-date" },
                  { label: "Method", value: METHOD_LABELS[receipt.method], testID: "pay-receipt-method" },
                  { label: "Invoice", value: inv.number },
                ]}
              />
            </View>
          ) : null}
        </Card>
      );
    } else if (cancelled) {
      body = (
        <Card testID="pay-cancelled-card">
          <View style={[styles.banner, styles.bannerCalm]}>
            <Feather name="x-circle" size={26} color={colors.crustInk} />
            <Heading level={2} color="crustInk" testID="pay-cancelled">
              The payment was canceled
            </Heading>
          </View>
          <AppText>{`Nothing was charged. ${money(inv.amountDueCents, inv.currency)} is still owed on ${inv.number}.`}</AppText>
          <PayByCard invoiceId={inv.id} label="Try again" testID="pay-retry" />
        </Card>
      );
    } else if (gaveUp) {
      body = (
        <Card testID="pay-timeout-card">
          <View style={[styles.banner, styles.bannerCalm]}>
            <Feather name="clock" size={26} color={colors.crustInk} />
            <Heading level={2} color="crustInk">
              Still waiting for confirmation
            </Heading>
          </View>
          <AppText testID="pay-timeout">{TIMEOUT_TEXT}</AppText>
          <AppText variant="small" color="muted">
            There is no need to pay again. If the invoice still shows money owed tomorrow, contact the bakery.
          </AppText>
          <Button label="Check again" icon="refresh-cw" variant="secondary" busy={detail.isFetching} onPress={() => detail.refetch()} testID="pay-check-again" />
        </Card>
      );
    } else {
      body = (
        <Card testID="pay-processing-card">
          <View style={[styles.banner, styles.bannerCalm]} accessibilityLiveRegion="polite">
            <ActivityIndicator size="small" color={colors.crustInk} />
            <AppText variant="bodyStrong" color="crustInk" style={styles.flex} testID="pay-processing">
              {PROCESSING_TEXT}
            </AppText>
          </View>
          <AppText color="muted">{`Confirming the card payment for ${inv.number}. This page updates by itself.`}</AppText>
        </Card>
      );
    }


    return (
      <>
        <PageHeader overline="Card payment" title={inv.number} subtitle={`${inv.accountName} · ${money(inv.totalCents, inv.currency)}`} testID="pay-title" />
        {body}
      </>
    );
  };

  return (
    <Screen narrow testID="pay-return">
      <QueryStates query={detail} testID="pay" loadingLabel="Loading the invoice…" errorTitle="The invoice didn't load">
        {result}
      </QueryStates>
      {detail.isPending ? null : backLinks}
    </Screen>
  );
}

const styles = StyleSheet.create({
  plain: { flex: 1, backgroundColor: colors.page, justifyContent: "center" },
  banner: { flexDirection: "row", alignItems: "center", gap: space.md, padding: space.md, borderRadius: radii.md },
  bannerPaid: { backgroundColor: colors.sageSoft },
  bannerCalm: { backgroundColor: colors.crustSoft },
  flex: { flex: 1 },
  links: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
