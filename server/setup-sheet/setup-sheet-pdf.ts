import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { formatMoney } from '../../shared/money-format';
import type { SetupSheetDto } from '../../shared/setup-sheet/setup-sheet.dto';

const require = createRequire(import.meta.url);
// Inter as shipped with the app's own font package: embedded, so the PDF reads the same everywhere and needs no CDN.
const fontFile = (weight: number) => readFileSync(require.resolve(`@fontsource/inter/files/inter-latin-${weight}-normal.woff`));
let fonts: { regular: Buffer; bold: Buffer } | null = null;
const interFonts = () => (fonts ??= { regular: fontFile(400), bold: fontFile(700) });

const ink = '#1d2430';
const muted = '#4b5563';

/** Renders the sheet DTO, the same object the page shows, as an A4 PDF. */
export function setupSheetPdf(sheet: SetupSheetDto, made: Date = new Date()): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: `Setup sheet · ${sheet.bikeLabel}`, Author: 'Loadline' } });
  const { regular, bold } = interFonts();
  doc.registerFont('Inter', regular);
  doc.registerFont('Inter-Bold', bold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const width = doc.page.width - 96;
  const heading = (text: string, size = 13) => {
    doc.moveDown(0.6).font('Inter-Bold').fontSize(size).fillColor(ink).text(text, { width });
    doc.moveDown(0.2);
  };
  const para = (text: string, color = ink) => doc.font('Inter').fontSize(10).fillColor(color).text(text, { width });
  const bullets = (items: string[]) => items.forEach((t, i) => doc.font('Inter').fontSize(10).fillColor(ink).text(`${i + 1}. ${t}`, { width, paragraphGap: 2 }));
  const row = (label: string, value: string) => {
    const y = doc.y;
    doc.font('Inter').fontSize(9).fillColor(muted).text(label, 48, y, { width: 140 });
    const afterLabel = doc.y;
    doc.font('Inter').fontSize(10).fillColor(ink).text(value, 196, y, { width: width - 148 });
    doc.y = Math.max(doc.y, afterLabel) + 3;
    doc.x = 48;
  };

  doc.font('Inter-Bold').fontSize(20).fillColor(ink).text(sheet.orderNumber ? `Setup sheet · order ${sheet.orderNumber}` : 'Setup sheet', { width });
  para(`${sheet.bikeLabel} · ${sheet.ridingStyle} riding · ${made.toLocaleDateString('en-GB', { dateStyle: 'long' })}`, muted);

  heading('Before you start');
  sheet.cautions.forEach((c) => para(`• ${c}`));

  heading('The load');
  sheet.loadLines.forEach((l) => para(l));

  for (const end of sheet.ends) {
    heading(end.title, 15);
    end.rows.forEach((r) => row(r.label, r.value));
  }

  if (sheet.torques.length) {
    heading('Fastener torques');
    sheet.torques.forEach((t) => row(t.fastener, t.text));
    para("Check each figure against the bike maker's manual before you use it.", muted);
  }
  if (sheet.tools.length) {
    heading('Tools');
    sheet.tools.forEach((t) => para(`• ${t}`));
  }
  if (sheet.bikeNotes) {
    heading('Notes for this bike');
    para(sheet.bikeNotes);
  }
  heading('Fitting, in general terms');
  bullets(sheet.fittingSteps);
  heading('What a spring change disturbs');
  sheet.disturbedSteps.forEach((s) => para(`• ${s}`));
  heading('After fitting');
  para(sheet.afterFitting);
  const total = sheet.ends.reduce((s, e) => s + (e.unitPriceCents ?? 0) * e.units, 0);
  if (sheet.ends.every((e) => e.unitPriceCents !== null) && total > 0) {
    doc.moveDown(0.6);
    para(`Springs as listed: ${sheet.ends.map((e) => e.unitWords).join(' + ')}, ${formatMoney(total, sheet.ends[0]!.currency)} in all (adapters apart).`, muted);
  }
  doc.end();
  return done;
}
