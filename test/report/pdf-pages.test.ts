import { describe, expect, it } from 'vitest';
import { pdfPages } from './pdf-pages.js';

// A hand-written PDF skeleton (ISO 32000-1, 7.7.3: a page tree of nested /Pages nodes): the root
// holds one page and an intermediate node with two more, so the root's /Count is 3 while the
// inner node says 2.
const PDF = [
  '%PDF-1.4',
  '1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj',
  '2 0 obj << /Type /Pages /Kids [3 0 R 4 0 R] /Count 3 >> endobj',
  '3 0 obj << /Type /Page /Parent 2 0 R >> endobj',
  '4 0 obj << /Type /Pages /Parent 2 0 R /Kids [5 0 R 6 0 R] /Count 2 >> endobj',
  '5 0 obj << /Type /Page /Parent 4 0 R >> endobj',
  '6 0 obj << /Type/Page /Parent 4 0 R >> endobj',
  'trailer << /Size 7 /Root 1 0 R >>',
  '%%EOF',
].join('\n');

describe('pdfPages', () => {
  it('counts page objects (not /Pages nodes) and reads the root /Count, not an inner one', () => {
    expect(pdfPages(Buffer.from(PDF, 'latin1'))).toEqual({ pageObjects: 3, treeCount: 3 });
  });

  it('throws when the catalog names no page tree', () => {
    expect(() => pdfPages(Buffer.from(PDF.replace('/Pages 2 0 R >> endobj', '>> endobj'), 'latin1'))).toThrow('catalog /Pages');
  });
});
