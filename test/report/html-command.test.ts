// `isapart check -f html`: the page is written where asked, input errors appear in it, and --help names the format.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { folderWith, runCli } from '../cli/terminal-fake.js';
import { byId, parseReport, select, textOf } from './html-dom.js';

const PREFIXES = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
`;
const CYCLE = `${PREFIXES}nv:Car rdfs:subClassOf nv:Vehicle .\nnv:Vehicle rdfs:subClassOf nv:Car .\n`;
const BROKEN = `${PREFIXES}nv:Signal rdfs:subClassOf nv:Equipment .\nnv:Mast rdfs:subClassOf .\n`;

describe('isapart check -f html', () => {
  it('writes one well-formed page with -o and exits as the other formats do', async () => {
    const dir = folderWith({ 'cycle.ttl': CYCLE });
    const result = await runCli(dir, ['check', 'cycle.ttl', '-f', 'html', '-o', 'report.html']);
    expect(result.code).toBe(1);
    expect(result.out).toBe('');
    const { document, errors } = parseReport(readFileSync(path.join(dir, 'report.html'), 'utf8'));
    expect(errors).toEqual([]);
    expect(select(document, 'tbody', 'finding').map((row) => textOf(select(row, 'td')[0]))).toEqual(['subclass-cycle']);
  });

  it('shows input errors with file, line and hint in the page, and also on standard error', async () => {
    const dir = folderWith({ 'a-broken.ttl': BROKEN, 'b-cycle.ttl': CYCLE });
    const result = await runCli(dir, ['check', '.', '-f', 'html']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/a-broken\.ttl:4:\d+: error:/);
    const { document, errors } = parseReport(result.out);
    expect(errors).toEqual([]);
    const listed = textOf(byId(document, 'input-errors')!);
    expect(listed).toMatch(/a-broken\.ttl:4:\d+/);
    expect(listed).toContain('hint:');
    // The statement read before the error still counts: nv:Equipment is an orphan beside the other file's cycle.
    expect(select(document, 'tbody', 'finding').map((row) => textOf(select(row, 'td')[0]))).toEqual(['orphan-class', 'subclass-cycle']);
  });

  it('writes a page for a clean run too, with no rows and counts of zero', async () => {
    const dir = folderWith({ 'clean.ttl': `${PREFIXES}nv:Bogie rdfs:subClassOf nv:Asset .\n` });
    const result = await runCli(dir, ['check', 'clean.ttl', '-f', 'html', '--root', 'https://data.northvale-rail.example/def/Asset']);
    expect(result.code).toBe(0);
    const { document, errors } = parseReport(result.out);
    expect(errors).toEqual([]);
    expect(select(document, 'tbody', 'finding')).toEqual([]);
    expect(textOf(byId(document, 'summary-line')!)).toMatch(/^0 errors, 0 warnings, 0 notes; 0 allowed/);
  });

  it('is named by check --help, with an example', async () => {
    const result = await runCli(folderWith({}), ['check', '--help']);
    expect(result.code).toBe(0);
    expect(result.out.replace(/\s+/g, ' ')).toContain('(choices: "text", "json", "sarif", "html", "sparql-update", default: "text")');
    expect(result.out).toContain('-f html -o report.html');
  });
});
