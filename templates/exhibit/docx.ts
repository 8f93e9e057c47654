/**
 * The exhibit as an editable DOCX, from the same blocks as the PDF (layout.ts): real Word
 * headings (so the lab's own pages slot into the outline and the contents field), real tables
 * with a repeated header row, page numbers "Page n of N" in the footer, and DRAFT in the header
 * of an unsigned version. Charts are given as their data tables (Word draws no vector chart from
 * here). The zip container is rewritten with fixed dates so the same model gives the same bytes.
 */
import JSZip from 'jszip';
import { AlignmentType, BorderStyle, Document, Footer, Header, HeadingLevel, Packer, PageNumber, Paragraph, ShadingType, Table, TableCell, TableOfContents, TableRow, TextRun, WidthType } from 'docx';
import type { ExhibitModel } from './model';
import { depthChartFootnote, exhibitBlocks, fixed, num, derivationRows, signatureLines, type Block, type Column } from './layout';
import { EXHIBIT_TITLE, INTRO, SECTION, coverLines, documentSubject } from './texts';
import { DOCX_FONT_FAMILY, DOCX_MONO_FAMILY } from './fonts';

const TEXT_WIDTH_TWIPS = 9638; // A4 (11906) less 2 × 1134 (2 cm) margins.
const BORDER = { style: BorderStyle.SINGLE, size: 2, color: 'C7CCD3' };

function cellParagraph(text: string, opts: { bold?: boolean; align?: 'left' | 'right'; mono?: boolean }) {
  return new Paragraph({
    alignment: opts.align === 'right' ? AlignmentType.RIGHT : AlignmentType.LEFT,
    spacing: { before: 20, after: 20 },
    // A line break in the cell's text is a Word line break, not a run of its own paragraph.
    children: text.split('\n').map((line, i) => new TextRun({ text: line, break: i ? 1 : undefined, bold: opts.bold, size: 15, font: opts.mono ? DOCX_MONO_FAMILY : undefined })),
  });
}

function table(columns: Column[], rows: string[][], header = true): Table {
  const total = columns.reduce((s, c) => s + c.width, 0);
  const widths = columns.map((c) => Math.round((c.width / total) * TEXT_WIDTH_TWIPS));
  const mono = columns.map((c) => c.title === 'SHA-256');
  const make = (cells: string[], isHeader: boolean) =>
    new TableRow({
      tableHeader: isHeader,
      cantSplit: true,
      children: cells.map(
        (text, i) =>
          new TableCell({
            width: { size: widths[i], type: WidthType.DXA },
            shading: isHeader ? { type: ShadingType.CLEAR, color: 'auto', fill: 'E8ECEF' } : undefined,
            margins: { left: 60, right: 60 },
            children: [cellParagraph(text, { bold: isHeader || (!header && i === 0), align: columns[i].align, mono: mono[i] })],
          }),
      ),
    });
  return new Table({
    width: { size: TEXT_WIDTH_TWIPS, type: WidthType.DXA },
    columnWidths: widths,
    borders: { top: BORDER, bottom: BORDER, left: BORDER, right: BORDER, insideHorizontal: BORDER, insideVertical: BORDER },
    rows: [
      ...(header
        ? [
            make(
              columns.map((c) => c.title),
              true,
            ),
          ]
        : []),
      ...rows.map((r) => make(r, false)),
    ],
  });
}

const keyValue = (rows: [string, string][]) =>
  table(
    [
      { title: '', width: 0.27 },
      { title: '', width: 0.73 },
    ],
    rows,
    false,
  );

const spacer = () => new Paragraph({ spacing: { after: 120 }, children: [] });

