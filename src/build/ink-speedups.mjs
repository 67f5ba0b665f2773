/**
 * Speed-ups for the terminal screen, applied to dependencies while bundling (an esbuild plugin).
 * Each redraw of the screen went mostly to text measuring inside the terminal renderer:
 *
 * 1. string-width: text made only of characters that always take one cell (printable ASCII,
 *    Latin-1, Greek, box drawing, arrows, maths signs), once its colour and style codes (SGR escape
 *    sequences, which take no cells) are dropped, is `length` cells wide; the library's full
 *    path (grapheme segmentation, emoji and East Asian width tables) runs only for other text.
 *    test/build/ink-speedups.test.ts checks every one of these characters against both installed
 *    versions of the library.
 * 2. The styled-text tokenizer under Ink's Output: the same kind of text is split into characters
 *    directly instead of by grapheme segmentation (each such character is a grapheme of its own).
 *    Its style differ returns at once for neighbouring characters of the same style.
 * 3. Ink's Output keeps its per-frame caches (styled characters and widths of each line) for the
 *    next frame instead of dropping them: a keystroke changes a few lines of the screen, so most
 *    lines are read from the cache. The shared cache is renewed when it grows past CACHE_LIMIT.
 *    A screen row made of the same cells as in the last frame keeps its text, and blank cells are
 *    one shared frozen object instead of a new one per cell and frame.
 * 4. The grapheme segmenters these modules and slice-ansi create at load time are made on first
 *    use: the first one costs about 12 ms, and with 1 and 2 a frame of one-cell text needs none.
 *    Likewise string-width's full module and conf's schema validator and version comparer are
 *    loaded on first use (a bundled `require` is lazy), not at start-up.
 *
 * Each patch names the text it expects; a dependency update that changes it stops the build with a
 * message, so a patch can never silently fall away.
 */
import { readFile } from 'node:fs/promises';
import { dirname, relative, resolve } from 'node:path';

/** Characters that take exactly one terminal cell (see the test for the check). */
export const ONE_CELL_CLASS =
  '\\u0020-\\u007E\\u00A0-\\u00A8\\u00AA-\\u00AC\\u00AF-\\u00FF\\u0370-\\u03FF\\u2010-\\u2027\\u2030-\\u203B' +
  '\\u203D-\\u2048\\u204A-\\u205E\\u2070-\\u209F\\u20A0-\\u20BF\\u2100-\\u2121\\u2123-\\u2138\\u213A-\\u214F' +
  '\\u2190-\\u2193\\u219A-\\u21A8\\u21AB-\\u21FF\\u2200-\\u22FF\\u2500-\\u259F\\u25A0-\\u25A9\\u25AC-\\u25B5' +
  '\\u25B7-\\u25BF\\u25C1-\\u25FA';

/** Entries per cache map before the shared Output cache is renewed. */
export const CACHE_LIMIT = 4000;

/** Import prefix that loads a patched file's original text (see `original` of a patch). */
const ORIGINAL = 'tapline-original:';

/** Replaces each [anchor, replacement] once in `text`; null when an anchor is missing. */
function edit(text, pairs) {
  let out = text;
  for (const [anchor, replacement] of pairs) {
    if (!out.includes(anchor)) return null;
    out = out.replace(anchor, () => replacement);
  }
  return out;
}

/**
 * A module-level `const NAME = new Intl.Segmenter(ARGS);` made lazy: the first segmenter of a
 * process costs about 12 ms (the break rules load), paid at start-up by four dependencies even when
 * no text needs it.
 */
function lazySegmenter(name, args) {
  return [`const ${name} = new Intl.Segmenter(${args});`, `let ${name}Made = null;
const ${name} = { segment: (text) => (${name}Made ??= new Intl.Segmenter(${args})).segment(text) };`];
}

/** Source of a function `oneCellText(text)`: true when `text` less its SGR codes is all one-cell characters. */
const ONE_CELL_TEXT = `const oneCell = /^[${ONE_CELL_CLASS}]*$/;
const sgr = /\\u001B\\[[0-9;]*m/g;
function oneCellText(text) {
  return oneCell.test(text.includes('\\u001B') ? text.replace(sgr, '') : text);
}`;

