// Page counts read from a PDF's bytes, for the print checks. Counts two ways that must agree:
// the page objects (`/Type /Page`, not `/Pages`) and the /Count of the page tree's root, which
// the catalog names (ISO 32000-1, 7.7.2 and 7.7.3.2). Enough for Chromium's PDFs, whose
// dictionaries are not packed into object streams; anything else throws rather than guessing.

/** The dictionary text of object `num` (`num 0 obj … endobj`). */
function objectText(pdf: string, num: string): string {
  const body = new RegExp(`(?:^|\\s)${num}\\s+0\\s+obj\\b([\\s\\S]*?)endobj`).exec(pdf)?.[1];
  if (body === undefined) throw new Error(`PDF object ${num} not found`);
  return body;
}

/** The number after `key` in `text`, or an error naming what was missing. */
function numberAfter(text: string, pattern: RegExp, what: string): string {
  const value = pattern.exec(text)?.[1];
  if (value === undefined) throw new Error(`PDF: no ${what}`);
  return value;
}

export interface PdfPages {
  /** Objects of type /Page. */
  pageObjects: number;
  /** /Count of the root of the page tree. */
  treeCount: number;
}

export function pdfPages(bytes: Uint8Array): PdfPages {
  const pdf = Buffer.from(bytes).toString('latin1');
  const root = numberAfter(pdf, /\/Root\s+(\d+)\s+0\s+R/, 'trailer /Root');
  const pagesRoot = numberAfter(objectText(pdf, root), /\/Pages\s+(\d+)\s+0\s+R/, 'catalog /Pages');
  const treeCount = Number(numberAfter(objectText(pdf, pagesRoot), /\/Count\s+(\d+)/, 'page tree /Count'));
  return { pageObjects: pdf.match(/\/Type\s*\/Page(?![A-Za-z])/g)?.length ?? 0, treeCount };
}
