/**
 * Lays out the bench sheet from its model: header with the check code and QR,
 * the uncontrolled-copy notice, scope, parameters, clamping (with the setup photo), coolant,
 * numbered instructions, acceptance criteria, cautions, the standard cautions box,
 * signatures, and a footer on every page. One page where the end of the sheet set tighter
 * fits, else two or more.
 */
import { NO_SAFETY_CLAIM, PRECEDENCE_LINE, type Caution } from '../../../shared/cautions';
import type { SheetModel } from './content';
import { INK, MUTED, RULE, SheetWriter, STATUS_INK, TINT, TYPE, type PaperSize } from './layout';
import { markdownHeight, writeMarkdown } from './markdown';

export interface SheetPhoto {
  jpeg: Buffer;
  width: number;
  height: number;
  caption: string;
}

export interface SheetRenderInput {
  model: SheetModel;
  paper: PaperSize;
  qrPng: Buffer;
  photo: SheetPhoto | null;
  /** "Printed 2026-12-01 14:03 UTC by Ana Operator — check the code before use". */
  footer: string;
}

const QR_SIZE = 62;

function header(w: SheetWriter, m: SheetModel, qr: Buffer): void {
  const top = w.y;
  // Over the box: who issues the sheet and what it is.
  w.place(m.labName.toUpperCase(), w.left, top, 'bold', 8, { characterSpacing: 0.8, lineBreak: false, width: w.width * 0.6, ellipsis: true });
  w.use('regular', 7.5, MUTED);
  const kind = 'BENCH SHEET · CUTTING RECIPE';
  w.place(
    kind,
    w.right - w.doc.widthOfString(kind, { characterSpacing: 0.8 }) - 1,
    top + 0.5,
    'regular',
    7.5,
    { characterSpacing: 0.8, lineBreak: false },
    MUTED,
  );

  const boxTop = top + 14;
  const sideWidth = 124;
  const mainWidth = w.width - sideWidth;
  const pad = 10;

  // Recipe number and version, then the title.
  let y = boxTop + pad - 1;
  w.place(m.number, w.left + pad, y, 'bold', 20, { lineBreak: false });
  w.use('bold', 20);
  const numberWidth = w.doc.widthOfString(m.number);
  w.place(`Version ${m.version}`, w.left + pad + numberWidth + 12, y + 6.5, 'bold', 13, { lineBreak: false });
  y += 26;
  y += w.place(m.title, w.left + pad, y, 'bold', 12, { width: mainWidth - 2 * pad }) + 3;

  // Status, effective date, review due: small labels over values.
  // The status gets the widest field: "Approved — not yet current" must fit on one line.
  // Who prepared the version sits beside who approved it.
  const fieldRows: { label: string; value: string; share: number }[][] = [
    [
      { label: 'Status', value: m.statusLine, share: 0.44 },
      { label: 'Effective from', value: m.effectiveFrom, share: 0.28 },
      { label: 'Review due', value: m.reviewDueOn, share: 0.28 },
    ],
    [
      { label: 'Prepared by', value: m.preparedBy, share: 0.44 },
      { label: 'Approved by', value: m.approvedBy, share: 0.56 },
    ],
  ];
  for (const fields of fieldRows) {
    w.hrule(y, 0.5, RULE, w.left + pad, w.left + mainWidth - pad);
    y += 4;
    let fx = w.left + pad;
    for (const field of fields) {
      const fieldWidth = field.share * (mainWidth - 2 * pad);
      w.place(field.label.toUpperCase(), fx, y, 'regular', 6.5, { characterSpacing: 0.6, lineBreak: false }, MUTED);
      // The status in its status colour (dark enough to photocopy as black).
      const ink = field.label === 'Status' ? (m.current ? STATUS_INK.current : STATUS_INK.pending) : INK;
      w.place(field.value, fx, y + 8.5, 'bold', 9.5, { width: fieldWidth - 6, lineBreak: false, ellipsis: true }, ink);
      fx += fieldWidth;
    }
    y += 22;
  }

  // The check code column: QR code, then the code itself, large.
  const sideX = w.left + mainWidth;
  const sideHeight = pad + QR_SIZE + 34;
  const boxHeight = Math.max(y - boxTop + pad - 4, sideHeight);
  w.doc.image(qr, sideX + (sideWidth - QR_SIZE) / 2, boxTop + 6, { width: QR_SIZE, height: QR_SIZE });
  w.place('CHECK CODE', sideX, boxTop + QR_SIZE + 8, 'regular', 6.5, { width: sideWidth, align: 'center', characterSpacing: 0.8, lineBreak: false }, MUTED);
  // As large as fits the column on one line (W and M are wide).
  let codeSize = 16;
  w.use('bold', codeSize);
  while (codeSize > 10 && w.doc.widthOfString(m.checkCode, { characterSpacing: 0.8 }) > sideWidth - 12) w.use('bold', (codeSize -= 0.5));
  w.place(m.checkCode, sideX, boxTop + QR_SIZE + 18, 'bold', codeSize, { width: sideWidth, align: 'center', characterSpacing: 0.8, lineBreak: false });

  w.strokeRect(w.left, boxTop, w.width, boxHeight, 1.25, INK);
  w.vrule(sideX, boxTop, boxTop + boxHeight, 0.75, INK);
  w.y = boxTop + boxHeight + 6;
}

