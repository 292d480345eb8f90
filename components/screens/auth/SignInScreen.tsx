import React, { useRef, useState } from "react";
import { StyleSheet, View, type TextInput } from "react-native";
import { AuthFrame } from "./AuthFrame";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError } from "../../ui/FormError";
import { TextLink } from "../../ui/TextLink";
import { useAuth } from "../../auth/useAuth";
import { useSignInMutation } from "../../api/auth";
import { splitError, validate } from "../../forms/errors";
import { signInSchema } from "../../../shared/schemas/auth";
import type { FieldErrors } from "../../../shared/errors";
import { space } from "../../theme";

const FIELDS = ["email", "password"] as const;

export function SignInScreen() {
  const { signIn, endedMessage } = useAuth();
  const mutation = useSignInMutation();
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const passwordRef = useRef<TextInput>(null);

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = validate(signInSchema, { email, password });
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    mutation.mutate(checked.data, {
      onSuccess: (session) => signIn(session),
      onError: (err) => {
        const split = splitError(err, FIELDS);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  const topMessage = formError ?? (mutation.isIdle ? endedMessage : null);

  return (
    <AuthFrame title="Sign in to Panwise" intro="Use the e-mail address the bakery invited." testID="sign-in-screen">
      <FormError message={topMessage} testID="sign-in-error" />
      <View style={styles.fields}>
        <TextField
          label="E-mail"
          accessibilityLabel="E-mail"
          testID="sign-in-email"
          value={email}
          onChangeText={setEmail}
          error={fields.email}
          keyboardType="email-address"
          autoCapitalize="none"
          autoCorrect={false}
          autoComplete="email"
          textContentType="username"
          inputMode="email"
          returnKeyType="next"
          onSubmitEditing={() => passwordRef.current?.focus()}
          submitBehavior="submit"
        />
        <TextField
          ref={passwordRef}
          label="Password"
          accessibilityLabel="Password"
          testID="sign-in-password"
          value={password}
          onChangeText={setPassword}
          error={fields.password}
          secureTextEntry
          autoCapitalize="none"
          autoComplete="current-password"
          textContentType="password"
          returnKeyType="go"
          onSubmitEditing={submit}
        />
      </View>
      <Button label="Sign in" testID="sign-in-submit" onPress={submit} busy={mutation.isPending} block />
      <TextLink href="/forgot-password" label="Forgot your password?" testID="forgot-password-link" />
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
});
