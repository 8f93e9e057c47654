/**
 * The exhibit as PDF: A4 pages laid out from exhibitBlocks(model) with pdf-lib, the shipped
 * fonts embedded as subsets (text a reader can search and copy), tables that continue across
 * pages under a repeated header row, "Page n of N", vector charts, and a DRAFT mark on every
 * page of an unsigned version. The same model always gives the same bytes: every date comes from
 * the model and the document id is derived from its content.
 */
import { createHash } from 'node:crypto';
import fontkit from '@pdf-lib/fontkit';
import { PDFArray, PDFDocument, PDFHexString, PDFName, degrees, rgb, type PDFFont, type PDFPage, type RGB } from 'pdf-lib';
import type { ExhibitDepthProfile, ExhibitModel } from './model';
import { depthChartFootnote, exhibitBlocks, fixed, num, derivationRows, signatureLines, type Block, type Column, type MarginBar } from './layout';
import { EXHIBIT_TITLE, INTRO, SECTION, coverLines, documentSubject, formatDateTime } from './texts';
import { fontBytes, type FontRole } from './fonts';

const PAGE_W = 595.28;
const PAGE_H = 841.89;
const MARGIN_X = 54;
const TOP = PAGE_H - 72;
const BOTTOM = 64;
const TEXT_W = PAGE_W - 2 * MARGIN_X;

const INK = rgb(0.11, 0.13, 0.16);
const MUTED = rgb(0.38, 0.41, 0.45);
const RULE = rgb(0.78, 0.8, 0.83);
const ACCENT = rgb(0.08, 0.3, 0.36);
const HEADER_FILL = rgb(0.91, 0.93, 0.94);
const ZEBRA = rgb(0.972, 0.976, 0.98);
const OK_FILL = rgb(0.2, 0.5, 0.45);
const ATTENTION_FILL = rgb(0.78, 0.45, 0.12);

const SIZE = { body: 9.5, small: 8, table: 7.4, h1: 14, h2: 10.5 } as const;

type Fonts = Record<FontRole, PDFFont>;

/** Subset font names with a fixed six-letter tag (pdf-lib would add a random suffix). */
const SUBSET_NAMES: Record<FontRole, string> = {
  regular: 'FFEXRG+Exhibit-Regular',
  medium: 'FFEXMD+Exhibit-Medium',
  semibold: 'FFEXSB+Exhibit-SemiBold',
  bold: 'FFEXBD+Exhibit-Bold',
  mono: 'FFEXMO+Exhibit-Mono',
  symbols: 'FFEXSY+Exhibit-Symbols',
};

export interface PdfOptions {
  /** Producer string stamped in the document properties (e.g. "Fieldfile 0.1.0"). */
  producer: string;
}

class Flow {
  pages: PDFPage[] = [];
  page!: PDFPage;
  y = TOP;
  readonly headings: { text: string; level: 1 | 2; pageIndex: number }[] = [];

  constructor(
    readonly doc: PDFDocument,
    readonly fonts: Fonts,
  ) {}

  newPage() {
    this.page = this.doc.addPage([PAGE_W, PAGE_H]);
    this.pages.push(this.page);
    this.y = TOP;
  }

  /** Starts a new page unless `height` points still fit above the bottom margin. */
  ensure(height: number) {
    if (this.y - height < BOTTOM) this.newPage();
  }

  text(s: string, x: number, y: number, font: PDFFont, size: number, color: RGB = INK) {
    this.textOn(this.page, s, x, y, font, size, color);
  }

  private readonly advance = new Map<PDFFont, Map<string, number>>();

  private readonly charsets = new Map<PDFFont, Set<number>>();

  /** The font that draws `ch`: the given one, or the symbol font for what it lacks. */
  fontFor(ch: string, font: PDFFont): PDFFont {
    let set = this.charsets.get(font);
    if (!set) this.charsets.set(font, (set = new Set(font.getCharacterSet())));
    return set.has(ch.codePointAt(0)!) ? font : this.fonts.symbols;
  }

