import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../src/engine/analysis-types';
import { batteryCautions } from '../../../src/ui/findings/findings-lines';
import { FindingsPane } from '../../../src/ui/findings/findings-pane';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign, renderApp } from '../../helpers/ui';

const d = demoDesign();
const theme = makeTheme({ ascii: false, color: false });
const finding: Finding = { severity: 'error', code: 'sink-current', part: 'S1', x: 14, amount: '2 mA over', message: 'sinks more than the part allows', fix: 'raise the LED resistor' };

describe('FindingsPane', () => {
  it('lists errors first with the battery cautions', () => {
    const { lastFrame } = render(<FindingsPane design={d} findings={[finding]} spread={{ state: 'idle' }} selected={0} isFocused={false} width={70} height={6} theme={theme} />);
    const f = lastFrame() ?? '';
    expect(f).toContain('1 error, 0 warnings');
    expect(f).toMatch(/ERR +S1 @14\.00 V: sinks more/);
    expect(f).toContain('lead-acid battery');
  });

  it('shows the fix under the selected finding', () => {
    const { lastFrame } = render(<FindingsPane design={d} findings={[finding]} spread={{ state: 'idle' }} selected={0} isFocused width={70} height={6} theme={theme} />);
    expect(lastFrame()).toContain('raise the LED resistor');
  });

  it('shows the spread of each trip point once computed', () => {
    const spread = { state: 'done' as const, design: d, result: { trials: 100, channels: [{ id: 'S1', rising: { min: 11.7, max: 11.9, lo: 11.72, hi: 11.88, worstMin: 11.6, worstMax: 12 }, falling: null }] } };
    const { lastFrame } = render(<FindingsPane design={d} findings={[]} spread={spread} selected={0} isFocused={false} width={70} height={8} theme={theme} />);
    expect(lastFrame()).toContain('S1 rise 11.72 V..11.88 V');
  });
});

/** The pane's text with its rows joined: tags, indents and the right-hand border of the frame dropped. */
function readAcross(frame: string): string {
  return frame.split('\n').slice(1).map((l) => l.replace(/^(CARE|ERR |WARN|info|sprd)? +/, '').trimEnd()).join(' ');
}

describe('FindingsPane at 80 columns (the pane is 51 cells wide there)', () => {
  const cautions = batteryCautions(d);

  it('wraps a caution longer than the pane onto the next row instead of cutting it', () => {
    const { lastFrame } = render(<FindingsPane design={d} findings={[]} spread={{ state: 'idle' }} selected={0} isFocused={false} width={51} height={4} theme={theme} />);
    const f = lastFrame() ?? '';
    expect(f.split('\n').every((l) => [...l].length <= 51)).toBe(true);
    for (const c of cautions) expect(readAcross(f)).toContain(c.text);
    expect(f).not.toContain('…');
  });

  it('names the entries it has no room for, and how many are cautions', () => {
    const { lastFrame } = render(<FindingsPane design={d} findings={[finding]} spread={{ state: 'idle' }} selected={0} isFocused={false} width={51} height={4} theme={theme} />);
    const f = lastFrame() ?? '';
    expect(readAcross(f)).toContain('sinks more than the part allows (2 mA over)');
    expect(f).toContain('+2 more (2 cautions)');
  });

  it('focused, Up/Down read every caution and its fix in full even in a two-row pane', () => {
    let read = '';
    for (let k = 0; k < 12; k++) {
      const { lastFrame, unmount } = render(<FindingsPane design={d} findings={[]} spread={{ state: 'idle' }} selected={k} isFocused width={51} height={3} theme={theme} />);
      read += ` ${readAcross(lastFrame() ?? '')}`;
      unmount();
    }
    for (const c of cautions) {
      expect(read).toContain(c.text);
      expect(read).toContain(c.detail);
    }
  });

  it('shows the whole caution on the demo screen at 80x24', () => {
    const app = renderApp({ columns: 80, rows: 24 });
    const pane = app.frame().split('\n').map((l) => l.slice(29)).filter((l) => /^(CARE| {5}\S)/.test(l)).join('\n');
    expect(readAcross(`title\n${pane}`)).toContain(cautions[0].text);
    app.unmount();
  });
});
