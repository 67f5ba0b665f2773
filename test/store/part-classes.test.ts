import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import type { PartClass } from '../../src/engine/design/types';
import { BUILTIN_PARTS, resolvePart } from '../../src/engine/parts';
import { checkPartClass, openPartClassStore } from '../../src/store/part-classes';

const temp = () => mkdtempSync(join(tmpdir(), 'tapline-parts-'));
const mine = (over: Partial<PartClass> = {}): PartClass => ({ ...BUILTIN_PARTS['cmos-pp-quad'], id: 'my-quad', description: 'my push-pull quad', ...over });

describe('part-class store', () => {
  test('a saved class is listed and survives reopening', () => {
    const cwd = temp();
    expect(openPartClassStore({ cwd }).save(mine())).toEqual({ ok: true });
    expect(openPartClassStore({ cwd }).list().map((p) => p.id)).toEqual(['my-quad']);
  });

  test('the file lives under XDG_CONFIG_HOME/tapline when no folder is given', () => {
    const xdg = temp();
    const store = openPartClassStore({ env: { XDG_CONFIG_HOME: xdg } });
    store.save(mine());
    expect(store.path).toBe(join(xdg, 'tapline', 'part-classes.json'));
    expect(JSON.parse(readFileSync(store.path, 'utf8')).classes['my-quad'].id).toBe('my-quad');
  });

  test('a built-in id cannot be taken', () => {
    const result = openPartClassStore({ cwd: temp() }).save(mine({ id: 'bipolar-oc-quad' }));
    expect(result).toMatchObject({ ok: false, problems: [expect.stringContaining('built-in')] });
  });

  test('removing a class drops it and reports whether it was there', () => {
    const store = openPartClassStore({ cwd: temp() });
    store.save(mine());
    expect(store.remove('my-quad')).toBe(true);
    expect(store.remove('my-quad')).toBe(false);
    expect(store.list()).toEqual([]);
  });

  test('all() holds built-ins and user classes, and resolvePart finds a user class through it', () => {
    const store = openPartClassStore({ cwd: temp() });
    store.save(mine({ vosMax: 3e-3 }));
    expect(Object.keys(store.all())).toEqual(expect.arrayContaining(['my-quad', ...Object.keys(BUILTIN_PARTS)]));
    expect(resolvePart('my-quad', { vosTyp: 2e-3 }, store.all())).toMatchObject({ id: 'my-quad', vosMax: 3e-3, vosTyp: 2e-3 });
  });
});

describe('part-class checks', () => {
  test('a bad number is named with its value and the fix', () => {
    expect(checkPartClass(mine({ vosMax: Number.NaN }))[0]).toMatch(/^vosMax: null is not a number; give it in SI units/);
  });

  test('a maximum under its typical value is refused', () => {
    expect(checkPartClass(mine({ ibTyp: 2e-9, ibMax: 1e-9 }))).toEqual([expect.stringMatching(/^ibMax: 1e-9 is below ibTyp 2e-9/)]);
  });

  test('a valid class has no problems', () => {
    expect(checkPartClass(mine())).toEqual([]);
  });
});
