import React, { useRef } from "react";
import { StyleSheet, View, type TextInput } from "react-native";
import { AuthFrame } from "./AuthFrame";
import { EMAIL_INPUT, TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError } from "../../ui/FormError";
import { TextLink } from "../../ui/TextLink";
import { useAuth } from "../../auth/useAuth";
import { useSignInMutation } from "../../api/auth";
import { useZodForm } from "../../forms/useZodForm";
import { signInSchema } from "../../../shared/schemas/auth";
import { space } from "../../theme";

const FIELDS = ["email", "password"] as const;

export function SignInScreen() {
  const { signIn, endedMessage } = useAuth();
  const mutation = useSignInMutation();
  const form = useZodForm({ schema: signInSchema, initial: { email: "", password: "" }, fields: FIELDS, manyMessage: null });
  const passwordRef = useRef<TextInput>(null);

  const submit = () => void form.submit(async (input) => signIn(await mutation.mutateAsync(input)));

  const topMessage = form.formError ?? (mutation.isIdle ? endedMessage : null);

  return (
    <AuthFrame title="Sign in to Panwise" intro="Use the e-mail address the bakery invited." testID="sign-in-screen">
      <FormError message={topMessage} testID="sign-in-error" />
      <View style={styles.fields}>
        <TextField
          label="E-mail"
          accessibilityLabel="E-mail"
          testID="sign-in-email"
          {...form.text("email")}
          {...EMAIL_INPUT}
          autoComplete="email"
          textContentType="username"
          returnKeyType="next"
          onSubmitEditing={() => passwordRef.current?.focus()}
          submitBehavior="submit"
        />
        <TextField
          ref={passwordRef}
          label="Password"
          accessibilityLabel="Password"
          testID="sign-in-password"
          {...form.text("password")}
          secureTextEntry
          autoCapitalize="none"
          autoComplete="current-password"
          textContentType="password"
          returnKeyType="go"
          onSubmitEditing={submit}
        />
      </View>
      <Button label="Sign in" testID="sign-in-submit" onPress={submit} busy={form.submitting} block />
      <TextLink href="/forgot-password" label="Forgot your password?" testID="forgot-password-link" />
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
});