/** The patches: which files, and how each is changed (null when the expected text is missing). */
export const PATCHES = [
  {
    // The full module (its emoji and width tables take several milliseconds to set up) is
    // evaluated on the first text that needs it, if ever: `require` of a bundled module is lazy.
    name: 'one-cell fast path in string-width',
    file: /[\\/]node_modules[\\/](?:.*[\\/])?string-width[\\/]index\.js$/,
    apply(text, path) {
      if (!text.includes('export default function stringWidth(')) return null;
      return `${ONE_CELL_TEXT}
let full = null;
export default function stringWidth(text, options) {
  if (typeof text === 'string' && (!options || (options.ambiguousIsNarrow !== false && !options.countAnsiEscapeCodes)) && oneCellText(text)) {
    return text.includes('\\u001B') ? text.replace(sgr, '').length : text.length;
  }
  full ??= require(${JSON.stringify(ORIGINAL + path)}).default;
  return full(text, options);
}
`;
    },
    original: (text) => edit(text, [lazySegmenter('segmenter', '')]),
  },
  {
    // Every character of one-cell text (SGR codes included) is a grapheme of its own.
    name: 'one-cell fast path in the styled-text tokenizer',
    file: /[\\/]node_modules[\\/]@alcalzone[\\/]ansi-tokenize[\\/]build[\\/]tokenize\.js$/,
    apply(text) {
      const out = edit(text, [
        lazySegmenter('segmenter', 'undefined, { granularity: "grapheme" }'),
        ['for (const { segment, index } of segmenter.segment(str)) {', 'for (const { segment, index } of graphemes(str)) {'],
      ]);
      return out && `${out}
${ONE_CELL_TEXT}
function graphemes(str) {
  if (!oneCellText(str)) return segmenter.segment(str);
  const out = new Array(str.length);
  for (let index = 0; index < str.length; index++) out[index] = { segment: str[index], index };
  return out;
}
`;
    },
  },
  {
    // Neighbouring characters almost always share their style: equal style lists need no diff.
    name: 'equal styles short-cut in the style differ',
    file: /[\\/]node_modules[\\/]@alcalzone[\\/]ansi-tokenize[\\/]build[\\/]diff\.js$/,
    apply: (text) =>
      edit(text, [[
        'export function diffAnsiCodes(from, to) {',
        `export function diffAnsiCodes(from, to) {
    if (from === to || (from.length === to.length && from.every((c, i) => c.code === to[i].code && c.endCode === to[i].endCode))) return [];`,
      ]]),
  },
  {
    name: 'lazy segmenter in slice-ansi',
    file: /[\\/]node_modules[\\/]slice-ansi[\\/]tokenize-ansi\.js$/,
    apply: (text) => edit(text, [lazySegmenter('GRAPHEME_SEGMENTER', "undefined, {granularity: 'grapheme'}")]),
  },
  {
    // Settings are kept without a schema, so the schema validator and the version comparer that
    // conf loads at start-up (about 8 ms) are loaded on first use instead, which is never here.
    name: 'validator and version comparer loaded on first use in conf',
    file: /[\\/]node_modules[\\/]conf[\\/]dist[\\/]source[\\/]index\.js$/,
    apply(text) {
      const out = edit(text, [
        ["import { Ajv2020 as Ajv } from 'ajv/dist/2020.js';\n", ''],
        ["import ajvFormatsModule from 'ajv-formats';\n", ''],
        ["import semver from 'semver';\n", ''],
        ['const ajvFormats = ajvFormatsModule.default;', "const ajvFormats = require('ajv-formats').default;"],
        ['const ajv = new Ajv({', "const ajv = new (require('ajv/dist/2020.js').Ajv2020)({"],
      ]);
      if (out === null || /\bAjv\b|ajvFormatsModule/.test(out.replace(/Ajv2020/g, ''))) return null;
      return out.replace(/\bsemver\./g, "require('semver').");
    },
  },
  {
    name: 'Output caches kept across frames in ink',
    file: /[\\/]node_modules[\\/]ink[\\/]build[\\/]output\.js$/,
    apply(text) {
      if (!text.includes('class OutputCaches {')) return null;
      const out = edit(text, [
        ['    caches = new OutputCaches();', '    caches = sharedCaches();'],
        [`                row.push({
                    type: 'char',
                    value: ' ',
                    fullWidth: false,
                    styles: [],
                });`, '                row.push(BLANK);'],
        ['            .map(line => {', '            .map((line, y) => {'],
        [`            const lineWithoutEmptyItems = line.filter(item => item !== undefined);
            return styledCharsToString(lineWithoutEmptyItems).trimEnd();`, '            return rowText(line, y);'],
        [`        return {
            output: generatedOutput,`, `        rowsSeen.length = output.length;
        return {
            output: generatedOutput,`],
      ]);
      return out && `${out}
// One shared, frozen blank cell: cells are replaced, never changed, and freezing makes sure of it.
const BLANK = Object.freeze({ type: 'char', value: ' ', fullWidth: false, styles: Object.freeze([]) });
// The text of each row of the last frame with the cells it was made from: a row whose cells are
// the same objects as last time (the caches above hand out the same ones) keeps its text.
const rowsSeen = [];
function rowText(line, y) {
    const seen = rowsSeen[y];
    if (seen && seen.cells.length === line.length && seen.cells.every((cell, x) => cell === line[x])) return seen.text;
    const text = styledCharsToString(line.filter(item => item !== undefined)).trimEnd();
    rowsSeen[y] = { cells: line, text };
    return text;
}
let shared = null;
function sharedCaches() {
    if (!shared || shared.styledChars.size > ${CACHE_LIMIT} || shared.widths.size > ${CACHE_LIMIT} || shared.blockWidths.size > ${CACHE_LIMIT}) {
        shared = new OutputCaches();
    }
    return shared;
}
`;
    },
  },
];

