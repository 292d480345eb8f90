import React from "react";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { TextLink } from "../../../ui/TextLink";
import { QueryStates } from "../../../ui/QueryStates";
import { useProductionSettingsQuery } from "../../../api/production";
import { SettingsForm } from "./SettingsForm";

/** The owner's production settings: mixers, ovens, crew, packing, shift start, dispatch and overnight retard. */
export function ProductionSettingsScreen() {
  const settings = useProductionSettingsQuery();
  return (
    <Screen narrow testID="production-settings">
      <TextLink href="/office/production" label="‹ Production" testID="back-to-production" />
      <PageHeader
        title="Production settings"
        subtitle="Every plan is scheduled from these, back from dispatch: each mix on a mixer that holds it, dividing and shaping by the crew, the pans in oven loads that fit each oven."
        testID="production-settings-title"
      />
      <QueryStates query={settings} loadingLabel="Loading the settings…" errorTestID="production-settings-error">
        {(data) => <SettingsForm initial={data} />}
      </QueryStates>
    </Screen>
  );
}
