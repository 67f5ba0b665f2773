/** Column alignment for `textTable`. */
export type Align = 'left' | 'right';

/**
 * Lays out rows as a plain text table: columns padded to their widest cell, two spaces apart,
 * header underlined with dashes. Width is counted in code points so µ and Ω line up.
 */
export function textTable(header: string[], rows: string[][], align: Align[] = []): string {
  const len = (s: string) => [...s].length;
  const widths = header.map((h, c) => Math.max(len(h), ...rows.map((r) => len(r[c] ?? ''))));
  const line = (cells: string[]) =>
    cells
      .map((cell, c) => {
        const pad = ' '.repeat(widths[c] - len(cell));
        return align[c] === 'right' ? pad + cell : cell + pad;
      })
      .join('  ')
      .trimEnd();
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}