  /** Text width from cached per-character advances (pdf-lib's own measure runs a full layout each call). */
  width(s: string, font: PDFFont, size: number) {
    let w = 0;
    for (const ch of s) {
      const f = this.fontFor(ch, font);
      let table = this.advance.get(f);
      if (!table) this.advance.set(f, (table = new Map()));
      let a = table.get(ch);
      if (a === undefined) table.set(ch, (a = f.widthOfTextAtSize(ch, 1000) / 1000));
      w += a;
    }
    return w * size;
  }

  /** Draws `s` on `page`, switching to the symbol font for characters the font lacks. */
  textOn(page: PDFPage, s: string, x: number, y: number, font: PDFFont, size: number, color: RGB = INK) {
    let run = '';
    let runFont = font;
    const flush = () => {
      if (!run) return;
      page.drawText(run, { x, y, size, font: runFont, color });
      x += this.width(run, runFont, size);
      run = '';
    };
    for (const ch of s) {
      const f = this.fontFor(ch, font);
      if (f !== runFont) {
        flush();
        runFont = f;
      }
      run += ch;
    }
    flush();
  }

  /** Words wrapped to `width`; a word longer than the line (a hash, a formula) is cut. */
  wrap(s: string, font: PDFFont, size: number, width: number): string[] {
    const lines: string[] = [];
    for (const paragraph of s.split('\n')) {
      let line = '';
      for (const word of paragraph.split(/ +/)) {
        const candidate = line ? `${line} ${word}` : word;
        if (this.width(candidate, font, size) <= width) {
          line = candidate;
          continue;
        }
        if (line) lines.push(line);
        line = '';
        let rest = word;
        while (this.width(rest, font, size) > width) {
          let cut = rest.length - 1;
          while (cut > 1 && this.width(rest.slice(0, cut), font, size) > width) cut--;
          lines.push(rest.slice(0, cut));
          rest = rest.slice(cut);
        }
        line = rest;
      }
      lines.push(line);
    }
    return lines;
  }

  paragraph(s: string, style: 'normal' | 'small' | 'caution' = 'normal') {
    const size = style === 'small' ? SIZE.small : SIZE.body;
    const font = this.fonts.regular;
    const indent = style === 'caution' ? 12 : 0;
    const lines = this.wrap(s, font, size, TEXT_W - indent);
    const lh = size * 1.42;
    for (const [i, line] of lines.entries()) {
      this.ensure(lh);
      if (style === 'caution' && i === 0) this.text('›', MARGIN_X, this.y - size, this.fonts.regular, size, ACCENT);
      this.text(line, MARGIN_X + indent, this.y - size, font, size, style === 'small' ? MUTED : INK);
      this.y -= lh;
    }
    this.y -= size * 0.6;
  }

  heading(s: string, level: 1 | 2) {
    const size = level === 1 ? SIZE.h1 : SIZE.h2;
    const font = level === 1 ? this.fonts.semibold : this.fonts.medium;
    // Keep a heading with at least a few lines of what follows.
    this.ensure(size * 2 + 60);
    this.y -= level === 1 ? 8 : 4;
    this.headings.push({ text: s, level, pageIndex: this.pages.length - 1 });
    this.text(s, MARGIN_X, this.y - size, font, size, level === 1 ? ACCENT : INK);
    this.y -= size * 1.35;
    if (level === 1) {
      this.page.drawLine({ start: { x: MARGIN_X, y: this.y }, end: { x: MARGIN_X + TEXT_W, y: this.y }, thickness: 0.6, color: ACCENT });
      this.y -= 8;
    } else this.y -= 3;
  }

