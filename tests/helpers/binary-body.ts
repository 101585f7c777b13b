/**
 * supertest's parser for a binary answer (a PDF, a ZIP): `.buffer(true).parse(binaryBody)` gives the
 * body as one Buffer, which supertest leaves empty for types it does not know.
 */
export function binaryBody(
  res: { on(e: string, f: (c?: Buffer) => void): void },
  cb: (err: Error | null, body: Buffer) => void,
): void {
  const chunks: Buffer[] = [];
  res.on("data", (c) => chunks.push(c!));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
}
