import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText } from "../../ui/Text";
import { ContactLink } from "../../ui/ContactLink";
import { useBakeryQuery } from "../../api/bakery";
import { space } from "../../theme";

/** "Call Hollowbrook Bakehouse: +1 (555) 014-2290" with the number a tel: link, wherever a screen says to call. */
export function CallBakery({ testID = "call-bakery" }: { testID?: string }) {
  const bakery = useBakeryQuery().data;
  if (!bakery || (!bakery.phone && !bakery.email)) return null;
  return (
    <View style={styles.row} testID={testID}>
      <AppText variant="bodyStrong">{`Call ${bakery.name}:`}</AppText>
      {bakery.phone ? <ContactLink kind="phone" value={bakery.phone} testID={`${testID}-phone`} /> : <ContactLink kind="email" value={bakery.email} testID={`${testID}-email`} />}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", columnGap: space.sm },
});
