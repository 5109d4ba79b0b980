/**
 * A small page writer over pdfkit for the server's reports: A4 pages with room for a running header and footer
 * (stamped on every page once the page count is known), headings, paragraphs, key–value lists and tables that break
 * across pages with their header row repeated. Text goes through `latin` (fonts.ts) so that no character is missing.
 */
import PDFDocument from 'pdfkit';
import { FONT_REGULAR, FONT_SEMIBOLD, latin, registerWorkSans } from './fonts';
import type { Box } from './plots';

export const pageColours = {
  ink: '#1b222c',
  soft: '#3d4652',
  muted: '#5b6472',
  rule: '#cfc9bd',
  shade: '#f3f0e8',
  alert: '#8a4213',
  pass: '#176a63',
} as const;

export interface TableColumn {
  title: string;
  /** Fraction of the text width. */
  width: number;
  align?: 'left' | 'right';
}

export interface PageWriterOptions {
  title: string;
  /** Space kept free at the top and bottom of every page for the running header and footer, pt. */
  headerHeight?: number;
  footerHeight?: number;
}

export class PageWriter {
  readonly doc: PDFKit.PDFDocument;
  readonly left = 50;
  readonly right: number;
  readonly width: number;
  readonly top: number;
  readonly bottom: number;
  private readonly done: Promise<Buffer>;