function render(block: Block): (Paragraph | Table | TableOfContents)[] {
  switch (block.kind) {
    case 'heading':
      return [new Paragraph({ heading: block.level === 1 ? HeadingLevel.HEADING_1 : HeadingLevel.HEADING_2, children: [new TextRun(block.text)] })];
    case 'paragraph':
      return [
        new Paragraph({
          spacing: { after: 120 },
          bullet: block.style === 'caution' ? { level: 0 } : undefined,
          children: [new TextRun({ text: block.text, size: block.style === 'small' ? 16 : 19, color: block.style === 'small' ? '60676F' : undefined })],
        }),
      ];
    case 'table':
      return [table(block.columns, block.rows, block.header !== false), spacer()];
    case 'keyValue':
      return [keyValue(block.rows), spacer()];
    case 'marginChart':
      return [
        table(
          [
            { title: 'Market', width: 0.25 },
            { title: 'Transmitter', width: 0.25 },
            { title: 'Smallest margin', width: 0.2, align: 'right' },
            { title: 'Result', width: 0.3 },
          ],
          block.markets.flatMap((m) => m.bars.map((b) => [m.market, b.label, b.marginDb === null ? '—' : `${fixed(b.marginDb, 1)} dB`, b.result === 'exempt' ? '✓ Exempt' : '! Evaluation needed'])),
        ),
        spacer(),
      ];
    case 'depthChart':
      return [
        table(
          [
            { title: 'Depth', width: 0.5, align: 'right' },
            { title: block.profile.scale === 'absolute' ? 'SAR (estimate)' : 'SAR relative to the surface', width: 0.5, align: 'right' },
          ],
          block.profile.points
            .filter((_, i, all) => i % Math.max(1, Math.ceil(all.length / 24)) === 0)
            .map((p) => [`${num(p.depthM * 1000, 3)} mm`, block.profile.scale === 'absolute' ? `${num(p.value, 3)} W/kg` : num(p.value, 3)]),
        ),
        new Paragraph({ spacing: { after: 120 }, children: [new TextRun({ size: 16, text: depthChartFootnote(block.profile) })] }),
      ];
    case 'derivation': {
      const d = block.entry.derivation;
      const rows = derivationRows(d);
      return [new Paragraph({ heading: HeadingLevel.HEADING_3, children: [new TextRun(`${block.entry.ref}  ${block.entry.title}`)] }), keyValue(rows), spacer()];
    }
    case 'pageBreak':
      return [new Paragraph({ pageBreakBefore: true, children: [] })];
  }
}

/**
 * docx numbers heading bookmarks with a counter that runs on across documents in one process;
 * renumber them 1…n in order of appearance so the same model gives the same XML.
 */
function renumberBookmarks(xml: string): string {
  const map = new Map<string, number>();
  for (const m of xml.matchAll(/<w:bookmarkStart[^>]*w:id="(\d+)"/g)) if (!map.has(m[1])) map.set(m[1], map.size + 1);
  const ids = (n: string) => String(map.get(n) ?? n);
  return xml.replace(/_Toc(\d+)/g, (_, n: string) => `_Toc${ids(n)}`).replace(/(<w:bookmark(?:Start|End)[^>]*w:id=")(\d+)"/g, (_, head: string, n: string) => `${head}${ids(n)}"`);
}

/** Rewrites the DOCX container: fixed entry dates and the document's own date in core.xml. */
async function normalise(buffer: Buffer, isoDate: string): Promise<Buffer> {
  const zip = await JSZip.loadAsync(buffer);
  const date = new Date(isoDate);
  const stamp = `${isoDate.slice(0, 19)}Z`;
  const out = new JSZip();
  for (const name of Object.keys(zip.files).sort()) {
    const entry = zip.files[name];
    if (entry.dir) continue;
    let data: string | Buffer = await entry.async('nodebuffer');
    if (name === 'docProps/core.xml') data = data.toString('utf8').replace(/(<dcterms:(created|modified)[^>]*>)[^<]*(<\/dcterms:\2>)/g, `$1${stamp}$3`);
    if (name === 'word/document.xml') data = renumberBookmarks(data.toString('utf8'));
    out.file(name, data, { date, createFolders: false });
  }
  return out.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 }, platform: 'UNIX' });
}

