import { createRequire } from "node:module";
import fs from "node:fs";

// Atkinson Hyperlegible, embedded so the statement reads the same on any machine (SIL OFL).
const require = createRequire(import.meta.url);
const FAMILY = "@expo-google-fonts/atkinson-hyperlegible";
let cache: { regular: Buffer; bold: Buffer } | null = null;

export function statementFonts(): { regular: Buffer; bold: Buffer } {
  cache ??= {
    regular: fs.readFileSync(require.resolve(`${FAMILY}/400Regular/AtkinsonHyperlegible_400Regular.ttf`)),
    bold: fs.readFileSync(require.resolve(`${FAMILY}/700Bold/AtkinsonHyperlegible_700Bold.ttf`)),
  };
  return cache;
}
