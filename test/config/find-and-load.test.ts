// Specification of findConfigFile (upward search), loadConfig, checkRuleIds and mergeCommandLine.
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkRuleIds, COMMAND_LINE_SOURCE, emptyConfig, findConfigFile, loadConfig, mergeCommandLine, parseConfig } from '../../src/config/load-config.js';

const NV = 'https://data.northvale-rail.example/';
/** The built-in rule ids of design.md's "Built-in rules" table. */
const BUILT_IN_IDS = ['subclass-cycle', 'part-cycle', 'kind-and-part', 'instance-and-subclass', 'orphan-class', 'redundant-subclass', 'disjoint-overlap', 'individual-as-class', 'deprecated-in-use'];

describe('findConfigFile', () => {
  let root: string;

  beforeAll(() => {
    // root/isapart.yaml, root/graphs/rolling-stock/units.ttl, root/graphs/infra/isapart.yaml, root/graphs/infra/track/lines.ttl
    root = mkdtempSync(path.join(tmpdir(), 'isapart-config-'));
    mkdirSync(path.join(root, 'graphs', 'rolling-stock'), { recursive: true });
    mkdirSync(path.join(root, 'graphs', 'infra', 'track'), { recursive: true });
    mkdirSync(path.join(root, 'graphs', 'infra', 'signals', 'isapart.yaml'), { recursive: true });
    writeFileSync(path.join(root, 'isapart.yaml'), 'presets: [rdfs]\n');
    writeFileSync(path.join(root, 'graphs', 'infra', 'isapart.yaml'), 'presets: [rdfs, obo]\n');
    writeFileSync(path.join(root, 'graphs', 'rolling-stock', 'units.ttl'), '');
    writeFileSync(path.join(root, 'graphs', 'infra', 'track', 'lines.ttl'), '');
  });

  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('finds the nearest isapart.yaml above a file', () => {
    expect(findConfigFile(path.join(root, 'graphs', 'rolling-stock', 'units.ttl'))).toBe(path.join(root, 'isapart.yaml'));
    expect(findConfigFile(path.join(root, 'graphs', 'infra', 'track', 'lines.ttl'))).toBe(path.join(root, 'graphs', 'infra', 'isapart.yaml'));
  });

  it('starts in the folder itself when given a folder', () => {
    expect(findConfigFile(path.join(root, 'graphs', 'infra'))).toBe(path.join(root, 'graphs', 'infra', 'isapart.yaml'));
    expect(findConfigFile(root)).toBe(path.join(root, 'isapart.yaml'));
  });

  it('skips a folder named isapart.yaml', () => {
    expect(findConfigFile(path.join(root, 'graphs', 'infra', 'signals'))).toBe(path.join(root, 'graphs', 'infra', 'isapart.yaml'));
  });

  it('searches from the folder of a path that does not exist yet', () => {
    expect(findConfigFile(path.join(root, 'graphs', 'rolling-stock', 'missing.ttl'))).toBe(path.join(root, 'isapart.yaml'));
  });

  it('stops at the filesystem root when there is none', () => {
    const bare = mkdtempSync(path.join(tmpdir(), 'isapart-none-'));
    try {
      // The folders from the temp folder up to the root, listed by splitting the path, nearest first.
      const parts = path.resolve(tmpdir()).split(path.sep);
      const ancestors = parts.map((_, index) => parts.slice(0, parts.length - index).join(path.sep) || path.sep);
      const stray = ancestors.map((folder) => path.join(folder, 'isapart.yaml')).find((file) => existsSync(file));
      // Normally there is no isapart.yaml above the temp folder, and the search ends with nothing.
      expect(findConfigFile(bare)).toBe(stray);
      expect(findConfigFile(path.join(bare, 'deep', 'er', 'file.ttl'))).toBe(stray);
    } finally {
      rmSync(bare, { recursive: true, force: true });
    }
  });

  it('loads the found file with its path on the config', () => {
    const file = path.join(root, 'graphs', 'infra', 'isapart.yaml');
    const { config, errors } = loadConfig(file);
    expect(errors).toEqual([]);
    expect(config.file).toBe(file);
    expect(config.presets).toEqual(['rdfs', 'obo']);
  });
});

