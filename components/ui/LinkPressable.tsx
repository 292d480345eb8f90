import React, { forwardRef, useState } from "react";
import { Pressable, View, type PressableProps, type StyleProp, type ViewStyle } from "react-native";

export interface LinkPressableProps extends Omit<PressableProps, "style"> {
  style?: StyleProp<ViewStyle>;
  /** Added while hovered or pressed (and when `highlighted`). */
  highlightStyle?: StyleProp<ViewStyle>;
  highlighted?: boolean;
}

/**
 * A Pressable for `<Link asChild>`: Link's Slot merges style objects and drops a style function,
 * so hover and press feedback are tracked here and applied as plain styles. Pass one style object (or
 * StyleSheet.flatten an array): the Slot spreads it, and a spread array is no style on the web.
 */
export const LinkPressable = forwardRef<View, LinkPressableProps>(function LinkPressable(
  { style, highlightStyle, highlighted, onHoverIn, onHoverOut, onPressIn, onPressOut, ...rest },
  ref,
) {
  const [hovered, setHovered] = useState(false);
  const [pressed, setPressed] = useState(false);
  return (
    <Pressable
      ref={ref}
      {...rest}
      onHoverIn={(e) => {
        setHovered(true);
        onHoverIn?.(e);
      }}
      onHoverOut={(e) => {
        setHovered(false);
        onHoverOut?.(e);
      }}
      onPressIn={(e) => {
        setPressed(true);
        onPressIn?.(e);
      }}
      onPressOut={(e) => {
        setPressed(false);
        onPressOut?.(e);
      }}
      style={[style, (highlighted || hovered || pressed) && highlightStyle]}
    />
  );
});
