import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useDeletePriceListMutation } from "../../api/priceLists";
import { messageOf } from "../../api/client";
import type { PriceListDto } from "../../../shared/schemas/catalog";
import { usedBy } from "./priceListForm";
import { colors, radii, space } from "../../theme";

/** Deleting a price list, after a confirm step: its accounts go back to list prices. */
export function PriceListDeleteCard({ list, onDone }: { list: PriceListDto; onDone: (message: string) => void }) {
  const remove = useDeletePriceListMutation();
  const [confirmDelete, setConfirmDelete] = useState(false);
  return (
    <Card title="Delete" testID="price-list-delete-card">
      <AppText color="muted">{`${usedBy(list.accountCount)}. Deleting it puts ${list.accountCount === 0 ? "no account" : list.accountCount === 1 ? "that account" : "those accounts"} back on list prices.`}</AppText>
      <FormError message={remove.isError ? messageOf(remove.error) : null} />
      {confirmDelete ? (
        <View style={styles.confirm}>
          <AppText variant="bodyStrong" color="dangerInk">{`Delete ${list.name}?`}</AppText>
          <View style={styles.buttons}>
            <Button label="Yes, delete" variant="danger" busy={remove.isPending} onPress={() => remove.mutate(list.id, { onSuccess: () => onDone(`${list.name} is deleted.`) })} testID="price-list-delete-confirm" />
            <Button label="Keep it" variant="secondary" onPress={() => setConfirmDelete(false)} />
          </View>
        </View>
      ) : (
        <Button label="Delete price list" icon="trash-2" variant="ghost" onPress={() => setConfirmDelete(true)} testID="price-list-delete" />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
