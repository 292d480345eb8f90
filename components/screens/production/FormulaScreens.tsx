import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Badge } from "../../ui/Badge";
import { Button } from "../../ui/Button";
import { DataTable } from "../../ui/DataTable";
import { DetailList } from "../../ui/DetailList";
import { LinkButton } from "../../ui/LinkButton";
import { MultiChoice } from "../../ui/MultiChoice";
import { TextLink } from "../../ui/TextLink";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { ListCard, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { ApiError, messageOf } from "../../api/client";
import { useCreateFormulaMutation, useFormulaHistoryQuery, useFormulaQuery, useFormulasQuery, useLinkProductsMutation, useUpdateFormulaMutation } from "../../api/formulas";
import { useIngredientsQuery } from "../../api/ingredients";
import { useProductsQuery } from "../../api/products";
import { useBakeryTimeZone } from "../../api/bakery";
import { useIsWide } from "../../shell/useIsWide";
import { formatDateTime, formatNum } from "../../format";
import { emptyFormula, ingredientMap, valuesOf } from "../../production/formulaForm";
import { kitchenPaths, type KitchenArea, type KitchenPaths } from "../../production/paths";
import { formatPercent } from "../../production/units";
import { FiguresPanel, FormulaEditor, KIND_LABEL } from "./FormulaEditor";
import { ALLERGEN_LABEL } from "../../../shared/allergens";
import { STEP_LABELS } from "../../../shared/production";
import { celsiusToFahrenheit } from "../../../shared/units";
import type { FormulaDto } from "../../../shared/schemas/production";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { colors, space } from "../../theme";

const withF = (c: number) => `${c} °C (${Math.round(celsiusToFahrenheit(c))} °F)`;

function productNames(ids: number[], products: ProductDto[] | undefined): string {
  if (!products) return ids.length ? `${ids.length} products` : "None yet";
  const names = ids.map((id) => products.find((p) => p.id === id)?.name).filter(Boolean);
  return names.length ? names.join(", ") : "None yet";
}

function Back({ paths }: { paths: KitchenPaths }) {
  return paths.hub ? <TextLink href={paths.hub} label="‹ Production" testID="back-to-production" /> : null;
}

// ---- list ---------------------------------------------------------------------------------------

/** Every dough formula with its figures and the products made from it. */
export function FormulasScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const wide = useIsWide();
  const router = useRouter();
  const formulas = useFormulasQuery();
  const products = useProductsQuery();
  const open = (f: FormulaDto) => router.push(paths.formula(f.id));

  let body: React.ReactNode;
  if (formulas.isPending) body = <LoadingState label="Loading formulas…" testID="formulas-loading" />;
  else if (formulas.isError) body = <ErrorState error={formulas.error} title="Formulas didn't load" onRetry={() => formulas.refetch()} retrying={formulas.isFetching} testID="formulas-error" />;
  else if (formulas.data.length === 0)
    body = (
      <EmptyState
        icon="book-open"
        title="No formulas yet"
        message="Write the first dough in baker's percentages; then give products their formula."
        action={<LinkButton href={paths.newFormula} label="New formula" icon="plus" />}
        testID="formulas-empty"
      />
    );
  else if (wide)
    body = (
      <DataTable
        testID="formulas-table"
        rows={formulas.data}
        rowKey={(f) => f.id}
        onRowPress={open}
        rowLabel={(f) => `${f.name}, version ${f.version}`}
        rowTestID={(f) => `formula-row-${f.id}`}
        columns={[
          {
            key: "name",
            label: "Formula",
            flex: 2,
            render: (f) => (
              <View>
                <AppText variant="bodyStrong">{f.name}</AppText>
                <AppText variant="small" color="muted">{`Version ${f.version}`}</AppText>
              </View>
            ),
          },
          { key: "hydration", label: "Hydration", render: (f) => <AppText>{formatPercent(f.figures.hydrationPercent)}</AppText> },
          { key: "effective", label: "Effective", render: (f) => <AppText>{formatPercent(f.figures.effectiveHydrationPercent)}</AppText> },
          { key: "paste", label: "Paste share", render: (f) => <AppText>{f.paste ? formatPercent(f.figures.pasteSharePercent) : "No paste"}</AppText> },
          { key: "yield", label: "Dough / kg flour", render: (f) => <AppText>{`${formatNum(Math.round(f.figures.doughYieldPerKgFlour))} g`}</AppText> },
          { key: "products", label: "Products", flex: 2.4, render: (f) => <AppText variant="small">{productNames(f.productIds, products.data)}</AppText> },
        ]}
      />
    );
  else
    body = (
      <ListCards testID="formulas-list">
        {formulas.data.map((f) => (
          <ListCard key={f.id} onPress={() => open(f)} accessibilityLabel={`${f.name}, version ${f.version}`} testID={`formula-row-${f.id}`}>
            <View style={styles.flex}>
              <View style={styles.titleRow}>
                <AppText variant="heading" style={styles.flex}>
                  {f.name}
                </AppText>
                <Badge label={`v${f.version}`} tone="crust" />
              </View>
              <AppText variant="small" color="muted">{`Hydration ${formatPercent(f.figures.hydrationPercent)} (effective ${formatPercent(f.figures.effectiveHydrationPercent)}) · ${f.paste ? `paste ${formatPercent(f.figures.pasteSharePercent)} of flour` : "no paste"}`}</AppText>
              <AppText variant="small">{`For: ${productNames(f.productIds, products.data)}`}</AppText>
            </View>
          </ListCard>
        ))}
      </ListCards>
    );

  return (
    <Screen testID="formulas-screen">
      <Back paths={paths} />
      <PageHeader
        title="Formulas"
        subtitle="Doughs in baker's percentages. Saving an edit keeps the old version for the plans that used it."
        actions={
          <>
            <LinkButton href={paths.ingredients} label="Ingredients" icon="package" variant="secondary" testID="open-ingredients" />
            <LinkButton href={paths.newFormula} label="New formula" icon="plus" testID="new-formula" />
          </>
        }
        testID="formulas-title"
      />
      {body}
    </Screen>
  );
}