/** The esbuild plugin applying PATCHES; the build fails when one cannot be applied or never matched. */
export function inkSpeedups() {
  return {
    name: 'tapline-ink-speedups',
    setup(build) {
      const applied = new Set();
      const refuse = (patch, path) => ({ errors: [{ text: `${patch.name}: ${path} no longer has the expected text; update src/build/ink-speedups.mjs for this version` }] });
      for (const patch of PATCHES) {
        build.onLoad({ filter: patch.file, namespace: 'file' }, async (args) => {
          const out = patch.apply(await readFile(args.path, 'utf8'), args.path);
          if (out === null) return refuse(patch, args.path);
          applied.add(patch.name);
          return { contents: out, loader: 'js', resolveDir: dirname(args.path) };
        });
      }
      // The original of a replaced module, for the replacement to load when it needs it.
      // Paths in that namespace are relative to the working folder, so no build path ends up in dist/.
      const root = build.initialOptions.absWorkingDir ?? process.cwd();
      build.onResolve({ filter: new RegExp(`^${ORIGINAL}`) }, (args) => ({ path: relative(root, args.path.slice(ORIGINAL.length)), namespace: 'tapline-original' }));
      build.onLoad({ filter: /.*/, namespace: 'tapline-original' }, async (args) => {
        const path = resolve(root, args.path);
        const patch = PATCHES.find((p) => p.original && p.file.test(path));
        const out = patch ? patch.original(await readFile(path, 'utf8')) : null;
        if (out === null) return refuse(patch ?? { name: 'original module' }, path);
        return { contents: out, loader: 'js', resolveDir: dirname(path) };
      });
      build.onEnd((result) => {
        if (result.errors.length) return;
        const missing = PATCHES.filter((p) => !applied.has(p.name)).map((p) => p.name);
        if (missing.length) result.errors.push({ text: `patch never applied (file moved?): ${missing.join(', ')}; update src/build/ink-speedups.mjs` });
      });
    },
  };
}
