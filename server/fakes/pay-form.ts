/**
 * Decodes the payment provider's request encoding: `application/x-www-form-urlencoded` with
 * bracketed keys (`items[0][quantity]=3`, `expand[0]=latest_invoice`, `expand[]=x`,
 * `metadata[studioId]=7`) into nested objects and arrays. Numeric keys become array slots.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

function keyPath(raw: string): string[] {
  const first = raw.indexOf('[');
  if (first < 0) return [raw];
  const parts = [raw.slice(0, first)];
  for (const m of raw.slice(first).matchAll(/\[([^\]]*)\]/g)) parts.push(m[1]);
  return parts;
}

function assign(target: FormObject | FormValue[], path: string[], value: string) {
  const [head, ...rest] = path;
  const container = target as Record<string, FormValue>;
  const slot = head === '' && Array.isArray(target) ? String(target.length) : head;
  if (rest.length === 0) {
    container[slot] = value;
    return;
  }
  const nextIsIndex = rest[0] === '' || /^\d+$/.test(rest[0]);
  if (container[slot] === undefined || typeof container[slot] === 'string') container[slot] = nextIsIndex ? [] : {};
  assign(container[slot] as FormObject | FormValue[], rest, value);
}

/** Parses a form body or query string (without the leading `?`). */
export function parseForm(body: string): FormObject {
  const out: FormObject = {};
  if (!body) return out;
  for (const pair of body.split('&')) {
    if (!pair) continue;
    const eq = pair.indexOf('=');
    const decode = (s: string) => decodeURIComponent(s.replace(/\+/g, ' '));
    const key = decode(eq < 0 ? pair : pair.slice(0, eq));
    const value = eq < 0 ? '' : decode(pair.slice(eq + 1));
    assign(out, keyPath(key), value);
  }
  return out;
}

/** Reads a field as a list (arrays keep their order; sparse slots are dropped). */
export function asList(v: FormValue | undefined): FormValue[] {
  if (v === undefined) return [];
  if (Array.isArray(v)) return v.filter((x) => x !== undefined);
  if (typeof v === 'object') return Object.values(v);
  return [v];
}

export const asString = (v: FormValue | undefined): string | undefined => (typeof v === 'string' ? v : undefined);

export function asInt(v: FormValue | undefined): number | undefined {
  const s = asString(v);
  return s !== undefined && /^-?\d+$/.test(s) ? Number(s) : undefined;
}
