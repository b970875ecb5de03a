// Push-down on the demo graph: the oxigraph store gives exactly the in-memory findings.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/load-config.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { loadSources } from '../../src/load/sources.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { bothWays, comparable } from './sparql-harness.js';

const DEMO = path.resolve(import.meta.dirname, '../../fixtures/demo');

describe('push-down on the demo', () => {
  it('gives the in-memory findings of every built-in rule', async () => {
    const { config, errors } = loadConfig(path.join(DEMO, 'isapart.yaml'));
    expect(errors).toEqual([]);
    const loaded = await loadSources([DEMO], { cwd: DEMO });
    const rules = loadBuiltinRules().rules;
    const setting = { roleMap: buildRoleMap(config.presets, config.roles), scope: config.scope, roots: config.roots };
    const { memory, pushed } = bothWays(loaded.sources, rules, setting);
    expect(memory.length).toBeGreaterThan(5);
    expect(comparable(pushed)).toEqual(comparable(memory));
  });
});
