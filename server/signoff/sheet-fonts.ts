import fs from 'node:fs';
import path from 'node:path';

/**
 * Fonts for the sign-off sheet. pdfkit embeds TrueType/OpenType but cannot subset the project's
 * variable WOFF2 files, so the sheet uses a TTF from fonts/ when one is there, then Debian's DejaVu
 * (installed with fontconfig, which chromium pulls in), and otherwise the PDF's built-in
 * Helvetica/Courier, whose WinAnsi encoding cannot show every character (see toWinAnsi).
 */
export interface SheetFonts {
  regular: string;
  bold: string;
  mono: string;
  /** True for the built-in fonts: text must be narrowed to WinAnsi first. */
  builtIn: boolean;
}

const ROOT = path.resolve(import.meta.dirname, '../..');
const CANDIDATES: Array<Omit<SheetFonts, 'builtIn'>> = [
  {
    regular: path.join(ROOT, 'fonts/Inter-Regular.ttf'),
    bold: path.join(ROOT, 'fonts/Inter-Bold.ttf'),
    mono: '/usr/share/fonts/truetype/dejavu/DejaVuSansMono.ttf',
  },
  {
    regular: '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf',
    bold: '/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf',
    mono: '/usr/share/fonts/truetype/dejavu/DejaVuSansMono.ttf',
  },
];

let chosen: SheetFonts | undefined;

export function sheetFonts(): SheetFonts {
  if (chosen) return chosen;
  const found = CANDIDATES.find((c) => [c.regular, c.bold, c.mono].every((f) => fs.existsSync(f)));
  chosen = found ? { ...found, builtIn: false } : { regular: 'Helvetica', bold: 'Helvetica-Bold', mono: 'Courier', builtIn: true };
  return chosen;
}

/** Characters outside Latin-1 that WinAnsi (CP1252) still has, which pdfkit's built-in fonts encode. */
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
const REPLACEMENTS: Record<string, string> = { 'ω': 'omega', '≤': '<=', '≥': '>=', '−': '-', '×': 'x', '≈': '~', 'Ł': 'L', 'ł': 'l', 'Đ': 'D', 'đ': 'd', 'ı': 'i' };

/** Narrows text to what Helvetica can show: known symbols spelled out, accents kept when Latin-1, the rest as "?". */
export function toWinAnsi(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (code < 0x100 || WIN_ANSI_EXTRA.has(ch)) out += ch;
    else if (REPLACEMENTS[ch]) out += REPLACEMENTS[ch];
    else {
      const stripped = ch.normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
      out += [...stripped].every((c) => c.codePointAt(0)! < 0x100) && stripped ? stripped : '?';
    }
  }
  return out;
}
