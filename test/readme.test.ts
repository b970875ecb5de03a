// The README's rules table is the output of `isapart rules --format markdown`, kept in sync.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { rulesInUse } from '../src/check.js';
import { rulesToMarkdown } from '../src/report/rules-list.js';

const root = path.resolve(__dirname, '..');

describe('README', () => {
  it('opens with one paragraph, then the demo and test commands', () => {
    const readme = readFileSync(path.join(root, 'README.md'), 'utf8');
    const body = readme.split('\n').slice(1).join('\n').trim();
    const [paragraph, commands] = body.split(/\n\s*\n/);
    expect(paragraph.length).toBeGreaterThan(100);
    expect(commands).toContain('npm ci && npm run demo');
    expect(commands).toContain('npm ci && npm test');
  });

  it('carries the rules table exactly as `isapart rules --format markdown` prints it', () => {
    const readme = readFileSync(path.join(root, 'README.md'), 'utf8');
    const match = /<!-- rules:start -->\n([\s\S]*?)<!-- rules:end -->/.exec(readme);
    expect(match).not.toBeNull();
    const { rules, errors } = rulesInUse({ cwd: root, paths: ['.'] });
    expect(errors).toEqual([]);
    expect(match![1]).toBe(rulesToMarkdown(rules));
  });
});
