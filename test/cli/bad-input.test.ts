// Acceptance of `isapart` on bad and unusual input: every problem is named, placed, hinted, and sets exit 2.
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { fakeTerminal, folderWith, runCli } from './terminal-fake.js';

const NV = 'https://data.northvale-rail.example/';
const PREFIXES = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <${NV}def/> .
`;
/** One subclass cycle (an error) and one orphan class nv:Asset (a note). */
const CYCLE_AND_ORPHAN = `${PREFIXES}nv:Component rdfs:subClassOf nv:Asset .\nnv:Car rdfs:subClassOf nv:Car .\n`;

const run = runCli;

describe('-o, --output', () => {
  it('refuses a report path in a folder that does not exist, before linting, with a hint and no stack trace', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', '-o', 'reports/lint.sarif', '-f', 'sarif']);
    expect(result.code).toBe(2);
    expect(result.err).toBe(
      `isapart: -o reports/lint.sarif: cannot write the report there: the folder ${path.join(dir, 'reports')} does not exist\n` +
        `  hint: create it first (mkdir -p ${path.join(dir, 'reports')}), or write into an existing folder\n`,
    );
    expect(result.out).toBe('');
    expect(existsSync(path.join(dir, 'reports'))).toBe(false);
  });

  it('refuses a report path that is a folder, and leaves no temporary file behind', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN, 'reports/keep.txt': 'x' });
    const result = await run(dir, ['check', 'data.ttl', '-o', 'reports']);
    expect(result.code).toBe(2);
    expect(result.err).toContain(`cannot write the report there: ${path.join(dir, 'reports')} is a folder`);
    expect(result.err).not.toContain('internal error');
    expect(readdirSync(dir).sort()).toEqual(['data.ttl', 'reports']);
  });

  it('still says on stderr what went wrong with the input when the report goes to a file', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', 'missing.ttl', '-o', 'lint.json', '-f', 'json']);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toBe(
      'missing.ttl: error: missing.ttl does not exist; nothing was read from it.\n' +
        '  hint: give a file, a folder, or - for standard input; relative paths start from the working folder\n',
    );
  });
});

describe('machine formats on stdout', () => {
  it('keep stdout pure JSON and put each input error on stderr with file, line and column', async () => {
    const broken = `${PREFIXES}nv:Bogie rdfs:subClassOf nv:Component .\nnv:Wheel rdfs:subClassOf nv:Bogie\nnv:Axle rdfs:subClassOf nv:Bogie .\n`;
    const dir = folderWith({ 'broken.ttl': broken });
    const result = await run(dir, ['check', 'broken.ttl', '-f', 'json']);
    expect(result.code).toBe(2);
    expect(JSON.parse(result.out).inputErrors[0]).toMatchObject({ file: 'broken.ttl', line: 5, column: 1 });
    expect(result.err).toMatch(/^broken\.ttl:5:1: error: Turtle syntax error: .*\n {2}hint: /);
  });

  it('print nothing on stderr for a clean run', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', '-f', 'sarif']);
    expect(result.code).toBe(1);
    expect(result.err).toBe('');
  });
});

describe('--quiet', () => {
  it('says how many findings below the threshold it left out, since the summary no longer counts them', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', '-q']);
    expect(result.code).toBe(1);
    expect(result.out).toContain('subclass-cycle');
    expect(result.out).not.toContain('orphan-class');
    expect(result.out.endsWith('--quiet: 1 note below level error not shown (the counts above leave them out); run without -q to see them\n')).toBe(true);
  });

  it('adds nothing when it hides nothing', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', '-q', '--fail-on', 'note']);
    expect(result.out).toContain('orphan-class');
    expect(result.out).not.toContain('--quiet');
  });
});

describe('files a folder holds that are not read', () => {
  it('are named in one input warning, while the config file in use is not', async () => {
    const dir = folderWith({
      'data/assets.ttl': CYCLE_AND_ORPHAN,
      'data/README.md': '# notes',
      'data/extra/build.xml': '<?xml version="1.0"?><project/>',
      'data/isapart.yaml': `scope: [${NV}]\n`,
    });
    const result = await run(dir, ['check', 'data', '-f', 'json']);
    expect(result.code).toBe(1);
    const report = JSON.parse(result.out);
    expect(report.inputWarnings).toEqual([
      {
        file: 'data',
        line: 0,
        column: 0,
        message:
          'under this folder 2 files were not read, as their names do not end in .ttl, .trig, .nt, .nq, .rdf, .owl, .jsonld (or those with .gz): README.md, extra/build.xml',
        hint: 'name an RDF file on the command line to read it whatever its extension (an .xml file is then read as RDF/XML; any other syntax is told from its content)',
      },
    ]);
  });

  it('name the hidden folders and node_modules that were not walked, apart from the files', async () => {
    const dir = folderWith({ 'data/assets.ttl': CYCLE_AND_ORPHAN, 'data/.git/config.ttl': CYCLE_AND_ORPHAN, 'data/notes.txt': 'x' });
    const result = await run(dir, ['check', 'data', '-f', 'json']);
    expect(JSON.parse(result.out).inputWarnings[0].message).toBe(
      'under this folder 1 file was not read, as its name does not end in .ttl, .trig, .nt, .nq, .rdf, .owl, .jsonld (or those with .gz): notes.txt; 1 folder was not walked (hidden folders and node_modules): .git/',
    );
  });

  it('are counted past the first five names', async () => {
    const files: Record<string, string> = { 'data/assets.ttl': CYCLE_AND_ORPHAN };
    for (let index = 1; index <= 7; index++) files[`data/note-${index}.txt`] = 'x';
    const result = await run(folderWith(files), ['check', 'data', '-f', 'json']);
    expect(JSON.parse(result.out).inputWarnings[0].message).toMatch(/^under this folder 7 files were not read, .*: note-1\.txt, note-2\.txt, note-3\.txt, note-4\.txt, note-5\.txt and 2 more$/);
  });
});

describe('scope prefixes and roots that match nothing', () => {
  it('warn, so that a prefixed name given as --scope does not silently put everything out of scope', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN });
    const result = await run(dir, ['check', 'data.ttl', '--scope', 'nv:', '--root', `${NV}def/Aset`]);
    expect(result.code).toBe(0);
    expect(result.out).toContain('input warnings (2)');
    expect(result.out).toContain('<command line>  warning  the scope prefix `nv:` starts no IRI of the linted graph, so it puts nothing in scope');
    expect(result.out).toContain(`<command line>  warning  the root \`${NV}def/Aset\` is not a node of the linted graph`);
  });

  it('say nothing for a prefix that matches', async () => {
    const result = await run(folderWith({ 'data.ttl': CYCLE_AND_ORPHAN }), ['check', 'data.ttl', '--scope', NV, '-f', 'json']);
    expect(JSON.parse(result.out).inputWarnings).toEqual([]);
  });
});

