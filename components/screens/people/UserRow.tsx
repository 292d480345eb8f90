import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../ui/Button";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { FormError, Notice } from "../../ui/FormError";
import { Badge, RoleBadge } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { useUpdateUserMutation } from "../../api/users";
import { useBakeryTimeZone } from "../../api/bakery";
import { ApiError, messageOf } from "../../api/client";
import { splitError, validate } from "../../forms/errors";
import { formatDateTime } from "../../format";
import { userUpdateSchema, type UserDto } from "../../../shared/schemas/users";
import { ROLE_LABELS, type Role } from "../../../shared/roles";
import type { FieldErrors } from "../../../shared/errors";
import { AccountPicker } from "./AccountPicker";
import { ROLE_CHOICES } from "./roleChoices";
import { colors, radii, space } from "../../theme";

export interface UserRowProps {
  user: UserDto;
  isSelf: boolean;
  wide: boolean;
}

/** Why a change was refused, in words the owner can act on. */
export function userChangeMessage(error: unknown): string {
  if (error instanceof ApiError && error.code === "last_owner") {
    return error.message || "This is the only active owner. Make someone else an owner first.";
  }
  return messageOf(error);
}

/** One person: who they are, and the owner's controls (change role, turn the sign-in off or on). */
export function UserRow({ user, isSelf, wide }: UserRowProps) {
  const mutation = useUpdateUserMutation();
  const timeZone = useBakeryTimeZone();
  const [editing, setEditing] = useState(false);
  const [role, setRole] = useState<Role>(user.role);
  const [accountId, setAccountId] = useState<number | null>(user.accountId);
  const [fields, setFields] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const startEdit = () => {
    setRole(user.role);
    setAccountId(user.accountId);
    setFields({});
    setError(null);
    setDone(null);
    setEditing(true);
  };

  const fail = (err: unknown) => {
    const split = splitError(err, ["role", "accountId"]);
    setFields(split.fields);
    setError(split.formError ? userChangeMessage(err) : null);
  };

  const saveRole = () => {
    setError(null);
    setDone(null);
    const patch = role === "buyer" ? { role, accountId } : { role, accountId: null };
    const checked = validate(userUpdateSchema, patch);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    if (role === "buyer" && !accountId) {
      setFields({ accountId: "Choose the customer account this buyer orders for." });
      return;
    }
    setFields({});
    mutation.mutate(
      { id: user.id, patch: checked.data },
      {
        onSuccess: (saved) => {
          setEditing(false);
          setDone(`${saved.name} is now ${saved.role === "owner" ? "the" : "a"} ${ROLE_LABELS[saved.role].toLowerCase()}${saved.accountName ? ` for ${saved.accountName}` : ""}.`);
        },
        onError: fail,
      },
    );
  };

  const toggleDisabled = () => {
    setError(null);
    setDone(null);
    mutation.mutate(
      { id: user.id, patch: { disabled: !user.disabled } },
      {
        onSuccess: (saved) => setDone(saved.disabled ? `${saved.name} can no longer sign in.` : `${saved.name} can sign in again.`),
        onError: (err) => setError(userChangeMessage(err)),
      },
    );
  };

  const who = (
    <View style={styles.who}>
      <View style={styles.nameLine}>
        <AppText variant="bodyStrong" numberOfLines={1} style={styles.shrink}>
          {user.name}
        </AppText>
        {isSelf ? <Badge label="You" tone="sage" /> : null}
      </View>
      <AppText variant="small" color="muted" numberOfLines={1}>
        {user.email}
      </AppText>
    </View>
  );
  const roleCell = (
    <View style={styles.roleCell}>
      <RoleBadge role={user.role} />
      {user.accountName ? (
        <AppText variant="small" color="muted" numberOfLines={1}>
          {user.accountName}
        </AppText>
      ) : null}
    </View>
  );
  const status = user.disabled ? <Badge label="Turned off" tone="danger" testID={`user-${user.id}-status`} /> : <Badge label="Active" tone="sage" testID={`user-${user.id}-status`} />;
  const actions = (
    <View style={styles.actions}>
      <Button label="Change role" small variant="secondary" onPress={editing ? () => setEditing(false) : startEdit} testID={`user-${user.id}-change-role`} accessibilityLabel={`Change role for ${user.name}`} />
      {isSelf ? null : (
        <Button
          label={user.disabled ? "Turn on" : "Turn off"}
          small
          variant={user.disabled ? "accent" : "ghost"}
          busy={mutation.isPending && !editing}
          onPress={toggleDisabled}
          testID={`user-${user.id}-toggle`}
          accessibilityLabel={`${user.disabled ? "Turn on" : "Turn off"} sign-in for ${user.name}`}
        />
      )}
    </View>
  );

  return (
    <View style={[styles.row, !wide && styles.card]} testID={`user-row-${user.id}`}>
      {wide ? (
        <View style={styles.wideLine}>
          <View style={{ flex: 2.2 }}>{who}</View>
          <View style={{ flex: 1.4 }}>{roleCell}</View>
          <View style={{ flex: 0.9 }}>{status}</View>
          <View style={{ flex: 1.2 }}>
            <AppText variant="small" color="muted">
              {formatDateTime(user.lastSignInAt, timeZone)}
            </AppText>
          </View>
          <View style={{ flex: 2 }}>{actions}</View>
        </View>
      ) : (
        <View style={styles.narrow}>
          <View style={styles.narrowTop}>
            {who}
            {status}
          </View>
          {roleCell}
          <AppText variant="small" color="muted">{`Last signed in: ${formatDateTime(user.lastSignInAt, timeZone)}`}</AppText>
          {actions}
        </View>
      )}
      {done ? <Notice message={done} testID={`user-${user.id}-done`} /> : null}
      <FormError message={error} testID={`user-${user.id}-error`} />
      {editing ? (
        <View style={styles.editor} testID={`user-${user.id}-editor`}>
          <ChoiceGroup<Role> label={`New role for ${user.name}`} choices={ROLE_CHOICES} value={role} onChange={setRole} error={fields.role} testID={`user-${user.id}-role`} />
          {role === "buyer" ? <AccountPicker value={accountId} onChange={setAccountId} error={fields.accountId} testID={`user-${user.id}-account`} /> : null}
          <View style={styles.actions}>
            <Button label="Save role" small busy={mutation.isPending} onPress={saveRole} testID={`user-${user.id}-save-role`} />
            <Button label="Cancel" small variant="ghost" onPress={() => setEditing(false)} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.sm, paddingVertical: space.md, paddingHorizontal: space.md },
  card: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: space.lg },
  wideLine: { flexDirection: "row", alignItems: "center", gap: space.md },
  narrow: { gap: space.sm },
  narrowTop: { flexDirection: "row", justifyContent: "space-between", alignItems: "flex-start", gap: space.sm },
  who: { flexShrink: 1, minWidth: 0, gap: space.xxs },
  nameLine: { flexDirection: "row", alignItems: "center", gap: space.sm },
  shrink: { flexShrink: 1 },
  roleCell: { gap: space.xxs, alignItems: "flex-start" },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  editor: { gap: space.md, padding: space.md, borderRadius: radii.md, backgroundColor: colors.sunken },
});
