import React, { useState } from "react";
import { AuthFrame } from "./AuthFrame";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { TextLink } from "../../ui/TextLink";
import { usePasswordResetRequestMutation } from "../../api/auth";
import { splitError, validate } from "../../forms/errors";
import { passwordResetRequestSchema } from "../../../shared/schemas/auth";
import type { FieldErrors } from "../../../shared/errors";

export function ForgotPasswordScreen() {
  const mutation = usePasswordResetRequestMutation();
  const [email, setEmail] = useState("");
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = validate(passwordResetRequestSchema, { email });
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    mutation.mutate(checked.data, {
      onSuccess: (res) => setSent(res.message),
      onError: (err) => {
        const split = splitError(err, ["email"]);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <AuthFrame
      title="Reset your password"
      intro="Enter the e-mail you sign in with. We'll send a link to choose a new password."
      testID="forgot-password-screen"
    >
      {sent ? (
        <>
          <Notice message={sent} testID="forgot-password-sent" />
          <Button label="Send again" variant="secondary" onPress={() => setSent(null)} />
        </>
      ) : (
        <>
          <FormError message={formError} />
          <TextField
            label="E-mail"
            accessibilityLabel="E-mail"
            testID="forgot-password-email"
            value={email}
            onChangeText={setEmail}
            error={fields.email}
            keyboardType="email-address"
            inputMode="email"
            autoCapitalize="none"
            autoCorrect={false}
            autoComplete="email"
            returnKeyType="send"
            onSubmitEditing={submit}
          />
          <Button label="Send reset link" testID="forgot-password-submit" onPress={submit} busy={mutation.isPending} block />
        </>
      )}
      <TextLink href="/sign-in" label="Back to sign in" testID="back-to-sign-in" />
    </AuthFrame>
  );
}
