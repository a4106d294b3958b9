import { LIMITS } from '../../shared/limits';

export { LIMITS };

const CUT = /… \[[\d,]+ more characters cut\]$/;

/**
 * `text` cut to `max` characters, ending with a marker that says how many were cut; null and short
 * texts are returned as they are. Never splits a surrogate pair.
 */
export function capText<T extends string | null | undefined>(text: T, max: number = LIMITS.MESSAGE_MAX_CHARS): T {
  if (typeof text !== 'string' || text.length <= max) return text;
  // Already cut to this length (the marker is at most 40 characters): keep its count of what was cut.
  if (text.length <= max + 40 && CUT.test(text) && text.length - text.lastIndexOf('… [') <= 40) return text;
  let end = max;
  const code = text.charCodeAt(end - 1);
  if (code >= 0xd800 && code <= 0xdbff) end--;
  return `${text.slice(0, end)}… [${(text.length - end).toLocaleString('en')} more characters cut]` as T;
}

/**
 * The deepest nesting of arrays and objects in JSON text, stopping as soon as it passes `max` (one pass
 * over the bytes, no recursion, so 450,000 nested brackets cost about a millisecond). Brackets inside
 * strings do not count. Hand-written because JSON.parse has no depth limit and parsing first is the cost
 * being avoided.
 */
export function jsonDepthExceeds(buf: Buffer, max: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i];
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > max) return true;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return false;
}
