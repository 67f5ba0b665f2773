import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, openSettings, RECENT_LIMIT, sanitizeSettings } from '../../src/store/settings';

const dirs: string[] = [];
const tempHome = () => {
  const d = mkdtempSync(join(tmpdir(), 'tapline-settings-'));
  dirs.push(d);
  return d;
};
afterEach(() => dirs.splice(0).forEach((d) => rmSync(d, { recursive: true, force: true })));

describe('settings store', () => {
  it('keeps settings in $XDG_CONFIG_HOME/tapline/settings.json', () => {
    const home = tempHome();
    const s = openSettings({ XDG_CONFIG_HOME: home });
    s.set({ series: 'E24', ascii: true });
    expect(s.path).toBe(join(home, 'tapline', 'settings.json'));
    expect(JSON.parse(readFileSync(s.path, 'utf8'))).toMatchObject({ series: 'E24', ascii: true });
    expect(openSettings({ XDG_CONFIG_HOME: home }).get().series).toBe('E24');
  });

  it('puts the newest recent file first without duplicates, up to the limit', () => {
    const s = openSettings({ XDG_CONFIG_HOME: tempHome() });
    for (let k = 0; k < RECENT_LIMIT + 3; k++) s.addRecent(`/d/${k}.json`);
    s.addRecent('/d/5.json');
    const recent = s.get().recent;
    expect(recent[0]).toBe('/d/5.json');
    expect(recent).toHaveLength(RECENT_LIMIT);
    expect(new Set(recent).size).toBe(RECENT_LIMIT);
  });

  it('falls back to defaults field by field for hand-edited bad values', () => {
    expect(sanitizeSettings({ series: 'E7', tolerance: -1, partClass: 'nope', ascii: 'yes', recent: [1, '/a'] })).toEqual({ ...DEFAULT_SETTINGS, recent: ['/a'] });
  });

  it('starts over when the file is not JSON', () => {
    const home = tempHome();
    const s = openSettings({ XDG_CONFIG_HOME: home });
    s.set({ ascii: true });
    writeFileSync(s.path, '{ not json');
    expect(openSettings({ XDG_CONFIG_HOME: home }).get()).toEqual(DEFAULT_SETTINGS);
  });
});
