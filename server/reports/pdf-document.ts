// The shared frame of Whorl's PDFs: fonts shipped with the app (DejaVu Sans for
// text, since it has δ μ σ Ω; Lato for headings), the organisation's name and a
// logo area at the top of every page, a footer with the page number and the
// record's SHA-256, the caution once (under the title, where it always fits),
// headings kept with their first lines, and dates in the organisation's zone.
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { RULE_STATUS_LABELS, roleLabel } from '../../shared/labels';
import { formatDateTime, formatSignatureTime } from '../../shared/format/dates';
import type { RuleStatus } from '../../shared/domain/checklist';

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
const HEADER_HEIGHT = 34;
const FOOTER_HEIGHT = 30;
/** Space a heading needs below it for its first lines: a heading never ends a page. */
const KEEP_WITH_HEADING = 72;

export type Doc = PDFKit.PDFDocument;

export interface ReportOrganisation {
  name: string;
  timeZone: string;
}

const ORGANISATION = new WeakMap<Doc, ReportOrganisation>();
const zoneOf = (doc: Doc) => ORGANISATION.get(doc)?.timeZone ?? 'UTC';

export function createReportDocument({ title, subject, organisation }: { title: string; subject: string; organisation: ReportOrganisation }): Doc {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN + HEADER_HEIGHT, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER_HEIGHT },
    bufferPages: true,
    info: { Title: title, Subject: subject, Creator: 'Whorl', Producer: 'Whorl' },
  });
  doc.registerFont('Body', FONTS.body);
  doc.registerFont('Bold', FONTS.bold);
  doc.registerFont('Mono', FONTS.mono);
  doc.registerFont('Heading', FONTS.heading);
  doc.font('Body').fontSize(10).fillColor(INK);
  ORGANISATION.set(doc, organisation);
  return doc;
}

/** The organisation's initials, drawn in the logo area until a logo file is configured. */
const initials = (name: string) =>
  name
    .split(/\s+/)
    .filter((word) => /^[A-Za-z]/.test(word))
    .slice(0, 3)
    .map((word) => word[0].toUpperCase())
    .join('');

function pageHeader(doc: Doc, documentTitle: string) {
  const organisation = ORGANISATION.get(doc);
  const width = doc.page.width - 2 * MARGIN;
  const top = MARGIN - 14;
  const logo = { x: MARGIN, y: top, w: 30, h: 30 };
  doc.roundedRect(logo.x, logo.y, logo.w, logo.h, 3).lineWidth(0.6).strokeColor('#9fb8bc').stroke();
  doc.font('Bold').fontSize(9).fillColor(SOFT).text(initials(organisation?.name ?? 'Whorl'), logo.x, logo.y + 10, { width: logo.w, align: 'center', lineBreak: false });
  doc.font('Bold').fontSize(9).fillColor(INK).text(organisation?.name ?? 'Whorl', logo.x + logo.w + 8, top + 4, { width: width - logo.w - 8, lineBreak: false });
  doc.font('Body').fontSize(7.5).fillColor(SOFT).text(documentTitle, logo.x + logo.w + 8, top + 17, { width: width - logo.w - 8, lineBreak: false });
  doc.moveTo(MARGIN, top + logo.h + 6).lineTo(doc.page.width - MARGIN, top + logo.h + 6).lineWidth(0.5).strokeColor('#9fb8bc').stroke();
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
    const savedTop = doc.page.margins.top;
    doc.page.margins.top = 0;
    pageHeader(doc, recordLabel);
    doc.page.margins.top = savedTop;
    doc.moveTo(MARGIN, bottom - 4).lineTo(doc.page.width - MARGIN, bottom - 4).lineWidth(0.5).strokeColor('#9fb8bc').stroke();
    doc.font('Body').fontSize(7).fillColor(SOFT);
    doc.text(`${recordLabel} · generated ${at(doc, generatedAt)} · Page ${i - range.start + 1} of ${range.count}`, MARGIN, bottom, { width, lineBreak: false });
    doc.font('Mono').fontSize(6.5).text(`Record SHA-256 ${sha256}`, MARGIN, bottom + 10, { width, lineBreak: false });
    doc.page.margins.bottom = savedBottom;
  }
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

/** A moment in the organisation's time zone, the one date format of every report. */
export function at(doc: Doc, date: Date | string | null | undefined): string {
  return formatDateTime(date ?? null, zoneOf(doc));
}

/** Starts a new page when fewer than `needed` points are left above the footer. */
export function ensureSpace(doc: Doc, needed: number) {
  if (doc.y + needed > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

/** The title, and the caution once, right under it, where it always fits. */
export function title(doc: Doc, text: string, sub?: string) {
  doc.font('Heading').fontSize(18).fillColor(INK).text(text);
  if (sub) doc.font('Body').fontSize(11).fillColor(SOFT).text(sub);
  doc.moveDown(0.4);
  doc.font('Body').fontSize(8.5).fillColor(SOFT).text(CAUTION_TEXT);
  doc.moveDown(0.6).fillColor(INK).fontSize(10);
}

export function heading(doc: Doc, text: string) {
  doc.font('Heading').fontSize(13);
  ensureSpace(doc, doc.heightOfString(text) + KEEP_WITH_HEADING);
  doc.moveDown(0.6).font('Heading').fontSize(13).fillColor(INK).text(text);
  doc.moveDown(0.2).font('Body').fontSize(10);
}

export function subheading(doc: Doc, text: string) {
  ensureSpace(doc, 14 + KEEP_WITH_HEADING * 0.6);
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

export function statusLine(doc: Doc, status: RuleStatus, text: string) {
  const label = RULE_STATUS_LABELS[status] ?? status;
  doc.font('Bold').fontSize(9.5).fillColor(STATUS_COLOURS[status] ?? INK).text(`${label}: `, { continued: true });
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
  ensureSpace(doc, 70);
  const x = doc.page.margins.left;
  const top = doc.y + 4;
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  doc.rect(x, top, width, 58).lineWidth(0.8).strokeColor('#1f6f78').stroke();
  doc.font('Bold').fontSize(10).fillColor(INK).text(`Signed by ${signature.printedName}`, x + 8, top + 6, { width: width - 16 });
  doc.font('Body').fontSize(9).text(`Role: ${roleLabel(signature.role)} · Date and time: ${formatSignatureTime(signature.signedAt, zoneOf(doc))}`, { width: width - 16 });
  doc.text(`Meaning: ${signature.meaning}`, { width: width - 16 });
  doc.font('Mono').fontSize(7).text(`Signed content SHA-256 ${signature.contentHash}`, { width: width - 16 });
  doc.font('Body').fontSize(10);
  doc.x = x;
  doc.y = top + 64;
}