/**
 * The uncontrolled-copy notice: a printed copy must be checked against the current revision
 * before use (ISO/IEC 17025:2017 §8.3, obsolete documents unusable by mistake).
 */
function uncontrolledNotice(w: SheetWriter, m: SheetModel): void {
  const pending = m.current ? '' : ` This version is not yet in force: do not use it before ${m.effectiveFrom}.`;
  const text = `Uncontrolled once printed. Before each use, scan the QR code or open ${m.checkUrl} and confirm that version ${m.version} is still the current revision. Do not use a superseded or withdrawn sheet.${pending}`;
  const height = w.heightOf(text, 'regular', TYPE.small + 0.5, w.width - 14);
  const top = w.y;
  w.fillRect(w.left, top, 3, height + 4, INK);
  w.place(text, w.left + 10, top + 2, 'regular', TYPE.small + 0.5, { width: w.width - 14 }, INK);
  w.y = top + height + 5;
}

/** Type of the key-settings strip: the values read at arm's length (about 5 mm capitals). */
const KEY = { value: 14, detail: 8.5, limit: 9, label: 6.5, pad: 7 } as const;

/**
 * The key settings at the top of page 1, in large type: wheel, wheel speed with the speed
 * never to exceed on this machine boxed under it, feed, cut motion and coolant — what the
 * operator sets, in the order they set it. The limit is smaller than the setting, so the eye
 * never takes the limit for the setting.
 */
function keySettingsStrip(w: SheetWriter, m: SheetModel): void {
  const shares = [0.19, 0.27, 0.17, 0.15, 0.22];
  // Each value on one line where it can be at 11 pt or more, else as large as lets its longest
  // word fit: a setting is never broken inside a word or a unit ("mm/ s").
  const cells = m.keySettings.map((k, i) => {
    const width = shares[i]! * w.width;
    const inner = 0.97 * (width - 2 * KEY.pad);
    const widthAt = (text: string) => w.use('bold', KEY.value).doc.widthOfString(text);
    const whole = (KEY.value * inner) / widthAt(k.value);
    // pdfkit counts the space after a word when it fits a line.
    const word = (KEY.value * inner) / Math.max(...k.value.split(/\s+/).map((part) => widthAt(`${part} `)));
    const size = Math.min(KEY.value, whole >= 11 ? whole : Math.max(11, word));
    return { ...k, width, size };
  });
  const top = w.y;
  const labelH = 11;
  const heightOf = (c: (typeof cells)[number]) => {
    const inner = c.width - 2 * KEY.pad;
    let h = labelH + w.heightOf(c.value, 'bold', c.size, inner);
    if (c.detail) h += w.heightOf(c.detail, 'regular', KEY.detail, inner);
    if (c.limit) h += 3 + w.heightOf(c.limit, 'bold', KEY.limit, inner - 8) + 5;
    return h;
  };
  const height = Math.max(...cells.map(heightOf)) + 2 * KEY.pad - 2;
  w.ensureSpace(height + 16);
  w.place('KEY SETTINGS', w.left, top, 'bold', TYPE.label, { characterSpacing: 0.5, lineBreak: false });
  w.place('set the machine to these', w.left + 80, top + 0.5, 'regular', TYPE.small, { lineBreak: false }, MUTED);
  const boxTop = top + 12;
  let x = w.left;
  cells.forEach((c, i) => {
    const inner = c.width - 2 * KEY.pad;
    let y = boxTop + KEY.pad - 2;
    w.place(c.label.toUpperCase(), x + KEY.pad, y, 'regular', KEY.label, { characterSpacing: 0.6, lineBreak: false }, MUTED);
    y += labelH;
    y += w.place(c.value, x + KEY.pad, y, 'bold', c.size, { width: inner });
    if (c.detail) y += w.place(c.detail, x + KEY.pad, y, 'regular', KEY.detail, { width: inner });
    if (c.limit) {
      const limitH = w.heightOf(c.limit, 'bold', KEY.limit, inner - 8) + 5;
      w.strokeRect(x + KEY.pad, y + 3, inner, limitH, 1.5, INK);
      w.place(c.limit, x + KEY.pad + 4, y + 5.5, 'bold', KEY.limit, { width: inner - 8 });
    }
    if (i > 0) w.vrule(x, boxTop, boxTop + height, 0.75, INK);
    x += c.width;
  });
  w.strokeRect(w.left, boxTop, w.width, height, 1.5, INK);
  w.y = boxTop + height + 4;
}

