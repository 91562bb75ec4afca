// The fonts the PDF embeds, shipped in fonts/ (DejaVu Sans; licence in fonts/DejaVu-LICENSE.txt).
// Inter, the screen font, ships only as a variable WOFF2, which pdfkit's font subsetter cannot
// embed (its composite glyphs fail to encode), so the PDF uses a static TrueType family instead.
import fs from 'node:fs';
import path from 'node:path';

export type ReportFonts = { regular: Uint8Array; bold: Uint8Array };

const cache = new Map<string, ReportFonts>();

export function loadReportFonts(root = process.cwd()): ReportFonts {
  let fonts = cache.get(root);
  if (!fonts) {
    fonts = {
      regular: fs.readFileSync(path.join(root, 'fonts', 'DejaVuSans.ttf')),
      bold: fs.readFileSync(path.join(root, 'fonts', 'DejaVuSans-Bold.ttf')),
    };
    cache.set(root, fonts);
  }
  return fonts;
}
