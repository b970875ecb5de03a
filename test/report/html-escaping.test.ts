// The HTML report escapes every IRI, label, literal and message: markup in the data renders as text, never as elements.
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import type { Finding } from '../../src/engine/finding.js';
import { toHtml } from '../../src/report/html/html.js';
import { PAGE_SCRIPT } from '../../src/report/html/page-script.js';
import { folderWith } from '../cli/terminal-fake.js';
import { attribute, elements, parseReport, select, textOf } from './html-dom.js';
import { OWL_DEPRECATED, RDFS_SUBCLASS_OF, statement } from './report-fixtures.js';

const HOSTILE_LABEL = '<script>alert("label")</script> & <b>bold</b>';
// Turtle IRIs may hold & and ' (W3C RDF 1.1 Turtle, production [18] IRIREF excludes only <>"{}|^`\ and spaces).
const ODD_IRI = "https://data.northvale-rail.example/def/Car?kind=driving&side='a'";

const HOSTILE_TURTLE = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
nv:Vehicle rdfs:subClassOf <${ODD_IRI}> ; rdfs:label ${JSON.stringify(HOSTILE_LABEL)} .
<${ODD_IRI}> rdfs:subClassOf nv:Vehicle .
`;

/** The two scripts of the page: the one that marks it as scripted, and the page script. */
function expectOnlyOwnScripts(html: string): void {
  const { document, errors } = parseReport(html);
  expect(errors).toEqual([]);
  const scripts = select(document, 'script').map(textOf);
  expect(scripts).toEqual(["document.documentElement.classList.add('js');", PAGE_SCRIPT]);
  expect(select(document, 'b')).toEqual([]);
  expect(select(document, 'img')).toEqual([]);
}

describe('escaping in the HTML report', () => {
  it('renders a label with <script> and an IRI with & and quotes as text, from a real run', async () => {
    const folder = folderWith({ 'hostile.ttl': HOSTILE_TURTLE });
    const result = await check({ paths: ['hostile.ttl'], cwd: folder });
    const cycle = result.findings.find((finding) => finding.ruleId === 'subclass-cycle');
    expect(cycle).toBeDefined();
    const html = toHtml(result.findings, result.context);
    expectOnlyOwnScripts(html);
    const { document } = parseReport(html);
    const row = select(document, 'tbody', 'finding').find((body) => attribute(body, 'data-rule') === 'subclass-cycle')!;
    const text = textOf(row);
    expect(text).toContain(ODD_IRI);
    const terms = select(row, 'g', 'node').map((node) => attribute(node, 'data-term'));
    expect(terms).toContain(ODD_IRI);
    const labelled = select(row, 'g', 'node').find((node) => attribute(node, 'data-term') === 'https://data.northvale-rail.example/def/Vehicle')!;
    expect(textOf(select(labelled, 'title')[0])).toBe(`https://data.northvale-rail.example/def/Vehicle\n${HOSTILE_LABEL}`);
    expect(text).toContain(HOSTILE_LABEL);
  });

  it('renders a literal object and a message with markup as text', () => {
    const hostileLiteral = '</script><img src=x onerror=alert(1)>';
    const finding: Finding = {
      ruleId: 'deprecated-in-use',
      level: 'warning',
      focus: 'https://data.northvale-rail.example/def/SignalPost',
      nodes: ['https://data.northvale-rail.example/def/SignalPost'],
      message: 'a message with <img src=x> and </td></tr></table> in it',
      evidence: [
        statement({ subject: 'https://data.northvale-rail.example/def/SignalPost', predicate: OWL_DEPRECATED, object: { value: hostileLiteral, datatype: '', language: '' }, file: '/srv/nv/signals.ttl', line: 3 }),
        statement({ subject: 'https://data.northvale-rail.example/def/GantrySignalPost', predicate: RDFS_SUBCLASS_OF, object: 'https://data.northvale-rail.example/def/SignalPost', file: '/srv/nv/signals.ttl', line: 4 }),
      ],
      fingerprint: '0'.repeat(64),
    };
    const context = {
      toolName: 'isapart' as const, toolVersion: '0.0.0', cwd: '/srv/nv', sources: [], inputErrors: [], inputWarnings: [], ruleFailures: [], rules: [],
      color: false, startTime: new Date(0), endTime: new Date(0), commandLine: 'isapart check <script>',
    };
    const html = toHtml([finding], context);
    expectOnlyOwnScripts(html);
    const { document } = parseReport(html);
    const row = select(document, 'tbody', 'finding')[0];
    expect(textOf(select(row, 'td')[3])).toBe(finding.message);
    const literalNode = select(row, 'g', 'node').find((node) => (attribute(node, 'class') ?? '').includes('literal'))!;
    expect(textOf(select(literalNode, 'title')[0])).toContain(hostileLiteral.slice(0, 20));
    expect(textOf(row)).toContain(`"${hostileLiteral}"`);
    expect(elements(document).filter((element) => element.attrs.some((attr) => attr.name.startsWith('on')))).toEqual([]);
  });
});