const PHOTO_MAX_HEIGHT = 120;

function photoSize(photo: SheetPhoto, width: number): { pw: number; ph: number } {
  const scale = Math.min(width / photo.width, PHOTO_MAX_HEIGHT / photo.height);
  return { pw: photo.width * scale, ph: photo.height * scale };
}

const photoCaption = (photo: SheetPhoto) => (photo.caption ? `Setup photo — ${photo.caption}` : 'Setup photo');

/** The height `photoBlock` takes: the photo and its caption. */
function photoBlockHeight(w: SheetWriter, photo: SheetPhoto, width: number): number {
  return photoSize(photo, width).ph + 3 + w.heightOf(photoCaption(photo), 'regular', TYPE.small, width);
}

function photoBlock(w: SheetWriter, photo: SheetPhoto, x: number, y: number, width: number): void {
  const { pw, ph } = photoSize(photo, width);
  w.doc.image(photo.jpeg, x + (width - pw) / 2, y, { width: pw, height: ph });
  w.strokeRect(x + (width - pw) / 2, y, pw, ph, 0.5, RULE);
  w.place(photoCaption(photo), x, y + ph + 3, 'regular', TYPE.small, { width, align: 'center' }, MUTED);
}

/** A caution the recipe calls for, full width: bold title, text, and its basis. */
const recipeCautionText = (c: Caution) => `${c.text}${c.sources.length ? ` (Basis: ${c.sources.join('; ')}.)` : ''}`;

/**
 * Splits items, in order, into `columns` runs whose tallest is as short as it can be (every
 * split tried: a handful of cautions), so a box of columns wastes no height.
 */
export function balancedColumns<T>(items: readonly T[], columns: number, height: (item: T) => number): T[][] {
  const sum = (list: readonly T[]) => list.reduce((total, item) => total + height(item), 0);
  if (columns <= 1 || items.length <= 1) return [items.slice()];
  let best: T[][] = [items.slice()];
  let bestTallest = sum(items);
  for (let k = 1; k < items.length; k += 1) {
    const rest = balancedColumns(items.slice(k), columns - 1, height);
    const tallest = Math.max(sum(items.slice(0, k)), ...rest.map(sum));
    if (tallest < bestTallest) [best, bestTallest] = [[items.slice(0, k), ...rest], tallest];
  }
  return best;
}

/**
 * How the standard cautions are set: two columns in 7 pt, a paragraph per caution; or, where
 * only that keeps a sheet on one page, each column as one run-on paragraph in 6.5 pt (the size
 * of the sheet's smallest labels) with tighter lines. Nothing is left out either way.
 */
interface CautionsStyle {
  columns: number;
  size: number;
  lineGap: number;
  band: number;
  /** Each column as one run-on paragraph (titles in bold) rather than a paragraph per caution. */
  runOn: boolean;
}
const CAUTIONS_STYLE: CautionsStyle = { columns: 2, size: 7, lineGap: 1.2, band: 18, runOn: false };
const CAUTIONS_COMPACT: CautionsStyle = { columns: 2, size: 6.5, lineGap: 0.8, band: 15, runOn: true };
const runOnText = (list: readonly Caution[]) => list.map((c) => `${c.title}. ${c.text}`).join('  ');
const CAUTIONS_PAD = 8;
const CAUTIONS_GUTTER = 12;

