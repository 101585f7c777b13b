/**
 * What a PDF shows, read with pdfjs-dist (Mozilla's PDF reader, general-purpose): each page's text,
 * and each text run with its box in PDF points, so tests can check that no two runs overlap.
 */
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import type { TextItem } from "pdfjs-dist/types/src/display/api";

export interface TextBox {
  str: string;
  /** Left edge and baseline-relative bottom/top, in points from the page's bottom-left corner. */
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PdfPage {
  width: number;
  height: number;
  boxes: TextBox[];
  text: string;
}

export async function pdfLayout(bytes: Uint8Array): Promise<PdfPage[]> {
  const doc = await getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
    verbosity: 0,
  }).promise;
  const pages: PdfPage[] = [];
  for (let n = 1; n <= doc.numPages; n++) {
    const page = await doc.getPage(n);
    const { width, height } = page.getViewport({ scale: 1 });
    const content = await page.getTextContent();
    const items = content.items.filter((i): i is TextItem => "str" in i);
    const boxes = items
      .filter((i) => i.str.trim() !== "")
      .map((i) => {
        const fontSize = Math.hypot(i.transform[2], i.transform[3]);
        // The run's box: from a descender's depth below the baseline to the cap height above it.
        return { str: i.str, x: i.transform[4], y: i.transform[5] - 0.2 * fontSize, width: i.width, height: fontSize };
      });
    const text = items.map((i) => i.str + (i.hasEOL ? "\n" : "")).join("");
    pages.push({ width, height, boxes, text });
  }
  await doc.destroy();
  return pages;
}

/** The text of each page, in reading order as the PDF draws it. */
export async function pdfText(bytes: Uint8Array): Promise<string[]> {
  return (await pdfLayout(bytes)).map((p) => p.text);
}

/**
 * Pairs of text runs on one page whose boxes overlap by more than `tolerance` points in both
 * directions (letters drawn over letters). Touching lines of one paragraph do not count.
 */
export function overlappingText(page: PdfPage, tolerance = 0.5): [TextBox, TextBox][] {
  const found: [TextBox, TextBox][] = [];
  const boxes = [...page.boxes].sort((a, b) => a.x - b.x);
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i];
    for (let j = i + 1; j < boxes.length && boxes[j].x < a.x + a.width - tolerance; j++) {
      const b = boxes[j];
      const dx = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
      const dy = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
      if (dx > tolerance && dy > tolerance) found.push([a, b]);
    }
  }
  return found;
}
