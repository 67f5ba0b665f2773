/**
 * One entry for every export format: the text of a design as a SPICE netlist, a bill of materials, a
 * Markdown report or JSON. The command line and the interactive screen both write what this returns.
 */
import { analyze } from '../analyze';
import type { Analysis } from '../analysis-types';
import { cautionsFor } from '../cautions';
import type { Design } from '../design/types';
import { type Prepared, prepare } from '../prepare';
import { runSpread, type SpreadReport } from '../spread';
import { bomCsv, bomTable, buildBom } from './bom';
import { assignDesignators } from './designators';
import { buildJsonExport } from './json';
import { buildReport } from './report';
import { spiceNetlist } from './spice';

/** The export formats. */
export const EXPORT_FORMATS = ['spice', 'bom', 'report', 'json'] as const;

/** One export format. */
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/** Monte Carlo trials the report and JSON exports run when no spread is given. */
export const EXPORT_TRIALS = 2000;

/** Seed of that spread run, so the same design always exports the same figures. */
export const EXPORT_SEED = 1;

/** File name ending of each format, after the design's base name ("gauge" -> "gauge.report.md"). */
export const EXPORT_SUFFIX: Record<ExportFormat, string> = { spice: '.cir', bom: '.bom.csv', report: '.report.md', json: '.json' };

/** Whether `format` includes the spread analysis (and so takes a second or so without one at hand). */
export function exportNeedsSpread(format: ExportFormat): boolean {
  return format === 'report' || format === 'json';
}

/** What an export is made from. */
export interface ExportInput {
  design: Design;
  format: ExportFormat;
  /** The prepared network and its analysis, when the caller has them already (they are recomputed otherwise). */
  prepared?: Prepared;
  analysis?: Analysis;
  /**
   * The spread of this very design, when it was run already. Undefined runs EXPORT_TRIALS trials with
   * EXPORT_SEED (report and JSON only); null leaves the spread out.
   */
  spread?: SpreadReport | null;
  /** With `bom`: a readable text table instead of CSV. */
  isTable?: boolean;
}

/** The export as text. Pure and deterministic. */
export function exportText(input: ExportInput): string {
  const { design, format } = input;
  const prepared = input.prepared ?? prepare(design);
  const designators = assignDesignators(design);
  if (format === 'spice') return spiceNetlist(design, prepared, designators);
  const analysis = input.analysis ?? analyze(design, prepared);
  if (format === 'bom') return (input.isTable ? bomTable : bomCsv)(buildBom(design, analysis, designators));
  const full = {
    design,
    analysis,
    designators,
    spread: input.spread === undefined ? runSpread(design, { trials: EXPORT_TRIALS, seed: EXPORT_SEED }) : input.spread,
    cautions: cautionsFor(design).map((c) => c.text),
  };
  return format === 'report' ? buildReport(full) : buildJsonExport(full);
}
