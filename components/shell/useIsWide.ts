import { useWindowDimensions } from "react-native";
import { layout } from "../theme";

/** True from 1024 px wide: side navigation, tables. */
export function useIsWide(): boolean {
  const { width } = useWindowDimensions();
  return width >= layout.wideBreakpoint;
}

/** True from 768 px wide (a tablet and up): two columns of cards instead of one stretched column. */
export function useTwoColumns(): boolean {
  const { width } = useWindowDimensions();
  return width >= layout.twoColumnBreakpoint;
}
