// Specification of the warnings for scope prefixes and roots that name nothing in the linted graph.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRESETS } from '../../src/config/config.js';
import { COMMAND_LINE_SOURCE, emptyConfig } from '../../src/config/load-config.js';
import { unmatchedSettingWarnings } from '../../src/config/unmatched-settings.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import { parseSource } from '../../src/load/parse.js';
import { buildRoleMap } from '../../src/roles/role-map.js';

const NV = 'https://data.northvale-rail.example/';
const CONFIG_FILE = '/projects/northvale/isapart.yaml';
const TURTLE = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <${NV}def/> .
nv:Bogie rdfs:subClassOf nv:Component .
nv:Component rdfs:subClassOf nv:Asset .
`;

/** The graph of a Turtle text, built the way a run builds it (default presets, no extra roles). */
function graphOf(text: string, scope: { prefixes: string[]; roots: string[] }) {
  return buildHierarchyGraph([parseSource(text, 'assets.ttl', 'turtle')], buildRoleMap(DEFAULT_PRESETS, {}), scope);
}

describe('unmatchedSettingWarnings', () => {
  it('warns for a scope prefix that starts no IRI, hinting that prefixed names are not expanded', () => {
    const config = { ...emptyConfig(), file: CONFIG_FILE, scope: [NV, 'nv:'] };
    const warnings = unmatchedSettingWarnings(graphOf(TURTLE, { prefixes: config.scope, roots: [] }), config, { commandLineScope: ['nv:'], commandLineRoots: [] });
    expect(warnings).toEqual([
      {
        file: COMMAND_LINE_SOURCE,
        line: 0,
        column: 0,
        message: 'the scope prefix `nv:` starts no IRI of the linted graph, so it puts nothing in scope',
        hint: 'write the namespace of your own terms in full, such as https://data.northvale-rail.example/. Prefixed names are not expanded in settings: write the full namespace IRI.',
      },
    ]);
  });

  it('warns for a root that is no node of the graph, against the config file when the config named it', () => {
    const misspelt = `${NV}def/Aset`;
    const config = { ...emptyConfig(), file: CONFIG_FILE, roots: [`${NV}def/Asset`, misspelt] };
    const warnings = unmatchedSettingWarnings(graphOf(TURTLE, { prefixes: [], roots: config.roots }), config, { commandLineScope: [], commandLineRoots: [] });
    expect(warnings.map((warning) => `${warning.file} ${warning.message}`)).toEqual([`${CONFIG_FILE} the root \`${misspelt}\` is not a node of the linted graph`]);
  });

  it('says nothing when every prefix and root matches, or when the graph is empty', () => {
    const config = { ...emptyConfig(), scope: [`${NV}def/`], roots: [`${NV}def/Asset`] };
    const origins = { commandLineScope: [], commandLineRoots: [] };
    expect(unmatchedSettingWarnings(graphOf(TURTLE, { prefixes: config.scope, roots: config.roots }), config, origins)).toEqual([]);
    expect(unmatchedSettingWarnings(graphOf('', { prefixes: ['nv:'], roots: [] }), { ...config, scope: ['nv:'] }, origins)).toEqual([]);
  });

  it('does not call a URN namespace a prefixed name', () => {
    const config = { ...emptyConfig(), scope: ['urn:northvale:asset:'] };
    const [warning] = unmatchedSettingWarnings(graphOf(TURTLE, { prefixes: config.scope, roots: [] }), config, { commandLineScope: [], commandLineRoots: [] });
    expect(warning.hint).not.toContain('Prefixed names');
    expect(warning.file).toBe(COMMAND_LINE_SOURCE);
  });
});
