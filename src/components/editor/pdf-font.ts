/**
 * Source Sans 3 (shipped with the app by @fontsource) embedded in the PDF, so Ω, ρ, π, −, µ and ²
 * print as themselves. @fontsource ships WOFF files and jspdf reads TrueType: a WOFF 1.0 file is
 * the TrueType tables, each zlib-compressed, behind a small header (W3C WOFF 1.0, section 5), so
 * unpacking it is a few lines. The Latin and Greek subsets are separate files; text is written
 * in runs, each in the subset that has its letters.
 */
import type { jsPDF } from 'jspdf';
import greek400 from '@fontsource/source-sans-3/files/source-sans-3-greek-400-normal.woff?url';
import greek700 from '@fontsource/source-sans-3/files/source-sans-3-greek-700-normal.woff?url';
import latin400 from '@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff?url';
import latin700 from '@fontsource/source-sans-3/files/source-sans-3-latin-700-normal.woff?url';

async function inflate(data: Uint8Array): Promise<Uint8Array> {
  const stream = new Blob([data as Uint8Array<ArrayBuffer>]).stream().pipeThrough(new DecompressionStream('deflate'));
  return new Uint8Array(await new Response(stream).arrayBuffer());
}

/** WOFF 1.0 → TrueType bytes. */
export async function woffToTtf(woff: ArrayBuffer): Promise<Uint8Array> {
  const view = new DataView(woff);
  if (view.getUint32(0) !== 0x774f4646) throw new Error('not a WOFF file');
  const flavor = view.getUint32(4);
  const numTables = view.getUint16(12);
  const tables: { tag: number; checksum: number; data: Uint8Array }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const offset = view.getUint32(at + 4);
    const compLength = view.getUint32(at + 8);
    const origLength = view.getUint32(at + 12);
    const raw = new Uint8Array(woff, offset, compLength);
    tables.push({ tag: view.getUint32(at), checksum: view.getUint32(at + 16), data: compLength < origLength ? await inflate(raw) : raw.slice() });
  }
  const headerSize = 12 + 16 * numTables;
  const padded = (n: number) => (n + 3) & ~3;
  const out = new Uint8Array(headerSize + tables.reduce((sum, t) => sum + padded(t.data.length), 0));
  const o = new DataView(out.buffer);
  let entrySelector = 0;
  while (2 ** (entrySelector + 1) <= numTables) entrySelector++;
  o.setUint32(0, flavor);
  o.setUint16(4, numTables);
  o.setUint16(6, 16 * 2 ** entrySelector);
  o.setUint16(8, entrySelector);
  o.setUint16(10, numTables * 16 - 16 * 2 ** entrySelector);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    o.setUint32(at, t.tag);
    o.setUint32(at + 4, t.checksum);
    o.setUint32(at + 8, offset);
    o.setUint32(at + 12, t.data.length);
    out.set(t.data, offset);
    offset += padded(t.data.length);
  });
  return out;
}

const toBinaryString = (bytes: Uint8Array) => {
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return s;
};

export const LATIN = 'SourceSans3';
export const GREEK = 'SourceSans3Greek';

/** Loads and registers the four faces (Latin and Greek, regular and bold) on this document. */
export async function embedFonts(pdf: jsPDF): Promise<void> {
  const faces: [string, string, 'normal' | 'bold'][] = [[latin400, LATIN, 'normal'], [latin700, LATIN, 'bold'], [greek400, GREEK, 'normal'], [greek700, GREEK, 'bold']];
  await Promise.all(faces.map(async ([url, family, style]) => {
    const ttf = await woffToTtf(await (await fetch(url)).arrayBuffer());
    const file = `${family}-${style}.ttf`;
    pdf.addFileToVFS(file, toBinaryString(ttf));
    pdf.addFont(file, family, style);
  }));
}

const isGreek = (ch: string) => /[\u0370-\u03ff\u1f00-\u1fff]/.test(ch);

/** Splits text into runs that one subset can print: [text, family][]. */
export function fontRuns(text: string): [string, string][] {
  const runs: [string, string][] = [];
  for (const ch of text) {
    const family = isGreek(ch) ? GREEK : LATIN;
    const last = runs[runs.length - 1];
    if (last && last[1] === family) last[0] += ch;
    else runs.push([ch, family]);
  }
  return runs;
}
