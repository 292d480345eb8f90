import React from "react";
import type { UseQueryResult } from "@tanstack/react-query";
import { EmptyState, ErrorState, LoadingState, type EmptyStateProps } from "./States";

export interface QueryStatesProps<T> {
  query: Pick<UseQueryResult<T>, "isPending" | "isError" | "error" | "data" | "refetch" | "isFetching">;
  /** "Loading the account…" */
  loadingLabel?: string;
  /** "The account didn't load" */
  errorTitle?: string;
  /** Prefix for the states' testIDs: "<testID>-loading", "<testID>-error", "<testID>-empty". */
  testID?: string;
  loadingTestID?: string;
  errorTestID?: string;
  /** When the data counts as empty, `empty` is shown instead of the children (default: a list with no rows). */
  isEmpty?: (data: T) => boolean;
  empty?: EmptyStateProps | React.ReactNode;
  children: (data: T) => React.ReactNode;
}

function isEmptyProps(value: unknown): value is EmptyStateProps {
  return !!value && typeof value === "object" && !React.isValidElement(value) && "title" in (value as object);
}

/**
 * The one way a screen shows a query: a spinner with what is loading, the error with "Try again", the
 * empty state, or the data. Every screen gets all four states from the same place.
 */
export function QueryStates<T>({ query, loadingLabel, errorTitle, testID, loadingTestID, errorTestID, isEmpty, empty, children }: QueryStatesProps<T>) {
  if (query.isPending) return <LoadingState label={loadingLabel} testID={loadingTestID ?? (testID ? `${testID}-loading` : undefined)} />;
  if (query.isError)
    return (
      <ErrorState
        error={query.error}
        title={errorTitle}
        onRetry={() => void query.refetch()}
        retrying={query.isFetching}
        testID={errorTestID ?? (testID ? `${testID}-error` : undefined)}
      />
    );
  const data = query.data as T;
  if (empty && (isEmpty ? isEmpty(data) : Array.isArray(data) && data.length === 0)) {
    return isEmptyProps(empty) ? <EmptyState testID={testID ? `${testID}-empty` : undefined} {...empty} /> : <>{empty}</>;
  }
  return <>{children(data)}</>;
}
