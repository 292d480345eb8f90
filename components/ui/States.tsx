import React from "react";
import { ActivityIndicator, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, radii, space } from "../theme";
import { AppText, Heading } from "./Text";
import { Button } from "./Button";
import { TextLink } from "./TextLink";
import type { Href } from "expo-router";
import { ApiError, messageOf } from "../api/client";

export function LoadingState({ label = "Loading…", testID = "loading" }: { label?: string; testID?: string }) {
  return (
    <View style={styles.center} accessibilityRole="progressbar" accessibilityLabel={label} testID={testID}>
      <ActivityIndicator size="large" color={colors.primary} />
      <AppText color="muted">{label}</AppText>
    </View>
  );
}

export interface EmptyStateProps {
  title: string;
  message?: string;
  icon?: React.ComponentProps<typeof Feather>["name"];
  action?: React.ReactNode;
  testID?: string;
}

export function EmptyState({ title, message, icon = "inbox", action, testID = "empty" }: EmptyStateProps) {
  return (
    <View style={[styles.center, styles.panel]} testID={testID}>
      <View style={styles.iconRing}>
        <Feather name={icon} size={24} color={colors.crust} />
      </View>
      <Heading level={3} align="center">
        {title}
      </Heading>
      {message ? (
        <AppText color="muted" align="center">
          {message}
        </AppText>
      ) : null}
      {action ? <View>{action}</View> : null}
    </View>
  );
}

/** The API answered 404 for the thing a page shows. */
export function isNotFound(error: unknown): boolean {
  return error instanceof ApiError && error.status === 404;
}

export interface NotFoundStateProps {
  /** "There's no such account". */
  title: string;
  message?: string;
  /** The list to go back to. */
  back: { href: Href; label: string };
  testID: string;
}

/** A page whose thing does not exist (a wrong id in the address): says so and links back to the list. */
export function NotFoundState({ title, message, back, testID }: NotFoundStateProps) {
  return (
    <>
      <EmptyState icon="help-circle" title={title} message={message} testID={testID} />
      <TextLink href={back.href} label={back.label} />
    </>
  );
}

export interface ErrorStateProps {
  error: unknown;
  title?: string;
  onRetry?: () => void;
  retrying?: boolean;
  testID?: string;
}

/** A failed query or request: what went wrong, the server's request id to quote (when it sent one), and a retry. */
export function ErrorState({ error, title = "This didn't load", onRetry, retrying, testID = "error" }: ErrorStateProps) {
  const requestId = error instanceof ApiError ? error.requestId : undefined;
  return (
    <View style={[styles.center, styles.panel, styles.errorPanel]} accessibilityRole="alert" testID={testID}>
      <Feather name="cloud-off" size={24} color={colors.dangerInk} />
      <Heading level={3} color="dangerInk" align="center">
        {title}
      </Heading>
      <AppText color="ink" align="center">
        {messageOf(error)}
      </AppText>
      {requestId ? (
        <AppText variant="small" color="muted" align="center" selectable testID={`${testID}-reference`}>
          {`Reference: ${requestId}`}
        </AppText>
      ) : null}
      {onRetry ? <Button label="Try again" icon="refresh-cw" variant="secondary" onPress={onRetry} busy={retrying} testID={`${testID}-retry`} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  center: { alignItems: "center", justifyContent: "center", gap: space.md, paddingVertical: space.xxl, paddingHorizontal: space.lg },
  panel: { borderRadius: radii.lg, borderWidth: 1, borderStyle: "dashed", borderColor: colors.border, backgroundColor: colors.surface },
  errorPanel: { borderStyle: "solid", backgroundColor: colors.dangerSoft, borderColor: colors.dangerSoft },
  iconRing: { width: 52, height: 52, borderRadius: 26, backgroundColor: colors.crustSoft, alignItems: "center", justifyContent: "center" },
});