describe('loadConfig', () => {
  it('reports a missing file without a line (there is none) in plain words, with a hint, and returns the defaults', () => {
    const missing = path.join(tmpdir(), 'isapart-no-such-folder', 'isapart.yaml');
    const { config, errors } = loadConfig(missing);
    expect(config).toEqual({ ...emptyConfig(), file: missing });
    expect(errors).toEqual([
      {
        file: missing,
        line: 0,
        column: 0,
        message: 'the config file cannot be read: there is no such file',
        hint: 'check the path given with --config (a YAML file such as isapart.yaml), or leave the option out to use the nearest isapart.yaml upward from the first path',
      },
    ]);
  });

  it('says so when the config path is a folder', () => {
    const folder = mkdtempSync(path.join(tmpdir(), 'isapart-config-folder-'));
    expect(loadConfig(folder).errors.map((error) => error.message)).toEqual(['the config file cannot be read: it is a folder, not a file']);
  });

  it('reports a rule-dirs folder that does not exist, or is a file, at its item with the folder it looked for', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-rule-dirs-'));
    mkdirSync(path.join(dir, 'team-rules'));
    writeFileSync(path.join(dir, 'notes.txt'), 'not a folder');
    const file = path.join(dir, 'isapart.yaml');
    writeFileSync(file, 'rule-dirs:\n  - ./team-rules\n  - ./team-rulez\n  - notes.txt\n');
    const { config, errors } = loadConfig(file);
    expect(config.ruleDirs).toEqual([path.join(dir, 'team-rules')]);
    expect(errors.map((error) => `${error.line}:${error.column} ${error.message}`)).toEqual([
      `3:5 the rule folder \`./team-rulez\` in \`rule-dirs\` does not exist (looked for ${path.join(dir, 'team-rulez')}); its rules were not loaded`,
      `4:5 the rule folder \`notes.txt\` in \`rule-dirs\` is a file, not a folder (${path.join(dir, 'notes.txt')}); its rules were not loaded`,
    ]);
    expect(errors[0].hint).toBe(`paths in rule-dirs are relative to the folder of this config file (${dir}); create the folder or correct the path`);
  });

  it('leaves rule-dirs folders unchecked when only text is parsed', () => {
    const { config, errors } = parseConfig('rule-dirs: [./not-there]\n', '/projects/northvale/isapart.yaml');
    expect(errors).toEqual([]);
    expect(config.ruleDirs).toEqual([path.resolve('/projects/northvale/not-there')]);
  });
});

describe('emptyConfig', () => {
  it('has the default presets and nothing else, fresh on every call', () => {
    const config = emptyConfig();
    expect(config).toEqual({ presets: ['rdfs', 'owl', 'dcterms', 'schema', 'obo'], roles: {}, scope: [], roots: [], rules: {}, ruleLines: {}, ruleDirs: [], allow: [], contexts: {} });
    config.presets.push('skos');
    expect(emptyConfig().presets).not.toContain('skos');
  });
});

describe('checkRuleIds', () => {
  const FILE = '/projects/northvale/isapart.yaml';
  const text = [
    'rules:',
    '  redundant-subclass: note',
    '  orphan-clas: off',
    'allow:',
    `  - { rule: kind-and-part, focus: ${NV}def/Pantograph }`,
    `  - { rule: part-cycles, focus: ${NV}def/Bogie }`,
    `  - { rule: team-naming, focus: ${NV}def/Bogie }`,
  ].join('\n');

  it('reports unknown ids in rules: and allow: at their lines with the nearest id', () => {
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(checkRuleIds(config, BUILT_IN_IDS)).toEqual([
      { file: FILE, line: 3, column: 1, message: 'unknown rule id `orphan-clas` in `rules`', hint: `did you mean \`orphan-class\`? (known rule ids: ${BUILT_IN_IDS.join(', ')})` },
      { file: FILE, line: 6, column: 1, message: 'unknown rule id `part-cycles` in an `allow` entry', hint: `did you mean \`part-cycle\`? (known rule ids: ${BUILT_IN_IDS.join(', ')})` },
      { file: FILE, line: 7, column: 1, message: 'unknown rule id `team-naming` in an `allow` entry', hint: `known rule ids: ${BUILT_IN_IDS.join(', ')}` },
    ]);
  });

  it('accepts ids of rules loaded from rule-dirs', () => {
    const { config } = parseConfig(text, FILE);
    expect(checkRuleIds(config, [...BUILT_IN_IDS, 'orphan-clas', 'part-cycles', 'team-naming'])).toEqual([]);
  });

  it('reports an unknown id given with --rule against the command line', () => {
    const { config } = mergeCommandLine(emptyConfig(), { ruleLevels: { 'kind-and-parts': 'off' } });
    expect(checkRuleIds(config, BUILT_IN_IDS)).toEqual([
      { file: COMMAND_LINE_SOURCE, line: 0, column: 0, message: '--rule: unknown rule id `kind-and-parts`', hint: `did you mean \`kind-and-part\`? (known rule ids: ${BUILT_IN_IDS.join(', ')})` },
    ]);
  });
});

