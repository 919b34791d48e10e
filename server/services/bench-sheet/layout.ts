/**
 * Drawing primitives of the bench sheet: a page writer that keeps the cursor, section
 * headings, ruled label/value tables, boxed blocks and the footer. Black on white with
 * grey hairlines, the status mark in its dark status ink: nothing depends on colour, so a
 * grey photocopy reads the same.
 */
import PDFDocument from 'pdfkit';
import { SHEET_VERDICT_TONES, TONE_COLOURS } from '../../../shared/status-colours';
import { registerSheetFonts, type SheetFont } from './fonts';

export type PaperSize = 'A4' | 'Letter';

/** Points (1/72 in). */
export const MARGIN = { top: 34, bottom: 46, left: 40, right: 40 } as const;
export const FOOTER_GAP = 22;

export const TYPE = {
  body: 9,
  small: 7.5,
  label: 8,
  heading: 9.5,
  lineGap: 1.2,
} as const;

export const INK = '#000000';
/** Rules and secondary text: dark enough to survive a photocopy. */
export const RULE = '#8a8a8a';
export const MUTED = '#3c3c3c';
/** The faint fill behind label columns and headings: decoration only, never meaning. */
export const TINT = '#efefef';
/**
 * The status mark prints in the shared status language's ink (shared/status-colours.ts), as
 * the check page shows the same version: green for current, amber for approved but not yet in
 * force. Both are dark enough to copy as black; the words carry the meaning.
 */
export const STATUS_INK = {
  current: TONE_COLOURS[SHEET_VERDICT_TONES.current].ink,
  pending: TONE_COLOURS[SHEET_VERDICT_TONES.pending].ink,
} as const;

/** Cell padding of the ruled tables, points. */
const CELL = { padX: 5, padY: 2.6 } as const;

/**
 * A row with a callout prints its value and the callout in this large bold type, the callout
 * boxed at the right of the value cell: the limit reads as large as the setting beside it,
 * never larger, so the eye does not take the limit for the setting.
 */
const CALLOUT = { size: 12, padX: 6, padY: 2.5, gap: 10 } as const;

export interface Row {
  label: string;
  value: string;
  /** A second line under the value, smaller (e.g. where a computed value comes from). */
  note?: string;
  /** Printed bold: the values the operator sets on the machine. */
  strong?: boolean;
  /** Printed in large bold type in a box beside the value (e.g. the speed never to exceed). */
  callout?: string;
}

export class SheetWriter {
  readonly doc: PDFKit.PDFDocument;

  constructor(paper: PaperSize, info: { title: string; author: string; subject: string }) {
    this.doc = new PDFDocument({
      size: paper === 'Letter' ? 'LETTER' : 'A4',
      margins: { ...MARGIN },
      bufferPages: true,
      info: { Title: info.title, Author: info.author, Subject: info.subject, Creator: 'Kerfbook' },
      lang: 'en',
    });
    registerSheetFonts(this.doc);
    this.doc.lineGap(TYPE.lineGap);
  }

  /** A column of the page the flow is narrowed to (side-by-side blocks); null for the full width. */
  private column: { left: number; width: number } | null = null;

  get left(): number {
    return this.column?.left ?? MARGIN.left;
  }

  get width(): number {
    return this.column?.width ?? this.doc.page.width - MARGIN.left - MARGIN.right;
  }

  /** Runs `draw` with the flow narrowed to a column; headings, paragraphs and lists keep to it. */
  inColumn<T>(left: number, width: number, draw: () => T): T {
    const outer = this.column;
    this.column = { left, width };
    try {
      return draw();
    } finally {
      this.column = outer;
    }
  }

  get right(): number {
    return this.left + this.width;
  }

  /** Lowest y content may reach on this page (the footer sits below it). */
  get bottom(): number {
    return this.doc.page.height - MARGIN.bottom;
  }

  get y(): number {
    return this.doc.y;
  }

  set y(value: number) {
    this.doc.y = value;
  }

