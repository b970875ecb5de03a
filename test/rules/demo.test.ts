// The Northvale Rail demo yields exactly the findings its README lists, and covers every rule.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { loadConfig } from '../../src/config/load-config.js';
import type { Finding } from '../../src/engine/finding.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';

const DEMO = new URL('../../fixtures/demo/', import.meta.url);
const BASE = 'https://data.northvale-rail.example/';

/** One row of the README's table of planted findings. */
interface PlantedFinding {
  rule: string;
  focus: string;
  file: string;
  outcome: string;
}

function plantedFindings(): PlantedFinding[] {
  const readme = readFileSync(new URL('README.md', DEMO), 'utf8');
  const table = readme.slice(readme.indexOf('## Planted findings'), readme.indexOf('## Not reported'));
  return table
    .split('\n')
    .filter((line) => line.startsWith('| ') && !line.startsWith('| rule ') && !line.startsWith('| ---'))
    .map((line) => {
      const [rule, focus, file, outcome] = line.split('|').slice(1, 5).map((cell) => cell.trim());
      return { rule, focus, file, outcome };
    });
}

/** Lints the demo as `npm run demo` does: the library entry point on the folder, its config found upward. */
async function lintDemo() {
  const folder = fileURLToPath(DEMO);
  const { config, errors: configErrors } = loadConfig(fileURLToPath(new URL('isapart.yaml', DEMO)));
  const result = await check({ paths: ['.'], cwd: folder });
  return { config, configErrors, result, graph: result.graph, findings: result.findings };
}

function outcomeOf(finding: Finding): string {
  if (finding.suppression?.kind === 'inSource') return 'suppressed in source';
  if (finding.suppression?.kind === 'external') return 'suppressed in config';
  return 'reported';
}

function row(finding: Finding): PlantedFinding {
  const file = finding.evidence[0]?.position.file ?? finding.location?.file ?? '';
  return { rule: finding.ruleId, focus: finding.focus.replace(BASE, ''), file, outcome: outcomeOf(finding) };
}

const byRow = (left: PlantedFinding, right: PlantedFinding): number =>
  `${left.rule} ${left.focus}`.localeCompare(`${right.rule} ${right.focus}`);

describe('fixtures/demo', async () => {
  const demo = await lintDemo();

  it('reads without errors: config, four sources in Turtle and N-Triples, every rule', () => {
    expect(demo.configErrors).toEqual([]);
    expect(demo.result.context.inputErrors).toEqual([]);
    expect(demo.result.context.ruleFailures).toEqual([]);
    expect(demo.result.context.configFile).toBe(fileURLToPath(new URL('isapart.yaml', DEMO)));
    expect(demo.result.context.sources.map((source) => [source.file, source.format])).toEqual([
      ['components.ttl', 'turtle'],
      ['depots.nt', 'n-triples'],
      ['infrastructure.ttl', 'turtle'],
      ['rolling-stock.ttl', 'turtle'],
    ]);
    const statements = demo.result.context.sources.reduce((sum, source) => sum + source.statements, 0);
    expect(statements).toBeGreaterThanOrEqual(150);
    expect(statements).toBeLessThanOrEqual(330);
    // The one input warning: this folder's README.md is not RDF and was not read.
    expect(demo.result.context.inputWarnings.map((warning) => warning.message)).toEqual([expect.stringContaining('README.md')]);
  });

  it('yields exactly the planted findings of its README', () => {
    const planted = plantedFindings();
    expect(planted.length).toBeGreaterThanOrEqual(10);
    expect(demo.findings.map(row).sort(byRow)).toEqual([...planted].sort(byRow));
  });

  it('has at least one reported finding of every built-in rule', () => {
    const reported = new Set(demo.findings.filter((finding) => finding.suppression === undefined).map((finding) => finding.ruleId));
    for (const rule of loadBuiltinRules().rules) expect(reported).toContain(rule.id);
  });

  it('maps Northvale\'s own part-of predicates, the inverse one turned round', () => {
    expect(demo.config.roles['part-of']).toEqual({ iri: [`${BASE}def/partOf`], inverse: [`${BASE}def/hasPart`] });
    const car = demo.graph.idOf(`${BASE}fleet/car-A101-1`);
    const unit = demo.graph.idOf(`${BASE}fleet/unit-A101`);
    // rolling-stock.ttl states `fleet:unit-A101 nv:hasPart fleet:car-A101-1`.
    expect(demo.graph.hasEdge('part-of', car, unit)).toBe(true);
    expect(demo.graph.hasEdge('part-of', unit, car)).toBe(false);
  });

  it('plants a part-of cycle across two files and a subclass cycle of three classes', () => {
    const partCycle = demo.findings.find((finding) => finding.ruleId === 'part-cycle');
    expect(new Set(partCycle?.evidence.map((statement) => statement.position.file))).toEqual(new Set(['rolling-stock.ttl', 'components.ttl']));
    const subclassCycle = demo.findings.find((finding) => finding.ruleId === 'subclass-cycle');
    expect(subclassCycle?.nodes.map((node) => node.replace(BASE, '')).sort()).toEqual(['def/RailVehicle', 'def/RollingStock', 'def/Vehicle']);
  });

  it('suppresses with an allow comment and with a config allow entry, and reports the unused comment', () => {
    const inSource = demo.findings.filter((finding) => finding.suppression?.kind === 'inSource');
    expect(inSource.map((finding) => finding.suppression?.justification)).toEqual([
      'the safety-case register reads only direct superclasses and must list brake control units under Component',
    ]);
    const external = demo.findings.filter((finding) => finding.suppression?.kind === 'external');
    expect(external.map((finding) => [finding.suppression?.file.endsWith('isapart.yaml'), finding.focus])).toEqual([[true, `${BASE}def/WorkOrder`]]);
    const unused = demo.findings.filter((finding) => finding.ruleId === 'unused-allow');
    expect(unused.map((finding) => [finding.location?.file, finding.location?.line])).toEqual([['components.ttl', 25]]);
  });

  it('states its disjointness once with owl:AllDisjointClasses, read as pairwise disjoint-with', () => {
    const id = (name: string): number => demo.graph.idOf(`${BASE}def/${name}`);
    expect(demo.graph.hasEdge('disjoint-with', id('Locomotive'), id('FreightWagon'))).toBe(true);
    expect(demo.graph.hasEdge('disjoint-with', id('FreightWagon'), id('PassengerCoach'))).toBe(true);
    expect(demo.graph.hasEdge('disjoint-with', id('Locomotive'), id('PassengerCoach'))).toBe(true);
  });
});
