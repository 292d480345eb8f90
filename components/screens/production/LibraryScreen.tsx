import React from "react";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkButton } from "../../ui/LinkButton";
import { QueryStates, type QueryStatesProps } from "../../ui/QueryStates";
import type { KitchenPaths } from "../../production/paths";
import type { RoutePath } from "../../routing";
import { BackToProduction } from "./BackToProduction";

interface LinkSpec {
  href: RoutePath;
  label: string;
  testID: string;
}

export interface LibraryScreenProps<T> {
  paths: KitchenPaths;
  /** "formulas": the screen is "<name>-screen", its title "<name>-title", its states "<name>-loading" … */
  name: string;
  title: string;
  subtitle: string;
  /** The other library (formulas ↔ ingredients). */
  other: LinkSpec & { icon: React.ComponentProps<typeof Feather>["name"] };
  /** "New formula": in the header, and in the empty state. */
  add: LinkSpec;
  query: QueryStatesProps<T[]>["query"];
  loadingLabel: string;
  errorTitle: string;
  empty: { icon: React.ComponentProps<typeof Feather>["name"]; title: string; message: string };
  children: (rows: T[]) => React.ReactNode;
}

/** The kitchen's libraries (formulas, ingredients): a header with the other library and "New …", then the list's states. */
export function LibraryScreen<T>({ paths, name, title, subtitle, other, add, query, loadingLabel, errorTitle, empty, children }: LibraryScreenProps<T>) {
  return (
    <Screen testID={`${name}-screen`}>
      <BackToProduction paths={paths} />
      <PageHeader
        title={title}
        subtitle={subtitle}
        actions={
          <>
            <LinkButton href={other.href} label={other.label} icon={other.icon} variant="secondary" testID={other.testID} />
            <LinkButton href={add.href} label={add.label} icon="plus" testID={add.testID} />
          </>
        }
        testID={`${name}-title`}
      />
      <QueryStates
        query={query}
        loadingLabel={loadingLabel}
        errorTitle={errorTitle}
        testID={name}
        isEmpty={(rows) => rows.length === 0}
        empty={{ ...empty, action: <LinkButton href={add.href} label={add.label} icon="plus" /> }}
      >
        {children}
      </QueryStates>
    </Screen>
  );
}