  use(font: SheetFont, size: number, color = INK): this {
    this.doc.font(font).fontSize(size).fillColor(color);
    return this;
  }

  heightOf(text: string, font: SheetFont, size: number, width: number, lineGap: number = TYPE.lineGap): number {
    this.use(font, size);
    return this.doc.heightOfString(text, { width, lineGap });
  }

  /** Starts a new page unless `height` points still fit. */
  ensureSpace(height: number): void {
    if (this.y + height > this.bottom) {
      this.doc.addPage();
      this.y = MARGIN.top;
    }
  }

  gap(points: number): void {
    this.y += points;
  }

  hrule(y: number, weight = 0.5, color = RULE, x1 = this.left, x2 = this.right): void {
    this.doc.save().moveTo(x1, y).lineTo(x2, y).lineWidth(weight).strokeColor(color).stroke().restore();
  }

  vrule(x: number, y1: number, y2: number, weight = 0.5, color = RULE): void {
    this.doc.save().moveTo(x, y1).lineTo(x, y2).lineWidth(weight).strokeColor(color).stroke().restore();
  }

  fillRect(x: number, y: number, w: number, h: number, color = TINT): void {
    this.doc.save().rect(x, y, w, h).fillColor(color).fill().restore();
  }

  strokeRect(x: number, y: number, w: number, h: number, weight = 0.75, color = INK): void {
    this.doc.save().rect(x, y, w, h).lineWidth(weight).strokeColor(color).stroke().restore();
  }

  /** Text at a fixed place, without moving the flow. */
  place(text: string, x: number, y: number, font: SheetFont, size: number, options: PDFKit.Mixins.TextOptions = {}, color = INK): number {
    this.use(font, size, color);
    const height = this.doc.heightOfString(text, { lineGap: TYPE.lineGap, ...options });
    this.doc.text(text, x, y, { lineGap: TYPE.lineGap, ...options });
    return height;
  }

  /**
   * A numbered section heading: "3  CLAMPING" in bold capitals over a full-width rule.
   * `keepWith` is the height of what must follow on the same page.
   */
  section(number: number, title: string, keepWith = 40): void {
    this.ensureSpace(16 + keepWith);
    this.gap(3);
    const y = this.y;
    this.place(String(number), this.left, y, 'bold', TYPE.heading, { lineBreak: false });
    this.place(title.toUpperCase(), this.left + 16, y, 'bold', TYPE.heading, { characterSpacing: 0.6, lineBreak: false });
    this.hrule(y + 11.5, 1, INK);
    this.y = y + 13;
  }

  /**
   * A ruled two-column table: grey label column, value column; hairlines between rows.
   * Rows split across pages row by row, never inside a row.
   */
  /** The height `table` will take for these rows, on one page. */
  tableHeight(rows: readonly Row[], labelWidth = 150, tableWidth = this.width): number {
    return rows.reduce((sum, row) => sum + this.rowHeight(row, labelWidth, tableWidth - labelWidth), 0) + 2;
  }

  private rowHeight(row: Row, labelWidth: number, valueWidth: number): number {
    const labelH = this.heightOf(row.label, 'regular', TYPE.label, labelWidth - 2 * CELL.padX);
    const cell = this.valueCell(row, valueWidth);
    return Math.max(labelH, cell.height) + 2 * CELL.padY;
  }

