import { DEG_TO_RAD } from '../../shared/engine/constants';
import type { ResolvedDefinition } from '../../shared/engine/definition';
import { createFactorEvaluator } from '../../shared/engine/evaluator';
import { appendDouble, MAX_DOUBLE_BYTES } from './format-double';

/** A rejected input line; line is 1-based within the text given to the processor. */
export interface LineError {
  line: number;
  message: string;
}

export interface FactorLinesResult {
  /** ASCII: one "h k s omega a b" line per point (tab-separated, 17 significant digits, "nan" where undefined). */
  out: Uint8Array;
  errors: LineError[];
  /** Number of input lines consumed (the text's newline count, plus one for an unterminated last line). */
  lines: number;
}

const LINE_BYTES = 6 * (MAX_DOUBLE_BYTES + 1);

const isSpace = (c: number) => c === 32 || c === 9 || c === 13 || c === 11 || c === 12;

/**
 * Returns a function that turns "lon lat" lines (degrees; a third field, such as a height, and
 * anything after it is ignored; blank lines and lines starting with # are skipped) into factor lines.
 * Example: createFactorLineProcessor(resolveDefinition('+proj=merc +R=1'))('10 0\n').out holds "1\t1\t1\t0\t1\t1\n".
 */
export function createFactorLineProcessor(resolved: ResolvedDefinition): (text: string) => FactorLinesResult {
  const evaluator = createFactorEvaluator(resolved);
  const f = new Float64Array(8);
  return (text) => {
    let buf = new Uint8Array(4096 + text.length * 6);
    let o = 0;
    const errors: LineError[] = [];
    let lineNo = 0;
    let pos = 0;
    const n = text.length;
    while (pos < n) {
      let end = text.indexOf('\n', pos);
      if (end < 0) end = n;
      lineNo++;
      let i = pos;
      while (i < end && isSpace(text.charCodeAt(i))) i++;
      if (i === end || text.charCodeAt(i) === 35) {
        pos = end + 1;
        continue;
      }
      let j = i;
      while (j < end && !isSpace(text.charCodeAt(j))) j++;
      let k = j;
      while (k < end && isSpace(text.charCodeAt(k))) k++;
      let l = k;
      while (l < end && !isSpace(text.charCodeAt(l))) l++;
      const lonText = text.slice(i, j);
      const latText = text.slice(k, l);
      const lon = Number(lonText);
      const lat = Number(latText);
      if (k === l) {
        errors.push({ line: lineNo, message: `expected "lon lat" in degrees, got "${clip(text.slice(pos, end))}"` });
      } else if (!Number.isFinite(lon) || !Number.isFinite(lat)) {
        errors.push({ line: lineNo, message: `not a number: "${clip(Number.isFinite(lon) ? latText : lonText)}"` });
      } else if (lat < -90 || lat > 90) {
        errors.push({ line: lineNo, message: `latitude ${latText} is outside [−90, 90]` });
      } else {
        if (o + LINE_BYTES > buf.length) {
          const bigger = new Uint8Array(buf.length * 2);
          bigger.set(buf.subarray(0, o));
          buf = bigger;
        }
        if (!evaluator.factorsRad(lon * DEG_TO_RAD, lat * DEG_TO_RAD, f)) f.fill(NaN);
        for (let c = 0; c < 6; c++) {
          o = appendDouble(buf, o, f[c]);
          buf[o++] = c === 5 ? 10 : 9;
        }
      }
      pos = end + 1;
    }
    return { out: buf.subarray(0, o), errors, lines: lineNo };
  };
}

function clip(s: string): string {
  const t = s.trim();
  return t.length > 40 ? `${t.slice(0, 40)}…` : t;
}