  constructor(options: PageWriterOptions) {
    const headerHeight = options.headerHeight ?? 64;
    const footerHeight = options.footerHeight ?? 44;
    this.doc = new PDFDocument({
      size: 'A4',
      bufferPages: true,
      margins: { top: headerHeight, bottom: footerHeight, left: 50, right: 50 },
      info: { Title: latin(options.title), Creator: 'Stillspan' },
    });
    const chunks: Buffer[] = [];
    this.done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (chunk: Buffer) => chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
    });
    registerWorkSans(this.doc);
    this.doc.font(FONT_REGULAR);
    this.right = this.doc.page.width - 50;
    this.width = this.right - this.left;
    this.top = headerHeight;
    this.bottom = this.doc.page.height - footerHeight;
  }

  get y(): number {
    return this.doc.y;
  }

  set y(value: number) {
    this.doc.y = value;
  }

  /** A new page when less than `height` is left on this one. */
  ensureSpace(height: number): void {
    if (this.doc.y + height > this.bottom) this.newPage();
  }

  newPage(): void {
    this.doc.addPage();
    this.doc.x = this.left;
    this.doc.y = this.top;
  }

  /** A box of the text width and `height` at the cursor (on a new page when it does not fit); the cursor moves below it. */
  reserve(height: number, gapAfter = 8): Box {
    this.ensureSpace(height);
    const box = { x: this.left, y: this.doc.y, width: this.width, height };
    this.doc.y += height + gapAfter;
    return box;
  }

  heading(text: string, level: 1 | 2 = 1): void {
    const size = level === 1 ? 13 : 10.5;
    this.ensureSpace(level === 1 ? 60 : 44);
    this.doc.y += level === 1 ? 10 : 6;
    this.doc.font(FONT_SEMIBOLD).fontSize(size).fillColor(pageColours.ink).text(latin(text), this.left, this.doc.y, { width: this.width });
    if (level === 1) {
      const y = this.doc.y + 1;
      this.doc.save().lineWidth(0.8).strokeColor(pageColours.rule).moveTo(this.left, y).lineTo(this.right, y).stroke().restore();
      this.doc.y = y + 5;
    } else {
      this.doc.y += 2;
    }
  }

  paragraph(text: string, options: { size?: number; colour?: string; bold?: boolean; gapAfter?: number; indent?: number } = {}): void {
    const size = options.size ?? 9;
    const indent = options.indent ?? 0;
    this.doc.font(options.bold ? FONT_SEMIBOLD : FONT_REGULAR).fontSize(size);
    const height = this.doc.heightOfString(latin(text), { width: this.width - indent });
    this.ensureSpace(Math.min(height, 3 * size));
    this.doc.fillColor(options.colour ?? pageColours.ink).text(latin(text), this.left + indent, this.doc.y, { width: this.width - indent });
    this.doc.y += options.gapAfter ?? 4;
    this.doc.x = this.left;
  }

  /** Label–value pairs, the label in a narrow column; a value may wrap. */
  keyValues(rows: ReadonlyArray<readonly [string, string]>, options: { labelWidth?: number; size?: number } = {}): void {
    const size = options.size ?? 9;
    const labelWidth = options.labelWidth ?? 0.34;
    this.table([{ title: '', width: labelWidth }, { title: '', width: 1 - labelWidth }], rows.map(([k, v]) => [k, v]), {
      size,
      header: false,
      boldFirstColumn: true,
    });
  }

  /**
   * A table: each row as tall as its tallest cell, a new page (header row repeated) when a row does not fit; rows
   * alternate a pale shade. `emphasis(rowIndex, columnIndex)` colours a cell (a verdict).
   */
  table(
    columns: readonly TableColumn[],
    rows: ReadonlyArray<readonly string[]>,
    options: { size?: number; header?: boolean; boldFirstColumn?: boolean; emphasis?: (row: number, column: number) => string | null } = {},
  ): void {
    const doc = this.doc;
    const size = options.size ?? 8.5;
    const pad = 3;
    const xs: number[] = [];
    let x = this.left;
    for (const c of columns) {
      xs.push(x);
      x += c.width * this.width;
    }
    const cellWidth = (i: number) => columns[i].width * this.width - 2 * pad;
    const heightOf = (cells: readonly string[], font: string) => {
      doc.font(font).fontSize(size);
      return Math.max(...cells.map((c, i) => doc.heightOfString(latin(c) || ' ', { width: cellWidth(i) }))) + 2 * pad;
    };
    const drawHeader = () => {
      if (options.header === false) return;
      const titles = columns.map((c) => c.title);
      const h = heightOf(titles, FONT_SEMIBOLD);
      const y = doc.y;
      doc.save().rect(this.left, y, this.width, h).fill('#e6e1d6').restore();
      doc.font(FONT_SEMIBOLD).fontSize(size).fillColor(pageColours.ink);
      titles.forEach((t, i) => doc.text(latin(t), xs[i] + pad, y + pad, { width: cellWidth(i), align: columns[i].align ?? 'left' }));
      doc.y = y + h;
    };
    drawHeader();
    rows.forEach((cells, r) => {
      const h = Math.max(heightOf(cells, FONT_REGULAR), options.boldFirstColumn ? heightOf(cells.slice(0, 1), FONT_SEMIBOLD) : 0);
      if (doc.y + h > this.bottom) {
        this.newPage();
        drawHeader();
      }
      const y = doc.y;
      if (r % 2 === 1) doc.save().rect(this.left, y, this.width, h).fill(pageColours.shade).restore();
      cells.forEach((c, i) => {
        const bold = options.boldFirstColumn && i === 0;
        const colour = options.emphasis?.(r, i) ?? null;
        doc.font(bold || colour ? FONT_SEMIBOLD : FONT_REGULAR).fontSize(size).fillColor(colour ?? (bold ? pageColours.soft : pageColours.ink));
        doc.text(latin(c), xs[i] + pad, y + pad, { width: cellWidth(i), align: columns[i].align ?? 'left' });
      });
      doc.y = y + h;
    });
    doc.save().lineWidth(0.5).strokeColor(pageColours.rule).moveTo(this.left, doc.y).lineTo(this.right, doc.y).stroke().restore();
    doc.y += 6;
    doc.x = this.left;
  }

  /**
   * Draws `stamp(pageIndex, pageCount)` on every page (running header and footer), with the page's margins lifted so
   * that nothing written there starts a new page; then ends the document.
   */
  finish(stamp: (page: number, count: number) => void): Promise<Buffer> {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const margins = { ...this.doc.page.margins };
      this.doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
      stamp(i - range.start, range.count);
      this.doc.page.margins = margins;
    }
    this.doc.end();
    return this.done;
  }
}
