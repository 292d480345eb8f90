import React from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { RoleBadge } from "../../ui/Badge";
import { useSignedInUser } from "../../auth/useAuth";
import { usePasswordResetRequestMutation } from "../../api/auth";
import { messageOf } from "../../api/client";

/** "You": who is signed in, and a way to change the password (Sign out sits in the navigation). */
export function ProfileScreen() {
  const user = useSignedInUser();
  const reset = usePasswordResetRequestMutation();
  return (
    <Screen narrow testID="profile-screen">
      <PageHeader overline="Profile" title={user.name} />
      <Card title="Details">
        <DetailList
          items={[
            { label: "Name", value: user.name },
            { label: "E-mail", value: user.email },
            { label: "Role", value: <RoleBadge role={user.role} /> },
          ]}
        />
      </Card>
      <Card title="Password">
        <AppText color="muted">We&apos;ll e-mail you a link to choose a new password. The link works for one hour.</AppText>
        {reset.isSuccess ? <Notice message={reset.data.message} testID="profile-reset-sent" /> : null}
        <FormError message={reset.isError ? messageOf(reset.error) : null} />
        <Button
          label={reset.isSuccess ? "Send another link" : "E-mail me a reset link"}
          icon="mail"
          variant="secondary"
          busy={reset.isPending}
          onPress={() => reset.mutate({ email: user.email })}
          testID="profile-reset"
        />
      </Card>
    </Screen>
  );
}
