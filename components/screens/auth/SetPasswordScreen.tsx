import React, { useState } from "react";
import type { z } from "zod";
import { StyleSheet, View } from "react-native";
import { Redirect } from "expo-router";
import { AuthFrame } from "./AuthFrame";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { TextLink } from "../../ui/TextLink";
import { LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useAuth } from "../../auth/useAuth";
import { homePathFor } from "../../auth/homePath";
import { useInvitationAcceptMutation, useInvitationPreviewQuery, usePasswordResetConfirmMutation } from "../../api/auth";
import { messageOf } from "../../api/client";
import { useZodForm } from "../../forms/useZodForm";
import { invitationAcceptSchema, passwordResetConfirmSchema, type SignInResponse } from "../../../shared/schemas/auth";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from "../../../shared/schemas/common";
import { ROLE_LABELS } from "../../../shared/roles";
import { withConfirmation } from "./newPassword";
import { colors, radii, space } from "../../theme";

export type SetPasswordKind = "invite" | "reset";

export interface SetPasswordScreenProps {
  kind: string | undefined;
  token: string | undefined;
  email?: string;
}

/** One screen for both links the bakery e-mails: accepting an invitation, and resetting a password. */
export function SetPasswordScreen({ kind, token, email }: SetPasswordScreenProps) {
  const { status, user, signOut } = useAuth();
  const [done, setDone] = useState(false);

  if (done && user) return <Redirect href={homePathFor(user.role)} />;

  if (kind !== "invite" && kind !== "reset") {
    return <BrokenLink message="This link is incomplete. Open it again from the e-mail, or ask for a new one." />;
  }
  if (!token) {
    return <BrokenLink kind={kind} message={`This ${kind === "invite" ? "invitation" : "reset"} link is missing its code. Open it again from the e-mail.`} />;
  }

  if (status === "signedIn" && user) {
    return (
      <AuthFrame title={kind === "invite" ? "Accept your invitation" : "Choose a new password"} testID="set-password-screen">
        <Notice tone="info" message={`You're signed in as ${user.name} (${user.email}). Sign out first to use this link.`} />
        <Button label="Sign out and continue" onPress={signOut} testID="set-password-sign-out" block />
        <TextLink href={homePathFor(user.role)} label="Stay signed in and go home" />
      </AuthFrame>
    );
  }

  return kind === "invite" ? (
    <AcceptInvitation token={token} email={email} onDone={() => setDone(true)} />
  ) : (
    <ResetPassword token={token} onDone={() => setDone(true)} />
  );
}

function BrokenLink({ message, kind }: { message: string; kind?: SetPasswordKind }) {
  return (
    <AuthFrame title="This link doesn't work" testID="set-password-screen">
      <FormError message={message} testID="set-password-link-error" />
      {kind !== "invite" ? <TextLink href="/forgot-password" label="Ask for a new reset link" /> : null}
      <TextLink href="/sign-in" label="Go to sign in" />
    </AuthFrame>
  );
}

function AcceptInvitation({ token, email, onDone }: { token: string; email?: string; onDone: () => void }) {
  const preview = useInvitationPreviewQuery(token);
  const mutation = useInvitationAcceptMutation();

  if (preview.isPending) {
    return (
      <AuthFrame title="Accept your invitation" testID="set-password-screen">
        <LoadingState label="Checking your invitation…" />
      </AuthFrame>
    );
  }
  if (preview.isError) {
    return (
      <AuthFrame title="This invitation doesn't work" testID="set-password-screen">
        <FormError message={messageOf(preview.error)} testID="set-password-link-error" />
        <AppText color="muted">Ask the bakery&apos;s owner to send you a new invitation.</AppText>
        <TextLink href="/sign-in" label="Go to sign in" />
      </AuthFrame>
    );
  }

  const invite = preview.data;
  return (
    <AuthFrame title="Accept your invitation" intro="Choose how you'll sign in to Panwise." testID="set-password-screen">
      <View style={styles.who} testID="invitation-for">
        <AppText variant="caption" color="muted">
          Invitation for
        </AppText>
        <AppText variant="bodyStrong">{invite.email || email}</AppText>
        <AppText color="muted">as {ROLE_LABELS[invite.role]}</AppText>
      </View>
      <NewPasswordForm schema={INVITE_SCHEMA} token={token} name={invite.name ?? ""} send={(input) => mutation.mutateAsync(input)} onDone={onDone} submitLabel="Create my sign-in" />
    </AuthFrame>
  );
}

