import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { probe } from '../../../src/engine/analyze';
import { prepare } from '../../../src/engine/prepare';
import { paneFields } from '../../../src/ui/state/fields';
import { StringPane } from '../../../src/ui/string/string-pane';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign } from '../../helpers/ui';

const d = demoDesign();
const p = probe(prepare(d), 12.5, 'up');

describe('StringPane', () => {
  it('draws the string top to bottom with values, tap voltages and wired channels', () => {
    const { lastFrame } = render(<StringPane design={d} fields={paneFields(d, 'string')} selectedId="string.0" probe={p} isFocused width={30} height={16} theme={makeTheme({ ascii: false, color: false })} />);
    const lines = (lastFrame() ?? '').split('\n');
    const at = (re: RegExp) => lines.findIndex((l) => re.test(l));
    expect(at(/RS1 3k09/)).toBeLessThan(at(/T1 \d\.\d{3} V {2}S4\+/));
    expect(at(/T1 /)).toBeLessThan(at(/RS2 845R/));
    expect(at(/RS5 25k5/)).toBeLessThan(at(/gnd/));
    expect(lines[at(/T4 /)]).toContain('S1+');
    // Tap voltage: T1 at the probe, from the engine's probe (same numbers, 4 digits).
    expect(lines[at(/T1 /)]).toContain(`${p.nodes.T1.toFixed(3)} V`);
  });

  it('uses only ASCII characters in ASCII mode', () => {
    const { lastFrame } = render(<StringPane design={d} fields={paneFields(d, 'string')} selectedId="string.0" probe={p} isFocused width={30} height={16} theme={makeTheme({ ascii: true, color: false })} />);
    expect(lastFrame()).toMatch(/^[\x20-\x7e\n]*$/);
  });

  it('scrolls to keep the selected value visible in a short pane', () => {
    const { lastFrame } = render(<StringPane design={d} fields={paneFields(d, 'string')} selectedId="input.bottom" probe={p} isFocused={false} width={30} height={5} theme={makeTheme({ ascii: false, color: false })} />);
    expect(lastFrame()).toContain('RD2 93k1');
  });
});
