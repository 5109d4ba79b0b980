/**
 * The hardware sheet as a PDF for the workshop (pdfkit), set in Work Sans from @fontsource/work-sans (the product's
 * own font, read from node_modules; fontkit reads its WOFF files). The rows are those of the CSV and the page
 * (shared/compute/hardware-sheet.ts).
 */
import PDFDocument from 'pdfkit';
import { formatHardwareValue, type HardwareSheet } from '../../../shared/compute/hardware-sheet';
import { FONT_REGULAR, FONT_SEMIBOLD, latin, registerWorkSans } from '../../pdf/fonts';

export function hardwareSheetPdf(sheet: HardwareSheet): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: `Hardware sheet ${sheet.projectName} ${sheet.revision}`, Creator: 'Stillspan' } });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerWorkSans(doc);

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  doc.font(FONT_SEMIBOLD).fontSize(18).text('Hardware sheet', left);
  doc.font(FONT_REGULAR).fontSize(11).text(`Project: ${sheet.projectName}`);
  doc.text(`Tuning variant: ${sheet.variantName}`);
  doc.text(`Revision: ${sheet.revision}`);
  doc.moveDown(0.8);

  const columns = [
    { title: 'Quantity', x: left, w: width * 0.42 },
    { title: 'Value', x: left + width * 0.43, w: width * 0.17 },
    { title: 'Unit', x: left + width * 0.61, w: width * 0.08 },
    { title: 'Note', x: left + width * 0.7, w: width * 0.3 },
  ];
  const line = (cells: string[], font: string) => {
    doc.font(font).fontSize(9);
    const height = Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: columns[i].w })));
    if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
    const y = doc.y;
    cells.forEach((c, i) => doc.text(c, columns[i].x, y, { width: columns[i].w }));
    doc.y = y + height + 3;
    doc.x = left;
  };
  let section = '';
  for (const row of sheet.rows) {
    if (row.section !== section) {
      section = row.section;
      doc.moveDown(0.4);
      line([section.toUpperCase(), '', '', ''], FONT_SEMIBOLD);
    }
    line([latin(row.quantity), latin(formatHardwareValue(row.value)), latin(row.unit), latin(row.note)], FONT_REGULAR);
  }
  doc.moveDown(1);
  doc.font(FONT_SEMIBOLD).fontSize(10).text('Caution', left, doc.y, { width });
  doc.font(FONT_REGULAR).fontSize(10).text(sheet.caution, left, doc.y, { width });
  doc.end();
  return done;
}
