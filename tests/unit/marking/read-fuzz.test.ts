/**
 * Property test: random bytes and near-valid mutations of real reports never make the reader
 * throw or hang; every answer is either clean points or a refusal with a known code.
 */
import { readFileSync } from 'node:fs';
import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import { READ_ERROR_CODE_LIST, detectFileType, readReport, type ReadResult } from '@shared/marking/read';
import { mulberry32 } from '../../support/random';

const fixtureDir = new URL('../../fixtures/reports/', import.meta.url);
const fixture = (name: string) => new Uint8Array(readFileSync(new URL(name, fixtureDir)));


const HANG_GUARD_MS = 10_000; // per call; a guard against hangs, not a benchmark

async function checkOne(bytes: Uint8Array, label: string): Promise<ReadResult> {
  const started = performance.now();
  let result: ReadResult;
  try {
    detectFileType(bytes, 'fuzz.bin');
    result = await readReport(bytes, { fileName: 'fuzz.csv' });
  } catch (error) {
    throw new Error(`${label}: readReport threw ${String(error)}`);
  }
  const elapsed = performance.now() - started;
  expect(elapsed, `${label} took ${elapsed} ms`).toBeLessThan(HANG_GUARD_MS);
  expect(typeof result.ok, label).toBe('boolean');
  if (result.ok) {
    const n = result.points.distance.length;
    expect(n, label).toBeGreaterThanOrEqual(5);
    expect(result.points.rowNumbers, label).toHaveLength(n);
    for (let i = 0; i < n; i++) {
      expect(Number.isFinite(result.points.distance[i]) && result.points.distance[i] > 0, label).toBe(true);
      if (i > 0) expect(result.points.distance[i] > result.points.distance[i - 1], label).toBe(true);
    }
    for (const values of Object.values(result.points.energies)) {
      expect(values, label).toHaveLength(n);
      expect(values.every(Number.isFinite), label).toBe(true);
    }
  } else {
    expect(READ_ERROR_CODE_LIST, label).toContain(result.error.code);
    expect(result.error.message.length, label).toBeGreaterThan(5);
    // every refusal is a deliberate one, not an internal error caught by the last guard
    expect(result.error.message, label).not.toContain('(unexpected:');
  }
  return result;
}

const MAGIC = [
  [0x50, 0x4b, 0x03, 0x04],
  [0x50, 0x4b, 0x05, 0x06],
  [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1],
  [0x25, 0x50, 0x44, 0x46, 0x2d],
  [0xef, 0xbb, 0xbf],
  [0xff, 0xfe],
  [0xfe, 0xff],
  [],
];

