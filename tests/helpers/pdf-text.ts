/**
 * Text of a PDF the way viewers extract it (ISO 32000-1 §9.10.2): each page's content stream is
 * decoded, the strings shown by Tj/TJ are read as character codes of the font chosen by Tf, and the
 * codes are mapped to Unicode through that font's ToUnicode CMap (§9.10.3, bfchar and bfrange).
 * pdf-lib parses the file and inflates the streams; pdf-lib itself has no text extraction.
 */
import {
  PDFArray,
  PDFDict,
  PDFDocument,
  PDFName,
  PDFRawStream,
  PDFRef,
  decodePDFRawStream,
  type PDFObject,
} from "pdf-lib";

type CMap = { bytes: number; map: Map<number, string> };

function hexToString(hex: string): string {
  let s = "";
  for (let i = 0; i + 4 <= hex.length; i += 4) s += String.fromCharCode(parseInt(hex.slice(i, i + 4), 16));
  if (hex.length === 2) s = String.fromCharCode(parseInt(hex, 16));
  return s;
}

function parseCMap(text: string): CMap {
  const map = new Map<number, string>();
  let bytes = 2;
  const cs = /begincodespacerange\s*<([0-9a-fA-F]+)>/.exec(text);
  if (cs) bytes = cs[1].length / 2;
  for (const block of text.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g))
      map.set(parseInt(m[1], 16), hexToString(m[2]));
  }
  for (const block of text.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F]+>)/g)) {
      const lo = parseInt(m[1], 16);
      const hi = parseInt(m[2], 16);
      if (m[3].startsWith("[")) {
        const items = [...m[3].matchAll(/<([0-9a-fA-F]+)>/g)].map((x) => hexToString(x[1]));
        for (let c = lo; c <= hi && c - lo < items.length; c++) map.set(c, items[c - lo]);
      } else {
        const start = parseInt(m[3].slice(1, -1), 16);
        for (let c = lo; c <= hi; c++) map.set(c, String.fromCodePoint(start + c - lo));
      }
    }
  }
  return { bytes, map };
}

function streamText(doc: PDFDocument, obj: PDFObject | undefined): string {
  const o = obj instanceof PDFRef ? doc.context.lookup(obj) : obj;
  if (o instanceof PDFRawStream) return Buffer.from(decodePDFRawStream(o).decode()).toString("latin1");
  if (o instanceof PDFArray)
    return o
      .asArray()
      .map((x) => streamText(doc, x))
      .join("\n");
  return "";
}

function decodeHexWith(hex: string, cmap: CMap | undefined): string {
  const step = (cmap?.bytes ?? 1) * 2;
  let out = "";
  for (let i = 0; i + step <= hex.length; i += step) {
    const code = parseInt(hex.slice(i, i + step), 16);
    out += cmap?.map.get(code) ?? String.fromCharCode(code);
  }
  return out;
}

export async function pdfText(bytes: Uint8Array): Promise<string[]> {
  const doc = await PDFDocument.load(bytes);
  const pages: string[] = [];
  for (const page of doc.getPages()) {
    const fonts = new Map<string, CMap>();
    const res = page.node.Resources();
    const fontDict = res?.lookup(PDFName.of("Font"));
    if (fontDict instanceof PDFDict) {
      for (const [name, ref] of fontDict.entries()) {
        const font = doc.context.lookup(ref);
        if (!(font instanceof PDFDict)) continue;
        const tu = font.get(PDFName.of("ToUnicode"));
        if (tu) fonts.set(name.asString().slice(1), parseCMap(streamText(doc, tu)));
      }
    }
    const content = streamText(doc, page.node.get(PDFName.of("Contents")));
    let current: CMap | undefined;
    const lines: string[] = [];
    // /F1 10 Tf … [<00a1> 12 <00b2>] TJ or <00a1> Tj
    for (const m of content.matchAll(/\/([\w.+-]+)\s+[\d.]+\s+Tf|\[((?:[^\]\\]|\\.)*)\]\s*TJ|<([0-9a-fA-F]*)>\s*Tj/g)) {
      if (m[1]) current = fonts.get(m[1]);
      else if (m[2] !== undefined)
        lines.push([...m[2].matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => decodeHexWith(h[1], current)).join(""));
      else if (m[3] !== undefined) lines.push(decodeHexWith(m[3], current));
    }
    pages.push(lines.join("\n"));
  }
  return pages;
}
