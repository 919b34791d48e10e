/**
 * The recipe's Markdown (instructions, acceptance criteria, cautions) as sheet text. Built
 * from `marked.lexer` tokens, never from rendered HTML: paragraphs, numbered and bulleted
 * lists, headings as bold lines; bold stays bold, italic and code become plain text; a
 * link prints its text and its address. HTML in the Markdown is printed as the literal
 * characters the author typed — never interpreted.
 */
import { marked, type Token, type Tokens } from 'marked';
import { TYPE, type SheetWriter } from './layout';

/** A piece of a line in one weight. */
export interface Run {
  text: string;
  bold: boolean;
}

/** A block as the sheet lays it out: a paragraph, or a list item with its marker and depth. */
export interface SheetBlock {
  runs: Run[];
  /** "3." for numbered steps, "•" for bullets, "" for paragraphs. */
  marker: string;
  depth: number;
  heading: boolean;
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: '\u00a0' };

/** Markdown text keeps entities the author typed (&amp;, &#216;): print the characters. */
export function decodeEntities(text: string): string {
  return text.replace(/&(#x[0-9a-f]+|#\d+|[a-z]+);/gi, (whole, name: string) => {
    if (name.startsWith('#x') || name.startsWith('#X')) return safeCodePoint(parseInt(name.slice(2), 16), whole);
    if (name.startsWith('#')) return safeCodePoint(parseInt(name.slice(1), 10), whole);
    return ENTITIES[name.toLowerCase()] ?? whole;
  });
}

function safeCodePoint(n: number, fallback: string): string {
  return Number.isInteger(n) && n > 0 && n <= 0x10ffff ? String.fromCodePoint(n) : fallback;
}

function inlineRuns(tokens: readonly Token[] | undefined, bold: boolean, out: Run[]): Run[] {
  for (const token of tokens ?? []) {
    switch (token.type) {
      case 'text': {
        const t = token as Tokens.Text;
        if (t.tokens && t.tokens.length > 0) inlineRuns(t.tokens, bold, out);
        else out.push({ text: decodeEntities(t.text), bold });
        break;
      }
      case 'strong':
        inlineRuns((token as Tokens.Strong).tokens, true, out);
        break;
      case 'em':
      case 'del':
        inlineRuns((token as Tokens.Em).tokens, bold, out);
        break;
      case 'codespan':
        out.push({ text: (token as Tokens.Codespan).text, bold });
        break;
      case 'link': {
        const link = token as Tokens.Link;
        const before = out.length;
        inlineRuns(link.tokens, bold, out);
        const shown = out
          .slice(before)
          .map((r) => r.text)
          .join('');
        if (link.href && shown !== link.href) out.push({ text: ` (${link.href})`, bold: false });
        break;
      }
      case 'image': {
        const image = token as Tokens.Image;
        out.push({ text: `[picture: ${image.text || 'untitled'}] (${image.href})`, bold: false });
        break;
      }
      case 'br':
        out.push({ text: '\n', bold });
        break;
      case 'escape':
        out.push({ text: (token as Tokens.Escape).text, bold });
        break;
      case 'html':
        // Printed as typed: the characters, not markup.
        out.push({ text: token.raw, bold });
        break;
      default:
        out.push({ text: token.raw, bold });
    }
  }
  return out;
}

function listBlocks(list: Tokens.List, depth: number, out: SheetBlock[]): void {
  const start = typeof list.start === 'number' ? list.start : 1;
  list.items.forEach((item, index) => {
    const marker = list.ordered ? `${start + index}.` : depth === 0 ? '•' : '–';
    let first = true;
    for (const child of item.tokens) {
      if (child.type === 'list') {
        listBlocks(child as Tokens.List, depth + 1, out);
        continue;
      }
      if (child.type === 'space') continue;
      const runs =
        child.type === 'text' || child.type === 'paragraph' ? inlineRuns((child as Tokens.Text).tokens ?? [child], false, []) : inlineRuns([child], false, []);
      out.push({ runs, marker: first ? marker : '', depth, heading: false });
      first = false;
    }
    if (first) out.push({ runs: [], marker, depth, heading: false });
  });
}

