/**
 * Work Sans for the server's PDFs (pdfkit), from @fontsource/work-sans: the product's own font, read from
 * node_modules (fontkit reads its WOFF files), never from a CDN. The latin files hold no Greek letters and few
 * mathematical signs, so the text that goes into a PDF spells them out (`latin`).
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

/** The names the fonts are registered under in a document. */
export const FONT_REGULAR = 'WorkSans';
export const FONT_SEMIBOLD = 'WorkSans-SemiBold';

const fontDir = join(dirname(createRequire(import.meta.url).resolve('@fontsource/work-sans/LICENSE')), 'files');
let fonts: { regular: Buffer; semibold: Buffer } | undefined;

function workSans() {
  fonts ??= {
    regular: readFileSync(join(fontDir, 'work-sans-latin-400-normal.woff')),
    semibold: readFileSync(join(fontDir, 'work-sans-latin-600-normal.woff')),
  };
  return fonts;
}

/** Registers Work Sans (regular and semibold) in the document as FONT_REGULAR and FONT_SEMIBOLD. */
export function registerWorkSans(doc: PDFKit.PDFDocument): void {
  const { regular, semibold } = workSans();
  doc.registerFont(FONT_REGULAR, regular);
  doc.registerFont(FONT_SEMIBOLD, semibold);
}

/** Characters Work Sans' latin files lack, spelled out. */
const spelled: Record<string, string> = {
  'ω': 'w',
  'ζ': 'zeta',
  'μ': 'mu',
  'π': 'pi',
  'ψ': 'psi',
  'φ': 'phi',
  'ξ': 'xi',
  'Δ': 'Delta',
  'λ': 'lambda',
  'β': 'beta',
  'α': 'alpha',
  '∝': '~',
  '≤': '<=',
  '≥': '>=',
  '≈': '~',
  '∞': '-infinity',
  '√': 'sqrt',
  '→': '->',
  '∓': '-/+',
};
const unprintable = new RegExp(`[${Object.keys(spelled).join('')}]`, 'g');

/** The text with the characters Work Sans' latin files lack spelled out (ζ → zeta, ≤ → <=, …). */
export function latin(text: string): string {
  return text.replace(unprintable, (c) => spelled[c] ?? c);
}