  /**
   * Column widths in points: the layout's shares, except that a column whose longest word (in
   * its header or any cell) would not fit takes the room from columns that have some to spare,
   * so words are broken only when the whole table cannot hold them. Mono columns (hashes) shrink
   * their type instead.
   */
  columnWidths(columns: Column[], rows: string[][], header: boolean, fontFor: (col: number, header: boolean) => PDFFont, size: number, padX: number, mono: number[]): number[] {
    const total = columns.reduce((s, c) => s + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * TEXT_W);
    const longest = (text: string, font: PDFFont) => Math.max(0, ...text.split(/\s+/).map((w) => this.width(w, font, size)));
    const need = columns.map((c, i) => {
      let w = header ? longest(c.title, fontFor(i, true)) : 0;
      for (const r of rows) w = Math.max(w, longest(r[i] ?? '', fontFor(i, false)));
      // A mono column keeps the room it has (it shrinks its type rather than grow).
      return mono.includes(i) ? Math.min(widths[i], w + 2 * padX + 0.5) : w + 2 * padX + 0.5;
    });
    for (;;) {
      const short = widths.reduce((s, w, i) => s + Math.max(0, need[i] - w), 0);
      const spare = widths.reduce((s, w, i) => s + Math.max(0, w - need[i]), 0);
      if (short <= 0) return widths;
      if (spare >= short) return widths.map((w, i) => (need[i] > w ? need[i] : w - ((w - need[i]) / spare) * short));
      // Not enough room for every word: the column that lacks the most breaks its words.
      const worst = need.reduce((best, n, i) => (n - widths[i] > need[best] - widths[best] ? i : best), 0);
      need[worst] = widths[worst];
    }
  }

  /** A table whose header row is repeated at the top of every page it continues on. */
  table(columns: Column[], rows: string[][], opts: { header?: boolean; mono?: number[]; firstBold?: boolean; size?: number } = {}) {
    const size = opts.size ?? SIZE.table;
    const lh = size * 1.3;
    const padX = 3.5;
    const padY = 3;
    const fontFor = (col: number, header: boolean) =>
      header ? this.fonts.semibold : opts.mono?.includes(col) ? this.fonts.mono : opts.firstBold && col === 0 ? this.fonts.medium : this.fonts.regular;
    const widths = this.columnWidths(columns, rows, opts.header !== false, fontFor, size, padX, opts.mono ?? []);
    // A mono column (hashes) is set small enough that its longest word fits on one line, so a
    // hash is never broken and a reader can search and copy it whole (not below 5.5 pt).
    const sizes = columns.map((_, i) => {
      if (!opts.mono?.includes(i)) return size;
      const longest = Math.max(0, ...rows.flatMap((r) => (r[i] ?? '').split(/\s+/)).map((w) => this.width(w, this.fonts.mono, 1)));
      return longest ? Math.max(5.5, Math.min(size, (widths[i] - 2 * padX - 0.5) / longest)) : size;
    });
    const layout = (cells: string[], header: boolean) => {
      const wrapped = cells.map((c, i) => this.wrap(c, fontFor(i, header), header ? size : sizes[i], widths[i] - 2 * padX));
      return { wrapped, height: Math.max(...wrapped.map((l) => l.length)) * lh + 2 * padY };
    };
    const header =
      opts.header === false
        ? null
        : layout(
            columns.map((c) => c.title),
            true,
          );
    const drawRow = (row: { wrapped: string[][]; height: number }, isHeader: boolean, zebra: boolean) => {
      const top = this.y;
      if (isHeader) this.page.drawRectangle({ x: MARGIN_X, y: top - row.height, width: TEXT_W, height: row.height, color: HEADER_FILL });
      else if (zebra) this.page.drawRectangle({ x: MARGIN_X, y: top - row.height, width: TEXT_W, height: row.height, color: ZEBRA });
      let x = MARGIN_X;
      row.wrapped.forEach((lines, i) => {
        const font = fontFor(i, isHeader);
        const cellSize = isHeader ? size : sizes[i];
        lines.forEach((line, j) => {
          const w = this.width(line, font, cellSize);
          const tx = columns[i].align === 'right' ? x + widths[i] - padX - w : x + padX;
          this.text(line, tx, top - padY - size * 0.95 - j * lh, font, cellSize, INK);
        });
        x += widths[i];
      });
      this.y -= row.height;
      this.page.drawLine({ start: { x: MARGIN_X, y: this.y }, end: { x: MARGIN_X + TEXT_W, y: this.y }, thickness: isHeader ? 0.7 : 0.3, color: isHeader ? MUTED : RULE });
    };
    const startPage = () => {
      if (header) drawRow(header, true, false);
    };
    const first = rows.length ? layout(rows[0], false) : null;
    this.ensure((header?.height ?? 0) + (first?.height ?? 0));
    startPage();
    rows.forEach((cells, i) => {
      const row = i === 0 && first ? first : layout(cells, false);
      if (this.y - row.height < BOTTOM) {
        this.newPage();
        startPage();
      }
      drawRow(row, false, i % 2 === 1);
    });
    this.y -= 10;
  }

