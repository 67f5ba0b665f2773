import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstSentence, listPresets, presetsDir } from '../../src/store/presets';
import { PRESETS_DIR } from '../helpers/presets';

const ROOT = join(PRESETS_DIR, '..');

describe('presetsDir', () => {
  it('finds presets/ from the sources', () => {
    expect(presetsDir()).toBe(PRESETS_DIR);
  });

  it('finds presets/ beside dist/ from the bundle and its chunks', () => {
    expect(presetsDir(join(ROOT, 'dist'))).toBe(PRESETS_DIR);
    expect(presetsDir(join(ROOT, 'dist', 'chunks'))).toBe(PRESETS_DIR);
  });
});

describe('listPresets', () => {
  it('lists every preset with a name, a one-line description and an absolute path', async () => {
    const { presets, problems } = await listPresets();
    expect(problems).toEqual([]);
    expect(presets.length).toBeGreaterThanOrEqual(6);
    for (const p of presets) {
      expect(p.path.startsWith(PRESETS_DIR)).toBe(true);
      expect(p.description).not.toContain('\n');
      expect(p.description.length).toBeGreaterThan(0);
    }
  });

  it('says where the folder is missing instead of throwing', async () => {
    const { presets, problems } = await listPresets(join(ROOT, 'no-such-folder'));
    expect(presets).toEqual([]);
    expect(problems[0]).toContain('cannot list the presets');
  });
});

describe('firstSentence', () => {
  it('stops at the first full stop followed by a space', () => {
    expect(firstSentence('Four LEDs at 11.8 V. Caution follows.')).toBe('Four LEDs at 11.8 V.');
  });
});
