// The service record as an A4 PDF (pdfkit), set in the fonts the app ships (Atkinson Hyperlegible
// Next from @fontsource; its .woff files, which pdfkit's font engine reads and subsets).
import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { Severity } from '../../db/schema';
import type { ServiceRecord } from './service-record';
import { formatMoney } from '../billing/money';
import { formatQuantity, unitSymbol } from '../billing/units';
import { SEVERITY_DISPLAY } from '../record/severity';
import { dayLabel, localDate } from './local-date';

const require = createRequire(import.meta.url);
const fontDir = join(dirname(require.resolve('@fontsource/atkinson-hyperlegible-next/package.json')), 'files');
const FONTS = {
  body: join(fontDir, 'atkinson-hyperlegible-next-latin-400-normal.woff'),
  bold: join(fontDir, 'atkinson-hyperlegible-next-latin-700-normal.woff'),
};

const INK = '#14202b';
const MUTED = '#4a5560';
const BRAND = '#0d5c63';
const MARGIN = 48;

export type PhotoBytes = (photoId: string) => Promise<Buffer | null>;

function drawSeverity(doc: PDFKit.PDFDocument, severity: Severity, x: number, y: number, size = 12) {
  const { colour, shape } = SEVERITY_DISPLAY[severity];
  const c = size / 2;
  doc.save().fillColor(colour);
  if (shape === 'octagon') {
    const k = size * 0.29;
    doc.polygon([x + k, y], [x + size - k, y], [x + size, y + k], [x + size, y + size - k], [x + size - k, y + size], [x + k, y + size], [x, y + size - k], [x, y + k]).fill();
  } else if (shape === 'triangle') {
    doc.polygon([x + c, y], [x + size, y + size], [x, y + size]).fill();
  } else if (shape === 'circle') {
    doc.circle(x + c, y + c, c).fill();
    doc.fillColor('#ffffff').circle(x + c, y + c, c * 0.35).fill();
  } else {
    doc.circle(x + c, y + c, c).fill();
    doc.strokeColor('#ffffff').lineWidth(size * 0.12).moveTo(x + size * 0.28, y + size * 0.52).lineTo(x + size * 0.44, y + size * 0.68).lineTo(x + size * 0.74, y + size * 0.34).stroke();
  }
  doc.restore();
}