export async function renderExhibitDocx(m: ExhibitModel, opts: { producer: string }): Promise<Buffer> {
  const draftRun = m.draft ? [new TextRun({ text: `DRAFT — ${INTRO.draftNotice.replace(/^DRAFT — /, '')}  `, bold: true, color: 'B4581A' })] : [];
  const doc = new Document({
    creator: m.organisation,
    lastModifiedBy: opts.producer,
    title: `${EXHIBIT_TITLE} — ${m.device.name} (${m.device.model}) v${m.versionNumber}${m.draft ? ' — DRAFT' : ''}`,
    subject: documentSubject(m),
    keywords: `RF exposure, SAR, exhibit, ${m.device.model}`,
    description: documentSubject(m),
    revision: m.versionNumber,
    features: { updateFields: true },
    styles: {
      default: {
        document: { run: { font: DOCX_FONT_FAMILY, size: 19, color: '1C2129' } },
        heading1: { run: { font: DOCX_FONT_FAMILY, size: 28, bold: true, color: '144D5C' }, paragraph: { spacing: { before: 320, after: 140 } } },
        heading2: { run: { font: DOCX_FONT_FAMILY, size: 22, bold: true, color: '1C2129' }, paragraph: { spacing: { before: 220, after: 100 } } },
        heading3: { run: { font: DOCX_FONT_FAMILY, size: 19, bold: true, color: '144D5C' }, paragraph: { spacing: { before: 180, after: 80 } } },
      },
    },
    sections: [
      {
        properties: { page: { size: { width: 11906, height: 16838 }, margin: { top: 1134, bottom: 1134, left: 1134, right: 1134 } } },
        headers: {
          default: new Header({
            children: [
              new Paragraph({
                children: [...draftRun, new TextRun({ text: `${EXHIBIT_TITLE} · ${m.device.name} (${m.device.model}) · filing ${m.filingId} v${m.versionNumber}`, size: 15, color: '60676F' })],
              }),
            ],
          }),
        },
        footers: {
          default: new Footer({
            children: [
              new Paragraph({
                alignment: AlignmentType.RIGHT,
                children: [...draftRun, new TextRun({ size: 16, children: ['Page ', PageNumber.CURRENT, ' of ', PageNumber.TOTAL_PAGES] })],
              }),
            ],
          }),
        },
        children: [
          new Paragraph({ children: [new TextRun({ text: m.organisation.toUpperCase(), size: 18, color: '60676F' })] }),
          new Paragraph({ heading: HeadingLevel.TITLE, spacing: { before: 600, after: 200 }, children: [new TextRun({ text: EXHIBIT_TITLE, size: 56, bold: true, color: '144D5C' })] }),
          new Paragraph({ spacing: { after: 400 }, children: [new TextRun({ text: `${m.device.name} — model ${m.device.model}`, size: 30 })] }),
          ...(m.draft ? [new Paragraph({ spacing: { after: 200 }, children: [new TextRun({ text: INTRO.draftNotice, bold: true, color: 'B4581A', size: 24 })] })] : []),
          keyValue(coverLines(m)),
          spacer(),
          new Paragraph({ heading: HeadingLevel.HEADING_2, children: [new TextRun('Signature')] }),
          keyValue(signatureLines(m)),
          new Paragraph({ pageBreakBefore: true, heading: HeadingLevel.HEADING_1, children: [new TextRun(SECTION.contents)] }),
          new TableOfContents(SECTION.contents, { hyperlink: true, headingStyleRange: '1-2' }),
          new Paragraph({ pageBreakBefore: true, children: [] }),
          ...exhibitBlocks(m).flatMap(render),
        ],
      },
    ],
  });
  return normalise(await Packer.toBuffer(doc), m.documentDate);
}