/** The standard cautions split into balanced columns, and the recipe's own cautions, measured for `style`. */
function cautionsLayout(w: SheetWriter, m: SheetModel, style: CautionsStyle) {
  const { columns, size, lineGap } = style;
  const colWidth = (w.width - 2 * CAUTIONS_PAD - (columns - 1) * CAUTIONS_GUTTER) / columns;
  const fullWidth = w.width - 2 * CAUTIONS_PAD;
  // Measured in regular type, the column narrowed by what the bold title takes beyond regular type.
  const boldExtra = (title: string) => w.use('bold', size).doc.widthOfString(`${title}. `) - w.use('regular', size).doc.widthOfString(`${title}. `);
  const items = m.standardCautions.map((c) => ({
    ...c,
    height: w.heightOf(`${c.title}. ${c.text}`, 'regular', size, colWidth - boldExtra(c.title), lineGap) + 3.5,
  }));
  const forRecipe = m.recipeCautions.map((c) => ({ ...c, height: w.heightOf(`${c.title}. ${recipeCautionText(c)}`, 'bold', TYPE.small + 0.5, fullWidth) + 4 }));
  const forRecipeHeight = forRecipe.length ? 12 + forRecipe.reduce((sum, i) => sum + i.height, 0) + 17 : 0;
  // Split in order where the tallest column is the shortest, so the box wastes no height.
  const heightOf = (list: typeof items) =>
    style.runOn ? w.heightOf(runOnText(list), 'bold', size, colWidth, lineGap) + 3.5 : list.reduce((sum, i) => sum + i.height, 0);
  const parts = balancedColumns(items, columns, (i) => (style.runOn ? i.text.length + i.title.length : i.height));
  const colHeight = Math.max(...parts.map(heightOf));
  const precedenceHeight = w.heightOf(PRECEDENCE_LINE, 'bold', TYPE.small, fullWidth);
  const claimHeight = w.heightOf(NO_SAFETY_CLAIM, 'regular', TYPE.small, fullWidth);
  // As drawn below: heading band, recipe cautions, columns, rule, precedence line, claim.
  const height = style.band + 4 + forRecipeHeight + colHeight + 6 + precedenceHeight + 2 + claimHeight + CAUTIONS_PAD - 2;
  return { colWidth, fullWidth, forRecipe, parts, height };
}

