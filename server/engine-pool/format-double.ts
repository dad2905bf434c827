/**
 * Fast decimal output of doubles with 17 significant digits, which round-trips every double
 * (IEEE 754-2008, §5.12.2: 17 significant digits suffice for binary64), written as ASCII bytes
 * straight into a buffer: Number#toString is exact too but 3–6× slower, and formatting
 * dominates a text pipeline of factors.
 *
 * For 1e-5 ≤ |x| < 1e17 the product x·10^k (0 ≤ k ≤ 22, so 10^k is exact) is formed exactly as a
 * double-double with Dekker's TwoProduct (Dekker 1971), split into a 9-digit and an 8-digit
 * integer and rounded once at the 17th digit (half up). Other values use toPrecision(17).
 * Trailing zeros are trimmed; NaN is written "nan".
 * Example: formatDouble(0.1) === '0.10000000000000001', formatDouble(2) === '2'.
 */
const SPLITTER = 134217729; // 2^27 + 1
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));
/** "00".."99" as character codes, two per entry (read-only). */
const PAIRS = Uint8Array.from({ length: 200 }, (_, i) => 48 + (i & 1 ? (i >> 1) % 10 : Math.floor((i >> 1) / 10)));

/** Worst-case bytes appendDouble writes for one number. */
export const MAX_DOUBLE_BYTES = 48;

export function appendDouble(buf: Uint8Array, start: number, x: number): number {
  let pos = start;
  if (x !== x) {
    buf[pos] = 110; buf[pos + 1] = 97; buf[pos + 2] = 110;
    return pos + 3;
  }
  let ax = x;
  if (x < 0 || (x === 0 && 1 / x < 0)) {
    buf[pos++] = 45;
    ax = -x;
  }
  if (ax === 0) {
    buf[pos] = 48;
    return pos + 1;
  }
  if (!(ax >= 1e-5 && ax < 1e17)) return appendText(buf, pos, trimExp(ax.toPrecision(17)));
  let e = Math.floor(Math.log10(ax));
  if (e + 1 >= 0 && e < 16 && ax >= POW10[e + 1]) e++;
  let q = 0;
  let rr = 0;
  // Two tries at most: log10 may round up just below a power of ten (then q has 8 digits).
  for (let attempt = 0; attempt < 2; attempt++) {
    const k = 16 - e;
    if (k > 22 || k < 0) return appendText(buf, pos, trimExp(ax.toPrecision(17)));
    const p = POW10[k];
    const hi = ax * p;
    let t = SPLITTER * ax;
    const ah = t - (t - ax);
    const al = ax - ah;
    t = SPLITTER * p;
    const bh = t - (t - p);
    const bl = p - bh;
    const lo = al * bl - (hi - ah * bh - al * bh - ah * bl);
    q = Math.floor(hi / 1e8);
    let r = hi - q * 1e8 + lo;
    if (r < 0) { q -= 1; r += 1e8; } else if (r >= 1e8) { q += 1; r -= 1e8; }
    rr = Math.floor(r + 0.5);
    if (rr >= 1e8) { rr -= 1e8; q += 1; }
    if (q >= 1e8) break;
    e -= 1;
  }
  if (q < 1e8) return appendText(buf, pos, trimExp(ax.toPrecision(17)));
  if (q >= 1e9) { q = 100000000; rr = 0; e += 1; }
  // 17 digits, q (9) then rr (8), written right to left into scratch space past the output.
  const d = pos + 24;
  let qi = q | 0;
  let ri = rr | 0;
  for (let i = 15; i >= 9; i -= 2) {
    const n = (ri / 100) | 0;
    const pair = (ri - n * 100) << 1;
    buf[d + i] = PAIRS[pair];
    buf[d + i + 1] = PAIRS[pair + 1];
    ri = n;
  }
  for (let i = 7; i >= 1; i -= 2) {
    const n = (qi / 100) | 0;
    const pair = (qi - n * 100) << 1;
    buf[d + i] = PAIRS[pair];
    buf[d + i + 1] = PAIRS[pair + 1];
    qi = n;
  }
  buf[d] = 48 + qi;
  let last = 16;
  while (last > 0 && buf[d + last] === 48) last--;
  if (e >= 0) {
    const intDigits = e + 1;
    for (let i = 0; i < intDigits; i++) buf[pos++] = buf[d + i];
    if (last >= intDigits) {
      buf[pos++] = 46;
      for (let i = intDigits; i <= last; i++) buf[pos++] = buf[d + i];
    }
    return pos;
  }
  buf[pos++] = 48;
  buf[pos++] = 46;
  for (let i = 1; i < -e; i++) buf[pos++] = 48;
  for (let i = 0; i <= last; i++) buf[pos++] = buf[d + i];
  return pos;
}

/** formatDouble(x) as a string (for tests and small outputs). */
export function formatDouble(x: number): string {
  const buf = new Uint8Array(MAX_DOUBLE_BYTES + 16);
  const end = appendDouble(buf, 0, x);
  return String.fromCharCode(...buf.subarray(0, end));
}

function appendText(buf: Uint8Array, start: number, text: string): number {
  for (let i = 0; i < text.length; i++) buf[start + i] = text.charCodeAt(i);
  return start + text.length;
}

function trimFraction(s: string): string {
  if (!s.includes('.')) return s;
  let end = s.length;
  while (s.charCodeAt(end - 1) === 48) end--;
  if (s.charCodeAt(end - 1) === 46) end--;
  return s.slice(0, end);
}

function trimExp(s: string): string {
  const i = s.indexOf('e');
  if (i < 0) return trimFraction(s);
  return trimFraction(s.slice(0, i)) + s.slice(i);
}
