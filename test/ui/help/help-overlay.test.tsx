import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { helpLines } from '../../../src/ui/help/help-lines';
import { HelpOverlay } from '../../../src/ui/help/help-overlay';
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

  it('says why a key is off right now', () => {
    const { lastFrame } = render(<HelpOverlay ctx={ctx} top={0} width={80} height={40} theme={makeTheme({ ascii: false, color: false })} />);
    expect(lastFrame()).toContain('off now: the planner is not part of this build yet');
  });
});
