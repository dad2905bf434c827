#!/usr/bin/env node
// Copies the Inter variable-font files the client uses from the npm package into fonts/
// (committed), so the app serves its own fonts from /fonts and never calls a font CDN.
// Run once after changing the subsets: `node server/scripts/copy-fonts.mjs`.
import fs from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(import.meta.dirname, '../..');
const PKG = path.join(ROOT, 'node_modules/@fontsource-variable/inter');
const OUT = path.join(ROOT, 'fonts');

// Latin and Latin Extended cover place names in most Latin-script languages; Greek covers the
// symbols of the trade on screen (φ, λ, ω, θ).
const SUBSETS = ['latin', 'latin-ext', 'greek'];
const STYLES = ['normal', 'italic'];

fs.mkdirSync(OUT, { recursive: true });
for (const subset of SUBSETS) {
  for (const style of STYLES) {
    const name = `inter-${subset}-wght-${style}.woff2`;
    fs.copyFileSync(path.join(PKG, 'files', name), path.join(OUT, name));
    console.log(`fonts/${name}`);
  }
}
// The SIL Open Font License must travel with the font files.
fs.copyFileSync(path.join(PKG, 'LICENSE'), path.join(OUT, 'OFL.txt'));
const version = JSON.parse(fs.readFileSync(path.join(PKG, 'package.json'), 'utf8')).version;
fs.writeFileSync(
  path.join(OUT, 'README.md'),
  `# Fonts\n\nInter (variable weight 100–900), from @fontsource-variable/inter ${version}, subsets: ${SUBSETS.join(', ')}.\n` +
    'Licensed under the SIL Open Font License 1.1 (OFL.txt). Copied by `node server/scripts/copy-fonts.mjs`;\n' +
    'served by the app at /fonts and declared in fonts/inter.css (linked from index.html).\n',
);
