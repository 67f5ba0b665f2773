import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../src/engine/analysis-types';
import { FindingsPane } from '../../../src/ui/findings/findings-pane';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign } from '../../helpers/ui';

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