export async function renderRecordPdf(record: ServiceRecord, photoBytes?: PhotoBytes): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: {
      Title: `Service record ${record.vehicle.registration} ${record.visit.date}`,
      Author: record.business.name,
      Subject: 'Vehicle service record',
      Creator: 'Tickover',
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  doc.registerFont('body', FONTS.body);
  doc.registerFont('bold', FONTS.bold);
  const width = doc.page.width - MARGIN * 2;
  const money = (minor: number) => formatMoney(minor, record.business.currency);

  const heading = (text: string) => {
    if (doc.y > doc.page.height - MARGIN - 80) doc.addPage();
    doc.moveDown(0.8).font('bold').fontSize(15).fillColor(BRAND).text(text, MARGIN, doc.y, { width });
    doc.moveTo(MARGIN, doc.y + 2).lineTo(MARGIN + width, doc.y + 2).lineWidth(0.8).strokeColor(BRAND).stroke();
    doc.moveDown(0.5).fillColor(INK);
  };
  const body = (text: string, options: PDFKit.Mixins.TextOptions = {}) => doc.font('body').fontSize(10.5).fillColor(INK).text(text, { width, ...options });
  const row = (label: string, value: string, y: number, x = MARGIN, w = width / 2) => {
    doc.font('body').fontSize(9).fillColor(MUTED).text(label, x, y, { width: w });
    doc.font('bold').fontSize(11).fillColor(INK).text(value, x, doc.y, { width: w - 8 });
  };

  // Header: the business, and what this document is.
  doc.font('bold').fontSize(18).fillColor(BRAND).text(record.business.name, MARGIN, MARGIN, { width: width * 0.6 });
  doc.font('body').fontSize(9.5).fillColor(MUTED).text([record.business.addressLines, record.business.phone, record.business.email].filter(Boolean).join('\n'), { width: width * 0.6 });
  doc.font('bold').fontSize(20).fillColor(INK).text('Service record', MARGIN + width * 0.6, MARGIN, { width: width * 0.4, align: 'right' });
  doc.font('body').fontSize(10).fillColor(MUTED).text(record.visit.dateLabel, { width: width * 0.4, align: 'right' });
  doc.y = Math.max(doc.y, MARGIN + 70);

  heading('Vehicle');
  const top = doc.y;
  row('Registration', record.vehicle.registration, top);
  row('Vehicle', `${record.vehicle.make} ${record.vehicle.model}${record.vehicle.year ? ` (${record.vehicle.year})` : ''}`, top, MARGIN + width / 2);
  const second = doc.y + 6;
  row('Engine', record.vehicle.engine || '—', second);
  row('Odometer', record.signOff ? formatQuantity(record.signOff.odometer, record.signOff.odometerUnit) : '—', second, MARGIN + width / 2);
  const third = doc.y + 6;
  row('Work', record.visit.templateName, third);
  row('Technician', record.visit.technicianName, third, MARGIN + width / 2);
  if (record.vehicle.vin) row('VIN', record.vehicle.vin, doc.y + 6);
  row('Customer', record.customer.name, doc.y + 6);
  doc.x = MARGIN;

  heading('Findings');
  if (record.findings.length === 0) body('Nothing that needs work.');
  for (const finding of record.findings) {
    if (doc.y > doc.page.height - MARGIN - 90) doc.addPage();
    const y = doc.y;
    drawSeverity(doc, finding.severity, MARGIN, y + 1, 12);
    doc.font('bold').fontSize(9).fillColor(SEVERITY_DISPLAY[finding.severity].colour).text(SEVERITY_DISPLAY[finding.severity].label.toUpperCase(), MARGIN + 18, y + 2, { width: width - 18 });
    doc.font('bold').fontSize(12).fillColor(INK).text(finding.title, MARGIN + 18, doc.y + 1, { width: width - 18 });
    if (finding.detail) doc.font('body').fontSize(10.5).text(finding.detail, MARGIN + 18, doc.y, { width: width - 18 });
    if (finding.advised) {
      const a = finding.advised;
      const answer = a.decision === 'pending' ? 'awaiting your answer' : a.decision;
      doc.font('bold').fontSize(10.5).text(`Advised work: ${a.description}. ${money(a.priceMinor + a.taxMinor)} including tax (${answer}).`, MARGIN + 18, doc.y + 2, { width: width - 18 });
    }
    if (photoBytes && finding.photos.length > 0) {
      let x = MARGIN + 18;
      const photoTop = doc.y + 4;
      for (const photo of finding.photos.slice(0, 4)) {
        const bytes = await photoBytes(photo.id).catch(() => null);
        if (!bytes) continue;
        try {
          doc.image(bytes, x, photoTop, { fit: [110, 82] });
          x += 118;
        } catch {
          // A format pdfkit cannot embed (WebP): the photo stays on the web page only.
        }
      }
      if (x > MARGIN + 18) doc.y = photoTop + 88;
    }
    doc.x = MARGIN;
    doc.moveDown(0.6);
  }

  if (record.invoice) {
    const inv = record.invoice;
    heading(`Invoice ${inv.number}`);
    const status =
      inv.status === 'paid'
        ? `Paid${inv.paidAt ? ` on ${dayLabel(localDate(inv.paidAt, record.business.timeZone), 'd MMMM yyyy')}` : ''}`
        : inv.status === 'void'
          ? `Cancelled by credit note ${inv.creditNote?.number ?? ''}`
          : `Please pay by ${inv.dueAt ? dayLabel(localDate(inv.dueAt, record.business.timeZone), 'd MMMM yyyy') : '—'}`;
    body(status);
    doc.moveDown(0.3);
    for (const line of inv.lines) {
      const y = doc.y;
      doc.font('body').fontSize(10).fillColor(INK).text(`${line.description}  (${formatQuantity(line.quantity, line.unit)} × ${money(line.unitPriceMinor)})`, MARGIN, y, { width: width - 100 });
      const after = doc.y;
      doc.text(money(line.netMinor), MARGIN + width - 100, y, { width: 100, align: 'right' });
      doc.y = Math.max(after, doc.y) + 2;
    }
    const total = (label: string, value: string, bold = false) => {
      const y = doc.y;
      doc.font(bold ? 'bold' : 'body').fontSize(bold ? 12 : 10.5).text(label, MARGIN, y, { width: width - 100, align: 'right' });
      doc.text(value, MARGIN + width - 100, y, { width: 100, align: 'right' });
    };
    doc.moveDown(0.3);
    total('Net', money(inv.netMinor));
    total(`Tax at ${(inv.taxRateBasisPoints / 100).toLocaleString('en-GB')} %`, money(inv.taxMinor));
    total('Total', money(inv.totalMinor), true);
    doc.x = MARGIN;
  }

  if (record.nextService) {
    const n = record.nextService;
    heading('Next service');
    body(
      `Due by ${n.dueDate ? dayLabel(n.dueDate, 'd MMMM yyyy') : '—'}${n.dueOdometer !== null ? ` or at ${formatQuantity(n.dueOdometer, n.unit)}` : ''}, whichever comes first.`,
    );
  }

  heading('Work done');
  for (const section of record.sections) {
    if (doc.y > doc.page.height - MARGIN - 60) doc.addPage();
    doc.font('bold').fontSize(11.5).fillColor(INK).text(section.title, MARGIN, doc.y + 4, { width });
    if (section.done.length > 0) body(section.done.join(' · '));
    if (section.notDone.length > 0) body(`Not done this time: ${section.notDone.join('; ')}`, { oblique: false });
    for (const r of section.readings) {
      const value = r.value !== null ? formatQuantity(r.value, r.unit) : (r.textValue ?? '');
      const expected =
        r.expectedMin !== null && r.expectedMax !== null ? `expected ${formatQuantity(r.expectedMin, null)} to ${formatQuantity(r.expectedMax, null)} ${unitSymbol(r.unit)}`.trim() : '';
      const y = doc.y;
      doc.font('body').fontSize(10).fillColor(INK).text(r.label, MARGIN + 8, y, { width: width * 0.5 });
      const after = doc.y;
      doc.font('bold').text(`${value}${r.outOfRange ? '  (outside range)' : ''}`, MARGIN + width * 0.52, y, { width: width * 0.24 });
      doc.font('body').fillColor(MUTED).text(expected, MARGIN + width * 0.76, y, { width: width * 0.24 });
      doc.fillColor(INK);
      doc.y = Math.max(after, doc.y) + 1;
    }
    doc.x = MARGIN;
  }
  if (record.parts.length > 0) {
    doc.font('bold').fontSize(11.5).text('Parts fitted', MARGIN, doc.y + 6, { width });
    for (const p of record.parts) body(`${formatQuantity(p.quantity, p.unit)} × ${p.description}  (${p.partNumber})`);
  }
  if (record.notes.length > 0) {
    doc.font('bold').fontSize(11.5).text('Technician’s notes', MARGIN, doc.y + 6, { width });
    for (const n of record.notes) body(n);
  }

  heading('Safety');
  body(
    'The values shown are those recorded at this visit. The vehicle maker’s data and local regulations take precedence over them. If a warning light comes on, the brakes or steering feel different, or you see a leak, stop when it is safe and call us.',
  );

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('body').fontSize(8.5).fillColor(MUTED).text(`${record.business.name} · Service record ${record.vehicle.registration} · ${record.visit.date} · page ${i + 1} of ${range.count}`, MARGIN, doc.page.height - 30, { width, align: 'center' });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
