// A deterministic generator of synthetic class hierarchies for benchmarks and scale tests.
// Invented data in the Northvale Rail namespace: it stands in for a dump, it is not a fact of the trade.
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { pathToFileURL } from 'node:url';
import { randomSource } from '../random-source.js';

/** What to generate. Every count derives from `classes` and `seed`, so the same spec gives the same bytes. */
export interface HierarchySpec {
  /** Number of classes; class 0 is the single root. */
  classes: number;
  /** Seed of the pseudo-random choices; default 1. */
  seed?: number;
  /** Cycles planted by a subclass statement from a class's parent back to the class; default 5. */
  plantedCycles?: number;
}

/** The syntaxes the generator writes. */
export type GeneratedSyntax = 'n-triples' | 'turtle';

/** What a generated file holds. */
export interface GeneratedCounts {
  classes: number;
  statements: number;
  subclassStatements: number;
  partOfStatements: number;
  instances: number;
  plantedCycles: number;
  bytes: number;
}

export const BENCH_NAMESPACE = 'https://data.northvale-rail.example/bench/';
const RDF_TYPE = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type';
const RDFS = 'http://www.w3.org/2000/01/rdf-schema#';
const OWL_CLASS = 'http://www.w3.org/2002/07/owl#Class';
const DCTERMS = 'http://purl.org/dc/terms/';
const XSD_DATE = 'http://www.w3.org/2001/XMLSchema#date';

/** Share of classes with a second superclass, with a part-of statement, and with an instance. */
const SECOND_SUPER = 0.3;
const PART_OF = 0.03;
const INSTANCE = 0.5;
/** Statements per text chunk handed to the writer. */
const CHUNK_STATEMENTS = 20_000;

/** One generated statement: subject, predicate and an object that is an IRI or a ready-made N-Triples literal. */
interface GeneratedStatement {
  subject: string;
  predicate: string;
  iri?: string;
  literal?: string;
}

/** The IRI of class `i` and of instance `i`. */
export function classIri(i: number): string {
  return `${BENCH_NAMESPACE}class/C${i}`;
}
function instanceIri(i: number): string {
  return `${BENCH_NAMESPACE}asset/A${i}`;
}

/**
 * The statements of one class, in order: declaration, label, superclasses (always of lower number,
 * so the hierarchy is acyclic but for planted cycles), a part-of now and then, attributes, an instance.
 */
function classStatements(i: number, random: () => number, counts: GeneratedCounts): GeneratedStatement[] {
  const subject = classIri(i);
  const out: GeneratedStatement[] = [
    { subject, predicate: RDF_TYPE, iri: OWL_CLASS },
    { subject, predicate: `${RDFS}label`, literal: `"Component type ${i}"@en` },
  ];
  if (i > 0) {
    const first = Math.floor(random() * i);
    out.push({ subject, predicate: `${RDFS}subClassOf`, iri: classIri(first) });
    counts.subclassStatements += 1;
    if (i > 1 && random() < SECOND_SUPER) {
      const second = Math.floor(random() * i);
      if (second !== first) {
        out.push({ subject, predicate: `${RDFS}subClassOf`, iri: classIri(second) });
        counts.subclassStatements += 1;
      }
    }
    if (random() < PART_OF) {
      out.push({ subject, predicate: `${DCTERMS}isPartOf`, iri: classIri(Math.floor(random() * i)) });
      counts.partOfStatements += 1;
    }
  }
  out.push({ subject, predicate: `${RDFS}comment`, literal: `"Generated type ${i}."` });
  const day = 1 + (i % 28);
  out.push({ subject, predicate: `${DCTERMS}created`, literal: `"2026-11-${String(day).padStart(2, '0')}"^^<${XSD_DATE}>` });
  if (random() < INSTANCE) {
    out.push({ subject: instanceIri(i), predicate: RDF_TYPE, iri: subject });
    out.push({ subject: instanceIri(i), predicate: `${RDFS}label`, literal: `"Asset ${i}"` });
    counts.instances += 1;
  }
  return out;
}

/** The classes whose parent gets a subclass statement back to them, closing a two-class cycle. */
function plantedCycleClasses(spec: HierarchySpec): Set<number> {
  const wanted = Math.min(spec.plantedCycles ?? 5, Math.max(0, spec.classes - 1));
  const chosen = new Set<number>();
  const random = randomSource((spec.seed ?? 1) ^ 0x9e3779b9);
  while (chosen.size < wanted) chosen.add(1 + Math.floor(random() * (spec.classes - 1)));
  return chosen;
}

function nTriplesLine(statement: GeneratedStatement): string {
  const object = statement.iri !== undefined ? `<${statement.iri}>` : statement.literal;
  return `<${statement.subject}> <${statement.predicate}> ${object} .\n`;
}

