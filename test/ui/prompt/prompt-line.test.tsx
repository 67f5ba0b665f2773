import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { PromptLine } from '../../../src/ui/prompt/prompt-line';
import { makeTheme } from '../../../src/ui/theme';

describe('PromptLine', () => {
  it('shows the label, the text and the error above it', () => {
    const prompt = { kind: 'value' as const, fieldId: 'string.0', label: 'RS1 =', text: '4x7', error: 'RS1: "4x7" is not a value in ohms: write 4k7, 4.7k or 4700', recentIndex: -1 };
    const { lastFrame } = render(<PromptLine prompt={prompt} width={80} theme={makeTheme({ ascii: true, color: false })} />);
    expect(lastFrame()).toBe('RS1: "4x7" is not a value in ohms: write 4k7, 4.7k or 4700\nRS1 = 4x7_');
  });
});