  keyValue(rows: [string, string][], mono: boolean = false) {
    this.table(
      [
        { title: '', width: 0.27 },
        { title: '', width: 0.73 },
      ],
      rows.map(([k, v]) => [k, v]),
      { header: false, firstBold: true, size: SIZE.small, mono: mono ? [1] : [] },
    );
  }

  marginChart(markets: { market: string; bars: MarginBar[] }[]) {
    const barH = 9;
    const gap = 4;
    const labelW = 74;
    const valueW = 118;
    const plotW = TEXT_W - labelW - valueW;
    const all = markets.flatMap((m) => m.bars.map((b) => b.marginDb)).filter((x): x is number => x !== null);
    const lo = Math.floor(Math.min(0, ...all) / 5) * 5;
    const hi = Math.max(5, Math.ceil(Math.max(0, ...all) / 5) * 5);
    const xOf = (db: number) => MARGIN_X + labelW + ((db - lo) / (hi - lo)) * plotW;
    const step = hi - lo > 60 ? 20 : hi - lo > 30 ? 10 : 5;
    for (const market of markets) {
      const height = 16 + market.bars.length * (barH + gap) + 22;
      this.ensure(height);
      const top = this.y;
      this.text(market.market, MARGIN_X, top - 9, this.fonts.medium, 8.5);
      let y = top - 16;
      for (const bar of market.bars) {
        this.text(bar.label, MARGIN_X, y - barH + 2, this.fonts.regular, SIZE.table);
        if (bar.marginDb === null) {
          this.text('no threshold — ' + (bar.result === 'exempt' ? 'exempt' : 'evaluation needed'), xOf(0) + 3, y - barH + 2, this.fonts.regular, SIZE.table, MUTED);
        } else {
          const x0 = xOf(Math.min(0, bar.marginDb));
          const x1 = xOf(Math.max(0, bar.marginDb));
          const attention = bar.result !== 'exempt';
          this.page.drawRectangle({ x: x0, y: y - barH, width: Math.max(0.8, x1 - x0), height: barH, color: attention ? ATTENTION_FILL : OK_FILL });
          if (attention) {
            // Diagonal hatching, so the difference does not rest on colour alone.
            for (let hx = x0 - barH; hx < x1; hx += 4) {
              const sx = Math.max(x0, hx);
              const ex = Math.min(x1, hx + barH);
              if (ex > sx) this.page.drawLine({ start: { x: sx, y: y - barH + (sx - hx) }, end: { x: ex, y: y - barH + (ex - hx) }, thickness: 0.6, color: rgb(1, 1, 1) });
            }
          }
          const word = bar.result === 'exempt' ? '✓ exempt' : '! evaluate';
          this.text(`${fixed(bar.marginDb, 1)} dB  ${word}`, MARGIN_X + labelW + plotW + 6, y - barH + 2, this.fonts.regular, SIZE.table, attention ? INK : INK);
        }
        y -= barH + gap;
      }
      // Axis with ticks in dB.
      this.page.drawLine({ start: { x: xOf(lo), y: y + gap - 1 }, end: { x: xOf(hi), y: y + gap - 1 }, thickness: 0.5, color: MUTED });
      for (let t = lo; t <= hi; t += step) {
        this.page.drawLine({ start: { x: xOf(t), y: y + gap - 1 }, end: { x: xOf(t), y: y + gap - 4 }, thickness: 0.5, color: MUTED });
        const label = `${t}`;
        this.text(label, xOf(t) - this.width(label, this.fonts.regular, 6.5) / 2, y + gap - 11, this.fonts.regular, 6.5, MUTED);
      }
      this.page.drawLine({ start: { x: xOf(0), y: top - 14 }, end: { x: xOf(0), y: y + gap - 1 }, thickness: 0.7, color: INK });
      this.text('dB', xOf(hi) + 12, y + gap - 11, this.fonts.regular, 6.5, MUTED);
      this.y = y - 16;
    }
    this.y -= 6;
  }

