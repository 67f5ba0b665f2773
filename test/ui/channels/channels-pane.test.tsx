import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { ChannelsPane } from '../../../src/ui/channels/channels-pane';
import { matchTargets } from '../../../src/ui/state/target-match';
import { makeTheme } from '../../../src/ui/theme';
import { demoDesign } from '../../helpers/ui';

const d = demoDesign();
const a = analyze(d);
const theme = makeTheme({ ascii: false, color: false });

describe('ChannelsPane', () => {
  it('shows package.channel, function, trip points, hysteresis, target, feedback, load and sink current at 80 columns', () => {
    const { lastFrame } = render(<ChannelsPane design={d} channels={a.channels} targets={matchTargets(d, a.channels)} selectedId={undefined} selectedChannel={undefined} isFocused={false} width={80} height={6} isWide={false} theme={theme} />);
    const f = lastFrame() ?? '';
    for (const head of ['pk', 'function', 'rise', 'fall', 'hyst', 'target', 'off by', 'fdbk', 'load', 'sink']) expect(f).toContain(head);
    const s1 = f.split('\n').find((l) => l.includes('S1'))!;
    // Realised trips from the engine, printed to 4 significant digits.
    expect(s1).toContain(a.channels[0].rising!.x.toFixed(2));
    expect(s1).toContain(a.channels[0].falling!.x.toFixed(2));
    expect(s1).toMatch(/1\.1 +11\.8 V step/);
    expect(s1).toContain('LED 2k21');
  });

  it('adds units to every cell when wide', () => {
    const { lastFrame } = render(<ChannelsPane design={d} channels={a.channels} targets={matchTargets(d, a.channels)} selectedId={undefined} selectedChannel={undefined} isFocused={false} width={120} height={6} isWide theme={theme} />);
    expect(lastFrame()).toMatch(/11\.80 V/);
    expect(lastFrame()).toMatch(/mA/);
  });

  it('drops the least important columns first on a narrow screen', () => {
    const { lastFrame } = render(<ChannelsPane design={d} channels={a.channels} targets={{}} selectedId={undefined} selectedChannel={undefined} isFocused={false} width={60} height={6} isWide={false} theme={theme} />);
    const f = lastFrame() ?? '';
    expect(f).toContain('rise');
    expect(f).toContain('fall');
    expect(f.split('\n').every((l) => l.length <= 60)).toBe(true);
  });
});
