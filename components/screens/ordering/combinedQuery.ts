import type { QueryStatesProps } from "../../ui/QueryStates";

type QueryLike = { isError: boolean; error: unknown; isFetching: boolean; refetch: () => Promise<unknown> };

/**
 * Several queries a screen needs, as one for `QueryStates`: the first that failed (its error and its retry),
 * else pending until `data` can be made from them all, else `data`.
 */
export function combinedQuery<T>(queries: readonly QueryLike[], data: T | undefined): QueryStatesProps<T>["query"] {
  const failed = queries.find((q) => q.isError);
  const result = {
    isPending: !failed && data === undefined,
    isError: !!failed,
    error: failed ? failed.error : null,
    data: failed ? undefined : data,
    isFetching: failed?.isFetching ?? false,
    refetch: () => (failed ?? queries[0]).refetch(),
  };
  // The retry's result is never read (QueryStates only starts it), so its type is the one QueryStates names.
  return result as unknown as QueryStatesProps<T>["query"];
}