  depthChart(p: ExhibitDepthProfile) {
    const h = 200;
    const left = MARGIN_X + 46;
    const width = TEXT_W - 60;
    this.ensure(h + 40);
    const top = this.y - 6;
    const bottom = top - h;
    const maxDepth = Math.max(...p.points.map((x) => x.depthM));
    const maxSar = Math.max(...p.points.map((x) => x.value)) || 1;
    const niceMax = niceCeil(maxSar);
    const xOf = (d: number) => left + (d / maxDepth) * width;
    const yOf = (s: number) => bottom + (s / niceMax) * h;
    this.page.drawRectangle({ x: left, y: bottom, width, height: h, borderColor: MUTED, borderWidth: 0.5 });
    for (const layer of p.layers) {
      if (layer.startDepthM <= 0 || layer.startDepthM >= maxDepth) continue;
      const x = xOf(layer.startDepthM);
      this.page.drawLine({ start: { x, y: bottom }, end: { x, y: top }, thickness: 0.4, color: RULE, dashArray: [2, 2] });
    }
    p.layers.forEach((layer, i) => {
      if (layer.startDepthM >= maxDepth) return;
      const next = p.layers[i + 1]?.startDepthM ?? maxDepth;
      const mid = xOf((layer.startDepthM + Math.min(next, maxDepth)) / 2);
      const w = this.width(layer.name, this.fonts.regular, 6.5);
      if (xOf(Math.min(next, maxDepth)) - xOf(layer.startDepthM) > w + 2) this.text(layer.name, mid - w / 2, top - 9, this.fonts.regular, 6.5, MUTED);
    });
    for (let i = 0; i <= 4; i++) {
      const s = (niceMax * i) / 4;
      const label = num(s, 3);
      this.text(label, left - 4 - this.width(label, this.fonts.regular, 6.5), yOf(s) - 2, this.fonts.regular, 6.5, MUTED);
      if (i > 0 && i < 4) this.page.drawLine({ start: { x: left, y: yOf(s) }, end: { x: left + width, y: yOf(s) }, thickness: 0.25, color: RULE });
    }
    const depthStep = niceCeil(maxDepth / 6);
    for (let i = 0; i * depthStep <= maxDepth + 1e-12; i++) {
      const d = i * depthStep;
      const label = num(d * 1000, 3);
      this.text(label, xOf(d) - this.width(label, this.fonts.regular, 6.5) / 2, bottom - 10, this.fonts.regular, 6.5, MUTED);
    }
    const path = p.points.map((pt, i) => `${i ? 'L' : 'M'}${(xOf(pt.depthM) - left).toFixed(2)},${(h - (yOf(pt.value) - bottom)).toFixed(2)}`).join(' ');
    this.page.drawSvgPath(path, { x: left, y: top, borderColor: ACCENT, borderWidth: 1.2 });
    this.text('Depth in tissue (mm)', left + width / 2 - 35, bottom - 21, this.fonts.regular, 7, INK);
    this.page.drawText(p.scale === 'absolute' ? 'SAR (W/kg)' : 'SAR / surface SAR', { x: MARGIN_X + 4, y: bottom + h / 2 - 18, size: 7, font: this.fonts.regular, color: INK, rotate: degrees(90) });
    this.y = bottom - 30;
    this.paragraph(depthChartFootnote(p), 'small');
  }