describe('allow comments', () => {
  it('naming an unknown rule are an error at the comment with the nearest id, not an unused-allow note', async () => {
    const text = `${PREFIXES}nv:Car rdfs:subClassOf nv:Car . # isapart-allow subclass-cycel: merged next sprint\n`;
    const result = await run(folderWith({ 'data.ttl': text }), ['check', 'data.ttl', '-f', 'json']);
    expect(result.code).toBe(2);
    const report = JSON.parse(result.out);
    expect(report.inputErrors).toHaveLength(1);
    expect(report.inputErrors[0]).toMatchObject({
      file: 'data.ttl',
      line: 3,
      column: 33, // the `#` of the comment
      message: 'unknown rule id `subclass-cycel` in an isapart-allow comment; it suppresses nothing',
    });
    expect(report.inputErrors[0].hint).toMatch(/^did you mean `subclass-cycle`\?/);
    expect(report.findings.map((finding: { ruleId: string }) => finding.ruleId)).toEqual(['subclass-cycle']);
  });
});

describe('config problems through the command line', () => {
  it('place a missing rule-dirs folder at its line in isapart.yaml, once', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN, 'isapart.yaml': 'rules: { orphan-class: off }\nrule-dirs: [./team-rules]\n' });
    const result = await run(dir, ['check', 'data.ttl', '-f', 'json']);
    expect(result.code).toBe(2);
    const errors = JSON.parse(result.out).inputErrors;
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ file: 'isapart.yaml', line: 2, column: 13 });
    expect(errors[0].message).toContain('the rule folder `./team-rules` in `rule-dirs` does not exist');
  });

  it('suggest the key meant by swapped letters', async () => {
    const dir = folderWith({ 'data.ttl': CYCLE_AND_ORPHAN, 'isapart.yaml': `scpoe: [${NV}]\n` });
    const result = await run(dir, ['check', 'data.ttl']);
    expect(result.code).toBe(2);
    expect(result.out).toContain('isapart.yaml:1:1  error    unknown key `scpoe`\n      hint: did you mean `scope`?');
  });

  it('name a missing -c file without a made-up line, in plain words', async () => {
    const result = await run(folderWith({ 'data.ttl': CYCLE_AND_ORPHAN }), ['check', 'data.ttl', '-c', 'nope.yaml']);
    expect(result.code).toBe(2);
    expect(result.out).toContain('  nope.yaml  error    the config file cannot be read: there is no such file\n');
  });

  it('show option errors against the command line without a line number', async () => {
    const result = await run(folderWith({ 'data.ttl': CYCLE_AND_ORPHAN }), ['check', 'data.ttl', '--preset', 'skso']);
    expect(result.code).toBe(2);
    expect(result.out).toContain('  <command line>  error    --preset: unknown preset `skso`\n      hint: did you mean `skos`?');
  });
});

