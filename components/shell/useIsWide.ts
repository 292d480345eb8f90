import { useWindowDimensions } from "react-native";
import { layout } from "../theme";

/** True from 1024 px wide: side navigation, tables. */
export function useIsWide(): boolean {
  const { width } = useWindowDimensions();
  return width >= layout.wideBreakpoint;
}