  derivation(entry: { ref: string; title: string; derivation: ExhibitModel['appendix'][number]['derivation'] }) {
    const d = entry.derivation;
    const rows = derivationRows(d);
    const title = this.wrap(`${entry.ref}  ${entry.title}`, this.fonts.semibold, SIZE.body, TEXT_W);
    this.ensure(title.length * SIZE.body * 1.35 + 60);
    for (const line of title) {
      this.text(line, MARGIN_X, this.y - SIZE.body, this.fonts.semibold, SIZE.body, ACCENT);
      this.y -= SIZE.body * 1.35;
    }
    this.y -= SIZE.body * 0.4;
    this.table(
      [
        { title: '', width: 0.17 },
        { title: '', width: 0.83 },
      ],
      rows,
      { header: false, firstBold: true, size: SIZE.table },
    );
  }
}

function niceCeil(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10]) if (m * p >= x) return m * p;
  return 10 * p;
}

function renderBlock(flow: Flow, block: Block) {
  switch (block.kind) {
    case 'heading':
      return flow.heading(block.text, block.level);
    case 'paragraph':
      return flow.paragraph(block.text, block.style);
    case 'table':
      return flow.table(block.columns, block.rows, { header: block.header, mono: block.columns.map((c, i) => (c.title === 'SHA-256' ? i : -1)).filter((i) => i >= 0) });
    case 'keyValue':
      return flow.keyValue(block.rows);
    case 'marginChart':
      return flow.marginChart(block.markets);
    case 'depthChart':
      return flow.depthChart(block.profile);
    case 'derivation':
      return flow.derivation(block.entry);
    case 'pageBreak':
      return flow.newPage();
  }
}

function cover(flow: Flow, m: ExhibitModel) {
  const f = flow.fonts;
  flow.page.drawRectangle({ x: 0, y: PAGE_H - 14, width: PAGE_W, height: 14, color: ACCENT });
  flow.text(m.organisation.toUpperCase(), MARGIN_X, PAGE_H - 70, f.medium, 9, MUTED);
  flow.text(EXHIBIT_TITLE, MARGIN_X, PAGE_H - 128, f.bold, 28, ACCENT);
  flow.y = PAGE_H - 150;
  for (const line of flow.wrap(`${m.device.name} — model ${m.device.model}`, f.medium, 15, TEXT_W)) {
    flow.text(line, MARGIN_X, flow.y - 15, f.medium, 15);
    flow.y -= 21;
  }
  flow.y -= 18;
  flow.keyValue(coverLines(m));
  flow.y -= 6;
  flow.text('Signature', MARGIN_X, flow.y - SIZE.h2, f.semibold, SIZE.h2, ACCENT);
  flow.y -= SIZE.h2 * 1.8;
  flow.keyValue(signatureLines(m));
  flow.y = Math.min(flow.y, BOTTOM + 120);
  flow.page.drawLine({ start: { x: MARGIN_X, y: flow.y }, end: { x: MARGIN_X + TEXT_W, y: flow.y }, thickness: 0.4, color: RULE });
  flow.y -= 6;
  flow.paragraph(
    'Engineering estimates from published formulas or summaries of laboratory measurements. The certifying body and accredited laboratories decide; follow the applicable regulations and local codes. See section 12.',
    'small',
  );
}

