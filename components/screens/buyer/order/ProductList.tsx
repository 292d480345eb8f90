import React from "react";
import { StyleSheet, View } from "react-native";
import { Notice } from "../../../ui/FormError";
import { EmptyState } from "../../../ui/States";
import { Heading } from "../../../ui/Text";
import { AllergenCaution } from "../../ordering/Allergens";
import { formatCutoff } from "../../../ordering/dates";
import { isChosen, type DraftLine, type Quantities } from "../../../ordering/draft";
import { quantityText } from "../../../../shared/quantity";
import type { OrderDto } from "../../../../shared/schemas/orders";
import { space } from "../../../theme";
import { ProductLine } from "./ProductLine";

export interface ProductListProps {
  lines: DraftLine[];
  quantities: Quantities;
  onChange: (productId: number, text: string) => void;
  /** The server's messages by product id. */
  lineErrors: Record<number, string>;
  /** Ordering has closed for the date. */
  locked: boolean;
  busy: boolean;
  /** The date's own cut-off (ms): products closing earlier say so. */
  dayCutoff: number;
  timeZone?: string;
  /** Lines of the saved order no longer on offer. */
  gone: OrderDto["lines"];
  money: (cents: number) => string;
}

const at = (ms: number, timeZone?: string) => formatCutoff(new Date(ms).toISOString(), timeZone);

/** The products on offer, one line each, with the allergen caution and what saving takes off. */
export function ProductList({ lines, quantities, onChange, lineErrors, locked, busy, dayCutoff, timeZone, gone, money }: ProductListProps) {
  return (
    <View style={styles.products}>
      <Heading level={2}>Products</Heading>
      {lines.length === 0 ? (
        <EmptyState icon="shopping-bag" title="Nothing on offer right now" message="The bakery has no products to order at the moment." testID="order-no-products" />
      ) : (
        lines.map((l) => {
          const chosen = isChosen(l);
          const lateNote = l.tooLate
            ? `Needs ordering by ${at(l.cutoff, timeZone)}, so it can't be added for this date.`
            : l.cutoff < dayCutoff && !locked
              ? `Needs more notice: order it by ${at(l.cutoff, timeZone)}.`
              : null;
          return (
            <ProductLine
              key={l.product.id}
              product={l.product}
              text={quantities[l.product.id] ?? ""}
              onChange={(t) => onChange(l.product.id, t)}
              disabled={locked || busy || (l.tooLate && !(l.quantity > 0))}
              problem={lineErrors[l.product.id] ?? l.problem ?? (l.tooLate && l.quantity > 0 ? "Too late for this date: take it off to order the rest." : null)}
              lateNote={lateNote}
              lineTotal={chosen ? money(l.quantity * l.product.priceCents) : null}
              money={money}
            />
          );
        })
      )}
      {lines.length ? <AllergenCaution /> : null}
      {gone.length ? (
        <Notice
          tone="info"
          testID="order-gone-lines"
          message={`No longer offered, and taken off when you save: ${gone.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ")}.`}
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  products: { gap: space.md },
});
