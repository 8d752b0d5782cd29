import path from 'node:path';
import PDFDocument from 'pdfkit';
import { formatMass, formatMoney, formatVolume } from '@/lib/format/units';
import { formatShare, formatSyrup, statementLines } from './format';
import type { Ledger, Statement } from './types';

// The app's own typeface, shipped in node_modules. pdfkit embeds WOFF; it cannot subset WOFF2.
const FONT_DIR = path.join(process.cwd(), 'node_modules', '@fontsource', 'source-sans-3', 'files');
const REGULAR = path.join(FONT_DIR, 'source-sans-3-latin-400-normal.woff');
const BOLD = path.join(FONT_DIR, 'source-sans-3-latin-700-normal.woff');

function render(draw: (doc: PDFKit.PDFDocument) => void, info: { Title: string }): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'LETTER', margin: 54, info: { ...info, Author: 'Brixhouse' } });
    doc.registerFont('regular', REGULAR);
    doc.registerFont('bold', BOLD);
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    try {
      draw(doc);
      doc.end();
    } catch (err) {
      reject(err);
    }
  });
}

/** One household's season statement as a PDF. */
export function statementPdf(s: Statement, payUrl: string | null): Promise<Buffer> {
  return render(
    (doc) => {
      doc.font('bold').fontSize(20).text(`${s.seasonLabel} statement`);
      doc.font('regular').fontSize(12).text(`${s.householdName} household · ${s.cooperativeName}`);
      doc.fontSize(10).fillColor('#545e69').text(`Settled ${s.settledAt.slice(0, 10)} · statement ${s.id}`);
      doc.moveDown(1.2).fillColor('#232c36');
      const left = doc.page.margins.left;
      const valueX = left + 260;
      for (const line of statementLines(s)) {
        const y = doc.y;
        doc.font(line.strong ? 'bold' : 'regular').fontSize(12);
        doc.text(line.label, left, y, { width: 250 });
        doc.text(line.value, valueX, y, { width: 250, align: 'right' });
        doc.moveDown(0.35);
      }
      doc.moveDown(1).font('regular').fontSize(10).fillColor('#545e69');
      doc.text(
        'Syrup and fuel are split by the sugar each household’s sap put into each boil, not by litres: sugar = litres × density(°Brix) × °Brix / 100, density from the sucrose table (CRC Handbook).',
        left,
        doc.y,
        { width: 504 },
      );
      if (payUrl && s.balanceCents > 0) {
        doc.moveDown(1).fillColor('#1e5b43').font('bold').fontSize(12).text(`Pay the balance of ${formatMoney(s.balanceCents, s.currency)} online:`);
        doc.font('regular').fontSize(11).text(payUrl, { link: payUrl, underline: true });
      } else if (s.balanceCents <= 0) {
        doc.moveDown(1).fillColor('#1e5b43').font('bold').fontSize(12).text('Paid in full. Thank you.');
      }
    },
    { Title: `${s.seasonLabel} statement, ${s.householdName}` },
  );
}

/** The Season ledger (by sugar, with the split by volume) as a PDF, landscape. */
export function ledgerPdf(l: Ledger, cooperativeName: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'LETTER', layout: 'landscape', margin: 36, info: { Title: `${l.season.label} ledger`, Author: 'Brixhouse' } });
    doc.registerFont('regular', REGULAR);
    doc.registerFont('bold', BOLD);
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    try {
      const u = l.unitSystem;
      const money = (c: number) => formatMoney(c, l.currency);
      doc.font('bold').fontSize(18).text(`Season ledger · ${l.season.label}`);
      doc.font('regular').fontSize(11).text(`${cooperativeName} · ${l.season.startsOn} to ${l.season.endsOn} · ${l.season.status}`);
      doc.moveDown(0.8);
      const cols = ['Household', 'Sap', 'Rejected', '°Bx', 'Sugar', 'Share', 'Syrup', 'Fuel', 'Fee', 'Due', 'Paid', 'Balance', 'By volume: syrup', 'fuel'];
      const widths = [92, 56, 50, 32, 52, 44, 52, 52, 46, 56, 56, 56, 60, 52];
      const row = (cells: string[], bold = false) => {
        const y = doc.y;
        let x = doc.page.margins.left;
        doc.font(bold ? 'bold' : 'regular').fontSize(9);
        cells.forEach((c, i) => {
          doc.text(c, x, y, { width: widths[i] - 4, align: i === 0 ? 'left' : 'right' });
          x += widths[i];
        });
        doc.moveDown(0.4);
      };
      row(cols, true);
      for (const h of l.households) {
        row([
          h.name,
          formatVolume(h.sapL, u, { digits: 1 }),
          formatVolume(h.rejectedL, u, { digits: 1 }),
          h.meanBrix === null ? '—' : h.meanBrix.toFixed(1),
          formatMass(h.sugarKg, u, { digits: 1 }),
          formatShare(h.share),
          formatSyrup(h.syrupMl, u),
          money(h.fuelCents),
          money(h.feeCents),
          money(h.dueCents),
          money(h.paidCents),
          money(h.balanceCents),
          formatSyrup(h.byVolume.syrupMl, u),
          money(h.byVolume.fuelCents),
        ]);
      }
      const t = l.totals;
      row(['Co-op', formatVolume(t.sapL, u, { digits: 1 }), formatVolume(t.rejectedL, u, { digits: 1 }), t.meanBrix === null ? '—' : t.meanBrix.toFixed(1), formatMass(t.sugarKg, u, { digits: 1 }), '100.0 %', formatSyrup(t.syrupMl, u), money(t.fuelCents), money(t.feeCents), money(t.dueCents), money(t.paidCents), money(t.balanceCents), '', ''], true);
      doc.moveDown(1).font('regular').fontSize(9).fillColor('#545e69');
      doc.text('Split by sugar delivered into each boil (largest remainder, whole millilitres and cents); the split by raw volume is shown for comparison only.', doc.page.margins.left, doc.y);
      doc.end();
    } catch (err) {
      reject(err);
    }
  });
}
