import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { BOM_COLUMNS, bomCsv, bomTable, buildBom, csvField, powerRating } from '../../../src/engine/export/bom';
import { loadPresets } from '../../helpers/presets';

// Reference parser: csv-parse (npm, the CSV project's RFC 4180 parser), strict column counts.
const parseCsv = (text: string): string[][] => parse(text, { relax_column_count: false, record_delimiter: '\r\n' });

describe('csvField', () => {
  it('quotes commas, quotes and line breaks as RFC 4180 section 2 rules 6 and 7 say', () => {
    const fields = ['plain', 'a,b', 'say "hi"', 'two\r\nlines'];
    const line = `${fields.map(csvField).join(',')}\r\n`;
    expect(parseCsv(line)).toEqual([fields]);
  });
});

describe('powerRating', () => {
  // Derating to half the rating: common practice, no source.
  it('picks the smallest common rating at least twice the dissipation', () => {
    expect([powerRating(0), powerRating(0.05), powerRating(0.1), powerRating(0.2)]).toEqual([0.0625, 0.1, 0.25, 0.5]);
  });
});

describe.each(loadPresets())('bill of materials of $id', (p) => {
  const lines = buildBom(p.design, p.analysis, p.designators);
  const rows = parseCsv(bomCsv(lines));
  const count = (part: string) => rows.slice(1).filter((r) => r[2] === part).reduce((s, r) => s + Number(r[1]), 0);

  it('parses as CSV with the header and one record per line', () => {
    expect(rows[0]).toEqual([...BOM_COLUMNS]);
    expect(rows).toHaveLength(lines.length + 1);
  });

  it('lists every resistor once', () => {
    const d = p.design;
    const perChannel = d.channels.reduce((s, c) => s + [c.seriesPlus, c.seriesMinus, c.feedback, c.pullup, c.led].filter((x) => x !== undefined).length, 0);
    const input = d.input.signal === 'current' ? 1 : d.input.divider ? 2 : 0;
    const bias = d.reference.kind === 'shunt' ? 1 : 0;
    expect(count('resistor')).toBe(d.string.length + input + bias + perChannel);
  });

  it('lists one LED per LED channel and one comparator per package', () => {
    const packages = new Set([...p.design.channels, ...p.design.spares].map((c) => c.package)).size;
    expect(count('LED')).toBe(p.design.channels.filter((c) => c.led).length);
    expect(count('quad comparator')).toBe(packages);
  });

  it('gives each designator exactly once across the lines', () => {
    const refs = rows.slice(1).flatMap((r) => r[0].split(' '));
    expect(new Set(refs).size).toBe(refs.length);
    expect(refs.length).toBe(p.designators.entries.length);
  });

  it('draws the readable table with one row per line plus header and rule', () => {
    expect(bomTable(lines).trimEnd().split('\n')).toHaveLength(lines.length + 2);
  });
});
