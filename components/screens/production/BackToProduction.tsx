import React from "react";
import { TextLink } from "../../ui/TextLink";
import type { KitchenPaths } from "../../production/paths";

/** "‹ Production", where the area has a production hub (the office; the baker's home is the bake day). */
export function BackToProduction({ paths }: { paths: KitchenPaths }) {
  return paths.hub ? <TextLink href={paths.hub} label="‹ Production" testID="back-to-production" /> : null;
}
