import React from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { EMAIL_INPUT, TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useCreateInvitationMutation } from "../../api/invitations";
import { useZodForm } from "../../forms/useZodForm";
import { invitationCreateSchema } from "../../../shared/schemas/users";
import type { Role } from "../../../shared/roles";
import { AccountPicker } from "./AccountPicker";
import { ROLE_CHOICES } from "./roleChoices";
import { space } from "../../theme";

const FIELDS = ["email", "role", "accountId", "name"] as const;

/** The owner invites someone: an e-mail goes out with a link to set a password. */
export function InviteScreen() {
  const router = useRouter();
  const mutation = useCreateInvitationMutation();
  const form = useZodForm({
    schema: invitationCreateSchema,
    initial: { email: "", name: "", role: null as Role | null, accountId: null as number | null },
    toInput: (v) => ({
      email: v.email,
      role: v.role ?? undefined,
      accountId: v.role === "buyer" ? v.accountId : undefined,
      name: v.name.trim() ? v.name : undefined,
    }),
    fields: FIELDS,
    manyMessage: null,
  });
  const { values, errors: fields } = form;

  const submit = () =>
    void form.submit(async (input) => {
      const inv = await mutation.mutateAsync(input);
      router.replace({ pathname: "/office/people", params: { invited: inv.email } });
    });

  return (
    <Screen narrow testID="invite-screen">
      <TextLink href="/office/people" label="‹ People" />
      <PageHeader title="Invite someone" subtitle="They'll get an e-mail with a link to choose their password. The link works for 3 days." />
      <Card testID="invite-form">
        <FormError message={form.formError} testID="invite-error" />
        <TextField
          label="E-mail"
          testID="invite-email"
          {...form.text("email")}
          {...EMAIL_INPUT}
        />
        <TextField label="Name" optional hint="They can change it when they accept." testID="invite-name" {...form.text("name")} autoCapitalize="words" />
        <ChoiceGroup<Role>
          label="Role"
          layout="list"
          testID="invite-role"
          choices={ROLE_CHOICES}
          value={values.role}
          onChange={(r) => {
            form.setValue("role", r);
            form.setErrors((f) => ({ ...f, role: "", accountId: "" }));
          }}
          error={fields.role}
        />
        {values.role === "buyer" ? (
          <AccountPicker value={values.accountId} onChange={form.set("accountId")} error={fields.accountId} testID="invite-account" />
        ) : fields.accountId ? (
          <AppText variant="small" color="dangerInk">
            {fields.accountId}
          </AppText>
        ) : null}
        <View style={styles.buttons}>
          <Button label="Send invitation" icon="send" onPress={submit} busy={form.submitting} testID="invite-submit" />
          <TextLink href="/office/people" label="Cancel" />
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.lg },
});