// ---- new ----------------------------------------------------------------------------------------

export function NewFormulaScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const ingredients = useIngredientsQuery();
  const create = useCreateFormulaMutation();
  const [initial] = useState(emptyFormula);
  return (
    <Screen testID="formula-new">
      <TextLink href={paths.formulas} label="‹ All formulas" testID="back-to-formulas" />
      <PageHeader title="New formula" subtitle="Start with the flour at 100 %; every other line is a share of it." testID="formula-title" />
      {ingredients.isPending ? (
        <LoadingState label="Loading the ingredients…" />
      ) : ingredients.isError ? (
        <ErrorState error={ingredients.error} title="The ingredients didn't load" onRetry={() => ingredients.refetch()} retrying={ingredients.isFetching} />
      ) : ingredients.data.length === 0 ? (
        <EmptyState icon="package" title="No ingredients yet" message="Add the ingredients first; formulas are written from them." action={<LinkButton href={paths.newIngredient} label="New ingredient" icon="plus" />} testID="formula-no-ingredients" />
      ) : (
        <FormulaEditor
          initial={initial}
          ingredients={ingredients.data}
          infos={ingredientMap(ingredients.data)}
          submitLabel="Add formula"
          askNote={false}
          busy={create.isPending}
          onSubmit={(input, fail) => create.mutate(input, { onSuccess: (f) => router.replace(paths.createdFormula(f.id)), onError: fail })}
        />
      )}
    </Screen>
  );
}

// ---- one formula --------------------------------------------------------------------------------

export interface FormulaScreenProps {
  area: KitchenArea;
  id: number;
  /** An earlier version to read (?version=N). */
  version?: number;
  created?: boolean;
}

