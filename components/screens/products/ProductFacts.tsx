import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { mmToInches } from "../../ordering/pan";
import { mayContainLabel } from "../../ordering/allergens";
import { ProductPhoto, useMoney } from "../ordering/parts";
import { ALLERGEN_LABEL } from "../../../shared/allergens";
import { quantityText } from "../../../shared/quantity";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { bakeText, componentsText } from "./productForm";

/** The product read-only (the bookkeeper's view). */
export function ProductFacts({ product: p }: { product: ProductDto }) {
  const money = useMoney();
  return (
    <Card title="Details" testID="product-facts">
      <ProductPhoto url={p.photoUrl} thumbUrl={p.photoThumbUrl} name={p.name} size={120} />
      <DetailList
        items={[
          { label: "Description", value: p.description },
          { label: "Sold as", value: `${p.saleUnit} (${p.piecesPerUnit} × ${p.pieceGrams} g)` },
          { label: "Pan", value: `${p.panName}: ${p.panLengthMm} × ${p.panWidthMm} mm (${mmToInches(p.panLengthMm)} × ${mmToInches(p.panWidthMm)}), ${p.unitsPerPan} per pan` },
          { label: "List price", value: money(p.listPriceCents) },
          { label: "Per order", value: `Minimum ${quantityText(p.minQuantity, p)}, maximum ${quantityText(p.maxQuantity, p)}` },
          { label: "Days of notice", value: p.leadDays === null ? "The bakery's usual cut-off" : `${p.leadDays} days before delivery` },
          { label: "Made", value: p.formulaId !== null ? `From the ${p.formulaName ?? "chosen"} formula` : p.boughtIn ? "Bought in / not planned" : "Not chosen yet: production cannot plan it" },
          ...(p.formulaId !== null ? [{ label: "Bake", value: bakeText(p) }] : []),
          ...(p.components.length ? [{ label: "Components", value: componentsText(p) }] : []),
          { label: "Allergens", value: p.allergens.map((a) => `${ALLERGEN_LABEL[a]} (${(p.allergenSources[a] ?? []).join(", ")})`).join("; ") || "None listed" },
          { label: "May contain", value: mayContainLabel(p.mayContain) || "Nothing listed" },
        ]}
      />
    </Card>
  );
}
