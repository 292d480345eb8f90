import React, { useState } from "react";
import { Linking, Platform, StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { useCalendarFeedQuery, useRevokeFeedMutation, useRotateFeedMutation } from "../../api/feed";
import { messageOf } from "../../api/client";
import { colors, radii, space } from "../../theme";

/** The same address with the webcal: scheme, which phones open in their calendar app. */
export function webcalUrl(url: string): string {
  return url.replace(/^https?:\/\//i, "webcal://");
}

async function copyText(text: string): Promise<boolean> {
  const clip = (globalThis as { navigator?: { clipboard?: { writeText?: (t: string) => Promise<void> } } }).navigator?.clipboard;
  if (!clip?.writeText) return false;
  try {
    await clip.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/**
 * The account's private delivery calendar: an address any calendar app can subscribe to, with copy,
 * a new address (the old one stops working) and turning it off. `accountId` for the owner.
 */
export function CalendarFeedCard({ accountId }: { accountId?: number }) {
  const office = accountId !== undefined;
  const feed = useCalendarFeedQuery(accountId);
  const rotate = useRotateFeedMutation(accountId);
  const revoke = useRevokeFeedMutation(accountId);
  const [note, setNote] = useState<string | null>(null);
  const [confirm, setConfirm] = useState<"rotate" | "revoke" | null>(null);
  const error = rotate.error ?? revoke.error;

  const copy = async (url: string) => {
    setNote((await copyText(url)) ? "Link copied. Paste it into your calendar app." : "Select the link above and copy it.");
  };

  return (
    <Card title={office ? "Delivery calendar link" : "Deliveries in your calendar"} testID="feed-card">
      <AppText color="muted">
        {office
          ? "A private calendar address for this account's deliveries, kept up to date as orders change. The account's buyers can make or change it from their Account screen too."
          : "Subscribe to this private link and every delivery shows up in your phone or computer calendar, kept up to date as orders change. Anyone with the link can see your delivery dates, so keep it to your team."}
      </AppText>
      <QueryStates
        query={feed}
        loadingLabel="Loading your calendar link…"
        loadingTestID="feed-loading"
        errorTitle="The calendar link didn't load"
        errorTestID="feed-error"
        isEmpty={(url) => !url}
        empty={
          <>
            <AppText testID="feed-none">There's no calendar link yet.</AppText>
            <Button label="Make a calendar link" icon="calendar" busy={rotate.isPending} onPress={() => { setNote(null); rotate.mutate(); }} testID="feed-create" />
          </>
        }
      >
        {(url) =>
          url ? (
            <>
              <View style={styles.urlBox}>
                <AppText variant="label">Your calendar link</AppText>
                <AppText variant="bodyStrong" color="ink" selectable testID="feed-url" style={styles.url}>
                  {url}
                </AppText>
              </View>
              <View style={styles.buttons}>
                <Button label="Copy link" icon="copy" onPress={() => copy(url)} testID="feed-copy" />
                <Button
                  label="Open in calendar app"
                  icon="external-link"
                  variant="secondary"
                  onPress={() => {
                    Linking.openURL(webcalUrl(url)).catch(() => setNote("This device has no calendar app for the link. Copy it instead."));
                  }}
                  testID="feed-open"
                />
              </View>
              {note ? <Notice tone="info" message={note} testID="feed-note" /> : null}
              <View style={styles.help} testID="feed-help">
                {/* General steps, not any one app's menus: subscribing by address is what iCalendar feeds are for (RFC 5545). */}
                <AppText variant="label">Adding it to your calendar</AppText>
                <AppText variant="small" color="ink" testID="feed-step-1">
                  1. Copy the link above, or tap “Open in calendar app” on the device whose calendar you use.
                </AppText>
                <AppText variant="small" color="ink" testID="feed-step-2">
                  2. In your calendar app, add a calendar by its link (often called subscribing to a calendar) and paste the link.
                </AppText>
                <AppText variant="small" color="ink" testID="feed-step-3">
                  3. If you add it on a computer, the deliveries also show on phones signed in to the same calendar.
                </AppText>
                <AppText variant="small" color="ink">
                  {`The link also works starting with webcal:// (${Platform.OS === "web" ? "some apps ask for that form" : "the button uses it"}). Calendar apps check for changes every few hours.`}
                </AppText>
              </View>
              {confirm ? (
                <View style={styles.confirm} testID="feed-confirm">
                  <AppText variant="bodyStrong" color="dangerInk">
                    {confirm === "rotate" ? "Make a new link? The current one stops working at once." : "Turn the link off? Calendars subscribed to it stop updating."}
                  </AppText>
                  <View style={styles.buttons}>
                    <Button
                      label={confirm === "rotate" ? "Yes, new link" : "Yes, turn it off"}
                      variant="danger"
                      busy={rotate.isPending || revoke.isPending}
                      onPress={() => {
                        setNote(null);
                        const done = { onSettled: () => setConfirm(null) };
                        if (confirm === "rotate") rotate.mutate(undefined, done);
                        else revoke.mutate(undefined, done);
                      }}
                      testID="feed-confirm-yes"
                    />
                    <Button label="Keep it" variant="secondary" onPress={() => setConfirm(null)} testID="feed-confirm-no" />
                  </View>
                </View>
              ) : (
                <View style={styles.buttons}>
                  <Button label="Make a new link" icon="refresh-cw" variant="ghost" onPress={() => setConfirm("rotate")} testID="feed-rotate" />
                  <Button label="Turn the link off" icon="slash" variant="ghost" onPress={() => setConfirm("revoke")} testID="feed-revoke" />
                </View>
              )}
            </>
          ) : null
        }
      </QueryStates>
      <FormError message={error ? messageOf(error) : null} testID="feed-action-error" />
    </Card>
  );
}

const styles = StyleSheet.create({
  urlBox: { backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xs },
  url: { fontFamily: "Nunito_600SemiBold" },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  help: { gap: space.xs },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
});
