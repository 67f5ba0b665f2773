import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { SweepPane } from '../../../src/ui/sweep/sweep-pane';
import { makeTheme } from '../../../src/ui/theme';
import { fourStepDesign } from '../../helpers/designs';

const d = fourStepDesign(100e3);
const a = analyze(d);

describe('SweepPane', () => {
  it('draws one row per channel with off, band and on cells and the probe cursor', () => {
    const { lastFrame } = render(<SweepPane design={d} analysis={a} probeX={2.5} selectedChannel={undefined} width={63} height={7} theme={makeTheme({ ascii: true, color: false })} />);
    const lines = (lastFrame() ?? '').split('\n');
    const s1 = lines.find((l) => l.trimStart().startsWith('S1'))!;
    // ASCII glyphs: '.' off, 'v' on only while falling (the hysteresis band), '#' on both ways.
    expect(s1).toMatch(/\.+v+#+/);
    const axis = lines.filter((l) => l.trim() !== '').at(-1)!;
    // 60 plot columns over 0..5 V: 2.5 V is column 30, after a 3-cell label.
    expect(axis.indexOf('^')).toBe(3 + 30);
  });
});
