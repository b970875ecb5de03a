// `isapart check` on RDF/XML and JSON-LD: --base, contexts from the config, exit codes and every report format.
import { describe, expect, it } from 'vitest';
import { folderWith, runCli } from './terminal-fake.js';

const NV = 'https://data.northvale-rail.example/def/';
const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const RDFS = 'http://www.w3.org/2000/01/rdf-schema#';
// Relative IRIs only, so what they name depends on the base.
const CYCLE_RDF_XML = `<?xml version="1.0"?>
<rdf:RDF xmlns:rdf="${RDF_NS}" xmlns:rdfs="${RDFS}">
  <rdf:Description rdf:about="Car">
    <rdfs:subClassOf rdf:resource="Vehicle"/>
  </rdf:Description>
  <rdf:Description rdf:about="Vehicle">
    <rdfs:subClassOf rdf:resource="Car"/>
  </rdf:Description>
</rdf:RDF>
`;
const CONTEXT_IRI = 'https://data.northvale-rail.example/context.jsonld';
const CONTEXT = `{ "@context": { "nv": "${NV}", "kindOf": { "@id": "${RDFS}subClassOf", "@type": "@id" } } }`;
const CYCLE_JSON_LD = `{
  "@context": "${CONTEXT_IRI}",
  "@graph": [
    { "@id": "nv:Car", "kindOf": "nv:Vehicle" },
    { "@id": "nv:Vehicle", "kindOf": "nv:Car" }
  ]
}
`;

describe('isapart check on RDF/XML', () => {
  it('resolves relative IRIs against --base and reports the cycle at the elements that state it', async () => {
    const dir = folderWith({ 'vocab.owl': CYCLE_RDF_XML });
    const result = await runCli(dir, ['check', 'vocab.owl', '--base', NV, '-f', 'json']);
    expect(result.code).toBe(1);
    const report = JSON.parse(result.out);
    expect(report.inputs).toEqual([{ file: 'vocab.owl', format: 'rdf-xml', statements: 2 }]);
    const cycle = report.findings.find((finding: { ruleId: string }) => finding.ruleId === 'subclass-cycle');
    expect([...cycle.nodes].sort()).toEqual([`${NV}Car`, `${NV}Vehicle`]);
    expect(cycle.evidence.map((statement: { line: number; column: number }) => [statement.line, statement.column]).sort()).toEqual([
      [4, 5],
      [7, 5],
    ]);
  });

  it('refuses a --base that is not an absolute IRI, with exit 2', async () => {
    const dir = folderWith({ 'vocab.owl': CYCLE_RDF_XML });
    const result = await runCli(dir, ['check', 'vocab.owl', '--base', 'def/']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/^isapart: --base def\/: not an absolute IRI: /);
    expect(result.err).toContain('hint: ');
  });

  it('names the media type of RDF/XML in SARIF', async () => {
    const dir = folderWith({ 'vocab.owl': CYCLE_RDF_XML });
    const result = await runCli(dir, ['check', 'vocab.owl', '--base', NV, '-f', 'sarif']);
    const artifacts = JSON.parse(result.out).runs[0].artifacts;
    expect(artifacts).toEqual([expect.objectContaining({ mimeType: 'application/rdf+xml' })]);
  });

  it('reports a syntax error with file, line and column, exit 2, and lints the other files', async () => {
    const dir = folderWith({ 'a-broken.rdf': CYCLE_RDF_XML.replace('</rdf:RDF>', ''), 'b-cycle.owl': CYCLE_RDF_XML });
    const result = await runCli(dir, ['check', 'a-broken.rdf', 'b-cycle.owl', '--base', NV]);
    expect(result.code).toBe(2);
    expect(result.out).toMatch(/a-broken\.rdf:\d+:\d+/);
    expect(result.out).toContain('RDF/XML syntax error: unclosed tag: rdf:RDF');
    expect(result.out).toContain('subclass-cycle');
  });
});

describe('isapart check on JSON-LD', () => {
  it('reads a remote context from the copy the config maps it to', async () => {
    const dir = folderWith({
      'graph.jsonld': CYCLE_JSON_LD,
      'contexts/northvale.jsonld': CONTEXT,
      'isapart.yaml': `contexts:\n  ${CONTEXT_IRI}: ./contexts/northvale.jsonld\n`,
    });
    const result = await runCli(dir, ['check', 'graph.jsonld', '-f', 'json']);
    expect(result.code).toBe(1);
    const report = JSON.parse(result.out);
    expect(report.inputErrors).toEqual([]);
    const cycle = report.findings.find((finding: { ruleId: string }) => finding.ruleId === 'subclass-cycle');
    expect(cycle.evidence.map((statement: { line: number; column: number }) => [statement.line, statement.column]).sort()).toEqual([
      [4, 5],
      [5, 5],
    ]);
  });

  it('without a mapping: exit 2, an error naming the context IRI, printed on stderr for JSON output', async () => {
    const dir = folderWith({ 'graph.jsonld': CYCLE_JSON_LD });
    const result = await runCli(dir, ['check', 'graph.jsonld', '-f', 'json']);
    expect(result.code).toBe(2);
    const report = JSON.parse(result.out);
    expect(report.inputErrors).toHaveLength(1);
    expect(report.inputErrors[0]).toMatchObject({ file: 'graph.jsonld', line: 1, column: 1 });
    expect(report.inputErrors[0].message).toContain(`<${CONTEXT_IRI}> is remote`);
    expect(result.err).toContain(`graph.jsonld:1:1: error: the JSON-LD context <${CONTEXT_IRI}> is remote`);
  });

  it('names a key that maps to no IRI in an input warning, which leaves the exit code alone', async () => {
    const text = `{ "@id": "${NV}Bogie", "${RDFS}subClassOf": { "@id": "${NV}Component" }, "depotName": "North" }\n`;
    const dir = folderWith({ 'graph.jsonld': text });
    const result = await runCli(dir, ['check', 'graph.jsonld', '-f', 'json', '--root', `${NV}Component`]);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.out);
    expect(report.inputErrors).toEqual([]);
    expect(report.inputWarnings).toEqual([
      expect.objectContaining({ file: 'graph.jsonld', line: 1, column: 1, message: expect.stringContaining('the key "depotName" of this node object maps to no IRI') }),
    ]);
  });
});
