import { Box } from 'ink';
import { Line } from '../common/line';
import type { PromptState } from '../state/app-state';
import type { Theme } from '../theme';

/** Props of PromptLine. */
export interface PromptLineProps {
  prompt: PromptState;
  width: number;
  theme: Theme;
}

/**
 * The inline prompt: label, the text typed so far with a block cursor, and on the line above it the
 * reason the last Enter was refused (naming the field, the value and the fix). Offered text (the
 * current value) is shown selected, as typing replaces it.
 */
export function PromptLine({ prompt, width, theme }: PromptLineProps) {
  const cursor = theme.isAscii ? '_' : '█';
  return (
    <Box flexDirection="column" width={width}>
      {prompt.error && <Line width={width} segs={[{ text: prompt.error, style: theme.error() }]} />}
      <Line width={width} segs={[{ text: `${prompt.label} `, style: theme.title(true) }, { text: prompt.text, style: prompt.offered ? theme.selected(true) : undefined }, { text: cursor }]} />
    </Box>
  );
}
