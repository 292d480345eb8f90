/** The one table (components/ui/DataTable.tsx) and list card (components/ui/ListCard.tsx) every list screen uses. */
import { Dimensions, ScrollView, StyleSheet, Text } from "react-native";
import { act, fireEvent, render, screen } from "@testing-library/react-native";
import { DataTable, NoValue, TitleCell } from "../../components/ui/DataTable";
import { ListCard } from "../../components/ui/ListCard";
import { TableOrCards } from "../../components/ui/TableOrCards";
import { colors } from "../../components/theme";

interface Row {
  id: number;
  name: string;
  owed: number;
  late: boolean;
}

const ROWS: Row[] = [
  { id: 1, name: "Tidewater Café", owed: 1200, late: false },
  { id: 2, name: "North Pier", owed: 4500, late: true },
];

function table(onRowPress?: (r: Row) => void) {
  return (
    <DataTable<Row>
      testID="t"
      rows={ROWS}
      rowKey={(r) => r.id}
      rowTestID={(r) => `row-${r.id}`}
      rowLabel={(r) => `${r.name}, ${r.owed} owed`}
      onRowPress={onRowPress}
      rowAlert={(r) => r.late}
      footer
      footerTestID="totals"
      columns={[
        { key: "name", label: "Account", flex: 2, render: (r) => r.name, footer: "Total" },
        { key: "owed", label: "Owed", align: "right", render: (r) => r.owed, footer: <Text testID="total-owed">5700</Text> },
      ]}
    />
  );
}

describe("DataTable", () => {
  it("writes plain strings and numbers as text, and a totals row from the columns' footers", () => {
    render(table());
    expect(screen.getByTestId("row-1")).toHaveTextContent("Tidewater Café1200");
    expect(screen.getByTestId("totals")).toHaveTextContent("Total5700");
    expect(screen.getByTestId("total-owed")).toBeOnTheScreen();
    expect(screen.getByTestId("t")).toHaveTextContent(/^AccountOwed/);
  });

  it("tints a row that needs attention, and only that one", () => {
    render(table());
    expect(screen.getByTestId("row-2")).toHaveStyle({ backgroundColor: colors.dangerSoft });
    expect(screen.getByTestId("row-1")).not.toHaveStyle({ backgroundColor: colors.dangerSoft });
    expect(screen.getByTestId("totals")).toHaveStyle({ backgroundColor: colors.sunken });
  });

  it("rows open their item as buttons named for a screen reader", () => {
    const open = jest.fn();
    render(table(open));
    fireEvent.press(screen.getByRole("button", { name: "North Pier, 4500 owed" }));
    expect(open).toHaveBeenCalledWith(ROWS[1]);
    expect(screen.getByTestId("row-2")).toHaveStyle({ backgroundColor: colors.dangerSoft });
  });

  it("without footer there is no totals row", () => {
    render(<DataTable<Row> rows={ROWS} rowKey={(r) => r.id} columns={[{ key: "name", label: "Account", render: (r) => r.name }]} footerTestID="totals" />);
    expect(screen.queryByTestId("totals")).toBeNull();
  });

  it("a strong column writes its text in bold; an empty cell is a muted dash", () => {
    render(
      <DataTable<Row>
        rows={ROWS}
        rowKey={(r) => r.id}
        rowTestID={(r) => `row-${r.id}`}
        columns={[
          { key: "name", label: "Account", strong: true, render: (r) => r.name },
          { key: "owed", label: "Owed", align: "right", render: (r) => (r.late ? r.owed : <NoValue />) },
        ]}
      />,
    );
    const bold = StyleSheet.flatten(screen.getByText("Tidewater Café").props.style).fontFamily;
    const plain = StyleSheet.flatten(screen.getByText("4500").props.style).fontFamily;
    expect(bold).not.toEqual(plain);
    expect(screen.getByTestId("row-1")).toHaveTextContent("Tidewater Café–");
    expect(StyleSheet.flatten(screen.getByText("–").props.style).color).toBe(colors.muted);
  });

  it("with a minimum width (a column per product or day) it scrolls sideways and keeps that width", () => {
    const { UNSAFE_queryAllByType } = render(table());
    expect(UNSAFE_queryAllByType(ScrollView)).toHaveLength(0);
    screen.unmount();
    const wide = render(<DataTable<Row> testID="wide" rows={ROWS} rowKey={(r) => r.id} minWidth={900} columns={[{ key: "name", label: "Account", render: (r) => r.name }]} />);
    const scroll = wide.UNSAFE_getByType(ScrollView);
    expect(scroll.props.horizontal).toBe(true);
    expect(screen.getByTestId("wide")).toHaveStyle({ width: 900 });
    expect(screen.queryByTestId("wide-scroll-hint")).toBeNull();
    // Laid out in a 1200 px region the table takes the whole width; in a 600 px one it keeps 900 and says it scrolls.
    fireEvent(scroll, "layout", { nativeEvent: { layout: { x: 0, y: 0, width: 1200, height: 300 } } });
    expect(screen.getByTestId("wide")).toHaveStyle({ width: 1200 });
    expect(screen.queryByTestId("wide-scroll-hint")).toBeNull();
    fireEvent(scroll, "layout", { nativeEvent: { layout: { x: 0, y: 0, width: 600, height: 300 } } });
    expect(screen.getByTestId("wide")).toHaveStyle({ width: 900 });
    expect(screen.getByTestId("wide-scroll-hint")).toHaveTextContent("The table is wider than the window: scroll it sideways to see every column.");
  });
});

