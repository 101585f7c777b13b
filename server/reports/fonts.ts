import { createRequire } from "node:module";

const require = createRequire(import.meta.url);

/**
 * Atkinson Hyperlegible as full TTFs: the @fontsource files are subsets (latin has 241 glyphs and no
 * ą/č/ę; latin-ext lacks A–Z), and pdfkit takes one file per font. Embedded by pdfkit as subsets of
 * what the report uses.
 */
export const REPORT_FONTS = {
  regular: require.resolve("@expo-google-fonts/atkinson-hyperlegible/400Regular/AtkinsonHyperlegible_400Regular.ttf"),
  bold: require.resolve("@expo-google-fonts/atkinson-hyperlegible/700Bold/AtkinsonHyperlegible_700Bold.ttf"),
};
