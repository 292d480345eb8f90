import { Platform } from "react-native";

/**
 * The name of a row or card that opens something. On the web the browser names a link or button from the text
 * inside it, and WCAG 2.1 success criterion 2.5.3 (Label in Name) wants that visible text in the name, so no
 * separate label is set there (an author label that leaves part of the text out fails it). iOS and Android read one
 * label for a pressable that groups its children, so there the summary is the label.
 */
export function nameFromContent(summary: string | undefined): { accessibilityLabel?: string } {
  return Platform.OS === "web" || summary === undefined ? {} : { accessibilityLabel: summary };
}