function cautionsBox(w: SheetWriter, m: SheetModel, style: CautionsStyle): void {
  const pad = CAUTIONS_PAD;
  const { columns, size, lineGap, band } = style;
  const { colWidth, fullWidth, forRecipe, parts, height } = cautionsLayout(w, m, style);
  w.ensureSpace(height + 6);
  w.gap(6);
  const top = w.y;

  // Heading bar: a drawn warning sign and the heading, on a faint band.
  w.fillRect(w.left, top, w.width, band, TINT);
  const tx = w.left + pad;
  const ty = top + (band - 11) / 2 - 0.5;
  w.doc
    .save()
    .moveTo(tx + 6, ty)
    .lineTo(tx + 12, ty + 11)
    .lineTo(tx, ty + 11)
    .closePath()
    .lineWidth(1)
    .strokeColor(INK)
    .stroke()
    .restore();
  w.place('!', tx + 4.4, ty + 2.2, 'bold', 7, { lineBreak: false });
  w.place(forRecipe.length ? 'CAUTIONS' : 'STANDARD CAUTIONS', tx + 18, ty + 1, 'bold', TYPE.heading, { characterSpacing: 0.6, lineBreak: false });
  w.place('Read before every cut', w.right - pad - 110, ty + 2.5, 'regular', TYPE.small, { width: 110, align: 'right', lineBreak: false }, MUTED);

  // What this recipe's material, coolant or flags call for, first and full width, with the basis of each.
  let columnsTop = top + band + 4;
  if (forRecipe.length) {
    let y = columnsTop;
    w.place('FOR THIS MATERIAL AND SETUP', w.left + pad, y, 'bold', TYPE.small, { characterSpacing: 0.6, lineBreak: false });
    y += 12;
    for (const c of forRecipe) {
      w.use('bold', TYPE.small + 0.5);
      w.doc.text(`${c.title}. `, w.left + pad, y, { width: fullWidth, lineGap: TYPE.lineGap, continued: true });
      w.use('regular', TYPE.small + 0.5);
      w.doc.text(recipeCautionText(c), { width: fullWidth, lineGap: TYPE.lineGap });
      y = w.doc.y + 4;
    }
    y += 1;
    w.hrule(y, 0.5, RULE, w.left + pad, w.right - pad);
    w.place('STANDARD', w.left + pad, y + 4, 'bold', TYPE.small, { characterSpacing: 0.6, lineBreak: false });
    columnsTop = y + 16;
  }

  const writeColumn = (list: (typeof parts)[number], x: number): number => {
    let y = columnsTop;
    if (style.runOn) {
      list.forEach((c, i) => {
        const last = i === list.length - 1;
        w.use('bold', size);
        if (i === 0) w.doc.text(`${c.title}. `, x, y, { width: colWidth, lineGap, continued: true });
        else w.doc.text(`${c.title}. `, { width: colWidth, lineGap, continued: true });
        w.use('regular', size);
        w.doc.text(last ? c.text : `${c.text}  `, { width: colWidth, lineGap, continued: !last });
      });
      return w.doc.y + 3.5;
    }
    for (const c of list) {
      w.use('bold', size);
      w.doc.text(`${c.title}. `, x, y, { width: colWidth, lineGap, continued: true });
      w.use('regular', size);
      w.doc.text(c.text, { width: colWidth, lineGap });
      y = w.doc.y + 3.5;
    }
    return y;
  };
  // Written first; the box is drawn last to the height the columns really took.
  const columnX = (i: number) => w.left + pad + i * (colWidth + CAUTIONS_GUTTER);
  const columnsEnd = Math.max(...parts.map((list, i) => writeColumn(list, columnX(i))));
  for (let i = 1; i < Math.min(parts.length, columns); i += 1) w.vrule(columnX(i) - CAUTIONS_GUTTER / 2, columnsTop, columnsEnd - 4, 0.5, RULE);

  let y = columnsEnd + 2;
  w.hrule(y, 0.5, RULE, w.left + pad, w.right - pad);
  y += 4;
  y += w.place(PRECEDENCE_LINE, w.left + pad, y, 'bold', TYPE.small, { width: fullWidth });
  y += 2;
  y += w.place(NO_SAFETY_CLAIM, w.left + pad, y, 'regular', TYPE.small, { width: fullWidth }, MUTED);

  const drawnHeight = y + pad - 2 - top;
  w.strokeRect(w.left, top, w.width, drawnHeight, 1.5, INK);
  w.y = top + drawnHeight + 4;
}

const SIGNATURE_COLUMNS = [
  { title: 'Signed by', width: 0.3 },
  { title: 'Meaning', width: 0.14 },
  { title: 'Date and time (UTC)', width: 0.24 },
  { title: 'Content SHA-256 (first 16)', width: 0.32 },
];
const bindingLine = (m: SheetModel) => `Signatures bind the content with SHA-256 ${m.contentHash.slice(0, 16)}…; the full hash and the trail are in Kerfbook.`;
const changeReasonLine = (m: SheetModel) => (m.version > 1 && m.changeReason.trim() ? `Why this version: ${m.changeReason.trim()}` : '');

/** One signature on one line: who, meaning, when (UTC) and the content hash they signed, then any comment. */
const signatureLine = (s: SheetModel['signatures'][number]) => `${s.name} · ${s.meaning} · ${s.signedAt} · content SHA-256 ${s.hash}`;
const signatureComment = (s: SheetModel['signatures'][number]) => (s.comment ? `“${s.comment}”` : '');

/** The signatures as lines under a small heading: the same facts as the table in about half its height. */
function compactSignaturesHeight(w: SheetWriter, m: SheetModel): number {
  const lines = m.signatures.length
    ? m.signatures.reduce(
        (sum, s) =>
          sum +
          w.heightOf(signatureLine(s), 'bold', TYPE.body, w.width) +
          (s.comment ? w.heightOf(signatureComment(s), 'regular', TYPE.small, w.width) : 0) +
          1,
        0,
      )
    : w.heightOf('No signature recorded.', 'regular', TYPE.body, w.width);
  const reason = changeReasonLine(m);
  return (
    6 + 10 + lines + 1 + w.heightOf(bindingLine(m), 'regular', TYPE.small, w.width) + (reason ? 2 + w.heightOf(reason, 'regular', TYPE.small, w.width) : 0)
  );
}

