import { describe, expect, it } from 'vitest';
import { main } from '../../../src/cli/main';
import type { CliIo } from '../../../src/io';
import { PRESETS_DIR } from '../../helpers/presets';

describe('tapline presets', () => {
  it('lists each preset with id, name, description and path', async () => {
    let out = '';
    const io: CliIo = { out: (t) => (out += t), err: () => undefined, isTty: false, cwd: PRESETS_DIR, env: {} };
    expect(await main(['presets'], io)).toBe(0);
    expect(out).toMatch(/^lead-acid-12v-gauge\s+12 V lead-acid battery gauge/m);
    expect(out).toContain('lead-acid-12v-gauge.tapline.json');
    expect(out.match(/\.tapline\.json$/gm)?.length).toBeGreaterThanOrEqual(6);
  });
});
