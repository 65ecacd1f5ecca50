/**
 * A small, linear-time XML scanner for the parts of SpreadsheetML the reader needs (ECMA-376
 * Part 1, §18: workbook, relationships, shared strings, styles, worksheet cells). Namespace
 * prefixes are dropped ("x:c" → "c"); only the five predefined entities and character references
 * are decoded (a DOCTYPE is skipped, so no entity can expand).
 */

export interface XmlHandler {
  open(name: string, attributes: string, selfClosing: boolean): void;
  close(name: string): void;
  /** character data between tags, still encoded (`cdata` true: already literal) */
  text(raw: string, cdata: boolean): void;
}

export class XmlError extends Error {}

function localName(tag: string): string {
  const colon = tag.indexOf(':');
  return colon >= 0 ? tag.slice(colon + 1) : tag;
}

export function scanXml(xml: string, handler: XmlHandler): void {
  const n = xml.length;
  let i = 0;
  while (i < n) {
    const lt = xml.indexOf('<', i);
    if (lt < 0) {
      handler.text(xml.slice(i), false);
      return;
    }
    if (lt > i) handler.text(xml.slice(i, lt), false);
    const next = xml.charCodeAt(lt + 1);
    if (next === 0x21 /* ! */) {
      if (xml.startsWith('<!--', lt)) {
        const end = xml.indexOf('-->', lt + 4);
        if (end < 0) throw new XmlError('unterminated comment');
        i = end + 3;
      } else if (xml.startsWith('<![CDATA[', lt)) {
        const end = xml.indexOf(']]>', lt + 9);
        if (end < 0) throw new XmlError('unterminated CDATA section');
        handler.text(xml.slice(lt + 9, end), true);
        i = end + 3;
      } else {
        const end = xml.indexOf('>', lt + 2);
        if (end < 0) throw new XmlError('unterminated declaration');
        i = end + 1;
      }
      continue;
    }
    if (next === 0x3f /* ? */) {
      const end = xml.indexOf('?>', lt + 2);
      if (end < 0) throw new XmlError('unterminated processing instruction');
      i = end + 2;
      continue;
    }
    // find the closing '>' outside quoted attribute values
    let j = lt + 1;
    let quote = 0;
    for (; j < n; j++) {
      const c = xml.charCodeAt(j);
      if (quote !== 0) {
        if (c === quote) quote = 0;
      } else if (c === 0x22 || c === 0x27) quote = c;
      else if (c === 0x3e) break;
    }
    if (j >= n) throw new XmlError('unterminated tag');
    const body = xml.slice(lt + 1, j);
    i = j + 1;
    if (body.charCodeAt(0) === 0x2f /* / */) {
      handler.close(localName(body.slice(1).trim()));
      continue;
    }
    const selfClosing = body.charCodeAt(body.length - 1) === 0x2f;
    const inner = selfClosing ? body.slice(0, -1) : body;
    let k = 0;
    while (k < inner.length && !isSpace(inner.charCodeAt(k))) k++;
    const name = inner.slice(0, k);
    if (name === '') throw new XmlError('empty tag name');
    handler.open(localName(name), inner.slice(k), selfClosing);
    if (selfClosing) handler.close(localName(name));
  }
}

function isSpace(c: number): boolean {
  return c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d;
}

const attributePatterns = new Map<string, RegExp>();

/** the decoded value of an attribute (namespace prefix ignored), or undefined */
export function attribute(attributes: string, name: string): string | undefined {
  let pattern = attributePatterns.get(name);
  if (!pattern) {
    pattern = new RegExp(`(?:^|\\s)(?:[\\w.-]+:)?${name}\\s*=\\s*(?:"([^"]*)"|'([^']*)')`);
    attributePatterns.set(name, pattern);
  }
  const match = pattern.exec(attributes);
  if (!match) return undefined;
  return decodeXmlText(match[1] ?? match[2] ?? '');
}

const NAMED: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

export function decodeXmlText(text: string): string {
  if (text.indexOf('&') < 0) return text;
  return text.replace(/&(#x[0-9a-fA-F]{1,6}|#\d{1,7}|[a-zA-Z]{2,4});/g, (whole, ref: string) => {
    if (ref[0] === '#') {
      const code = ref[1] === 'x' || ref[1] === 'X' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
      return code > 0 && code <= 0x10ffff ? String.fromCodePoint(code) : whole;
    }
    return NAMED[ref] ?? whole;
  });
}

/** OOXML escapes characters XML cannot hold as _xHHHH_ (ECMA-376 Part 1, §22.9.2.19 ST_Xstring) */
export function decodeOoxmlEscapes(text: string): string {
  if (text.indexOf('_x') < 0) return text;
  return text.replace(/_x([0-9a-fA-F]{4})_/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}
