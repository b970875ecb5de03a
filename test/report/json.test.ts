// toJson: the versioned findings document, validated with ajv against docs/findings.schema.json.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import { JSON_REPORT_FORMAT, JSON_REPORT_VERSION, toJson } from '../../src/report/json.js';
import {
  ALL_FINDINGS,
  ALLOWED_BY_CONFIG,
  DEPRECATED_FINDING,
  PANTOGRAPH_FINDING,
  UNUSED_ALLOW_FINDING,
  XSD_BOOLEAN,
  context,
} from './report-fixtures.js';

const schema = JSON.parse(readFileSync(path.resolve(__dirname, '../../docs/findings.schema.json'), 'utf8'));
// ajv's default class reads JSON Schema draft-07, the draft the document's schema names.
const validate = new Ajv({ allErrors: true }).compile(schema);

function fullDocument() {
  return JSON.parse(toJson(ALL_FINDINGS, context({ problems: true })));
}

function findingFor(document: any, fingerprint: string) {
  return document.findings.find((finding: any) => finding.fingerprint === fingerprint);
}

describe('toJson', () => {
  it('validates against docs/findings.schema.json, with and without problems', () => {
    const full = fullDocument();
    expect(validate(full)).toBe(true);
    expect(validate.errors ?? []).toEqual([]);
    expect(validate(JSON.parse(toJson([], context())))).toBe(true);
  });

  it('is checked by a schema that rejects a wrong document', () => {
    const document = fullDocument();
    document.version = 1;
    expect(validate(document)).toBe(false);
    const extraKey = fullDocument();
    extraKey.findings[0].position = {};
    expect(validate(extraKey)).toBe(false);
    const badLiteral = fullDocument();
    findingFor(badLiteral, DEPRECATED_FINDING.fingerprint).evidence[1].object = { value: 'true' };
    expect(validate(badLiteral)).toBe(false);
  });

  it('keeps its keys in a fixed order, 2-space indentation and a trailing newline', () => {
    const text = toJson(ALL_FINDINGS, context({ problems: true }));
    const document = JSON.parse(text);
    expect(text).toBe(`${JSON.stringify(document, null, 2)}\n`);
    expect(Object.keys(document)).toEqual(['format', 'version', 'tool', 'configFile', 'summary', 'inputs', 'findings', 'inputErrors', 'inputWarnings', 'ruleFailures']);
    expect(Object.keys(findingFor(document, PANTOGRAPH_FINDING.fingerprint))).toEqual(['ruleId', 'level', 'focus', 'nodes', 'message', 'fingerprint', 'evidence', 'fix']);
    expect(Object.keys(findingFor(document, ALLOWED_BY_CONFIG.fingerprint))).toEqual(['ruleId', 'level', 'focus', 'nodes', 'message', 'fingerprint', 'evidence', 'suppression']);
    expect(document.format).toBe(JSON_REPORT_FORMAT);
    expect(document.version).toBe(JSON_REPORT_VERSION);
  });

  it('counts findings per level apart from the suppressed ones, and what was read', () => {
    expect(fullDocument().summary).toEqual({
      errors: 1,
      warnings: 2,
      notes: 1,
      suppressed: 3,
      inputErrors: 2,
      ruleFailures: 1,
      files: 3,
      statements: 173,
    });
  });

  it('writes paths relative to the run folder', () => {
    const document = fullDocument();
    expect(document.configFile).toBe('isapart.yaml');
    expect(document.inputs.map((input: any) => input.file)).toEqual(['data/rolling-stock.ttl', 'data/infrastructure.trig', 'data/signal plans/signals.nt']);
    expect(document.inputErrors[0]).toEqual({
      file: 'data/broken.ttl',
      line: 4,
      column: 17,
      message: 'Expected a term after the predicate, found "."',
      hint: 'write an object before the full stop',
    });
    expect(findingFor(document, ALLOWED_BY_CONFIG.fingerprint).suppression).toEqual({ kind: 'external', justification: 'legacy catalogue term', file: 'isapart.yaml', line: 9 });
    expect(findingFor(document, UNUSED_ALLOW_FINDING.fingerprint).location).toEqual({ file: 'data/rolling-stock.ttl', line: 31, column: 40 });
  });

  it('lists input warnings apart from input errors', () => {
    const document = fullDocument();
    expect(document.inputWarnings).toEqual([
      { file: 'data/rolling-stock.ttl', line: 12, column: 1, message: 'the object of dcterms:isPartOf is a literal, so no part-of edge was made', hint: 'write the whole as an IRI' },
    ]);
  });

  it('writes a literal object as {value, datatype, language} and a fix as statements', () => {
    const document = fullDocument();
    expect(findingFor(document, DEPRECATED_FINDING.fingerprint).evidence[1].object).toEqual({ value: 'true', datatype: XSD_BOOLEAN, language: '' });
    expect(findingFor(document, PANTOGRAPH_FINDING.fingerprint).fix).toEqual({
      remove: [
        {
          subject: 'https://data.northvale-rail.example/def/Pantograph',
          predicate: 'http://purl.org/dc/terms/isPartOf',
          object: 'https://data.northvale-rail.example/def/Locomotive',
          graph: '',
          file: 'data/rolling-stock.ttl',
          line: 12,
          column: 1,
        },
      ],
    });
  });

  it('lists every finding, ordered by position whatever the input order', () => {
    const document = fullDocument();
    expect(document.findings).toHaveLength(ALL_FINDINGS.length);
    const places = document.findings.map((finding: any) => {
      const place = finding.evidence[0] ?? finding.location;
      return `${place.file}:${place.line}`;
    });
    expect(places).toEqual([
      'data/infrastructure.trig:7',
      'data/infrastructure.trig:30',
      'data/rolling-stock.ttl:12',
      'data/rolling-stock.ttl:20',
      'data/rolling-stock.ttl:24',
      'data/rolling-stock.ttl:31',
      'data/signal plans/signals.nt:3',
    ]);
    expect(toJson([...ALL_FINDINGS].reverse(), context({ problems: true }))).toBe(toJson(ALL_FINDINGS, context({ problems: true })));
  });
});
