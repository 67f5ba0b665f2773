import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { helpLines } from '../../../src/ui/help/help-lines';
import { HelpOverlay, helpRows, helpScrollCount } from '../../../src/ui/help/help-overlay';
import { KEYMAP, type KeyContext } from '../../../src/ui/keymap';
import { initialState } from '../../../src/ui/state/app-reducer';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign } from '../../helpers/ui';

const ctx: KeyContext = { state: initialState(demoDesign(), null, 'demo'), hasPlanner: false, hasSpread: true, hasExport: false };

describe('HelpOverlay', () => {
  it('lists every action of the key table', () => {
    const text = helpLines(ctx, false).map((l) => (l.kind === 'binding' ? l.text : l.text)).join('\n');
    for (const b of KEYMAP) expect(text).toContain(b.description);
  });

  it('wraps a long description onto the next row instead of cutting it (60 columns)', () => {
    const { lastFrame } = render(<HelpOverlay ctx={ctx} top={0} width={60} height={80} theme={makeTheme({ ascii: false, color: false })} />);
    const frame = lastFrame() ?? '';
    expect(frame.split('\n').every((l) => [...l].length <= 60)).toBe(true);
    expect(frame.replace(/\s+/g, ' ')).toContain('type a new value for the selected one (4k7, 4.7k, 4.7 kohm, 2.5 V)');
  });

  it('scrolls no further than its last row', () => {
    const rows = helpRows(ctx, false, 80).length;
    expect(helpScrollCount(ctx, false, 80, 21)).toBe(rows - 20 + 1);
  });

  it('says why a key is off right now', () => {
    const { lastFrame } = render(<HelpOverlay ctx={ctx} top={0} width={80} height={40} theme={makeTheme({ ascii: false, color: false })} />);
    expect(lastFrame()).toContain('off now: the planner is not part of this build yet');
  });
});
