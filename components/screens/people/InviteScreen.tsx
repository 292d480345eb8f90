import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useCreateInvitationMutation } from "../../api/invitations";
import { splitError, validate } from "../../forms/errors";
import { invitationCreateSchema } from "../../../shared/schemas/users";
import type { FieldErrors } from "../../../shared/errors";
import type { Role } from "../../../shared/roles";
import { AccountPicker } from "./AccountPicker";
import { ROLE_CHOICES } from "./roleChoices";
import { space } from "../../theme";

const FIELDS = ["email", "role", "accountId", "name"] as const;

/** The owner invites someone: an e-mail goes out with a link to set a password. */
export function InviteScreen() {
  const router = useRouter();
  const mutation = useCreateInvitationMutation();
  const [email, setEmail] = useState("");
  const [name, setName] = useState("");
  const [role, setRole] = useState<Role | null>(null);
  const [accountId, setAccountId] = useState<number | null>(null);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const input = {
      email,
      role: role ?? undefined,
      accountId: role === "buyer" ? accountId : undefined,
      name: name.trim() ? name : undefined,
    };
    const checked = validate(invitationCreateSchema, input);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    mutation.mutate(checked.data, {
      onSuccess: (inv) => router.replace({ pathname: "/office/people", params: { invited: inv.email } }),
      onError: (err) => {
        const split = splitError(err, FIELDS);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <Screen narrow testID="invite-screen">
      <TextLink href="/office/people" label="‹ People" />
      <PageHeader title="Invite someone" subtitle="They'll get an e-mail with a link to choose their password. The link works for 3 days." />
      <Card testID="invite-form">
        <FormError message={formError} testID="invite-error" />
        <TextField
          label="E-mail"
          testID="invite-email"
          value={email}
          onChangeText={setEmail}
          error={fields.email}
          keyboardType="email-address"
          inputMode="email"
          autoCapitalize="none"
          autoCorrect={false}
        />
        <TextField label="Name" optional hint="They can change it when they accept." testID="invite-name" value={name} onChangeText={setName} error={fields.name} autoCapitalize="words" />
        <ChoiceGroup<Role>
          label="Role"
          layout="list"
          testID="invite-role"
          choices={ROLE_CHOICES}
          value={role}
          onChange={(r) => {
            setRole(r);
            setFields((f) => ({ ...f, role: "", accountId: "" }));
          }}
          error={fields.role}
        />
        {role === "buyer" ? (
          <AccountPicker value={accountId} onChange={setAccountId} error={fields.accountId} testID="invite-account" />
        ) : fields.accountId ? (
          <AppText variant="small" color="dangerInk">
            {fields.accountId}
          </AppText>
        ) : null}
        <View style={styles.buttons}>
          <Button label="Send invitation" icon="send" onPress={submit} busy={mutation.isPending} testID="invite-submit" />
          <TextLink href="/office/people" label="Cancel" />
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.lg },
});
