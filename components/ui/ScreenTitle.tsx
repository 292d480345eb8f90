import React from "react";
import Head from "expo-router/head";

/** What the browser tab says for a screen: its page title, then the app's name. */
export function screenTitleText(title: string): string {
  return `${title} · Panwise`;
}

/**
 * The screen's browser title, through Expo Router's Head (react-helmet on the web; the newest mounted
 * one wins, so a route file sets it and a screen could refine it). Every route file renders one.
 */
export function ScreenTitle({ title }: { title: string }) {
  return (
    <Head>
      <title>{screenTitleText(title)}</title>
    </Head>
  );
}
