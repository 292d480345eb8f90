import { StyleSheet } from "react-native";
import { colors, radii, space } from "../../theme";

/** The product form's rows of fields and its boxes. */
export const formStyles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  cellWide: { flexBasis: 150 },
  preview: { gap: space.xs, padding: space.md, backgroundColor: colors.sunken, borderRadius: radii.md },
  derived: { gap: space.xxs, padding: space.md, backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
});
