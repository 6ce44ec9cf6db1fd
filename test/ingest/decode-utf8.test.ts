// Byte-level checks: what is refused as not UTF-8 or binary, and how multi-byte characters
// survive chunk boundaries. UTF-8 validity follows RFC 3629 §3 and the WHATWG Encoding
// Standard's UTF-8 decoder (overlongs, surrogates and code points above U+10FFFF are invalid).
import { describe, expect, it } from 'vitest';
import { collectDocuments, decodeUtf8, firstInvalidUtf8, IngestError } from '../../server/ingest/index.js';
import { parse, rejection, streamOf } from './chunks.js';

async function decodeAll(bytes: Uint8Array, cuts: number[] = []): Promise<string> {
  let s = '';
  for await (const t of decodeUtf8(streamOf(bytes, cuts))) s += t;
  return s;
}

describe('decodeUtf8', () => {
  const sample = 'a é 日本 😀 z'; // 1-, 2-, 3- and 4-byte characters (RFC 3629 §3)
  const bytes = new TextEncoder().encode(sample);

  it('decodes the same text wherever the bytes are cut, even inside a character', async () => {
    for (let i = 0; i <= bytes.length; i++) {
      for (let j = i; j <= bytes.length; j += 3) expect(await decodeAll(bytes, [i, j])).toBe(sample);
    }
    expect(await decodeAll(bytes, [...bytes.keys()])).toBe(sample);
  });

  it('drops a leading byte order mark but keeps one elsewhere', async () => {
    const withBom = new Uint8Array([0xef, 0xbb, 0xbf, 0x61, 0xef, 0xbb, 0xbf]);
    expect(await decodeAll(withBom, [1, 2])).toBe('a\uFEFF');
  });

  it('finds the first invalid sequence as RFC 3629 defines it', () => {
    const at = (...b: number[]) => firstInvalidUtf8(new Uint8Array(b));
    expect(at(0x61, 0xe9, 0x61)).toBe(1); // Latin-1 é
    expect(at(0xc0, 0xaf)).toBe(0); // overlong "/"
    expect(at(0xed, 0xa0, 0x80)).toBe(0); // UTF-16 surrogate D800
    expect(at(0xf4, 0x90, 0x80, 0x80)).toBe(0); // above U+10FFFF
    expect(at(0x61, 0xe6, 0x97)).toBe(-1); // valid so far, incomplete at the end
    expect(at(0xf0, 0x9f, 0x98, 0x80)).toBe(-1); // 😀
  });
});

describe('refusing what is not UTF-8 text', () => {
  it('refuses Latin-1 bytes with the line, the byte offset and what to do', async () => {
    const latin1 = new Uint8Array([...new TextEncoder().encode('text\nok\ncaf'), 0xe9, 0x0a]);
    for (const cuts of [[], [11], [12], [3, 11]]) {
      const err = await rejection(collectDocuments(streamOf(latin1, cuts)));
      expect(err).toBeInstanceOf(IngestError);
      expect(err.code).toBe('unsupported_media_type');
      expect(err.message).toMatch(/not UTF-8 text: byte 0xE9 at line 3 \(byte 11\).*save it as UTF-8/);
      expect(err.details).toMatchObject({ byteOffset: 11, line: 3 });
    }
  });

  it('reports the same offset when the bad byte comes in a later chunk', async () => {
    const bytes = new Uint8Array([...new TextEncoder().encode('text\n日本\n'), 0xe6, 0x97, 0x41]);
    for (let cut = 0; cut <= bytes.length; cut++) {
      const err = await rejection(collectDocuments(streamOf(bytes, [cut])));
      expect(err.details).toMatchObject({ byteOffset: 12, line: 3 });
    }
  });

  it('names a PNG image (its signature, per the PNG specification §5.2)', async () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
    const err = await rejection(parse(png));
    expect(err.code).toBe('unsupported_media_type');
    expect(err.message).toContain('PNG image');
  });

  it('names a spreadsheet saved as .xlsx (a ZIP archive) and says to export CSV', async () => {
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, 0x08, 0x00, 0x00, 0x00]);
    const err = await rejection(parse(zip, { fileName: 'tickets.xlsx' }));
    expect(err.code).toBe('unsupported_media_type');
    expect(err.message).toMatch(/ZIP archive.*CSV/);
  });

  it('refuses UTF-16 text and says to save it as UTF-8', async () => {
    const utf16 = new Uint8Array([0xff, 0xfe, 0x74, 0x00, 0x65, 0x00, 0x78, 0x00, 0x74, 0x00]);
    const err = await rejection(parse(utf16));
    expect(err.code).toBe('unsupported_media_type');
    expect(err.message).toMatch(/UTF-16.*UTF-8/);
  });

  it('refuses NUL bytes as binary, with the offset', async () => {
    const err = await rejection(parse(new Uint8Array([0x74, 0x65, 0x78, 0x74, 0x0a, 0x61, 0x00, 0x62, 0x63, 0x64])));
    expect(err.code).toBe('unsupported_media_type');
    expect(err.details).toMatchObject({ byteOffset: 6, line: 2 });
  });

  it('refuses a file cut in the middle of a character', async () => {
    const err = await rejection(parse(new Uint8Array([0x61, 0x62, 0x63, 0x0a, 0x64, 0x65, 0x66, 0x67, 0x68, 0xe6, 0x97])));
    expect(err.code).toBe('unsupported_media_type');
    expect(err.message).toContain('middle of a character');
  });
});