const contentsLineHeight = (level: 1 | 2) => (level === 1 ? SIZE.body * 1.9 : SIZE.small * 1.6);
const CONTENTS_FIRST_Y = TOP - SIZE.h1 * 1.35 - 14;

/** How many pages the contents need for these headings (reserved before the body is laid out). */
function contentsPageCount(blocks: Block[]): number {
  let pages = 1;
  let y = CONTENTS_FIRST_Y;
  for (const b of blocks) {
    if (b.kind !== 'heading') continue;
    if (y - contentsLineHeight(b.level) < BOTTOM) {
      pages++;
      y = TOP;
    }
    y -= contentsLineHeight(b.level);
  }
  return pages;
}

function contents(flow: Flow, firstPage: number, startAt: number) {
  const f = flow.fonts;
  let pageIndex = firstPage;
  let page = flow.pages[pageIndex];
  page.drawText(SECTION.contents, { x: MARGIN_X, y: TOP - SIZE.h1, size: SIZE.h1, font: f.semibold, color: ACCENT });
  page.drawLine({ start: { x: MARGIN_X, y: TOP - SIZE.h1 * 1.35 }, end: { x: MARGIN_X + TEXT_W, y: TOP - SIZE.h1 * 1.35 }, thickness: 0.6, color: ACCENT });
  let y = CONTENTS_FIRST_Y;
  for (const h of flow.headings.slice(startAt)) {
    if (y - contentsLineHeight(h.level) < BOTTOM) {
      page = flow.pages[++pageIndex];
      y = TOP;
    }
    const size = h.level === 1 ? SIZE.body : SIZE.small;
    const font = h.level === 1 ? f.medium : f.regular;
    const indent = h.level === 1 ? 0 : 16;
    const pageNo = String(h.pageIndex + 1);
    const label = h.text;
    const pw = font.widthOfTextAtSize(pageNo, size);
    flow.textOn(page, label, MARGIN_X + indent, y, font, size);
    const lw = flow.width(label, font, size);
    const dots = '.'.repeat(Math.max(0, Math.floor((TEXT_W - indent - lw - pw - 12) / font.widthOfTextAtSize('.', size))));
    page.drawText(dots, { x: MARGIN_X + indent + lw + 4, y, size, font: f.regular, color: RULE });
    page.drawText(pageNo, { x: MARGIN_X + TEXT_W - pw, y, size, font, color: INK });
    y -= contentsLineHeight(h.level);
  }
}

function furniture(flow: Flow, m: ExhibitModel) {
  const f = flow.fonts;
  const n = flow.pages.length;
  const running = `${EXHIBIT_TITLE} · ${m.device.name} (${m.device.model}) · filing ${m.filingId} v${m.versionNumber}`;
  flow.pages.forEach((page, i) => {
    if (i > 0) {
      flow.textOn(page, running, MARGIN_X, PAGE_H - 42, f.regular, 7.5, MUTED);
      const org = m.organisation;
      flow.textOn(page, org, MARGIN_X + TEXT_W - flow.width(org, f.regular, 7.5), PAGE_H - 42, f.regular, 7.5, MUTED);
      page.drawLine({ start: { x: MARGIN_X, y: PAGE_H - 48 }, end: { x: MARGIN_X + TEXT_W, y: PAGE_H - 48 }, thickness: 0.4, color: RULE });
    }
    page.drawLine({ start: { x: MARGIN_X, y: BOTTOM - 22 }, end: { x: MARGIN_X + TEXT_W, y: BOTTOM - 22 }, thickness: 0.4, color: RULE });
    const state = m.draft ? INTRO.draftNotice : `Signed ${formatDateTime(m.signature?.signedAt ?? m.documentDate)} · estimates and lab summaries; the certifying body decides`;
    flow.textOn(page, state, MARGIN_X, BOTTOM - 34, m.draft ? f.semibold : f.regular, 7, m.draft ? ATTENTION_FILL : MUTED);
    const label = `Page ${i + 1} of ${n}`;
    page.drawText(label, { x: MARGIN_X + TEXT_W - f.medium.widthOfTextAtSize(label, 8), y: BOTTOM - 34, size: 8, font: f.medium, color: INK });
    if (m.draft) {
      page.drawText('DRAFT', { x: 150, y: 260, size: 118, font: f.bold, color: rgb(0.75, 0.35, 0.1), opacity: 0.1, rotate: degrees(45) });
    }
  });
}