function compactSignatures(w: SheetWriter, m: SheetModel): void {
  w.place('SIGNATURES', w.left, w.y, 'regular', 6.5, { characterSpacing: 0.5, lineBreak: false }, MUTED);
  w.hrule(w.y + 8.5);
  w.y += 10;
  if (m.signatures.length === 0) w.paragraph('No signature recorded.', 'regular', TYPE.body);
  for (const s of m.signatures) {
    w.paragraph(signatureLine(s), 'bold', TYPE.body);
    if (s.comment) w.paragraph(signatureComment(s), 'regular', TYPE.small, MUTED);
    w.gap(1);
  }
  w.gap(1);
  w.paragraph(bindingLine(m), 'regular', TYPE.small, MUTED);
  const reason = changeReasonLine(m);
  if (reason) {
    w.gap(2);
    w.paragraph(reason, 'regular', TYPE.small, INK);
  }
}

/** The height the signature table, the binding line and the reason for the version take, as drawn below. */
function signaturesHeight(w: SheetWriter, m: SheetModel): number {
  const commentWidth = (SIGNATURE_COLUMNS[0]!.width + SIGNATURE_COLUMNS[1]!.width) * w.width - 10;
  const rows = m.signatures.length
    ? m.signatures.reduce((sum, s) => sum + 20 + (s.comment ? w.heightOf(`“${s.comment}”`, 'regular', TYPE.small, commentWidth) : 0), 0)
    : 18;
  const reason = changeReasonLine(m);
  return 6 + 15 + rows + 3 + w.heightOf(bindingLine(m), 'regular', TYPE.small, w.width) + (reason ? 2 + w.heightOf(reason, 'regular', TYPE.small, w.width) : 0);
}

function signatures(w: SheetWriter, m: SheetModel): void {
  const cols = SIGNATURE_COLUMNS.map((c) => ({ ...c, width: c.width * w.width }));
  const pad = 5;
  let top = w.y;
  w.fillRect(w.left, top, w.width, 15, TINT);
  let x = w.left;
  for (const c of cols) {
    w.place(c.title.toUpperCase(), x + pad, top + 4, 'regular', 6.5, { characterSpacing: 0.5, lineBreak: false }, MUTED);
    x += c.width;
  }
  w.hrule(top);
  top += 15;
  w.hrule(top);
  if (m.signatures.length === 0) {
    w.place('No signature recorded.', w.left + pad, top + 4, 'regular', TYPE.body);
    top += 18;
    w.hrule(top);
  }
  for (const s of m.signatures) {
    const cells = [s.name, s.meaning, s.signedAt, s.hash];
    const commentH = s.comment ? w.heightOf(`“${s.comment}”`, 'regular', TYPE.small, cols[0]!.width + cols[1]!.width - 2 * pad) : 0;
    const height = 20 + commentH;
    if (top + height > w.bottom) {
      w.doc.addPage();
      top = w.y;
      w.hrule(top);
    }
    x = w.left;
    cells.forEach((text, i) => {
      w.place(text, x + pad, top + 5, i === 0 ? 'bold' : 'regular', TYPE.body, { width: cols[i]!.width - 2 * pad, lineBreak: false, ellipsis: true });
      x += cols[i]!.width;
    });
    if (s.comment) w.place(`“${s.comment}”`, w.left + pad, top + 17, 'regular', TYPE.small, { width: cols[0]!.width + cols[1]!.width - 2 * pad }, MUTED);
    top += height;
    w.hrule(top);
  }
  w.y = top + 3;
  w.paragraph(bindingLine(m), 'regular', TYPE.small, MUTED);
  const reason = changeReasonLine(m);
  if (reason) {
    w.gap(2);
    w.paragraph(reason, 'regular', TYPE.small, INK);
  }
}

/**
 * Acceptance criteria and the recipe's own cautions: side by side when both fit on this page
 * (they are usually a few lines each), else one after the other. Returns the last section number.
 */