function ResetPassword({ token, onDone }: { token: string; onDone: () => void }) {
  const mutation = usePasswordResetConfirmMutation();
  return (
    <AuthFrame title="Choose a new password" intro="You'll be signed in straight after." testID="set-password-screen">
      <NewPasswordForm schema={RESET_SCHEMA} token={token} send={(input) => mutation.mutateAsync(input)} onDone={onDone} submitLabel="Save new password" resetLinkOnError />
    </AuthFrame>
  );
}

const INVITE_SCHEMA = withConfirmation(invitationAcceptSchema);
const RESET_SCHEMA = withConfirmation(passwordResetConfirmSchema);

interface NewPasswordFormProps<S extends typeof INVITE_SCHEMA | typeof RESET_SCHEMA> {
  schema: S;
  token: string;
  /** Asked for (and started from the invitation's name) when accepting an invitation. */
  name?: string;
  send: (input: z.output<S>) => Promise<SignInResponse>;
  onDone: () => void;
  submitLabel: string;
  /** A failed reset offers a new reset link. */
  resetLinkOnError?: boolean;
}

/** Both links' form: (your name,) the new password twice; signs in with the session the server answers. */
function NewPasswordForm<S extends typeof INVITE_SCHEMA | typeof RESET_SCHEMA>({ schema, token, name, send, onDone, submitLabel, resetLinkOnError }: NewPasswordFormProps<S>) {
  const { signIn } = useAuth();
  const withName = name !== undefined;
  const form = useZodForm({
    schema,
    initial: { name: name ?? "", password: "", confirm: "" },
    toInput: (v) => ({ token, password: v.password, confirm: v.confirm, ...(withName ? { name: v.name } : {}) }),
    fields: withName ? INVITE_FIELDS : RESET_FIELDS,
    manyMessage: null,
  });
  const { errors } = form;
  const submit = () =>
    void form.submit(async (input) => {
      signIn(await send(input as z.output<S>));
      onDone();
    });

  return (
    <>
      <FormError message={form.formError} testID="set-password-error" />
      {withName ? <TextField label="Your name" accessibilityLabel="Your name" testID="set-password-name" {...form.text("name")} autoComplete="name" textContentType="name" /> : null}
      <TextField
        label="New password"
        accessibilityLabel="New password"
        hint={`${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters; spaces in a row count once. A few unrelated words work well; common passwords are refused.`}
        testID="set-password-password"
        {...form.text("password")}
        secureTextEntry
        autoCapitalize="none"
        autoComplete="new-password"
        textContentType="newPassword"
      />
      <TextField
        label="Confirm new password"
        accessibilityLabel="Confirm new password"
        testID="set-password-confirm"
        {...form.text("confirm")}
        error={errors.confirm}
        secureTextEntry
        autoCapitalize="none"
        autoComplete="new-password"
        textContentType="newPassword"
        returnKeyType="go"
        onSubmitEditing={submit}
      />
      <Button label={submitLabel} testID="set-password-submit" onPress={submit} busy={form.submitting} block />
      {resetLinkOnError && form.formError ? <TextLink href="/forgot-password" label="Ask for a new reset link" /> : null}
    </>
  );
}

const INVITE_FIELDS = ["name", "password", "confirm"] as const;
const RESET_FIELDS = ["password", "confirm"] as const;

const styles = StyleSheet.create({
  who: { gap: space.xxs, padding: space.md, borderRadius: radii.md, backgroundColor: colors.sunken },
});
