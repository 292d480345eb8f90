/** ErrorState (components/ui/States.tsx): the server's request id, for a person to quote. */
import { act, render, screen } from "@testing-library/react-native";
import { ErrorState, isNotFound } from "../../components/ui/States";
import { QueryStates, type QueryStatesProps } from "../../components/ui/QueryStates";
import { ApiError } from "../../components/api/client";

async function settle() {
  // The state's icon loads its font after the first render.
  await act(async () => undefined);
}

test("an API error with a request id shows it under the message", async () => {
  render(<ErrorState error={new ApiError(500, "internal", "Something went wrong on our side.", undefined, { requestId: "req-7f3a" })} title="Orders didn't load" testID="orders-error" />);
  await settle();
  expect(screen.getByTestId("orders-error")).toHaveTextContent(/Orders didn't load.*Something went wrong on our side\./);
  expect(screen.getByTestId("orders-error-reference")).toHaveTextContent("Reference: req-7f3a");
});

test("no reference line without a request id, or for an error that is not the API's", async () => {
  render(
    <>
      <ErrorState error={new ApiError(404, "not_found", "Not found.")} testID="a" />
      <ErrorState error={new Error("Network down")} testID="b" />
    </>,
  );
  await settle();
  expect(screen.getByTestId("a")).toHaveTextContent(/Not found\./);
  expect(screen.queryByTestId("a-reference")).toBeNull();
  expect(screen.queryByTestId("b-reference")).toBeNull();
});

test("a query's error through QueryStates carries the reference with the screen's testID", async () => {
  type Query = QueryStatesProps<string[]>["query"];
  const q = { isPending: false, isError: true, error: new ApiError(503, "unavailable", "Try again in a moment.", undefined, { requestId: "abc-123" }), data: undefined, refetch: jest.fn(), isFetching: false } as unknown as Query;
  render(
    <QueryStates query={q} testID="things" errorTitle="Things didn't load">
      {(rows) => rows.join(", ")}
    </QueryStates>,
  );
  await settle();
  expect(screen.getByTestId("things-error-reference")).toHaveTextContent("Reference: abc-123");
});

test("isNotFound: only the API's 404 (the screens' not-found pages; accounts and invoices tests open one)", () => {
  expect(isNotFound(new ApiError(404, "not_found", "Not found."))).toBe(true);
  expect(isNotFound(new ApiError(403, "forbidden", "No."))).toBe(false);
  expect(isNotFound(new Error("404"))).toBe(false);
  expect(isNotFound(null)).toBe(false);
});
