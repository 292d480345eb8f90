import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { Badge, type BadgeTone } from "../../ui/Badge";
import { FormError, Notice } from "../../ui/FormError";
import { DataTable, TitleCell } from "../../ui/DataTable";
import { ListCard, ListCardTop, ListCards } from "../../ui/ListCard";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { MAIL_STATUSES, useOutboxQuery, useResendMailMutation, type MailStatus, type OutboxMailDto } from "../../api/outbox";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { mailKindLabel } from "../../../shared/mail";
import { useIsWide } from "../../shell/useIsWide";
import { useSignedInUser } from "../../auth/useAuth";
import { space } from "../../theme";

const STATUS_LABELS: Record<MailStatus, string> = { pending: "Waiting", sending: "Sending", sent: "Sent", failed: "Failed" };
const STATUS_TONE: Record<MailStatus, BadgeTone> = { pending: "amber", sending: "crust", sent: "sage", failed: "danger" };

type Show = MailStatus | "all";

const attemptsLabel = (n: number) => (n === 1 ? "1 attempt" : `${n} attempts`);

/** Outgoing e-mail (all of it for the owner, invoices and receipts for the bookkeeper): what went, what waits, what failed. */
export function OutboxScreen() {
  const wide = useIsWide();
  const isOwner = useSignedInUser().role === "owner";
  const [show, setShow] = useState<Show>("all");
  const mails = useOutboxQuery(show === "all" ? undefined : show);
  const resend = useResendMailMutation();
  const timeZone = useBakeryTimeZone();
  const [resent, setResent] = useState<string | null>(null);

  const again = (m: OutboxMailDto) => {
    setResent(null);
    resend.mutate(m.id, { onSuccess: () => setResent(`"${m.subject}" to ${m.to} is queued to go again.`) });
  };
  const resendButton = (m: OutboxMailDto) =>
    m.status === "failed" ? <Button label="Send again" icon="refresh-cw" small variant="secondary" busy={resend.isPending && resend.variables === m.id} onPress={() => again(m)} testID={`outbox-resend-${m.id}`} accessibilityLabel={`Send again: ${m.subject} to ${m.to}`} /> : null;
  const when = (m: OutboxMailDto) =>
    m.status === "sent" ? `Sent ${formatDateTime(m.sentAt, timeZone)}` : m.status === "failed" ? `Gave up after ${attemptsLabel(m.attempts)}` : `${m.attempts ? `${attemptsLabel(m.attempts)} · ` : ""}next try ${formatDateTime(m.nextAttemptAt, timeZone)}`;

  const body = (rows: OutboxMailDto[]) =>
    wide ? (
      <DataTable<OutboxMailDto>
        testID="outbox-table"
        rows={rows}
        rowKey={(m) => m.id}
        rowTestID={(m) => `outbox-row-${m.id}`}
        rowAlert={(m) => m.status === "failed"}
        columns={[
          { key: "status", label: "Status", flex: 0.8, render: (m) => <Badge label={STATUS_LABELS[m.status]} tone={STATUS_TONE[m.status]} testID={`outbox-status-${m.id}`} /> },
          {
            key: "mail",
            label: "E-mail",
            flex: 2.4,
            render: (m) => (
              <TitleCell title={m.subject} detail={`${mailKindLabel(m.kind)} · to ${m.to}`} detailColor={m.status === "failed" ? "ink" : "muted"} oneLine>
                {m.lastError ? (
                  <AppText variant="small" color="dangerInk" numberOfLines={2} testID={`outbox-error-${m.id}`}>
                    {`Last error: ${m.lastError}`}
                  </AppText>
                ) : null}
              </TitleCell>
            ),
          },
          { key: "when", label: "When", flex: 1.4, render: (m) => <AppText variant="small">{when(m)}</AppText> },
          { key: "action", label: "", flex: 0.9, align: "right", render: (m) => resendButton(m) ?? "" },
        ]}
      />
    ) : (
      <ListCards testID="outbox-list">
        {rows.map((m) => (
          <ListCard key={m.id} alert={m.status === "failed"} testID={`outbox-row-${m.id}`}>
            <View style={styles.card}>
              <ListCardTop>
                <Badge label={STATUS_LABELS[m.status]} tone={STATUS_TONE[m.status]} testID={`outbox-status-${m.id}`} />
                <AppText variant="small" color={m.status === "failed" ? "ink" : "muted"}>
                  {mailKindLabel(m.kind)}
                </AppText>
              </ListCardTop>
              <AppText variant="bodyStrong">{m.subject}</AppText>
              <AppText variant="small" color={m.status === "failed" ? "ink" : "muted"}>{`To ${m.to} · ${when(m)}`}</AppText>
              {m.lastError ? (
                <AppText variant="small" color="dangerInk" testID={`outbox-error-${m.id}`}>
                  {`Last error: ${m.lastError}`}
                </AppText>
              ) : null}
              {resendButton(m)}
            </View>
          </ListCard>
        ))}
      </ListCards>
    );

  return (
    <Screen testID="outbox-screen">
      <PageHeader
        title="Outgoing e-mail"
        subtitle={
          isOwner
            ? "Every e-mail sent from the bakery's Panwise: order confirmations, invoices and receipts, invitations and password resets. Each is kept here and retried with a growing pause until the mail server takes it."
            : "The invoice and receipt e-mails sent to the accounts (statements are invoices). Each is kept here and retried with a growing pause until the mail server takes it. Invitations, password resets and order e-mails are the owner's to see."
        }
        testID="outbox-title"
      />
      <ChoiceGroup<Show>
        label="Show"
        value={show}
        onChange={setShow}
        testID="outbox-status"
        choices={[{ value: "all", label: "All" }, ...MAIL_STATUSES.map((s) => ({ value: s, label: STATUS_LABELS[s] }))]}
      />
      {resent ? <Notice message={resent} testID="outbox-resent" /> : null}
      <FormError message={resend.isError ? messageOf(resend.error) : null} testID="outbox-resend-error" />
      <QueryStates
        query={mails}
        testID="outbox"
        loadingLabel="Loading outgoing mail…"
        errorTitle="The outbox didn't load"
        empty={{ icon: "mail", title: show === "all" ? "No e-mail yet" : `No ${STATUS_LABELS[show as MailStatus].toLowerCase()} e-mail`, message: "Invoices, receipts and invitations show here as they are sent." }}
      >
        {body}
      </QueryStates>
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { flex: 1, gap: space.xs },
});
