import { describe, expect, test } from 'vitest';
import { SCREEN_TRIALS, capabilities } from '../../src/ui/capabilities';
import { fourStepDesign } from '../helpers/designs';

describe('screen capabilities', () => {
  test('a new spread run replaces the one in progress, which ends as cancelled', async () => {
    const caps = capabilities();
    try {
      const first = caps.spread!(fourStepDesign(), () => {});
      const second = caps.spread!(fourStepDesign(), () => {});
      expect(await first.result).toBeNull();
      expect((await second.result)?.trials).toBe(SCREEN_TRIALS);
    } finally {
      await caps.close();
    }
  });
});
