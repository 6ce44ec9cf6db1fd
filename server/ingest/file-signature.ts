/**
 * Recognises common binary files by their first bytes, so a person who uploads a spreadsheet or
 * an image is told what they uploaded instead of "invalid byte". The signatures are the published
 * magic numbers of each format.
 */
const SIGNATURES: ReadonlyArray<{ bytes: readonly number[]; what: string; hint: string }> = [
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image', hint: 'upload text instead' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image', hint: 'upload text instead' },
  { bytes: [0x47, 0x49, 0x46, 0x38], what: 'a GIF image', hint: 'upload text instead' },
  { bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], what: 'a PDF document', hint: 'copy its text into a plain text file, one document per line' },
  {
    bytes: [0x50, 0x4b, 0x03, 0x04],
    what: 'a ZIP archive (an .xlsx or .docx file is one)',
    hint: 'open it in its program and save or export the sheet as CSV (UTF-8)',
  },
  {
    bytes: [0xd0, 0xcf, 0x11, 0xe0],
    what: 'an old Microsoft Office file (.xls or .doc)',
    hint: 'open it in its program and save or export the sheet as CSV (UTF-8)',
  },
  { bytes: [0x1f, 0x8b], what: 'a gzip archive', hint: 'decompress it first' },
  { bytes: [0xff, 0xfe], what: 'UTF-16 text', hint: 'save it as UTF-8 and upload it again' },
  { bytes: [0xfe, 0xff], what: 'UTF-16 text', hint: 'save it as UTF-8 and upload it again' },
];

/**
 * Names the kind of binary file that starts with `head`, or returns null when none is recognised.
 * @param head - the first bytes of the upload (8 are enough)
 */
export function recogniseFileSignature(head: Uint8Array): { what: string; hint: string } | null {
  for (const sig of SIGNATURES) {
    if (head.length >= sig.bytes.length && sig.bytes.every((b, i) => head[i] === b)) {
      return { what: sig.what, hint: sig.hint };
    }
  }
  return null;
}
