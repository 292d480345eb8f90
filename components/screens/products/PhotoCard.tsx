import React, { useRef, useState } from "react";
import { Platform, StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { ProgressBar } from "../../ui/ProgressBar";
import { HiddenFileInput } from "../../ui/HiddenFileInput";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { useUploadProductPhotoMutation } from "../../api/products";
import { ProductPhoto } from "../ordering/parts";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { space } from "../../theme";

const PHOTO_MAX_BYTES = 5 * 1024 * 1024;

/** Photo upload (web): choose a file, watch it go up, see the server's answer (415 wrong type, 413 too large). */
export function PhotoCard({ product }: { product: ProductDto }) {
  const upload = useUploadProductPhotoMutation(product.id);
  const input = useRef<HTMLInputElement | null>(null);
  const [localError, setLocalError] = useState<string | null>(null);
  const [done, setDone] = useState(false);

  const pick = (file: File | undefined) => {
    setDone(false);
    setLocalError(null);
    if (!file) return;
    if (file.size > PHOTO_MAX_BYTES) {
      setLocalError("The photo is larger than 5 MB. Use a smaller one.");
      return;
    }
    upload.mutate(file, { onSuccess: () => setDone(true) });
  };

  const error = localError ?? (upload.isError ? messageOf(upload.error) : null);
  return (
    <Card title="Photo" testID="photo-card">
      <View style={styles.photoRow}>
        <ProductPhoto url={product.photoUrl} thumbUrl={product.photoThumbUrl} name={product.name} size={96} />
        <View style={styles.flex}>
          <AppText color="muted">JPEG, PNG or WebP, up to 5 MB. A square photo on a plain background looks best.</AppText>
        </View>
      </View>
      {upload.isPending ? <ProgressBar value={upload.progress} label="Uploading the photo" testID="photo-progress" /> : null}
      {upload.isPending ? <AppText variant="small" color="muted" testID="photo-progress-text">{`Uploading… ${Math.round(upload.progress * 100)} %`}</AppText> : null}
      {done ? <Notice message="Photo saved. Buyers see it now." testID="photo-done" /> : null}
      <FormError message={error} testID="photo-error" />
      {Platform.OS === "web" ? (
        <>
          <HiddenFileInput ref={input} accept="image/jpeg,image/png,image/webp" onPick={pick} label="Photo file" testID="photo-input" />
          <Button label={product.photoUrl ? "Replace photo" : "Choose a photo"} icon="upload" variant="secondary" busy={upload.isPending} onPress={() => input.current?.click()} testID="photo-choose" />
        </>
      ) : (
        <AppText variant="small" color="muted">
          Upload photos from the web app on a computer.
        </AppText>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  photoRow: { flexDirection: "row", gap: space.md, alignItems: "center" },
});
