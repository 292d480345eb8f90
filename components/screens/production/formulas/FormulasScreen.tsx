import React from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Badge } from "../../../ui/Badge";
import { AppText } from "../../../ui/Text";
import { useFormulasQuery } from "../../../api/formulas";
import { useProductsQuery } from "../../../api/products";
import { formatNum } from "../../../format";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { formatPercent } from "../../../production/units";
import { LibraryScreen } from "../LibraryScreen";
import { CardBody, TableOrCards } from "../../../ui/TableOrCards";
import { TitleCell } from "../../../ui/DataTable";
import { productNames } from "./formulaText";
import { space } from "../../../theme";

/** Every dough formula with its figures and the products made from it. */
export function FormulasScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const formulas = useFormulasQuery();
  const products = useProductsQuery();
  const names = (ids: number[]) => productNames(ids, products.data);
  return (
    <LibraryScreen
      paths={paths}
      name="formulas"
      title="Formulas"
      subtitle="Doughs in baker's percentages. Saving an edit keeps the old version for the plans that used it."
      other={{ href: paths.ingredients, label: "Ingredients", icon: "package", testID: "open-ingredients" }}
      add={{ href: paths.newFormula, label: "New formula", testID: "new-formula" }}
      query={formulas}
      loadingLabel="Loading formulas…"
      errorTitle="Formulas didn't load"
      empty={{ icon: "book-open", title: "No formulas yet", message: "Write the first dough in baker's percentages; then give products their formula." }}
    >
      {(list) => (
        <TableOrCards
          rows={list}
          rowKey={(f) => f.id}
          onOpen={(f) => router.push(paths.formula(f.id))}
          rowLabel={(f) => `${f.name}, version ${f.version}`}
          rowTestID={(f) => `formula-row-${f.id}`}
          tableTestID="formulas-table"
          columns={[
            {
              key: "name",
              label: "Formula",
              flex: 2,
              render: (f) => <TitleCell title={f.name} detail={`Version ${f.version}`} />,
            },
            { key: "hydration", label: "Hydration", render: (f) => <AppText>{formatPercent(f.figures.hydrationPercent)}</AppText> },
            { key: "effective", label: "Effective", render: (f) => <AppText>{formatPercent(f.figures.effectiveHydrationPercent)}</AppText> },
            { key: "paste", label: "Paste share", render: (f) => <AppText>{f.paste ? formatPercent(f.figures.pasteSharePercent) : "No paste"}</AppText> },
            { key: "yield", label: "Dough / kg flour", render: (f) => <AppText>{`${formatNum(Math.round(f.figures.doughYieldPerKgFlour))} g`}</AppText> },
            { key: "products", label: "Products", flex: 2.4, render: (f) => <AppText variant="small">{names(f.productIds)}</AppText> },
          ]}
          cardsTestID="formulas-list"
          card={(f) => (
            <CardBody>
              <View style={styles.titleRow}>
                <AppText variant="heading" style={styles.flex}>
                  {f.name}
                </AppText>
                <Badge label={`v${f.version}`} tone="crust" />
              </View>
              <AppText variant="small" color="muted">{`Hydration ${formatPercent(f.figures.hydrationPercent)} (effective ${formatPercent(f.figures.effectiveHydrationPercent)}) · ${f.paste ? `paste ${formatPercent(f.figures.pasteSharePercent)} of flour` : "no paste"}`}</AppText>
              <AppText variant="small">{`For: ${names(f.productIds)}`}</AppText>
            </CardBody>
          )}
        />
      )}
    </LibraryScreen>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  titleRow: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm },
});