function acceptanceAndCautions(w: SheetWriter, m: SheetModel, n: number): number {
  const cautionsEmpty = m.recipeCautions.length ? 'None written beyond the cautions below.' : 'None beyond the standard cautions below.';
  const blocks = [
    { title: 'Acceptance criteria for the cut face', md: m.acceptanceMd, empty: 'None given.' },
    { title: 'Cautions for this recipe', md: m.cautionsMd, empty: cautionsEmpty },
  ];
  const gutter = 16;
  const half = (w.width - gutter) / 2;
  const tallest = Math.max(
    ...blocks.map((b) => w.inColumn(w.left, half, () => (b.md.trim() ? markdownHeight(w, b.md) : w.heightOf(b.empty, 'regular', TYPE.body, half)))),
  );
  // Short blocks go side by side, on the next page if not on this one; long ones one after the other.
  if (tallest > 240) {
    for (const b of blocks) {
      w.section(++n, b.title, 24);
      writeMarkdown(w, b.md, { emptyText: b.empty });
    }
    return n;
  }
  w.ensureSpace(20 + tallest);
  const top = w.y;
  const ends = blocks.map((b, i) => {
    w.y = top;
    const number = n + i + 1;
    return w.inColumn(w.left + i * (half + gutter), half, () => {
      w.section(number, b.title, 0);
      writeMarkdown(w, b.md, { emptyText: b.empty });
      return w.y;
    });
  });
  w.y = Math.max(...ends);
  return n + blocks.length;
}

export async function renderSheet(input: SheetRenderInput): Promise<Buffer> {
  const { model: m } = input;
  const w = new SheetWriter(input.paper, {
    title: `${m.number} v${m.version} — ${m.title}`,
    author: m.labName,
    subject: `Bench sheet, check code ${m.checkCode}`,
  });
  w.y = w.doc.page.margins.top;
  header(w, m, input.qrPng);
  uncontrolledNotice(w, m);

  keySettingsStrip(w, m);

  let n = 0;
  w.section(++n, 'Scope');
  w.grid(m.scope, 5);

  w.section(++n, 'Machine and wheel');
  w.grid(m.parameters);

  // Clamping beside the setup photo, kept together on one page.
  const photoWidth = 150;
  const gap = 12;
  if (input.photo) {
    const photoHeight = photoBlockHeight(w, input.photo, photoWidth);
    w.section(++n, 'Clamping', Math.max(w.tableHeight(m.clamping, 120, w.width - photoWidth - gap), photoHeight));
    const top = w.y;
    w.table(m.clamping, 120, w.width - photoWidth - gap);
    const tableEnd = w.y;
    photoBlock(w, input.photo, w.right - photoWidth, top, photoWidth);
    w.y = Math.max(tableEnd, top + photoHeight + 2);
  } else {
    // Up to six facts on one line: a second line of one fact wastes a row.
    w.section(++n, 'Clamping', 40);
    w.grid(m.clamping, m.clamping.length <= 6 ? Math.max(4, m.clamping.length) : 5);
  }

  // The steps follow straight on; a long list goes on over the page, step by step.
  w.section(++n, 'Instructions', Math.min(markdownHeight(w, m.instructionsMd), 40));
  writeMarkdown(w, m.instructionsMd, { emptyText: 'No instructions beyond the parameters above.' });

  acceptanceAndCautions(w, m, n);

  // The end of the sheet set tighter where only that keeps it off a page of its own.
  const normalEnd = 6 + cautionsLayout(w, m, CAUTIONS_STYLE).height + 4 + signaturesHeight(w, m);
  const compactEnd = 6 + cautionsLayout(w, m, CAUTIONS_COMPACT).height + 4 + compactSignaturesHeight(w, m);
  const compact = w.y + normalEnd > w.bottom && w.y + compactEnd <= w.bottom;
  cautionsBox(w, m, compact ? CAUTIONS_COMPACT : CAUTIONS_STYLE);
  w.ensureSpace(compact ? 30 : 60);
  w.gap(6);
  if (compact) compactSignatures(w, m);
  else signatures(w, m);

  w.footers(`${m.number} · Version ${m.version} · Check code ${m.checkCode}`, input.footer);
  return w.toBuffer();
}
