import { Box } from 'ink';
import type { ProbeResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import type { Seg } from '../common/line';
import { PaneText } from '../common/pane-title';
import { fmtA, fmtX } from '../format';
import type { Theme } from '../theme';

/**
 * LED current below which an indicator counts as faint rather than lit (A). Common practice, no
 * source: a small indicator LED is plainly visible from about a tenth of a milliampere.
 */
export const LED_VISIBLE_CURRENT = 100e-6;

/** How an LED looks at the probe. */
export type LedLook = 'on' | 'faint' | 'off' | 'none';

/** How channel `id`'s LED looks at the probe ('none' when the channel has no LED). */
export function ledLook(p: ProbeResult, d: Design, id: string): LedLook {
  if (!d.channels.find((c) => c.id === id)?.led) return 'none';
  const i = p.ledCurrent[id] ?? 0;
  if (!p.lit[id] || i <= 0) return 'off';
  return i >= LED_VISIBLE_CURRENT ? 'on' : 'faint';
}

/** Props of ProbePane. */
export interface ProbePaneProps {
  design: Design;
  probe: ProbeResult | null;
  width: number;
  height: number;
  theme: Theme;
}

/** The probe pane: at the probe value, which LEDs are lit, the supply current and every output's sink current. */
export function ProbePane({ design, probe, width, height, theme }: ProbePaneProps) {
  const g = theme.glyphs;
  const ascii = theme.isAscii;
  if (!probe) {
    return (
      <Box flexDirection="column" width={width} height={height}>
        <PaneText width={width} title={{ title: 'Probe', isFocused: false, width, theme }} rows={[[{ text: 'no solution at the probe', style: theme.error() }]]} />
      </Box>
    );
  }
  const dir = probe.direction === 'up' ? `${g.up} rising` : `${g.down} falling`;
  const ids = design.channels.map((c) => c.id);
  const leds: Seg[] = [{ text: 'LED ' }];
  for (const id of ids) {
    const look = ledLook(probe, design, id);
    if (look === 'none') continue;
    const mark = look === 'on' ? g.ledOn : look === 'faint' ? g.ledFaint : g.ledOff;
    leds.push({ text: mark, style: look === 'on' ? theme.on() : theme.muted() }, { text: `${id} ` });
  }
  const supply: Seg = { text: ` supply ${fmtA(probe.supplyCurrent, ascii)}` };
  const sinks: Seg[] = [{ text: 'sink' }];
  for (const id of ids) sinks.push({ text: ` ${id} ${fmtA(probe.sinkCurrent[id] ?? 0, ascii)}` });
  const faint = ids.filter((id) => ledLook(probe, design, id) === 'faint');
  const lines: Seg[][] = [[...leds, supply], sinks];
  if (height >= 4) {
    lines.push(faint.length
      ? [{ text: `faint: ${faint.map((id) => `${id} ${fmtA(probe.ledCurrent[id], ascii)}`).join(', ')} (below ${fmtA(LED_VISIBLE_CURRENT, ascii)})`, style: theme.muted() }]
      : [{ text: `${g.ledOn} lit  ${g.ledFaint} faint  ${g.ledOff} dark`, style: theme.muted() }]);
  }
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'Probe', note: `${fmtX(probe.x, design, ascii)} ${dir}`, isFocused: false, width, theme }} rows={lines.slice(0, Math.max(0, height - 1))} />
    </Box>
  );
}
