import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { Badge } from "../../ui/Badge";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { useArchiveProductMutation, useUpdateProductMutation } from "../../api/products";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { colors, radii, space } from "../../theme";

/** Take the product off the buyers' list (after a confirmation), or offer it again. */
export function ArchiveCard({ product }: { product: ProductDto }) {
  const router = useRouter();
  const archive = useArchiveProductMutation(product.id);
  const restore = useUpdateProductMutation(product.id);
  const [confirming, setConfirming] = useState(false);
  const error = archive.error ?? restore.error;
  return (
    <Card title={product.active ? "Stop offering it" : "Archived"} testID="archive-card" action={product.active ? null : <Badge label="Archived" tone="neutral" />}>
      <AppText color="muted">
        {product.active
          ? "Archiving takes it off the buyers' list. It stays on past orders, and you can offer it again later."
          : "Buyers can't order it. Offer it again to put it back on their list."}
      </AppText>
      <FormError message={error ? messageOf(error) : null} testID="archive-error" />
      {product.active ? (
        confirming ? (
          <View style={styles.confirm}>
            <AppText variant="bodyStrong" color="dangerInk">{`Archive ${product.name}?`}</AppText>
            <View style={styles.buttons}>
              <Button
                label="Yes, archive"
                variant="danger"
                busy={archive.isPending}
                onPress={() => archive.mutate(undefined, { onSuccess: (p) => router.replace(`/office/products?archived=${encodeURIComponent(p.name)}`) })}
                testID="archive-confirm"
              />
              <Button label="Keep offering it" variant="secondary" onPress={() => setConfirming(false)} />
            </View>
          </View>
        ) : (
          <Button label="Archive product" icon="archive" variant="secondary" onPress={() => setConfirming(true)} testID="archive-product" />
        )
      ) : (
        <Button label="Offer it again" icon="rotate-ccw" variant="accent" busy={restore.isPending} onPress={() => restore.mutate({ active: true })} testID="restore-product" />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
