import React from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { FormError, Notice } from "../../ui/FormError";
import { downloadBoardCsv } from "../../api/board";
import { useMaterialiseMutation } from "../../api/standing";
import { messageOf } from "../../api/client";
import { useDownload } from "../../forms/useDownload";
import { space } from "../../theme";

/** The office's actions on the board: the CSV, and (owner) making standing orders now and recording deliveries. */
export function OfficeActions({ date, isOwner }: { date: string; isOwner: boolean }) {
  const materialise = useMaterialiseMutation();
  const csv = useDownload();
  const r = materialise.data;
  return (
    <View style={styles.actionsWrap}>
      <View style={styles.actions}>
        <Button label="Download CSV" icon="download" variant="secondary" busy={csv.pending !== null} onPress={() => csv.run(() => downloadBoardCsv(date))} testID="board-csv" />
        {isOwner ? (
          <Button label="Make standing orders now" icon="repeat" variant="secondary" busy={materialise.isPending} onPress={() => materialise.mutate()} testID="materialise" />
        ) : null}
        {isOwner ? <LinkButton href={`/office/dispatch?date=${date}`} label="Record deliveries" icon="truck" variant="secondary" testID="board-confirm-dispatch" /> : null}
      </View>
      <FormError message={csv.error} testID="board-csv-error" />
      <FormError message={materialise.isError ? messageOf(materialise.error) : null} testID="materialise-error" />
      {r ? (
        <Notice
          testID="materialise-result"
          message={
            r.created + r.updated + r.cancelled === 0
              ? "Standing orders checked: every order was already up to date."
              : `Standing orders made: ${r.created} new, ${r.updated} updated, ${r.cancelled} canceled.`
          }
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  actionsWrap: { gap: space.sm },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
