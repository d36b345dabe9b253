/**
 * From bytes to text: UTF-8 with or without a byte-order mark. Binary files, UTF-16 and other
 * encodings are refused with the line and column of the first offending byte.
 */
import { InputError } from './types.js';
import { locate } from './messages.js';

/** Length of the valid UTF-8 prefix of `bytes` (RFC 3629: no overlongs, no surrogates, <= U+10FFFF). */
function validUtf8Length(bytes: Uint8Array): number {
  let i = 0;
  const n = bytes.length;
  while (i < n) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let min: number;
    let code: number;
    if (b >= 0xc2 && b <= 0xdf) { need = 1; min = 0x80; code = b & 0x1f; }
    else if (b >= 0xe0 && b <= 0xef) { need = 2; min = 0x800; code = b & 0x0f; }
    else if (b >= 0xf0 && b <= 0xf4) { need = 3; min = 0x10000; code = b & 0x07; }
    else return i;
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      code = (code << 6) | (c & 0x3f);
    }
    if (code < min || code > 0x10ffff || (code >= 0xd800 && code <= 0xdfff)) return i;
    i += need + 1;
  }
  return n;
}

/** 1-based line and column (in characters) of byte offset `offset` in valid UTF-8 `bytes`. */
function placeOfByte(bytes: Uint8Array, offset: number): { line: number; column: number } {
  const before = new TextDecoder('utf-8').decode(bytes.subarray(0, offset));
  const lines = before.split(/\r\n|\r|\n/);
  return { line: lines.length, column: [...lines[lines.length - 1]].length + 1 };
}

/**
 * Position of the first character that a text table cannot contain: NUL and the other C0
 * control characters except tab, line feed and carriage return, and DEL. Returns -1 if none.
 */
function firstControlCharacter(text: string): number {
  // eslint-disable-next-line no-control-regex
  return text.search(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/);
}

/** Throws InputError when `text` holds control characters (a binary file, read as text). */
export function refuseBinaryText(text: string, source: string): void {
  const at = firstControlCharacter(text);
  if (at < 0) return;
  const lines = text.slice(0, at).split(/\r\n|\r|\n/);
  const line = lines.length;
  const column = [...lines[lines.length - 1]].length + 1;
  const code = text.charCodeAt(at).toString(16).padStart(2, '0');
  throw new InputError(
    `${locate(source, { line, column })}not a text table (control character 0x${code}); this looks like a binary file, export the data as CSV or TSV`,
    source, line, column,
  );
}

/** Decodes file bytes as UTF-8 (a leading byte-order mark is dropped) or throws InputError. */
export function decodeRateBytes(bytes: Uint8Array, source: string): string {
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) {
    throw new InputError(
      `${locate(source, { line: 1, column: 1 })}the file is UTF-16; save it as UTF-8 (or CSV UTF-8) and read it again`,
      source, 1, 1,
    );
  }
  const valid = validUtf8Length(bytes);
  if (valid < bytes.length) {
    const place = placeOfByte(bytes, valid);
    throw new InputError(
      `${locate(source, place)}byte 0x${bytes[valid].toString(16).padStart(2, '0')} is not valid UTF-8; this is a binary file or another encoding, save it as UTF-8`,
      source, place.line, place.column,
    );
  }
  let text = new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  refuseBinaryText(text, source);
  return text;
}
