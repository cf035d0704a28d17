// The shared frame of Whorl's PDFs: fonts shipped with the app (DejaVu Sans for
// text, since it has δ μ σ Ω; Lato for headings), a footer on every page with the
// page number, the record's SHA-256 and the caution, and small layout helpers.
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { ROLE_LABELS, type Role } from '../../shared/roles';

const require = createRequire(import.meta.url);
const FONTS = {
  body: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf'),
  bold: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf'),
  mono: require.resolve('dejavu-fonts-ttf/ttf/DejaVuSansMono.ttf'),
  heading: require.resolve('@fontsource/lato/files/lato-latin-700-normal.woff'),
};

export const CAUTION_TEXT =
  "Caution: Whorl's checks support the judgement of a certified ET Level 3; they do not replace it. " +
  'The applicable standard, customer specification and local regulations always take precedence.';

const INK = '#14343b';
const SOFT = '#3f5f66';
const STATUS_COLOURS: Record<string, string> = { pass: '#2f7d4f', fail: '#b42318', warn: '#a15c00', not_applicable: '#3f5f66' };
const MARGIN = 50;
const FOOTER_HEIGHT = 48;

export type Doc = PDFKit.PDFDocument;

export function createReportDocument({ title, subject }: { title: string; subject: string }): Doc {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER_HEIGHT },
    bufferPages: true,
    info: { Title: title, Subject: subject, Creator: 'Whorl', Producer: 'Whorl' },
  });
  doc.registerFont('Body', FONTS.body);
  doc.registerFont('Bold', FONTS.bold);
  doc.registerFont('Mono', FONTS.mono);
  doc.registerFont('Heading', FONTS.heading);
  doc.font('Body').fontSize(10).fillColor(INK);
  return doc;
}

/** Writes the footer on every buffered page, then ends the document and returns its bytes. */
export async function finishReport(
  doc: Doc,
  { recordLabel, sha256, generatedAt, trailHead }: { recordLabel: string; sha256: string; generatedAt: Date; trailHead?: { seq: number; hash: string } },
): Promise<Buffer> {
  // The closing line: the trail's head when printed, to compare later with the trail and its anchors.
  if (trailHead) {
    doc.moveDown(1);
    doc.font('Mono').fontSize(7).fillColor(SOFT).text(`Trail head at print: sequence ${trailHead.seq}, hash ${trailHead.hash}`, MARGIN, undefined, {
      width: doc.page.width - 2 * MARGIN,
    });
  }
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<void>((resolve, reject) => {
    doc.on('end', resolve);
    doc.on('error', reject);
  });
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i += 1) {
    doc.switchToPage(i);
    const bottom = doc.page.height - MARGIN - FOOTER_HEIGHT + 10;
    const width = doc.page.width - 2 * MARGIN;
    // Writing below the bottom margin would start a new page: lift it while the footer is written.
    const savedBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.moveTo(MARGIN, bottom - 4).lineTo(doc.page.width - MARGIN, bottom - 4).lineWidth(0.5).strokeColor('#9fb8bc').stroke();
    doc.font('Body').fontSize(7).fillColor(SOFT);
    doc.text(`${recordLabel} · generated ${utc(generatedAt)} · Page ${i - range.start + 1} of ${range.count}`, MARGIN, bottom, { width, lineBreak: false });
    doc.font('Mono').fontSize(6.5).text(`Record SHA-256 ${sha256}`, MARGIN, bottom + 10, { width, lineBreak: false });
    doc.font('Body').fontSize(6.5).text(CAUTION_TEXT, MARGIN, bottom + 20, { width });
    doc.page.margins.bottom = savedBottom;
  }
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

export function utc(date: Date | string | null | undefined): string {
  if (!date) return '—';
  const d = typeof date === 'string' ? new Date(date) : date;
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function title(doc: Doc, text: string, sub?: string) {
  doc.font('Heading').fontSize(18).fillColor(INK).text(text);
  if (sub) doc.font('Body').fontSize(11).fillColor(SOFT).text(sub);
  doc.moveDown(0.6).fillColor(INK);
}

export function heading(doc: Doc, text: string) {
  if (doc.y > doc.page.height - doc.page.margins.bottom - 60) doc.addPage();
  doc.moveDown(0.6).font('Heading').fontSize(13).fillColor(INK).text(text);
  doc.moveDown(0.2).font('Body').fontSize(10);
}

export function subheading(doc: Doc, text: string) {
  if (doc.y > doc.page.height - doc.page.margins.bottom - 40) doc.addPage();
  doc.moveDown(0.4).font('Bold').fontSize(10.5).fillColor(INK).text(text);
  doc.font('Body').fontSize(10);
}

/** "Label: value" lines; empty values print as a dash so a gap is visible. */
export function fields(doc: Doc, rows: [string, string | number | null | undefined][]) {
  for (const [label, value] of rows) {
    doc.font('Bold').fontSize(9.5).fillColor(INK).text(`${label}: `, { continued: true });
    doc.font('Body').text(value === null || value === undefined || value === '' ? '—' : String(value));
  }
}

export function paragraph(doc: Doc, text: string, options: { colour?: string; size?: number } = {}) {
  doc.font('Body').fontSize(options.size ?? 10).fillColor(options.colour ?? INK).text(text);
  doc.fillColor(INK);
}

export function statusLine(doc: Doc, status: string, text: string) {
  const label = status === 'not_applicable' ? 'N/A' : status.toUpperCase();
  doc.font('Bold').fontSize(9.5).fillColor(STATUS_COLOURS[status] ?? INK).text(`[${label}] `, { continued: true });
  doc.fillColor(INK).font('Bold').text(text);
  doc.font('Body');
}

export function small(doc: Doc, text: string) {
  doc.font('Body').fontSize(8.5).fillColor(SOFT).text(text);
  doc.fontSize(10).fillColor(INK);
}

export function mono(doc: Doc, text: string) {
  doc.font('Mono').fontSize(8).fillColor(INK).text(text);
  doc.font('Body').fontSize(10);
}

export function signatureBlock(doc: Doc, signature: { printedName: string; role: string; meaning: string; signedAt: string; contentHash: string }) {
  if (doc.y > doc.page.height - doc.page.margins.bottom - 70) doc.addPage();
  const x = doc.page.margins.left;
  const top = doc.y + 4;
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  doc.rect(x, top, width, 58).lineWidth(0.8).strokeColor('#1f6f78').stroke();
  doc.font('Bold').fontSize(10).fillColor(INK).text(`Signed by ${signature.printedName}`, x + 8, top + 6, { width: width - 16 });
  doc.font('Body').fontSize(9).text(`Role: ${ROLE_LABELS[signature.role as Role] ?? signature.role} · Date and time: ${utc(signature.signedAt)}`, { width: width - 16 });
  doc.text(`Meaning: ${signature.meaning}`, { width: width - 16 });
  doc.font('Mono').fontSize(7).text(`Signed content SHA-256 ${signature.contentHash}`, { width: width - 16 });
  doc.font('Body').fontSize(10);
  doc.x = x;
  doc.y = top + 64;
}
