import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { draftFile, openDrafts } from '../../src/store/drafts';
import { demoDesign } from '../helpers/ui';

const dirs: string[] = [];
const tempHome = () => {
  const d = mkdtempSync(join(tmpdir(), 'tapline-drafts-'));
  dirs.push(d);
  return d;
};
afterEach(() => dirs.splice(0).forEach((d) => rmSync(d, { recursive: true, force: true })));

describe('draft store', () => {
  it('keeps one draft per file across store instances (a new process)', () => {
    const env = { XDG_CONFIG_HOME: tempHome() };
    const d = demoDesign();
    openDrafts(env).save('/w/a.tapline.json', { ...d, string: [1, 2] }, 42);
    openDrafts(env).save(null, d, 43);
    const again = openDrafts(env);
    expect(again.load('/w/a.tapline.json')).toMatchObject({ file: '/w/a.tapline.json', savedAt: 42 });
    expect(again.load('/w/a.tapline.json')?.design.string).toEqual([1, 2]);
    expect(again.load(null)?.savedAt).toBe(43);
    expect(again.load('/w/b.tapline.json')).toBeNull();
    expect(again.path).toBe(join(env.XDG_CONFIG_HOME, 'tapline', 'drafts.json'));
  });

  it('forgets a draft once cleared', () => {
    const s = openDrafts({ XDG_CONFIG_HOME: tempHome() });
    s.save('/w/a.json', demoDesign(), 1);
    s.clear('/w/a.json');
    expect(s.load('/w/a.json')).toBeNull();
  });

  it('names drafts by absolute path', () => {
    expect(draftFile('a.json', '/w')).toBe('/w/a.json');
    expect(draftFile(undefined, '/w')).toBeNull();
  });
});
