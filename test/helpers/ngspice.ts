import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Whether an ngspice executable answers on this machine. */
export function hasNgspice(): boolean {
  const r = spawnSync('ngspice', ['-v'], { encoding: 'utf8' });
  return r.status === 0 || /ngspice/i.test(`${r.stdout}${r.stderr}`);
}

/** Result of one batch run: the `.meas` values by (lower-case) name, and the whole log. */
export interface NgspiceRun {
  measures: Record<string, number>;
  failed: string[];
  log: string;
}

/** Runs `netlist` in ngspice batch mode (`ngspice -b FILE`) from a temporary file and parses `.meas` lines. */
export function runNgspice(netlist: string): NgspiceRun {
  const dir = mkdtempSync(join(tmpdir(), 'tapline-spice-'));
  try {
    const file = join(dir, 'design.cir');
    writeFileSync(file, netlist);
    const r = spawnSync('ngspice', ['-b', file], { encoding: 'utf8', cwd: dir, timeout: 120_000 });
    const log = `${r.stdout ?? ''}\n${r.stderr ?? ''}`;
    const measures: Record<string, number> = {};
    for (const m of log.matchAll(/^\s*(\w+)\s*=\s*([-+]?\d[\d.]*(?:e[-+]?\d+)?)/gim)) measures[m[1].toLowerCase()] = Number(m[2]);
    const failed = [...log.matchAll(/\.meas\S*\s+tran\s+(\w+).*failed/gi)].map((m) => m[1].toLowerCase());
    return { measures, failed, log };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
