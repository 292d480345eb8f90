import React, { useState } from "react";
import { AuthFrame } from "./AuthFrame";
import { EMAIL_INPUT, TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { TextLink } from "../../ui/TextLink";
import { usePasswordResetRequestMutation } from "../../api/auth";
import { useZodForm } from "../../forms/useZodForm";
import { passwordResetRequestSchema } from "../../../shared/schemas/auth";

const FIELDS = ["email"] as const;

export function ForgotPasswordScreen() {
  const mutation = usePasswordResetRequestMutation();
  const form = useZodForm({ schema: passwordResetRequestSchema, initial: { email: "" }, fields: FIELDS, manyMessage: null });
  const [sent, setSent] = useState<string | null>(null);

  const submit = () => void form.submit(async (input) => setSent((await mutation.mutateAsync(input)).message));

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
          <FormError message={form.formError} />
          <TextField
            label="E-mail"
            accessibilityLabel="E-mail"
            testID="forgot-password-email"
            {...form.text("email")}
            {...EMAIL_INPUT}
            autoComplete="email"
            returnKeyType="send"
            onSubmitEditing={submit}
          />
          <Button label="Send reset link" testID="forgot-password-submit" onPress={submit} busy={form.submitting} block />
        </>
      )}
      <TextLink href="/sign-in" label="Back to sign in" testID="back-to-sign-in" />
    </AuthFrame>
  );
}
