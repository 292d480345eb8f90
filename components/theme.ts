/**
 * Panwise's one theme: a flour-cream page, dark-roast ink, a baked-crust primary and a sage accent.
 * Every text colour is listed with the backgrounds it sits on in `textPairs`; a test holds them to
 * WCAG 2.1 AA (4.5:1).
 */
import type { TextStyle } from "react-native";

export const colors = {
  // Surfaces
  page: "#F6EFE2", // flour cream
  surface: "#FFFBF3", // cards, inputs
  sunken: "#EDE2CD", // table headers, quiet panels
  rowHover: "#FBF3E6", // a table row under the pointer
  border: "#DCCBB2", // decorative hairlines
  inputBorder: "#8F7A66", // form control outlines (3:1 or more against page and surface)
  nav: "#2E2018", // side navigation (dark roast)
  navActive: "#4B3427",

  // Text
  ink: "#2A1C13", // dark roast
  muted: "#62503F",
  crust: "#8E4219", // links and accents in text
  onPrimary: "#FFF8EC",
  navInk: "#F6EFE2",
  navMuted: "#CDBBA5",

  // Actions
  primary: "#9C4A1E", // baked crust
  primaryPressed: "#7E3914",
  sage: "#4F6547",
  sagePressed: "#3E5238",
  danger: "#A12B24",
  dangerPressed: "#85211B",

  // Status tints (background + its ink)
  sageSoft: "#DDE6D3",
  sageInk: "#354A2E",
  amberSoft: "#F4E3BE",
  amberInk: "#664607",
  dangerSoft: "#F7DEDA",
  dangerInk: "#8A221C",
  crustSoft: "#F3DCCB",
  crustInk: "#74330F",
  neutralSoft: "#E7DCCA",
  neutralInk: "#4A3A2D",

  focus: "#2F6F8F",
} as const;

export type ColorName = keyof typeof colors;

/** Every text colour on every background it is used on. Checked by tests/app/theme.test.tsx. */
export const textPairs: { fg: ColorName; bg: ColorName; use: string }[] = [
  { fg: "ink", bg: "page", use: "body text" },
  { fg: "ink", bg: "surface", use: "card text" },
  { fg: "ink", bg: "sunken", use: "table header" },
  { fg: "muted", bg: "page", use: "secondary text" },
  { fg: "muted", bg: "surface", use: "secondary text on cards" },
  { fg: "muted", bg: "sunken", use: "secondary text on panels" },
  { fg: "crust", bg: "page", use: "links" },
  { fg: "crust", bg: "surface", use: "links on cards" },
  { fg: "crust", bg: "sunken", use: "links on panels" },
  { fg: "ink", bg: "rowHover", use: "table row under the pointer" },
  { fg: "muted", bg: "rowHover", use: "secondary text in a hovered row" },
  { fg: "crust", bg: "rowHover", use: "links in a hovered row" },
  { fg: "onPrimary", bg: "primary", use: "primary button" },
  { fg: "onPrimary", bg: "primaryPressed", use: "primary button pressed" },
  { fg: "onPrimary", bg: "sage", use: "accent button" },
  { fg: "onPrimary", bg: "sagePressed", use: "accent button pressed" },
  { fg: "onPrimary", bg: "danger", use: "danger button" },
  { fg: "onPrimary", bg: "dangerPressed", use: "danger button pressed" },
  { fg: "navInk", bg: "nav", use: "side navigation" },
  { fg: "navMuted", bg: "nav", use: "side navigation secondary" },
  { fg: "navInk", bg: "navActive", use: "side navigation current item" },
  { fg: "sageInk", bg: "sageSoft", use: "active badge" },
  { fg: "amberInk", bg: "amberSoft", use: "on-hold badge" },
  { fg: "dangerInk", bg: "dangerSoft", use: "error banner, closed badge" },
  { fg: "crustInk", bg: "crustSoft", use: "role badge, selected chip" },
  { fg: "neutralInk", bg: "neutralSoft", use: "neutral badge" },
  { fg: "dangerInk", bg: "page", use: "field error" },
  { fg: "dangerInk", bg: "surface", use: "field error on cards" },
  { fg: "sageInk", bg: "page", use: "success note" },
  { fg: "sageInk", bg: "surface", use: "success note on cards" },
  { fg: "ink", bg: "dangerSoft", use: "error panel body" },
  { fg: "dangerInk", bg: "sunken", use: "field error inside a panel" },
  { fg: "crustInk", bg: "surface", use: "current tab label" },
  { fg: "ink", bg: "crustSoft", use: "text on a selected option" },
];

export const fonts = {
  regular: "Nunito_400Regular",
  semibold: "Nunito_600SemiBold",
  bold: "Nunito_700Bold",
  extrabold: "Nunito_800ExtraBold",
} as const;

export const type = {
  display: { fontFamily: fonts.extrabold, fontSize: 30, lineHeight: 36, letterSpacing: -0.3 },
  title: { fontFamily: fonts.extrabold, fontSize: 24, lineHeight: 30 },
  heading: { fontFamily: fonts.bold, fontSize: 19, lineHeight: 26 },
  body: { fontFamily: fonts.regular, fontSize: 16, lineHeight: 24 },
  bodyStrong: { fontFamily: fonts.semibold, fontSize: 16, lineHeight: 24 },
  small: { fontFamily: fonts.regular, fontSize: 14, lineHeight: 20 },
  label: { fontFamily: fonts.bold, fontSize: 14, lineHeight: 20 },
  caption: { fontFamily: fonts.semibold, fontSize: 13, lineHeight: 18, letterSpacing: 0.2 },
  overline: { fontFamily: fonts.extrabold, fontSize: 12, lineHeight: 16, letterSpacing: 1.2, textTransform: "uppercase" },
} satisfies Record<string, TextStyle>;

export type TypeVariant = keyof typeof type;

export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radii = { sm: 6, md: 10, lg: 16, xl: 22, pill: 999 } as const;

export const layout = {
  /** From this width the side navigation replaces the bottom tabs, and lists become tables. */
  wideBreakpoint: 1024,
  /** From here (a tablet) content sits in two columns; the navigation stays at the bottom until wideBreakpoint. */
  twoColumnBreakpoint: 768,
  contentMaxWidth: 1100,
  formMaxWidth: 560,
  sideNavWidth: 248,
  /** Smallest touch target (WCAG 2.5.5 asks 44 x 44 CSS px). */
  minTouch: 44,
  tabBarHeight: 64,
} as const;

export const shadow = {
  card: {
    shadowColor: "#2A1C13",
    shadowOpacity: 0.07,
    shadowRadius: 10,
    shadowOffset: { width: 0, height: 3 },
    elevation: 2,
  },
} as const;

export const theme = { colors, fonts, type, space, radii, layout, shadow, textPairs };
export default theme;