/** The PDF's document id: two equal halves of the SHA-256 of the model, so it never changes for the same data. */
function setDocumentId(doc: PDFDocument, m: ExhibitModel) {
  const id = createHash('sha256').update(JSON.stringify(m)).digest('hex').slice(0, 32);
  doc.context.trailerInfo.ID = PDFArray.withContext(doc.context);
  const arr = doc.context.trailerInfo.ID as PDFArray;
  arr.push(PDFHexString.of(id));
  arr.push(PDFHexString.of(id));
}

/**
 * Encodes text one character at a time from a per-font cache. pdf-lib runs fontkit's full layout
 * (OpenType substitution and positioning) for every string it draws, which was most of the
 * exhibit's render time; the exhibit never uses kerning or ligatures (widths come from single
 * characters, see Flow.width), so the glyph of a character is all it needs. The subset still
 * takes glyphs in the order they first appear, so the same model gives the same bytes.
 */
function encodeByCharacter(font: PDFFont) {
  const embedder = (font as unknown as { embedder: { encodeText(text: string): PDFHexString } }).embedder;
  const encodeOne = embedder.encodeText.bind(embedder);
  const hexOf = new Map<string, string>();
  embedder.encodeText = (text: string) => {
    let hex = '';
    for (const ch of text) {
      let h = hexOf.get(ch);
      if (h === undefined) hexOf.set(ch, (h = encodeOne(ch).asString()));
      hex += h;
    }
    return PDFHexString.of(hex);
  };
}

export async function renderExhibitPdf(m: ExhibitModel, opts: PdfOptions): Promise<Uint8Array> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.registerFontkit(fontkit);
  const bytes = fontBytes();
  const fonts = {} as Fonts;
  for (const role of Object.keys(bytes) as FontRole[]) {
    // A fixed subset name: pdf-lib would otherwise add a random suffix and the bytes would vary.
    fonts[role] = await doc.embedFont(bytes[role], { subset: true, customName: SUBSET_NAMES[role] });
    encodeByCharacter(fonts[role]);
  }
  const flow = new Flow(doc, fonts);
  flow.newPage();
  cover(flow, m);
  const blocks = exhibitBlocks(m);
  const contentsPage = flow.pages.length;
  for (let i = contentsPageCount(blocks); i > 0; i--) flow.newPage();
  flow.newPage();
  const firstHeading = flow.headings.length;
  for (const block of blocks) renderBlock(flow, block);
  contents(flow, contentsPage, firstHeading);
  furniture(flow, m);

  const date = new Date(m.documentDate);
  doc.setTitle(`${EXHIBIT_TITLE} — ${m.device.name} (${m.device.model}) v${m.versionNumber}${m.draft ? ' — DRAFT' : ''}`);
  doc.setAuthor(m.organisation);
  doc.setSubject(documentSubject(m));
  doc.setKeywords(['RF exposure', 'SAR', 'exhibit', m.device.model]);
  doc.setCreator(opts.producer);
  doc.setProducer(opts.producer);
  doc.setCreationDate(date);
  doc.setModificationDate(date);
  doc.setLanguage('en');
  doc.catalog.set(PDFName.of('PageMode'), PDFName.of('UseNone'));
  setDocumentId(doc, m);
  return doc.save({ useObjectStreams: true });
}