/** One formula: edit the current version (saved as the next), read an earlier one, see the history. */
export function FormulaScreen({ area, id, version, created }: FormulaScreenProps) {
  const paths = kitchenPaths(area);
  const wide = useIsWide();
  const valid = Number.isInteger(id) && id > 0;
  const current = useFormulaQuery(valid ? id : null);
  const asked = version && version > 0 && current.data && version !== current.data.version ? version : undefined;
  const old = useFormulaQuery(asked ? id : null, asked);
  const ingredients = useIngredientsQuery();
  const update = useUpdateFormulaMutation(id);
  const [saved, setSaved] = useState<string | null>(created ? "Formula added. Give products this formula below so their dough is planned." : null);

  if (!valid || (current.error instanceof ApiError && current.error.status === 404)) {
    return (
      <Screen testID="formula-detail">
        <EmptyState icon="help-circle" title="There's no such formula" testID="formula-not-found" />
        <TextLink href={paths.formulas} label="All formulas" />
      </Screen>
    );
  }
  if (current.isPending) {
    return (
      <Screen testID="formula-detail">
        <LoadingState label="Loading the formula…" testID="formula-loading" />
      </Screen>
    );
  }
  if (current.isError) {
    return (
      <Screen testID="formula-detail">
        <TextLink href={paths.formulas} label="‹ All formulas" />
        <ErrorState error={current.error} title="The formula didn't load" onRetry={() => current.refetch()} retrying={current.isFetching} testID="formula-error" />
      </Screen>
    );
  }
  const f = current.data;
  const history = <HistoryCard id={id} current={f.version} reading={asked} paths={paths} />;

  let main: React.ReactNode;
  if (asked) {
    main = old.isPending ? (
      <LoadingState label={`Loading version ${asked}…`} />
    ) : old.isError ? (
      <ErrorState error={old.error} title={`Version ${asked} didn't load`} onRetry={() => old.refetch()} retrying={old.isFetching} testID="formula-version-error" />
    ) : (
      <>
        <Notice tone="info" message={`You are reading version ${asked}, read-only. The current version is ${f.version}.`} testID="formula-old-version" />
        <TextLink href={paths.formula(id)} label="Back to the current version" testID="formula-current-link" />
        <FormulaReadOnly formula={old.data} />
      </>
    );
  } else if (ingredients.isPending) {
    main = <LoadingState label="Loading the ingredients…" />;
  } else if (ingredients.isError) {
    main = <ErrorState error={ingredients.error} title="The ingredients didn't load" onRetry={() => ingredients.refetch()} retrying={ingredients.isFetching} />;
  } else {
    main = (
      <FormulaEditor
        key={`${f.id}-${f.version}`}
        initial={valuesOf(f)}
        ingredients={ingredients.data}
        infos={ingredientMap(ingredients.data)}
        submitLabel={`Save as version ${f.version + 1}`}
        askNote
        busy={update.isPending}
        onSubmit={(input, fail) => {
          setSaved(null);
          update.mutate(input, { onSuccess: (s) => setSaved(`${s.name} is saved as version ${s.version}. Plans not yet set at their cut-off use it now.`), onError: fail });
        }}
      />
    );
  }

  return (
    <Screen testID="formula-detail">
      <TextLink href={paths.formulas} label="‹ All formulas" testID="back-to-formulas" />
      <PageHeader overline={asked ? `Version ${asked} of ${f.version}` : `Formula · version ${f.version}`} title={f.name} testID="formula-title" />
      {saved ? <Notice message={saved} testID="formula-saved" /> : null}
      {f.allergens.length ? <AppText variant="small" color="muted" testID="formula-allergens">{`Allergens: ${f.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}`}</AppText> : null}
      {main}
      <View style={[styles.pair, wide && styles.pairWide]}>
        <View style={wide ? styles.flex : undefined}>
          <ProductsCard formula={f} />
        </View>
        <View style={wide ? styles.flex : undefined}>{history}</View>
      </View>
    </Screen>
  );
}

/** An earlier version, as it was: lines, paste, steps, figures. */
export function FormulaReadOnly({ formula: f }: { formula: FormulaDto }) {
  return (
    <View style={styles.stack} testID="formula-readonly">
      <Card title="Dough">
        <DetailList
          items={[
            { label: "Loss allowance", value: formatPercent(f.lossPercent) },
            { label: "Desired dough temperature", value: withF(f.ddtC) },
            { label: "Friction factor", value: `${f.frictionC} °C` },
            { label: "Target internal temperature", value: f.targetInternalC === null ? "Not given" : withF(f.targetInternalC) },
          ]}
        />
      </Card>
      <Card title="Ingredients" testID="formula-readonly-lines">
        {f.lines.map((l, i) => (
          <View key={`${l.ingredientId}-${i}`} style={[styles.roLine, i > 0 && styles.divider]}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{l.name}</AppText>
              <AppText variant="caption" color="muted">
                {KIND_LABEL[l.kind] ?? "Other"}
              </AppText>
            </View>
            <AppText variant="heading">{formatPercent(l.percent, 2)}</AppText>
          </View>
        ))}
      </Card>
      {f.paste ? (
        <Card title="Cooked paste">
          <DetailList
            items={[
              { label: "Flour", value: f.lines.find((l) => l.ingredientId === f.paste!.flourIngredientId)?.name ?? "?" },
              { label: "Liquid", value: f.lines.find((l) => l.ingredientId === f.paste!.liquidIngredientId)?.name ?? "?" },
              { label: "Share of flour cooked", value: formatPercent(f.paste.flourPercent) },
              { label: "Liquid-to-flour ratio", value: `${f.paste.liquidRatio} : 1` },
              { label: "Cook-to temperature", value: withF(f.paste.cookToC) },
            ]}
          />
        </Card>
      ) : null}
      <Card title="Steps">
        {f.steps.length === 0 ? <AppText color="muted">No steps.</AppText> : null}
        {f.steps.map((s, i) => (
          <View key={`${s.kind}-${i}`} style={[styles.roLine, i > 0 && styles.divider]}>
            <AppText variant="bodyStrong" style={styles.flex}>{`${i + 1}. ${STEP_LABELS[s.kind]}`}</AppText>
            <AppText>{`${s.minutes} min${s.temperatureC ? ` · ${withF(s.temperatureC)}` : ""}`}</AppText>
          </View>
        ))}
      </Card>
      <FiguresPanel figures={f.figures} hasPaste={!!f.paste} testID="formula-readonly-figures" />
    </View>
  );
}