  /** How a value cell is laid out: the width its text gets, its font size, the callout box and the height of it all. */
  private valueCell(
    row: Row,
    valueWidth: number,
  ): { textWidth: number; size: number; valueH: number; noteH: number; callout: { width: number; height: number } | null; height: number } {
    let callout: { width: number; height: number } | null = null;
    let textWidth = valueWidth - 2 * CELL.padX;
    if (row.callout) {
      this.use('bold', CALLOUT.size);
      // On one line where it fits, leaving room for the value (e.g. "3000 rpm") beside it.
      const width = Math.min(this.doc.widthOfString(row.callout) + 2 * CALLOUT.padX + 1, textWidth - 72);
      callout = { width, height: this.heightOf(row.callout, 'bold', CALLOUT.size, width - 2 * CALLOUT.padX) + 2 * CALLOUT.padY };
      textWidth -= width + CALLOUT.gap;
    }
    const size = row.callout ? CALLOUT.size : TYPE.body;
    const valueH = this.heightOf(row.value, row.strong ? 'bold' : 'regular', size, textWidth);
    const noteH = row.note ? this.heightOf(row.note, 'regular', TYPE.small, textWidth) : 0;
    return { textWidth, size, valueH, noteH, callout, height: Math.max(valueH + noteH, callout?.height ?? 0) };
  }

  /**
   * Short facts two to a line (label, value, label, value), for the scope: saves half the
   * height of a one-per-line table. A row marked `strong` is printed bold.
   */
  pairTable(rows: readonly Row[], labelWidth = 88): void {
    const half = this.width / 2;
    let top = this.y;
    this.hrule(top);
    for (let i = 0; i < rows.length; i += 2) {
      const pair = rows.slice(i, i + 2);
      const height = Math.max(...pair.map((r) => this.rowHeight(r, labelWidth, half - labelWidth)));
      pair.forEach((row, j) => {
        const x = this.left + j * half;
        this.fillRect(x, top + 0.25, labelWidth, height - 0.5);
        this.place(row.label, x + CELL.padX, top + CELL.padY + 0.6, 'regular', TYPE.label, { width: labelWidth - 2 * CELL.padX }, MUTED);
        const valueWidth = half - labelWidth - 2 * CELL.padX;
        const valueH = this.place(row.value, x + labelWidth + CELL.padX, top + CELL.padY, row.strong ? 'bold' : 'regular', TYPE.body, { width: valueWidth });
        if (row.note) this.place(row.note, x + labelWidth + CELL.padX, top + CELL.padY + valueH, 'regular', TYPE.small, { width: valueWidth }, MUTED);
        this.vrule(x + labelWidth, top, top + height);
        if (j === 1) this.vrule(x, top, top + height);
      });
      this.hrule(top + height);
      top += height;
    }
    this.y = top + 2;
  }

  /**
   * Facts in a grid of `columns` cells a line, each a small label over its value (and note):
   * about half the height of a label/value table for short values. Lines never split
   * across pages. A row marked `strong` is printed bold.
   */
  grid(rows: readonly Row[], columns = 4): void {
    const cellWidth = this.width / columns;
    const inner = cellWidth - 2 * CELL.padX;
    const labelH = 9.5;
    const measure = (row: Row) => {
      const valueH = this.heightOf(row.value, row.strong ? 'bold' : 'regular', TYPE.body, inner);
      const noteH = row.note ? this.heightOf(row.note, 'regular', TYPE.small, inner) : 0;
      return { valueH, height: labelH + valueH + noteH };
    };
    let top = this.y;
    this.hrule(top);
    for (let i = 0; i < rows.length; i += columns) {
      const line = rows.slice(i, i + columns).map((row) => ({ row, ...measure(row) }));
      const height = Math.max(...line.map((c) => c.height)) + 2 * CELL.padY - 1;
      if (top + height > this.bottom) {
        this.doc.addPage();
        top = MARGIN.top;
        this.hrule(top);
      }
      line.forEach(({ row, valueH }, j) => {
        const x = this.left + j * cellWidth + CELL.padX;
        this.place(row.label, x, top + CELL.padY, 'regular', TYPE.small - 0.5, { width: inner, lineBreak: false, ellipsis: true }, MUTED);
        this.place(row.value, x, top + CELL.padY + labelH, row.strong ? 'bold' : 'regular', TYPE.body, { width: inner });
        if (row.note) this.place(row.note, x, top + CELL.padY + labelH + valueH, 'regular', TYPE.small, { width: inner }, MUTED);
        if (j > 0) this.vrule(this.left + j * cellWidth, top, top + height);
      });
      this.hrule(top + height);
      top += height;
    }
    this.y = top + 2;
  }

