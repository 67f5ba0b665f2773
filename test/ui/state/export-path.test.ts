import { describe, expect, it } from 'vitest';
import { designBaseName, exportPathSuggestion } from '../../../src/ui/state/export-path';

describe('exportPathSuggestion', () => {
  it('puts the export beside a design file in the working folder, relative', () => {
    expect(exportPathSuggestion('/work/gauge.tapline.json', 'gauge.tapline.json', '/work', 'report')).toBe('gauge.report.md');
  });

  it('puts the export beside a design file elsewhere, as a full path', () => {
    expect(exportPathSuggestion('/data/jobs/gauge.tapline.json', 'gauge.tapline.json', '/work', 'spice')).toBe('/data/jobs/gauge.cir');
  });

  it('keeps a sub-folder relative', () => {
    expect(exportPathSuggestion('/work/jobs/gauge.tapline.json', 'gauge.tapline.json', '/work', 'bom')).toBe('jobs/gauge.bom.csv');
  });

  it('names the demo after its file name, in the working folder', () => {
    expect(exportPathSuggestion(null, 'demo.tapline.json (demo)', '/work', 'json')).toBe('demo.json');
  });

  it('never suggests the design file itself', () => {
    expect(exportPathSuggestion('/work/gauge.json', 'gauge.json', '/work', 'json')).toBe('gauge.export.json');
  });
});

describe('designBaseName', () => {
  it('drops the preset mark and the file ending', () => {
    expect(designBaseName(null, 'fan-control.tapline.json (preset)')).toBe('fan-control');
  });
});
