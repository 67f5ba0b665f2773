import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyze } from '../../src/engine/analyze';
import type { Analysis } from '../../src/engine/analysis-types';
import { parseDesign } from '../../src/engine/design/load';
import type { Design } from '../../src/engine/design/types';
import { assignDesignators, type Designators } from '../../src/engine/export/designators';
import { type Prepared, prepare } from '../../src/engine/prepare';

/** The presets folder of the repository. */
export const PRESETS_DIR = join(import.meta.dirname, '..', '..', 'presets');

/** One preset, loaded, prepared and analysed. */
export interface LoadedPreset {
  id: string;
  design: Design;
  prepared: Prepared;
  analysis: Analysis;
  designators: Designators;
}

/** Every preset in presets/, sorted by id; throws with the loader's problems if one does not load. */
export function loadPresets(): LoadedPreset[] {
  return readdirSync(PRESETS_DIR)
    .filter((f) => f.endsWith('.tapline.json'))
    .sort()
    .map((f) => {
      const parsed = parseDesign(JSON.parse(readFileSync(join(PRESETS_DIR, f), 'utf8')));
      if (!parsed.ok) throw new Error(`${f}: ${JSON.stringify(parsed.problems)}`);
      const design = parsed.design;
      const prepared = prepare(design);
      return { id: f.replace('.tapline.json', ''), design, prepared, analysis: analyze(design, prepared), designators: assignDesignators(design) };
    });
}