describe("TitleCell", () => {
  it("a bold title, a smaller line under it when there is one, cut to one line when asked", () => {
    render(
      <>
        <TitleCell title="Tidewater Café" detail="12 Harbor Rd" oneLine>
          <Text>Last error: refused</Text>
        </TitleCell>
        <TitleCell title="INV-2025-0007" detail={null} />
      </>,
    );
    expect(screen.getByText("Tidewater Café")).toHaveProp("numberOfLines", 1);
    expect(screen.getByText("12 Harbor Rd")).toHaveStyle({ color: colors.muted });
    expect(screen.getByText("Last error: refused")).toBeOnTheScreen();
    expect(screen.getByText("INV-2025-0007")).not.toHaveProp("numberOfLines", 1);
    expect(screen.getAllByText(/./)).toHaveLength(4);
  });
});

describe("ListCard", () => {
  it("a pressable row, or a card that does not open (no button), tinted when it needs attention, on the page colour when quiet", async () => {
    const open = jest.fn();
    render(
      <>
        <ListCard onPress={open} accessibilityLabel="Open Tidewater" testID="a">
          <Text>Tidewater</Text>
        </ListCard>
        <ListCard alert testID="b">
          <Text>Failed mail</Text>
        </ListCard>
        <ListCard quiet testID="c">
          <Text>Canceled order</Text>
        </ListCard>
      </>,
    );
    // The chevron's icon font loads after the first render.
    await act(async () => undefined);
    fireEvent.press(screen.getByRole("button", { name: "Open Tidewater" }));
    expect(open).toHaveBeenCalled();
    expect(screen.getAllByRole("button")).toHaveLength(1);
    expect(screen.getByTestId("b")).toHaveStyle({ backgroundColor: colors.dangerSoft, borderColor: colors.danger });
    expect(screen.getByTestId("c")).toHaveStyle({ backgroundColor: colors.page });
  });
});

describe("TableOrCards", () => {
  const original = Dimensions.get("window");
  afterEach(() => Dimensions.set({ window: original, screen: original }));
  const setWidth = (width: number) => Dimensions.set({ window: { ...original, width }, screen: { ...original, width } });
  const list = (open: (r: Row) => void, cardLabel?: (r: Row) => string) => (
    <TableOrCards<Row>
      rows={ROWS}
      rowKey={(r) => r.id}
      onOpen={open}
      rowLabel={(r) => `${r.name}, ${r.owed} owed`}
      cardLabel={cardLabel}
      rowTestID={(r) => `row-${r.id}`}
      columns={[{ key: "name", label: "Account", render: (r) => r.name }]}
      tableTestID="the-table"
      card={(r) => <Text>{r.name}</Text>}
      cardsTestID="the-cards"
    />
  );

  it("a table from 1024 px, its rows opening the item", async () => {
    setWidth(1280);
    const open = jest.fn();
    render(list(open));
    expect(screen.getByTestId("the-table")).toBeOnTheScreen();
    fireEvent.press(screen.getByRole("button", { name: "Tidewater Café, 1200 owed" }));
    expect(open).toHaveBeenCalledWith(ROWS[0]);
  });

  it("cards on a phone, named as the row unless the cards say less", async () => {
    setWidth(390);
    const open = jest.fn();
    render(list(open, (r) => r.name));
    await act(async () => undefined);
    expect(screen.queryByTestId("the-table")).toBeNull();
    expect(screen.getByTestId("the-cards")).toBeOnTheScreen();
    fireEvent.press(screen.getByRole("button", { name: "North Pier" }));
    expect(open).toHaveBeenCalledWith(ROWS[1]);
  });
});
