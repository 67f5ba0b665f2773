import { Box } from 'ink';
import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { Line, Lines, type Seg } from '../../../src/ui/common/line';

// Reference: Ink's own drawing of one <Text wrap="truncate-end"> per line (the Line component);
// Lines must draw the very same characters, cell for cell.
function column(rows: Seg[][], width: number): string {
  const r = render(<Box flexDirection="column" width={width}>{rows.map((segs, k) => <Line key={k} width={width} segs={segs} />)}</Box>);
  const frame = r.lastFrame() ?? '';
  r.unmount();
  return frame;
}

function merged(rows: Seg[][], width: number): string {
  const r = render(<Box flexDirection="column" width={width}><Lines width={width} rows={rows} /></Box>);
  const frame = r.lastFrame() ?? '';
  r.unmount();
  return frame;
}

describe('Lines', () => {
  it('draws styled, plain, empty and over-long rows exactly as a column of Line does', () => {
    const rows: Seg[][] = [
      [{ text: '▸ Title', style: { bold: true } }, { text: ' note ', style: { dimColor: true } }, { text: '──────────' }],
      [{ text: '' }],
      [{ text: '│ RS1 ' }, { text: '3k16', style: { inverse: true } }, { text: ' and a tail far wider than the pane is' }],
      [{ text: 'S1 ', style: {} }, { text: '▄███', style: { color: 'green' } }],
    ];
    expect(merged(rows, 20)).toBe(column(rows, 20));
  });

  it('falls back to one line per row when a character may take two cells (East Asian wide form)', () => {
    const rows: Seg[][] = [[{ text: 'label 電池電圧の監視回路です' }], [{ text: 'plain' }]];
    expect(merged(rows, 12)).toBe(column(rows, 12));
  });
});
