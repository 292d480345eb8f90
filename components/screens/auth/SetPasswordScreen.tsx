import React, { useState } from "react";
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
import { splitError, validate } from "../../forms/errors";
import { invitationAcceptSchema, passwordResetConfirmSchema, type SignInResponse } from "../../../shared/schemas/auth";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from "../../../shared/schemas/common";
import { ROLE_LABELS } from "../../../shared/roles";
import type { FieldErrors } from "../../../shared/errors";
import { colors, radii, space } from "../../theme";

export type SetPasswordKind = "invite" | "reset";

export interface SetPasswordScreenProps {
  kind: string | undefined;
  token: string | undefined;
  email?: string;
}

export const PASSWORD_MISMATCH = "The two passwords don't match.";

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

function usePasswordPair() {
  const [password, setPassword] = useState("");
  const [confirm, setConfirm] = useState("");
  return { password, setPassword, confirm, setConfirm };
}

/** Client-side checks for both forms: the shared schema, then the confirmation. */
export function checkNewPassword<T>(
  result: { ok: true; data: T } | { ok: false; fields: FieldErrors },
  password: string,
  confirm: string,
): { ok: true; data: T } | { ok: false; fields: FieldErrors } {
  const fields: FieldErrors = result.ok ? {} : { ...result.fields };
  if (!fields.password && password !== confirm) fields.confirm = PASSWORD_MISMATCH;
  if (!confirm && !fields.confirm) fields.confirm = "Type the password again.";
  if (Object.keys(fields).length || !result.ok) return { ok: false, fields };
  return result;
}

function PasswordFields({
  pair,
  fields,
  onSubmit,
}: {
  pair: ReturnType<typeof usePasswordPair>;
  fields: FieldErrors;
  onSubmit: () => void;
}) {
  return (
    <>
      <TextField
        label="New password"
        accessibilityLabel="New password"
        hint={`${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters; spaces in a row count once. A few unrelated words work well; common passwords are refused.`}
        testID="set-password-password"
        value={pair.password}
        onChangeText={pair.setPassword}
        error={fields.password}
        secureTextEntry
        autoCapitalize="none"
        autoComplete="new-password"
        textContentType="newPassword"
      />
      <TextField
        label="Confirm new password"
        accessibilityLabel="Confirm new password"
        testID="set-password-confirm"
        value={pair.confirm}
        onChangeText={pair.setConfirm}
        error={fields.confirm}
        secureTextEntry
        autoCapitalize="none"
        autoComplete="new-password"
        textContentType="newPassword"
        returnKeyType="go"
        onSubmitEditing={onSubmit}
      />
    </>
  );
}

function AcceptInvitation({ token, email, onDone }: { token: string; email?: string; onDone: () => void }) {
  const { signIn } = useAuth();
  const preview = useInvitationPreviewQuery(token);
  const mutation = useInvitationAcceptMutation();
  const pair = usePasswordPair();
  const [name, setName] = useState<string | null>(null);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

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
  const shownName = name ?? invite.name ?? "";

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = checkNewPassword(validate(invitationAcceptSchema, { token, password: pair.password, name: shownName }), pair.password, pair.confirm);
    if (!checked.ok) {
      setFields(checked.fields);
      if (checked.fields.token) setFormError(checked.fields.token);
      return;
    }
    setFields({});
    mutation.mutate(checked.data, {
      onSuccess: (session: SignInResponse) => {
        signIn(session);
        onDone();
      },
      onError: (err) => {
        const split = splitError(err, ["name", "password"]);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <AuthFrame title="Accept your invitation" intro="Choose how you'll sign in to Panwise." testID="set-password-screen">
      <View style={styles.who} testID="invitation-for">
        <AppText variant="caption" color="muted">
          Invitation for
        </AppText>
        <AppText variant="bodyStrong">{invite.email || email}</AppText>
        <AppText color="muted">as {ROLE_LABELS[invite.role]}</AppText>
      </View>
      <FormError message={formError} testID="set-password-error" />
      <TextField
        label="Your name"
        accessibilityLabel="Your name"
        testID="set-password-name"
        value={shownName}
        onChangeText={setName}
        error={fields.name}
        autoComplete="name"
        textContentType="name"
      />
      <PasswordFields pair={pair} fields={fields} onSubmit={submit} />
      <Button label="Create my sign-in" testID="set-password-submit" onPress={submit} busy={mutation.isPending} block />
    </AuthFrame>
  );
}

function ResetPassword({ token, onDone }: { token: string; onDone: () => void }) {
  const { signIn } = useAuth();
  const mutation = usePasswordResetConfirmMutation();
  const pair = usePasswordPair();
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = checkNewPassword(validate(passwordResetConfirmSchema, { token, password: pair.password }), pair.password, pair.confirm);
    if (!checked.ok) {
      setFields(checked.fields);
      if (checked.fields.token) setFormError(checked.fields.token);
      return;
    }
    setFields({});
    mutation.mutate(checked.data, {
      onSuccess: (session: SignInResponse) => {
        signIn(session);
        onDone();
      },
      onError: (err) => {
        const split = splitError(err, ["password"]);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <AuthFrame title="Choose a new password" intro="You'll be signed in straight after." testID="set-password-screen">
      <FormError message={formError} testID="set-password-error" />
      <PasswordFields pair={pair} fields={fields} onSubmit={submit} />
      <Button label="Save new password" testID="set-password-submit" onPress={submit} busy={mutation.isPending} block />
      {formError ? <TextLink href="/forgot-password" label="Ask for a new reset link" /> : null}
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  who: { gap: space.xxs, padding: space.md, borderRadius: radii.md, backgroundColor: colors.sunken },
});
