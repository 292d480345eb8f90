import React from "react";
import { Link, type Href } from "expo-router";
import { Button, type ButtonProps } from "./Button";
import { guardLinkPress } from "../shell/leaveGuard";

/** A Button that navigates: a real link on the web. */
export function LinkButton({ href, ...props }: ButtonProps & { href: Href }) {
  return (
    <Link href={href} onPress={guardLinkPress} asChild>
      <Button {...props} accessibilityRole="link" />
    </Link>
  );
}
