import React, { useState } from "react";
import { z } from "zod";
import { StyleSheet, View } from "react-native";
import { Button } from "../../ui/Button";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { FormError, Notice } from "../../ui/FormError";
import { Badge, RoleBadge } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { TableCell } from "../../ui/DataTable";
import { ListCard } from "../../ui/ListCard";
import { useUpdateUserMutation } from "../../api/users";
import { useBakeryTimeZone } from "../../api/bakery";
import { ApiError, messageOf } from "../../api/client";
import { useZodForm } from "../../forms/useZodForm";
import { formatDateTime } from "../../format";
import { userUpdateSchema, type UserDto } from "../../../shared/schemas/users";
import { ROLE_LABELS, type Role } from "../../../shared/roles";
import { AccountPicker } from "./AccountPicker";
import { ROLE_CHOICES } from "./roleChoices";
import { colors, radii, space } from "../../theme";

export interface UserRowProps {
  user: UserDto;
  isSelf: boolean;
  wide: boolean;
}

const ROLE_FIELDS = ["role", "accountId"] as const;

/** The people table's columns (PeopleScreen draws the header, each UserRow its cells). */
export const PEOPLE_COLUMNS = [
  { key: "person", label: "Person", flex: 2.2 },
  { key: "role", label: "Role", flex: 1.4 },
  { key: "status", label: "Sign-in", flex: 0.9 },
  { key: "last", label: "Last signed in", flex: 1.2 },
  { key: "actions", label: "", flex: 2 },
] as const;

/** A role change: the shared update schema, and a buyer needs the account they order for. */
const ROLE_CHANGE = userUpdateSchema.superRefine((v, ctx) => {
  if (v.role === "buyer" && !v.accountId) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["accountId"], message: "Choose the customer account this buyer orders for." });
});

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
  const form = useZodForm({
    schema: ROLE_CHANGE,
    initial: { role: user.role, accountId: user.accountId },
    toInput: (v) => (v.role === "buyer" ? v : { role: v.role, accountId: null }),
    fields: ROLE_FIELDS,
    manyMessage: null,
    errorMessage: userChangeMessage,
  });
  const { values, errors: fields } = form;
  const [done, setDone] = useState<string | null>(null);

  const startEdit = () => {
    form.reset({ role: user.role, accountId: user.accountId });
    setDone(null);
    setEditing(true);
  };

  const saveRole = () => {
    setDone(null);
    void form.submit(async (patch) => {
      const saved = await mutation.mutateAsync({ id: user.id, patch });
      setEditing(false);
      setDone(`${saved.name} is now ${saved.role === "owner" ? "the" : "a"} ${ROLE_LABELS[saved.role].toLowerCase()}${saved.accountName ? ` for ${saved.accountName}` : ""}.`);
    });
  };

  const toggleDisabled = () => {
    form.setFormError(null);
    setDone(null);
    mutation.mutate(
      { id: user.id, patch: { disabled: !user.disabled } },
      {
        onSuccess: (saved) => setDone(saved.disabled ? `${saved.name} can no longer sign in.` : `${saved.name} can sign in again.`),
        onError: (err) => form.setFormError(userChangeMessage(err)),
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

  const content = (
    <>
      {wide ? (
        <View style={styles.wideLine} role="row">
          <TableCell column={PEOPLE_COLUMNS[0]}>{who}</TableCell>
          <TableCell column={PEOPLE_COLUMNS[1]}>{roleCell}</TableCell>
          <TableCell column={PEOPLE_COLUMNS[2]}>{status}</TableCell>
          <TableCell column={PEOPLE_COLUMNS[3]}>
            <AppText variant="small" color="muted">
              {formatDateTime(user.lastSignInAt, timeZone)}
            </AppText>
          </TableCell>
          <TableCell column={PEOPLE_COLUMNS[4]}>{actions}</TableCell>
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
      <FormError message={form.formError} testID={`user-${user.id}-error`} />
      {editing ? (
        <View style={styles.editor} testID={`user-${user.id}-editor`}>
          <ChoiceGroup<Role> label={`New role for ${user.name}`} choices={ROLE_CHOICES} value={values.role} onChange={form.set("role")} error={fields.role} testID={`user-${user.id}-role`} />
          {values.role === "buyer" ? <AccountPicker value={values.accountId} onChange={form.set("accountId")} error={fields.accountId} testID={`user-${user.id}-account`} /> : null}
          <View style={styles.actions}>
            <Button label="Save role" small busy={form.submitting} onPress={saveRole} testID={`user-${user.id}-save-role`} />
            <Button label="Cancel" small variant="ghost" onPress={() => setEditing(false)} />
          </View>
        </View>
      ) : null}
    </>
  );
  // From 1024 px a row of the people table; on a phone a card of its own.
  return wide ? (
    <View style={styles.row} testID={`user-row-${user.id}`}>
      {content}
    </View>
  ) : (
    <ListCard testID={`user-row-${user.id}`}>
      <View style={styles.cardBody}>{content}</View>
    </ListCard>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.sm, paddingVertical: space.md, paddingHorizontal: space.md },
  cardBody: { flex: 1, minWidth: 0, gap: space.sm },
  wideLine: { flexDirection: "row", alignItems: "center" },
  narrow: { gap: space.sm },
  narrowTop: { flexDirection: "row", justifyContent: "space-between", alignItems: "flex-start", gap: space.sm },
  who: { flexShrink: 1, minWidth: 0, gap: space.xxs },
  nameLine: { flexDirection: "row", alignItems: "center", gap: space.sm },
  shrink: { flexShrink: 1 },
  roleCell: { gap: space.xxs, alignItems: "flex-start" },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  editor: { gap: space.md, padding: space.md, borderRadius: radii.md, backgroundColor: colors.sunken },
});
