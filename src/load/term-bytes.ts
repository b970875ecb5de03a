// Term and literal text as bytes: UTF-8, and generalized UTF-8 for the rare text with a lone surrogate.

/** U+FFFD as UTF-8: what `Buffer.write` makes of a lone surrogate. */
const REPLACEMENT_CHARACTER = Buffer.from('\uFFFD', 'utf8');
/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Whether a text holds a UTF-16 surrogate that is not half of a pair, which UTF-8 cannot encode. */
export function hasLoneSurrogate(text: string): boolean {
  return LONE_SURROGATE.test(text);
}

/**
 * Writes a text's bytes at the start of `target` (which must hold `3 * text.length` bytes) and
 * returns how many were written and whether the text has a lone surrogate. Such a text is written
 * as generalized UTF-8 (WTF-8: the surrogate as its own three-byte sequence), which no valid UTF-8
 * input holds, so two different texts never get the same bytes; decoding them as UTF-8 would not
 * give the text back, so its owner keeps the text itself.
 */
export function writeTermBytes(text: string, target: Buffer): { length: number; loneSurrogate: boolean } {
  const length = target.write(text, 0, 'utf8');
  // Only text that came out with a U+FFFD can be one with a lone surrogate.
  if (target.subarray(0, length).indexOf(REPLACEMENT_CHARACTER) < 0 || !hasLoneSurrogate(text)) return { length, loneSurrogate: false };
  return { length: writeGeneralizedUtf8(text, target), loneSurrogate: true };
}

/** WTF-8: UTF-8 of each code point, a lone surrogate encoded like any other code point below U+10000. */
function writeGeneralizedUtf8(text: string, target: Buffer): number {
  let length = 0;
  for (let index = 0; index < text.length; index++) {
    let code = text.charCodeAt(index);
    const next = index + 1 < text.length ? text.charCodeAt(index + 1) : 0;
    if (code >= 0xd800 && code <= 0xdbff && next >= 0xdc00 && next <= 0xdfff) {
      code = 0x10000 + ((code - 0xd800) << 10) + (next - 0xdc00);
      index++;
    }
    if (code < 0x80) {
      target[length++] = code;
    } else if (code < 0x800) {
      target[length++] = 0xc0 | (code >> 6);
      target[length++] = 0x80 | (code & 0x3f);
    } else if (code < 0x10000) {
      target[length++] = 0xe0 | (code >> 12);
      target[length++] = 0x80 | ((code >> 6) & 0x3f);
      target[length++] = 0x80 | (code & 0x3f);
    } else {
      target[length++] = 0xf0 | (code >> 18);
      target[length++] = 0x80 | ((code >> 12) & 0x3f);
      target[length++] = 0x80 | ((code >> 6) & 0x3f);
      target[length++] = 0x80 | (code & 0x3f);
    }
  }
  return length;
}