function HistoryCard({ id, current, reading, paths }: { id: number; current: number; reading?: number; paths: KitchenPaths }) {
  const history = useFormulaHistoryQuery(id);
  const timeZone = useBakeryTimeZone();
  return (
    <Card title="History" testID="formula-history">
      {history.isPending ? (
        <LoadingState label="Loading the history…" testID="history-loading" />
      ) : history.isError ? (
        <ErrorState error={history.error} title="The history didn't load" onRetry={() => history.refetch()} retrying={history.isFetching} testID="history-error" />
      ) : history.data.length === 0 ? (
        <AppText color="muted">No versions yet.</AppText>
      ) : (
        <View>
          {history.data.map((h, i) => {
            const isCurrent = h.version === current;
            const isReading = reading ? h.version === reading : isCurrent;
            return (
              <View key={h.version} style={[styles.history, i > 0 && styles.divider]} testID={`history-${h.version}`}>
                <View style={styles.flex}>
                  <View style={styles.titleRow}>
                    <AppText variant="bodyStrong">{`Version ${h.version}`}</AppText>
                    {isCurrent ? <Badge label="Current" tone="sage" /> : null}
                    {isReading && !isCurrent ? <Badge label="Reading" tone="crust" /> : null}
                  </View>
                  <AppText variant="small" color="muted">{`${formatDateTime(h.createdAt, timeZone)}${h.note ? ` · ${h.note}` : ""}`}</AppText>
                </View>
                {isReading ? null : <TextLink href={isCurrent ? paths.formula(id) : paths.formula(id, h.version)} label={isCurrent ? "Edit" : "Open"} testID={`history-${h.version}-open`} />}
              </View>
            );
          })}
        </View>
      )}
    </Card>
  );
}

/** Which products are made from this dough; the owner links products to it. */
function ProductsCard({ formula }: { formula: FormulaDto }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const products = useProductsQuery();
  const link = useLinkProductsMutation(formula.id);
  const [chosen, setChosen] = useState<number[] | null>(null);
  const [done, setDone] = useState(false);
  const selected = chosen ?? formula.productIds;

  let body: React.ReactNode;
  if (products.isPending) body = <LoadingState label="Loading products…" testID="formula-products-loading" />;
  else if (products.isError) body = <ErrorState error={products.error} title="Products didn't load" onRetry={() => products.refetch()} retrying={products.isFetching} />;
  else if (!isOwner)
    body = (
      <>
        <AppText testID="formula-products-list">{productNames(formula.productIds, products.data)}</AppText>
        <AppText variant="small" color="muted">
          The owner links products to formulas.
        </AppText>
      </>
    );
  else {
    const others = new Map(products.data.filter((p) => p.formulaId !== null && p.formulaId !== formula.id).map((p) => [p.id, p]));
    const save = () => {
      setDone(false);
      const link_ = selected.filter((id) => !formula.productIds.includes(id));
      const unlink = formula.productIds.filter((id) => !selected.includes(id));
      link.mutate({ link: link_, unlink }, { onSuccess: () => { setDone(true); setChosen(null); } });
    };
    const moving = selected.filter((id) => others.has(id));
    body = (
      <>
        <MultiChoice<number>
          label="Made from this dough"
          hint="A product has one formula: choosing one here moves it from its current formula."
          options={products.data.map((p) => ({ value: p.id, label: p.name }))}
          value={selected}
          onChange={(v) => { setChosen(v); setDone(false); }}
          testID="formula-products"
        />
        {moving.length ? <AppText variant="small" color="muted">{`Moves from another formula: ${moving.map((id) => others.get(id)!.name).join(", ")}.`}</AppText> : null}
        <FormError message={link.isError ? messageOf(link.error) : null} testID="formula-products-error" />
        {done ? <Notice message="Products linked. Their dough is planned from this formula." testID="formula-products-saved" /> : null}
        <Button label="Save products" icon="link" variant="secondary" busy={link.isPending} disabled={chosen === null} onPress={save} testID="formula-products-save" />
      </>
    );
  }
  return (
    <Card title="Products" testID="formula-products-card">
      {body}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  stack: { gap: space.lg },
  titleRow: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm },
  pair: { gap: space.lg },
  pairWide: { flexDirection: "row", alignItems: "flex-start" },
  roLine: { flexDirection: "row", alignItems: "center", gap: space.md, minHeight: 44, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  history: { flexDirection: "row", alignItems: "center", gap: space.md, paddingVertical: space.sm, minHeight: 52 },
});
