// A file's bytes as text. Fleet files and CSV are read as UTF-8 and nothing else: a file in
// another encoding decoded loosely would import with its accents replaced by U+FFFD, and the
// damage would be saved. Windows-1252 (what many spreadsheets write by default) is read only
// when the person says so.

export const FILE_ENCODINGS = ['utf-8', 'windows-1252'] as const;
export type FileEncoding = (typeof FILE_ENCODINGS)[number];

export type DecodedFile = { ok: true; text: string } | { ok: false; reason: string };

const HOW_TO_FIX =
  'Save the file again choosing UTF-8 as its text encoding (spreadsheets and editors offer it when saving as CSV or text), or, if it was saved with the Western European (Windows-1252) encoding, read it with --encoding windows-1252.';

/** Where the first byte that is not UTF-8 sits, as a line number and the byte itself. */
function firstBadByte(bytes: Uint8Array): { line: number; byte: number } {
  const strict = new TextDecoder('utf-8', { fatal: true });
  let line = 1;
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i]!;
    if (b === 10) line++;
    const size = b < 0x80 ? 1 : b >= 0xc2 && b <= 0xdf ? 2 : b >= 0xe0 && b <= 0xef ? 3 : b >= 0xf0 && b <= 0xf4 ? 4 : 0;
    if (size === 0) return { line, byte: b };
    try {
      strict.decode(bytes.subarray(i, i + size));
    } catch {
      return { line, byte: b };
    }
    i += size;
  }
  return { line, byte: bytes[bytes.length - 1] ?? 0 };
}

export function decodeFileBytes(bytes: Uint8Array, encoding: FileEncoding = 'utf-8'): DecodedFile {
  if (encoding === 'windows-1252') {
    // A UTF-8 byte-order mark says the file is not Windows-1252 after all.
    if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return decodeFileBytes(bytes, 'utf-8');
    return { ok: true, text: new TextDecoder('windows-1252').decode(bytes) };
  }
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, reason: `the file is UTF-16 text, and Rigbook reads UTF-8 only. ${HOW_TO_FIX.split(', or,')[0]}.` };
  }
  try {
    // fatal: a byte that is not UTF-8 is an error, never a silent U+FFFD; a leading BOM is dropped.
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    const bad = firstBadByte(bytes);
    const hex = bad.byte.toString(16).toUpperCase().padStart(2, '0');
    return { ok: false, reason: `the file is not UTF-8 text (byte 0x${hex} on line ${bad.line} is not valid UTF-8; accented letters saved as Windows-1252 look like this). ${HOW_TO_FIX}` };
  }
}

/**
 * Text handed over already decoded (the window reads the file itself) can only show the
 * damage: a U+FFFD replacement character is what a lenient decoder leaves for every byte that
 * was not UTF-8, and the letter it replaced is gone. Refused, rather than saved that way.
 */
export function lossyDecodingReason(text: string): string | null {
  const at = text.indexOf('\uFFFD');
  if (at < 0) return null;
  let line = 1;
  for (let i = 0; i < at; i++) if (text.charCodeAt(i) === 10) line++;
  return `the text holds a replacement character (U+FFFD) on line ${line}: the file was not UTF-8 and was decoded with its accented letters already lost. ${HOW_TO_FIX}`;
}
