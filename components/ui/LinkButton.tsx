import React from "react";
import { Link, type Href } from "expo-router";
import { Button, type ButtonProps } from "./Button";

/** A Button that navigates: a real link on the web. */
export function LinkButton({ href, ...props }: ButtonProps & { href: Href }) {
  return (
    <Link href={href} asChild>
      <Button {...props} accessibilityRole="link" />
    </Link>
  );
}