const TURTLE_PREFIXES: [string, string][] = [
  ['rdf', 'http://www.w3.org/1999/02/22-rdf-syntax-ns#'],
  ['rdfs', RDFS],
  ['owl', 'http://www.w3.org/2002/07/owl#'],
  ['dcterms', DCTERMS],
  ['xsd', 'http://www.w3.org/2001/XMLSchema#'],
  ['c', `${BENCH_NAMESPACE}class/`],
  ['a', `${BENCH_NAMESPACE}asset/`],
];

/** A Turtle term: a prefixed name where one of the prefixes fits, else `<iri>`; literals as given. */
function turtleTerm(iri: string): string {
  if (iri === RDF_TYPE) return 'a';
  for (const [name, namespace] of TURTLE_PREFIXES) {
    if (iri.startsWith(namespace) && /^[A-Za-z][A-Za-z0-9]*$/.test(iri.slice(namespace.length))) return `${name}:${iri.slice(namespace.length)}`;
  }
  return `<${iri}>`;
}

/** Turtle for a run of statements: one block per subject, predicates joined by `;`. */
function turtleBlocks(statements: GeneratedStatement[]): string {
  let text = '';
  let index = 0;
  while (index < statements.length) {
    const subject = statements[index].subject;
    const parts: string[] = [];
    while (index < statements.length && statements[index].subject === subject) {
      const statement = statements[index];
      const object = statement.iri !== undefined ? turtleTerm(statement.iri) : statement.literal!.replace(`^^<${XSD_DATE}>`, '^^xsd:date');
      parts.push(`${turtleTerm(statement.predicate)} ${object}`);
      index += 1;
    }
    text += `${turtleTerm(subject)} ${parts.join(' ;\n    ')} .\n`;
  }
  return text;
}

/**
 * The generated file as text chunks, in order. Counts are filled in as the chunks are taken.
 * Same spec and syntax, same chunks.
 */
export function* hierarchyChunks(spec: HierarchySpec, syntax: GeneratedSyntax, counts: GeneratedCounts): Generator<string> {
  const random = randomSource(spec.seed ?? 1);
  const planted = plantedCycleClasses(spec);
  counts.classes = spec.classes;
  counts.plantedCycles = 0;
  if (syntax === 'turtle') yield TURTLE_PREFIXES.map(([name, namespace]) => `@prefix ${name}: <${namespace}> .\n`).join('') + '\n';
  let batch: GeneratedStatement[] = [];
  const flush = (): string => {
    const text = syntax === 'turtle' ? turtleBlocks(batch) : batch.map(nTriplesLine).join('');
    counts.statements += batch.length;
    batch = [];
    return text;
  };
  for (let i = 0; i < spec.classes; i += 1) {
    const statements = classStatements(i, random, counts);
    if (planted.has(i)) {
      // The class's first superclass is stated to be its subclass too: a two-class cycle.
      const parent = statements.find((s) => s.predicate === `${RDFS}subClassOf`)!.iri!;
      statements.push({ subject: parent, predicate: `${RDFS}subClassOf`, iri: classIri(i) });
      counts.subclassStatements += 1;
      counts.plantedCycles += 1;
    }
    batch.push(...statements);
    if (batch.length >= CHUNK_STATEMENTS) yield flush();
  }
  if (batch.length > 0) yield flush();
}

/** Empty counts, to be filled by `hierarchyChunks`. */
export function emptyCounts(): GeneratedCounts {
  return { classes: 0, statements: 0, subclassStatements: 0, partOfStatements: 0, instances: 0, plantedCycles: 0, bytes: 0 };
}

/** Writes a generated hierarchy to a file, streaming, and says what it holds. */
export async function writeHierarchy(file: string, spec: HierarchySpec, syntax: GeneratedSyntax): Promise<GeneratedCounts> {
  const counts = emptyCounts();
  const out = createWriteStream(file);
  for (const chunk of hierarchyChunks(spec, syntax, counts)) {
    counts.bytes += Buffer.byteLength(chunk);
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  return counts;
}

// As a command: node --import tsx test/bench/generate.ts CLASSES n-triples|turtle OUT [SEED]
if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [classes, syntax, out, seed] = process.argv.slice(2);
  if (!classes || (syntax !== 'n-triples' && syntax !== 'turtle') || !out) {
    console.error('usage: node --import tsx test/bench/generate.ts CLASSES n-triples|turtle OUT [SEED]');
    process.exit(2);
  }
  const counts = await writeHierarchy(out, { classes: Number(classes), seed: seed ? Number(seed) : 1 }, syntax);
  console.log(JSON.stringify(counts));
}
