import React from "react";
import { BakeDayScreen } from "../production/BakeDayScreen";

/**
 * The baker's home is the bake day itself: the next bake day (or ?date=) with its pans, weigh-out
 * cards and timeline, so the first screen after sign-in is the one the night's work runs from.
 */
export function BakerHome({ date }: { date?: string }) {
  return <BakeDayScreen area="baker" date={date} home />;
}