/** Markdown → blocks, in order. */
export function markdownBlocks(markdown: string): SheetBlock[] {
  const out: SheetBlock[] = [];
  const visit = (tokens: readonly Token[]) => {
    for (const token of tokens) {
      switch (token.type) {
        case 'space':
        case 'hr':
          break;
        case 'paragraph':
          out.push({ runs: inlineRuns((token as Tokens.Paragraph).tokens, false, []), marker: '', depth: 0, heading: false });
          break;
        case 'heading':
          out.push({ runs: inlineRuns((token as Tokens.Heading).tokens, true, []), marker: '', depth: 0, heading: true });
          break;
        case 'list':
          listBlocks(token as Tokens.List, 0, out);
          break;
        case 'blockquote':
          visit((token as Tokens.Blockquote).tokens);
          break;
        case 'code':
          out.push({ runs: [{ text: (token as Tokens.Code).text, bold: false }], marker: '', depth: 0, heading: false });
          break;
        case 'html':
          // A block of HTML: its characters as a plain paragraph, never interpreted.
          out.push({ runs: [{ text: token.raw.trim(), bold: false }], marker: '', depth: 0, heading: false });
          break;
        case 'table': {
          const table = token as Tokens.Table;
          const line = (cells: Tokens.TableCell[]) =>
            cells
              .map((c) =>
                inlineRuns(c.tokens, false, [])
                  .map((r) => r.text)
                  .join(''),
              )
              .join(' | ');
          out.push({ runs: [{ text: line(table.header), bold: true }], marker: '', depth: 0, heading: false });
          for (const row of table.rows) out.push({ runs: [{ text: line(row), bold: false }], marker: '', depth: 0, heading: false });
          break;
        }
        default:
          out.push({ runs: [{ text: decodeEntities(token.raw.trim()), bold: false }], marker: '', depth: 0, heading: false });
      }
    }
  };
  visit(marked.lexer(markdown ?? ''));
  return out.filter((b) => b.marker !== '' || b.runs.some((r) => r.text.trim() !== ''));
}

/** Plain text of a block (for measuring and for tests). */
export function blockText(block: SheetBlock): string {
  return block.runs.map((r) => r.text).join('');
}

/** The height `writeMarkdown` will take (to keep short step lists on one page). */
export function markdownHeight(w: SheetWriter, markdown: string, size: number = TYPE.body): number {
  return markdownBlocks(markdown).reduce((sum, block) => {
    const indent = block.depth * 16 + (block.marker || block.depth > 0 ? 20 : 0);
    return sum + w.heightOf(blockText(block) || ' ', block.heading || block.runs.some((r) => r.bold) ? 'bold' : 'regular', size, w.width - indent) + 2.5;
  }, 0);
}

/** Writes the blocks into the flow: numbers and bullets hang in their own column. */
export function writeMarkdown(w: SheetWriter, markdown: string, options: { emptyText?: string; size?: number } = {}): void {
  const size = options.size ?? TYPE.body;
  const blocks = markdownBlocks(markdown);
  if (blocks.length === 0) {
    if (options.emptyText) w.paragraph(options.emptyText, 'regular', size);
    return;
  }
  const doc = w.doc;
  for (const block of blocks) {
    const indent = block.depth * 16 + (block.marker || block.depth > 0 ? 20 : 0);
    const x = w.left + indent;
    const width = w.width - indent;
    const text = blockText(block);
    w.use(block.heading ? 'bold' : 'regular', size);
    const height = doc.heightOfString(text || ' ', { width, lineGap: TYPE.lineGap });
    w.ensureSpace(Math.min(height, 36) + 2);
    const top = w.y;
    if (block.marker) w.place(block.marker, x - 20, top, 'bold', size, { width: 18, lineBreak: false });
    if (block.runs.length === 0) {
      w.y = top + height;
    } else {
      block.runs.forEach((run, i) => {
        w.use(run.bold || block.heading ? 'bold' : 'regular', size);
        const last = i === block.runs.length - 1;
        if (i === 0) doc.text(run.text, x, top, { width, lineGap: TYPE.lineGap, continued: !last });
        else doc.text(run.text, { width, lineGap: TYPE.lineGap, continued: !last });
      });
    }
    w.y = Math.max(w.y, top + height) + 2.5;
  }
}