describe('readReport never throws or hangs', () => {
  it('300 random byte arrays', async () => {
    const random = mulberry32(20250101);
    const codes = new Map<string, number>();
    for (let n = 0; n < 300; n++) {
      const length = Math.floor(random() ** 2 * 4096);
      const bytes = new Uint8Array(length);
      const printable = random() < 0.3;
      for (let i = 0; i < length; i++) bytes[i] = printable ? 32 + Math.floor(random() * 95) : Math.floor(random() * 256);
      const magic = MAGIC[Math.floor(random() * MAGIC.length)];
      bytes.set(magic.slice(0, length));
      const result = await checkOne(bytes, `random #${n}`);
      const key = result.ok ? 'ok' : result.error.code;
      codes.set(key, (codes.get(key) ?? 0) + 1);
    }
    // the inputs reached several refusal paths, not one
    expect(codes.size).toBeGreaterThanOrEqual(4);
  }, 120_000);

  it('300 near-valid CSV and XLSX mutations', async () => {
    const random = mulberry32(7);
    const pick = <T,>(items: T[]) => items[Math.floor(random() * items.length)];
    const csvBases = ['h2-bohr-hartree.csv', 'semicolon-decimal-comma.csv', 'numpy-comment-header.dat', 'blank-lines-trailing-delimiters.csv', 'utf16-unicode-text.txt', 'h2-angstrom-kcalmol.tsv'].map(fixture);
    const xlsxBases = ['template-filled.xlsx', 'plain-two-sheets.xlsx'].map(fixture);
    const tokens = [',', ';', '\t', '"', '\n', '\r\n', '#', 'NaN', '-', '.', ',5', '0', '-0', '1e400', 'é', 'Å', '\u2212', '', ' ', '0x1F', '=1+1', '\u0000'];
    const xmlTokens = ['<', '>', '&', '&amp;', '<c r="B7" t="s"><v>99999</v></c>', '<v>NaN</v>', '<f>SUM(A:A)</f>', '</row>', '<row r="0">', 't="e"', 's="9999"', '<![CDATA[', '<!--', 'r="XFD1048576"', '<c r="A2"><v>-1</v></c>'];
    const outcomes = { ok: 0, refused: 0 };

    for (let n = 0; n < 300; n++) {
      let bytes: Uint8Array;
      const mode = random();
      if (mode < 0.5) {
        // text: token-level edits of a good CSV
        const base = pick(csvBases);
        const isUtf16 = base[0] === 0xff && base[1] === 0xfe;
        let text = new TextDecoder(isUtf16 ? 'utf-16le' : 'utf-8').decode(base);
        const edits = 1 + Math.floor(random() * 6);
        for (let e = 0; e < edits; e++) {
          const at = Math.floor(random() * (text.length + 1));
          const kind = random();
          if (kind < 0.4) text = text.slice(0, at) + pick(tokens) + text.slice(at);
          else if (kind < 0.7) text = text.slice(0, at) + text.slice(at + 1 + Math.floor(random() * 20));
          else if (kind < 0.85) text = text.slice(0, at);
          else {
            const lines = text.split('\n');
            const line = Math.floor(random() * lines.length);
            lines.splice(line, 0, lines[Math.floor(random() * lines.length)]);
            text = lines.join('\n');
          }
        }
        bytes = new TextEncoder().encode(text);
      } else if (mode < 0.75) {
        // workbook: XML-level edits of one part, then re-zipped
        const zip = await JSZip.loadAsync(pick(xlsxBases));
        const parts = ['xl/worksheets/sheet1.xml', 'xl/worksheets/sheet2.xml', 'xl/sharedStrings.xml', 'xl/workbook.xml', 'xl/styles.xml', 'xl/_rels/workbook.xml.rels', '[Content_Types].xml'];
        const part = pick(parts);
        const file = zip.file(part);
        if (file) {
          let xml = await file.async('string');
          const edits = 1 + Math.floor(random() * 4);
          for (let e = 0; e < edits; e++) {
            const at = Math.floor(random() * (xml.length + 1));
            const kind = random();
            if (kind < 0.5) xml = xml.slice(0, at) + pick(xmlTokens) + xml.slice(at);
            else if (kind < 0.8) xml = xml.slice(0, at) + xml.slice(at + 1 + Math.floor(random() * 200));
            else xml = xml.slice(0, at);
          }
          zip.file(part, xml);
        } else if (random() < 0.5) {
          zip.remove(pick(parts));
        }
        bytes = await zip.generateAsync({ type: 'uint8array', compression: random() < 0.5 ? 'DEFLATE' : 'STORE' });
      } else {
        // workbook: byte-level damage to the container
        bytes = pick(xlsxBases).slice();
        const kind = random();
        if (kind < 0.4) {
          const flips = 1 + Math.floor(random() * 30);
          for (let f = 0; f < flips; f++) bytes[Math.floor(random() * bytes.length)] ^= 1 + Math.floor(random() * 255);
        } else if (kind < 0.7) {
          bytes = bytes.slice(0, Math.floor(random() * bytes.length));
        } else {
          const at = Math.floor(random() * bytes.length);
          const junk = Uint8Array.from({ length: 1 + Math.floor(random() * 64) }, () => Math.floor(random() * 256));
          const out = new Uint8Array(bytes.length + junk.length);
          out.set(bytes.subarray(0, at));
          out.set(junk, at);
          out.set(bytes.subarray(at), at + junk.length);
          bytes = out;
        }
      }
      const result = await checkOne(bytes, `mutation #${n}`);
      if (result.ok) outcomes.ok++;
      else outcomes.refused++;
      if (process.env.FUZZ_REPORT) console.log(n, result.ok ? 'ok' : `${result.error.code}: ${result.error.message.slice(0, 100)}`);
    }
    // near-valid inputs: many still read, many refused
    expect(outcomes.ok).toBeGreaterThan(30);
    expect(outcomes.refused).toBeGreaterThan(30);
  }, 180_000);
});
