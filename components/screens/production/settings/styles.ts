import { StyleSheet } from "react-native";
import { colors, radii, space } from "../../../theme";

/** The settings form's grid of fields and its boxed rows (a mixer, an oven). */
export const settingsStyles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  item: { gap: space.sm, borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, padding: space.md },
  retardRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 200 },
});