describe('mergeCommandLine', () => {
  it('adds presets, scope prefixes and roots, and sets rule levels, without changing its input', () => {
    const base = parseConfig(`presets: [rdfs]\nscope: [${NV}]\nrules: { orphan-class: off }\n`, '/p/isapart.yaml').config;
    const before = JSON.stringify(base);
    const { config, errors } = mergeCommandLine(base, {
      presets: ['skos', 'rdfs'],
      scope: ['https://data.northvale-rail.example/stations/', NV],
      roots: [`${NV}def/Asset`],
      ruleLevels: { 'orphan-class': 'warning', 'part-cycle': 'off' },
    });
    expect(errors).toEqual([]);
    expect(config.presets).toEqual(['rdfs', 'skos']);
    expect(config.scope).toEqual([NV, 'https://data.northvale-rail.example/stations/']);
    expect(config.roots).toEqual([`${NV}def/Asset`]);
    expect(config.rules).toEqual({ 'orphan-class': 'warning', 'part-cycle': 'off' });
    expect(config.ruleLines).toEqual({ 'orphan-class': 3 });
    expect(JSON.stringify(base)).toBe(before);
  });

  it('reports bad values naming the option, and keeps the good ones', () => {
    const { config, errors } = mergeCommandLine(emptyConfig(), {
      presets: ['skoss'],
      scope: ['northvale/'],
      roots: [`${NV}def/Rolling Stock`, `${NV}def/Asset`],
      ruleLevels: { 'orphan-class': 'silent' },
    });
    expect(errors.map((error) => `${error.file} ${error.message} | ${error.hint}`)).toEqual([
      '<command line> --preset: unknown preset `skoss` | did you mean `skos`? (known presets: rdfs, owl, dcterms, schema, obo, skos)',
      '<command line> --scope: `northvale/` is not an absolute IRI: it has no scheme; an absolute IRI starts with a scheme such as `https:` | write a full IRI such as --scope https://data.northvale-rail.example/',
      '<command line> --root: `https://data.northvale-rail.example/def/Rolling Stock` is not an absolute IRI: it contains a space at character 48 | write a full IRI such as --root https://data.northvale-rail.example/def/Asset',
      '<command line> --rule: `orphan-class=silent` has an unknown level `silent` | levels: error, warning, note, off',
    ]);
    expect(config.presets).toEqual(['rdfs', 'owl', 'dcterms', 'schema', 'obo']);
    expect(config.roots).toEqual([`${NV}def/Asset`]);
    expect(config.rules).toEqual({});
  });

  it('reports a conflict that an added preset creates with the config roles:, once', () => {
    const base = parseConfig('roles:\n  part-of: [http://www.w3.org/2004/02/skos/core#broader]\n', '/p/isapart.yaml');
    expect(base.errors).toEqual([]);
    const { errors } = mergeCommandLine(base.config, { presets: ['skos'] });
    expect(errors.map((error) => error.message)).toEqual([
      '--preset: predicate <http://www.w3.org/2004/02/skos/core#broader> is mapped to subclass-of by preset skos and to part-of by roles: part-of',
    ]);
    expect(mergeCommandLine(base.config, { scope: [NV] }).errors).toEqual([]);
  });
});