  table(rows: readonly Row[], labelWidth = 150, tableWidth = this.width): void {
    const padX = CELL.padX;
    const padY = CELL.padY;
    const valueX = this.left + labelWidth;
    const valueWidth = tableWidth - labelWidth;
    const tableRight = this.left + tableWidth;
    let top = this.y;
    this.hrule(top, 0.5, RULE, this.left, tableRight);
    for (const row of rows) {
      const labelH = this.heightOf(row.label, 'regular', TYPE.label, labelWidth - 2 * padX);
      const cell = this.valueCell(row, valueWidth);
      const height = Math.max(labelH, cell.height) + 2 * padY;
      if (top + height > this.bottom) {
        this.doc.addPage();
        top = MARGIN.top;
        this.hrule(top, 0.5, RULE, this.left, tableRight);
      }
      this.fillRect(this.left, top + 0.25, labelWidth, height - 0.5);
      this.place(row.label, this.left + padX, top + padY + 0.6, 'regular', TYPE.label, { width: labelWidth - 2 * padX }, MUTED);
      this.place(row.value, valueX + padX, top + padY, row.strong ? 'bold' : 'regular', cell.size, { width: cell.textWidth });
      if (row.note) this.place(row.note, valueX + padX, top + padY + cell.valueH, 'regular', TYPE.small, { width: cell.textWidth }, MUTED);
      if (row.callout && cell.callout) {
        const boxX = valueX + valueWidth - padX - cell.callout.width;
        this.strokeRect(boxX, top + padY, cell.callout.width, cell.callout.height, 1.5, INK);
        this.place(row.callout, boxX + CALLOUT.padX, top + padY + CALLOUT.padY, 'bold', CALLOUT.size, { width: cell.callout.width - 2 * CALLOUT.padX });
      }
      this.vrule(valueX, top, top + height);
      this.hrule(top + height, 0.5, RULE, this.left, tableRight);
      top += height;
    }
    this.y = top + 2;
  }

  /** A paragraph in the flow at full width. */
  paragraph(text: string, font: SheetFont = 'regular', size: number = TYPE.body, color = INK, indent = 0): void {
    const width = this.width - indent;
    const height = this.heightOf(text, font, size, width);
    this.ensureSpace(Math.min(height, 40));
    this.use(font, size, color);
    this.doc.text(text, this.left + indent, this.y, { width, lineGap: TYPE.lineGap });
  }

  /**
   * The foot of every page, written last: which recipe, version and check code the page
   * belongs to and "Page x of y" in bold, so a loose page can be matched to its sheet; under
   * it who printed it and when.
   */
  footers(identity: string, printed: string): void {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i += 1) {
      this.doc.switchToPage(i);
      // Writing below the bottom margin would make pdfkit start a new page: lift it first.
      const bottomMargin = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      const y = this.doc.page.height - MARGIN.bottom + FOOTER_GAP - 14;
      this.hrule(y - 5, 0.5, RULE);
      const pageText = `Page ${i - range.start + 1} of ${range.count}`;
      this.use('bold', TYPE.label);
      const pageWidth = this.doc.widthOfString(pageText);
      this.doc.text(identity, this.left, y, { width: this.width - pageWidth - 12, lineBreak: false, ellipsis: true });
      this.doc.text(pageText, this.right - pageWidth, y, { lineBreak: false });
      this.use('regular', TYPE.small, MUTED);
      this.doc.text(printed, this.left, y + 11, { width: this.width, lineBreak: false, ellipsis: true });
      this.doc.page.margins.bottom = bottomMargin;
    }
  }

  /** The finished document's bytes. */
  async toBuffer(): Promise<Buffer> {
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (chunk: Buffer) => chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
    });
    this.doc.end();
    return done;
  }
}
