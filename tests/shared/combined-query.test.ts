/** Several queries as one for QueryStates (components/screens/ordering/combinedQuery.ts). */
import { combinedQuery } from "../../components/screens/ordering/combinedQuery";

const query = (q: { isError?: boolean; error?: unknown; isFetching?: boolean } = {}) => ({ isError: false, error: null, isFetching: false, refetch: jest.fn(async () => undefined), ...q });

test("pending until the data can be made, then the data", () => {
  expect(combinedQuery([query(), query()], undefined)).toMatchObject({ isPending: true, isError: false, data: undefined });
  expect(combinedQuery([query(), query()], { n: 1 })).toMatchObject({ isPending: false, isError: false, data: { n: 1 } });
});

test("the first failure wins over loading and over data, and its retry is the one started", () => {
  const boom = new Error("boom");
  const ok = query();
  const failed = query({ isError: true, error: boom, isFetching: true });
  const later = query({ isError: true, error: new Error("later") });
  const c = combinedQuery([ok, failed, later], { n: 1 });
  expect(c).toMatchObject({ isPending: false, isError: true, error: boom, data: undefined, isFetching: true });
  void c.refetch();
  expect(failed.refetch).toHaveBeenCalledTimes(1);
  expect(ok.refetch).not.toHaveBeenCalled();
  expect(combinedQuery([ok, failed], undefined)).toMatchObject({ isPending: false, isError: true });
});
