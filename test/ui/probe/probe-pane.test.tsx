import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { probe } from '../../../src/engine/analyze';
import { prepare } from '../../../src/engine/prepare';
import { ProbePane } from '../../../src/ui/probe/probe-pane';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign } from '../../helpers/ui';

const d = demoDesign();
const p = probe(prepare(d), 12.5, 'up');

describe('ProbePane', () => {
  it('shows lit and dark LEDs as different characters, supply and sink currents', () => {
    const { lastFrame } = render(<ProbePane design={d} probe={p} width={60} height={4} theme={makeTheme({ ascii: true, color: false })} />);
    const f = lastFrame() ?? '';
    // Demo at 12.5 V rising: S1..S3 above their steps (11.8, 12.1, 12.4 V), S4 (12.7 V) not yet.
    expect(f).toContain('[#]S1 [#]S2 [#]S3 [ ]S4');
    expect(f).toMatch(/supply \d+\.\d+ mA/);
    expect(f).toMatch(/sink S1 \d\.\d+ mA S2 .* S4 0/);
    expect(f).toContain('12.50 V ^ rising');
  });
});
