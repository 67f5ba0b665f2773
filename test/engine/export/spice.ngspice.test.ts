/**
 * The exported netlists run unmodified in ngspice (batch mode) and reproduce the engine's trip
 * points. Reference: ngspice, an independent circuit simulator (Debian package), solving the same
 * circuit with its own switch, diode and source models. Skipped where ngspice is not installed.
 */
import { describe, expect, it } from 'vitest';
import { spiceNetlist } from '../../../src/engine/export/spice';
import { spiceMeasures, tripTolerance } from '../../../src/engine/export/spice-measures';
import { hasNgspice, runNgspice } from '../../helpers/ngspice';
import { loadPresets } from '../../helpers/presets';

const available = hasNgspice();

describe.skipIf(!available)('SPICE netlists in ngspice', () => {
  for (const preset of loadPresets()) {
    // Precision: 1 mV of x when x is in volts, else the x change that moves the sense node by 1 mV.
    it(`${preset.id}: every trip point within the stated tolerance of the engine`, () => {
      const netlist = spiceNetlist(preset.design, preset.prepared, preset.designators);
      const run = runNgspice(netlist);
      const measures = spiceMeasures(preset.prepared, preset.designators);
      const tol = tripTolerance(preset.prepared);
      expect(run.failed).toEqual([]);
      expect(measures.length).toBeGreaterThan(0);
      for (const m of measures) {
        const simulated = run.measures[m.name];
        expect(simulated, `${m.name} missing from ngspice output`).toBeTypeOf('number');
        expect(Math.abs(simulated - m.x), `${m.name}: ngspice ${simulated}, engine ${m.x}, tolerance ${tol}`).toBeLessThanOrEqual(tol);
      }
    }, 120_000);
  }
});
