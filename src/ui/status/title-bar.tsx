import { Line } from '../common/line';
import type { AppState } from '../state/app-state';
import { isModified } from '../state/app-reducer';
import type { Theme } from '../theme';

/** Props of TitleBar. */
export interface TitleBarProps {
  state: AppState;
  width: number;
  theme: Theme;
}

/** The top line: program, design file, unsaved marker, series and tolerance, and what is running. */
export function TitleBar({ state, width, theme }: TitleBarProps) {
  const d = state.design;
  const tol = `${+(d.resistorTolerance * 100).toPrecision(3)} %`;
  const spread = state.spread.state === 'running' ? `  spread ${Math.floor((100 * state.spread.done) / Math.max(1, state.spread.total))} %` : '';
  return (
    <Line width={width} segs={[
      { text: 'tapline ', style: theme.title(true) },
      { text: state.name },
      { text: isModified(state) ? ' [modified]' : '', style: theme.modified() },
      { text: spread, style: theme.modified() },
      { text: `  ${d.series} ${tol}  ${d.part.id}`, style: theme.muted() },
    ]} />
  );
}
