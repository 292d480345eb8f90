import React from "react";
import { Card } from "../../../ui/Card";
import { DetailList } from "../../../ui/DetailList";
import { QueryStates } from "../../../ui/QueryStates";
import { TextLink } from "../../../ui/TextLink";
import { AppText } from "../../../ui/Text";
import { useProductionSettingsQuery } from "../../../api/production";
import { settingsLines } from "../../../production/plan";
import type { Units } from "../../../production/units";
import type { KitchenPaths } from "../../../production/paths";

/** The owner's production settings, read-only here (the owner edits them in the office). */
export function SettingsFooter({ units, paths, isOwner }: { units: Units; paths: KitchenPaths; isOwner: boolean }) {
  const settings = useProductionSettingsQuery();
  return (
    <Card title="Production settings" testID="production-settings-summary">
      <QueryStates query={settings} loadingLabel="Loading the settings…" errorTitle="The settings didn't load" testID="settings">
        {(data) => {
          const lines = settingsLines(data, units);
          return (
            <DetailList
              items={[
                { label: data.mixers.length === 1 ? "Mixer" : "Mixers", value: lines.mixers, testID: "setting-mixer" },
                { label: "Dispatch", value: data.dispatchTime, testID: "setting-dispatch" },
                { label: data.ovens.length === 1 ? "Oven" : "Ovens", value: lines.ovens, testID: "setting-ovens" },
                { label: "Crew", value: lines.crew, testID: "setting-crew" },
              ]}
            />
          );
        }}
      </QueryStates>
      {isOwner && paths.settings ? (
        <TextLink href={paths.settings} label="Change production settings" testID="open-production-settings" />
      ) : (
        <AppText variant="small" color="muted">
          The owner sets these in the office.
        </AppText>
      )}
    </Card>
  );
}
