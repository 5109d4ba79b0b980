/**
 * A name as a piece of a download's file name: letters and digits, every other run of characters one dash, accents
 * dropped (NFKD), no dash at either end, at most `maxLength` characters. Empty when nothing is left.
 */
export function fileNameSlug(text: string, maxLength: number): string {
  return text
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, maxLength);
}
