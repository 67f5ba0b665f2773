import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../../src/cli/main';
import type { CliIo } from '../../../src/io';
import { PRESETS_DIR } from '../../helpers/presets';

const dir = mkdtempSync(join(tmpdir(), 'tapline-export-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function io(): CliIo & { stdout: string; stderr: string } {
  const o = { stdout: '', stderr: '', isTty: false, cwd: dir, env: {} } as CliIo & { stdout: string; stderr: string };
  o.out = (t) => (o.stdout += t);
  o.err = (t) => (o.stderr += t);
  return o;
}
const preset = join(PRESETS_DIR, 'lead-acid-12v-gauge.tapline.json');

describe('tapline export', () => {
  it('prints a netlist to stdout with --to spice', async () => {
    const o = io();
    expect(await main(['export', preset, '--to', 'spice'], o)).toBe(0);
    expect(o.stdout).toContain('.meas tran xr_u1a');
  });

  it('writes the CSV atomically with --out and leaves no temporary file', async () => {
    const o = io();
    expect(await main(['export', preset, '--to', 'bom', '--out', 'bom.csv'], o)).toBe(0);
    // Reference parser: csv-parse (RFC 4180).
    const rows = parse(readFileSync(join(dir, 'bom.csv'), 'utf8')) as string[][];
    expect(rows[0][0]).toBe('Designators');
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('writes a report with spread and cautions', async () => {
    const o = io();
    expect(await main(['export', preset, '--to', 'report'], o)).toBe(0);
    expect(o.stdout).toMatch(/2000 Monte Carlo trials \(seed 1\)/);
    expect(o.stdout).toMatch(/## Cautions\n\n- /);
  }, 60_000);

  it('writes JSON that parses and carries the design file', async () => {
    const o = io();
    expect(await main(['export', preset, '--to', 'json'], o)).toBe(0);
    expect(JSON.parse(o.stdout).design.format).toBe(1);
  }, 60_000);

  it('names the option, the value and the fix for an unknown format', async () => {
    const o = io();
    expect(await main(['export', preset, '--to', 'gerber'], o)).toBe(2);
    expect(o.stderr).toContain('--to is "gerber"; give one of spice, bom, report, json');
  });
});
