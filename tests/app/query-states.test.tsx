/** One query's loading / error / empty / data (components/ui/QueryStates.tsx). */
import { Text } from "react-native";
import { act, fireEvent, render, screen } from "@testing-library/react-native";
import { QueryStates, type QueryStatesProps } from "../../components/ui/QueryStates";

type Query = QueryStatesProps<string[]>["query"];
const query = (q: Partial<Query>): Query => ({ isPending: false, isError: false, error: null, data: undefined, refetch: jest.fn(), isFetching: false, ...q }) as Query;

async function show(q: Query, extra: Partial<QueryStatesProps<string[]>> = {}) {
  render(
    <QueryStates query={q} testID="things" loadingLabel="Loading things…" errorTitle="Things didn't load" empty={{ title: "No things yet" }} {...extra}>
      {(rows) => <Text testID="rows">{rows.join(", ")}</Text>}
    </QueryStates>,
  );
  // The states' icons load their font after the first render.
  await act(async () => undefined);
}

test("loading, with what is loading", async () => {
  await show(query({ isPending: true }));
  expect(screen.getByTestId("things-loading")).toHaveTextContent(/Loading things…/);
});

test("an error says what didn't load and retries", async () => {
  const q = query({ isError: true, error: new Error("Network down") });
  await show(q);
  expect(screen.getByTestId("things-error")).toHaveTextContent(/Things didn't load/);
  fireEvent.press(screen.getByTestId("things-error-retry"));
  expect(q.refetch).toHaveBeenCalled();
});

test("a list with no rows is empty by default; a test decides otherwise", async () => {
  await show(query({ data: [] }));
  expect(screen.getByTestId("things-empty")).toHaveTextContent(/No things yet/);
  expect(screen.queryByTestId("rows")).toBeNull();
});

test("the data, through the children", async () => {
  await show(query({ data: ["a", "b"] }), { isEmpty: (rows) => rows.length < 2 });
  expect(screen.getByTestId("rows")).toHaveTextContent("a, b");
  expect(screen.queryByTestId("things-empty")).toBeNull();
});
