import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { SEARCH_INPUT, TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { FormError, Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { RoleBadge } from "../../ui/Badge";
import { TableFrame, TableHeaderRow } from "../../ui/DataTable";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useUsersQuery } from "../../api/users";
import { useInvitationsQuery, useResendInvitationMutation, useRevokeInvitationMutation } from "../../api/invitations";
import { Badge } from "../../ui/Badge";
import { messageOf } from "../../api/client";
import { useBakeryTimeZone } from "../../api/bakery";
import { useDebounced } from "../../forms/useDebounced";
import { formatDateTime } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import type { InvitationDto } from "../../../shared/schemas/users";
import { PEOPLE_COLUMNS, UserRow } from "./UserRow";
import { colors, space } from "../../theme";

/** The owner's people desk: everyone with a sign-in, waiting invitations, and the way to invite. */
export function PeopleScreen({ invited }: { invited?: string }) {
  const me = useSignedInUser();
  const wide = useIsWide();
  const [q, setQ] = useState("");
  const search = useDebounced(q.trim());
  const users = useUsersQuery({ q: search || undefined });

  return (
    <Screen testID="people-screen">
      <PageHeader
        title="People"
        subtitle="Everyone who signs in to Panwise: bakery staff and wholesale buyers."
        actions={<LinkButton href="/office/people/invite" label="Invite someone" icon="user-plus" testID="invite-someone" />}
      />
      {invited ? <Notice message={`Invitation sent to ${invited}.`} testID="invited-notice" /> : null}

      <Invitations wide={wide} />

      <View style={styles.section}>
        <View style={[styles.searchRow, wide && styles.searchRowWide]}>
          <AppText variant="heading" accessibilityRole="header" aria-level={2}>
            Sign-ins
          </AppText>
          <View style={wide ? styles.searchWide : undefined}>
            <TextField
              label="Search people"
              placeholder="Name, e-mail or account"
              value={q}
              onChangeText={setQ}
              testID="people-search"
              {...SEARCH_INPUT}
            />
          </View>
        </View>
        <QueryStates
          query={users}
          testID="people"
          loadingTestID="loading"
          loadingLabel="Loading people…"
          errorTitle="People didn't load"
          empty={{ icon: "users", title: search ? "No one matches" : "No one here yet", message: search ? "Try a name, an e-mail or an account." : undefined }}
        >
          {(rows) =>
            wide ? (
          <TableFrame testID="people-table">
            <TableHeaderRow columns={PEOPLE_COLUMNS} />
            {rows.map((u, i) => (
              <View key={u.id} style={i > 0 ? styles.divider : undefined}>
                <UserRow user={u} isSelf={u.id === me.id} wide />
              </View>
            ))}
          </TableFrame>
            ) : (
          <View style={styles.cards} testID="people-list">
            {rows.map((u) => (
              <UserRow key={u.id} user={u} isSelf={u.id === me.id} wide={false} />
            ))}
          </View>
            )
          }
        </QueryStates>
      </View>
    </Screen>
  );
}

function Invitations({ wide }: { wide: boolean }) {
  const invitations = useInvitationsQuery();
  return (
    <QueryStates query={invitations} testID="invitations" loadingLabel="Loading invitations…" errorTitle="Invitations didn't load">
      {(waiting) =>
        waiting.length === 0 ? null : (
          <Card title={`Invitations not yet taken up (${waiting.length})`} testID="invitations-card">
            <View>
              {waiting.map((inv, i) => (
                <InvitationLine key={inv.id} invitation={inv} first={i === 0} wide={wide} />
              ))}
            </View>
          </Card>
        )
      }
    </QueryStates>
  );
}

function InvitationLine({ invitation, first, wide }: { invitation: InvitationDto; first: boolean; wide: boolean }) {
  const revoke = useRevokeInvitationMutation();
  const resend = useResendInvitationMutation();
  const timeZone = useBakeryTimeZone();
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={[styles.invite, !first && styles.divider]} testID={`invitation-${invitation.id}`}>
      <View style={[styles.inviteLine, wide && styles.inviteLineWide]}>
        <View style={styles.inviteWho}>
          <AppText variant="bodyStrong" numberOfLines={1}>
            {invitation.email}
          </AppText>
          <View style={styles.inviteMeta}>
            <RoleBadge role={invitation.role} />
            {invitation.accountName ? (
              <AppText variant="small" color="muted">
                {invitation.accountName}
              </AppText>
            ) : null}
            {invitation.expired ? (
              <Badge label={`Link ran out ${formatDateTime(invitation.expiresAt, timeZone)}`} tone="amber" testID={`invitation-${invitation.id}-expired`} />
            ) : (
              <AppText variant="small" color="muted">{`Link works until ${formatDateTime(invitation.expiresAt, timeZone)}`}</AppText>
            )}
          </View>
        </View>
        {confirming ? (
          <View style={styles.inviteActions}>
            <Button label="Yes, revoke" small variant="danger" busy={revoke.isPending} onPress={() => revoke.mutate(invitation.id)} testID={`invitation-${invitation.id}-revoke-confirm`} />
            <Button label="Keep" small variant="ghost" onPress={() => setConfirming(false)} />
          </View>
        ) : (
          <View style={styles.inviteActions}>
          <Button
            label="Send again"
            small
            variant={invitation.expired ? "accent" : "secondary"}
            icon="send"
            busy={resend.isPending}
            onPress={() => resend.mutate(invitation.id)}
            testID={`invitation-${invitation.id}-resend`}
            accessibilityLabel={`Send the invitation for ${invitation.email} again`}
          />
          <Button
            label="Revoke"
            small
            variant="secondary"
            icon="x"
            onPress={() => setConfirming(true)}
            testID={`invitation-${invitation.id}-revoke`}
            accessibilityLabel={`Revoke the invitation for ${invitation.email}`}
          />
          </View>
        )}
      </View>
      <FormError message={revoke.isError ? messageOf(revoke.error) : resend.isError ? messageOf(resend.error) : null} />
      {resend.data ? <Notice message={`Sent again to ${invitation.email}: the new link works until ${formatDateTime(resend.data.expiresAt, timeZone)}; the old one no longer does.`} testID="invitation-resent" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  searchRow: { gap: space.md },
  searchRowWide: { flexDirection: "row", alignItems: "flex-end", justifyContent: "space-between" },
  searchWide: { width: 380 },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  cards: { gap: space.sm },
  invite: { paddingVertical: space.md, gap: space.sm },
  inviteLine: { gap: space.sm },
  inviteLineWide: { flexDirection: "row", alignItems: "center", justifyContent: "space-between" },
  inviteWho: { flexShrink: 1, gap: space.xs },
  inviteMeta: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  inviteActions: { flexDirection: "row", gap: space.sm },
});
