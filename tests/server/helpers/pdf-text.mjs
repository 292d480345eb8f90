// Reads a PDF from stdin and prints its positioned text items as JSON, one array per page:
// [{ width, height, items: [{ str, x, y, w, h }] }]. pdfjs-dist (Mozilla PDF.js) is ESM-only, so the tests run
// it in this child process. x, y in PDF points from the bottom-left corner; w is the item's advance width.
import { createRequire } from "node:module";
import path from "node:path";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";

const require = createRequire(import.meta.url);
const fonts = path.join(path.dirname(require.resolve("pdfjs-dist/package.json")), "standard_fonts") + path.sep;
const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const pdf = await getDocument({ data: new Uint8Array(Buffer.concat(chunks)), standardFontDataUrl: fonts, verbosity: 0 }).promise;
const pages = [];
for (let n = 1; n <= pdf.numPages; n++) {
  const page = await pdf.getPage(n);
  const [x0, y0, x1, y1] = page.view;
  const content = await page.getTextContent();
  pages.push({
    width: x1 - x0,
    height: y1 - y0,
    items: content.items.filter((i) => "str" in i && i.str.trim() !== "").map((i) => ({ str: i.str, x: i.transform[4], y: i.transform[5], w: i.width, h: i.height })),
  });
}
process.stdout.write(JSON.stringify(pages));