describe('rules, explain and the program help', () => {
  it('explain suggests the nearest rule id for a typo', async () => {
    const result = await run(folderWith({}), ['explain', 'kind-and-prat']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/^isapart: no rule 'kind-and-prat'\n {2}hint: did you mean `kind-and-part`\?/);
  });

  it('rules takes -f like check, and --no-color', async () => {
    const dir = folderWith({});
    const terminal = fakeTerminal(dir, '', true);
    expect(await main(['rules', '--no-color'], terminal)).toBe(0);
    expect(terminal.stdout.join('')).not.toMatch(/\u001b\[/);
    const coloured = fakeTerminal(dir, '', true);
    await main(['rules'], coloured);
    expect(coloured.stdout.join('')).toMatch(/\u001b\[/);
    const json = await run(dir, ['rules', '-f', 'json']);
    expect(JSON.parse(json.out).format).toBe('isapart-rules');
  });

  it('the top-level help shows how to start and the exit codes', async () => {
    const result = await run(folderWith({}), ['--help']);
    expect(result.code).toBe(0);
    expect(result.out).toContain('$ isapart check extract.ttl');
    expect(result.out).toContain('$ isapart explain kind-and-part');
    expect(result.out).toContain('Exit codes: 0 nothing at or above --fail-on; 1 findings at or above it; 2 a usage, config or input error.');
  });
});

describe('input with no statements', () => {
  it('passes, but warns that nothing was linted', async () => {
    const result = await run(folderWith({}), ['check', '-', '-f', 'json'], '# an export that came out empty\n');
    expect(result.code).toBe(0);
    expect(JSON.parse(result.out).inputWarnings).toEqual([
      {
        file: '<stdin>',
        line: 0,
        column: 0,
        message: '<stdin> holds no RDF statement, so nothing was linted',
        hint: 'check that the export or the command feeding standard input produced data',
      },
    ]);
  });

  it('does not warn when one file of several has statements', async () => {
    const result = await run(folderWith({ 'a.ttl': CYCLE_AND_ORPHAN, 'b.ttl': PREFIXES }), ['check', '.', '-f', 'json']);
    expect(JSON.parse(result.out).inputWarnings).toEqual([]);
  });
});
