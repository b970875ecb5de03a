// loadSources: files, folders, stdin and gzip, in a deterministic order, with errors instead of silent drops.
import { mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { pathToFileURL } from 'node:url';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { loadSources } from '../../src/load/sources.js';
import { temporaryTree } from './temp-tree.js';

const NV = 'https://data.northvale-rail.example/def/';
const ROLLING_STOCK = `@prefix nv: <${NV}> .\nnv:Pantograph nv:partOf nv:Locomotive .\nnv:Locomotive a nv:RollingStock .\n`;
const INFRASTRUCTURE = `<${NV}Sleeper> <${NV}partOf> <${NV}Track> .\n`;
const BLANK_NODES = `@prefix nv: <${NV}> .\n_:coupler nv:partOf nv:Car .\n[ a nv:Buffer ] nv:partOf _:coupler .\n`;
const FLEET_TRIG = `@prefix nv: <${NV}> .\nnv:fleet-2024 { nv:Car nv:partOf nv:Train . }\n`;

let root: string;

beforeAll(() => {
  const tree = temporaryTree('isapart-load-');
  root = tree.root;
  const write = tree.write;
  write('demo/rolling-stock.ttl', ROLLING_STOCK);
  write('demo/infrastructure/track.nt', INFRASTRUCTURE);
  write('demo/infrastructure/fleet.trig.gz', gzipSync(FLEET_TRIG));
  write('demo/README.md', '# not RDF\n');
  write('demo/.cache/old.ttl', ROLLING_STOCK);
  write('demo/node_modules/vocab/terms.ttl', ROLLING_STOCK);
  write('gzip-under-plain-name.ttl', gzipSync(ROLLING_STOCK));
  write('plain-under-gz-name.nt.gz', INFRASTRUCTURE);
  write('truncated.ttl.gz', gzipSync(ROLLING_STOCK).subarray(0, 20));
  write('broken.ttl', `@prefix nv: <${NV}> .\nnv:Axle nv:partOf nv:Bogie .\nnv:Wheel nv:partOf\n`);
  write('with-bom.ttl', `\ufeff<${NV}Bogie> <${NV}partOf> <${NV}Car> .\n`);
  write('latin1.ttl', Buffer.concat([Buffer.from(`<${NV}Car> <${NV}label> "Wagen`), Buffer.from([0xe4]), Buffer.from('" .\n')]));
  write('export.data', ROLLING_STOCK);
  write('notes.txt', 'Northvale Rail asset graph, see the wiki.\n');
  write('relative.ttl', '<Car> <partOf> <Train> .\n');
  write('nested/.git/objects/pack.ttl', ROLLING_STOCK);
  write('nested/depots/north.ttl', INFRASTRUCTURE);
  write('nested/depots/.backup/north.ttl', INFRASTRUCTURE);
  write('nested/depots/node_modules/vocab.ttl', INFRASTRUCTURE);
  write('only-hidden/.snapshots/north.ttl', INFRASTRUCTURE);
  write('blank.ttl', BLANK_NODES);
  write('sub/blank.ttl', BLANK_NODES);
  mkdirSync(join(root, 'empty-folder'));
});

afterAll(() => {
  rmSync(root, { recursive: true, force: true });
});

describe('loadSources on folders', () => {
  it('walks a folder recursively in sorted order, skipping node_modules and dot-folders, naming files as given', async () => {
    const result = await loadSources(['demo'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => [source.file, source.format, source.statements.length])).toEqual([
      ['demo/infrastructure/fleet.trig.gz', 'trig', 1],
      ['demo/infrastructure/track.nt', 'n-triples', 1],
      ['demo/rolling-stock.ttl', 'turtle', 2],
    ]);
    expect(result.sources[0].statements[0].position.file).toBe('demo/infrastructure/fleet.trig.gz');
    // node_modules and dot-folders are counted as skipped, as the folder with a trailing slash.
    expect(result.skippedFiles).toEqual(['demo/.cache/', 'demo/README.md', 'demo/node_modules/']);
  });

  it('lists skipped dot-folders at any depth, named from the folder as the user wrote it', async () => {
    const result = await loadSources(['./nested/'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => source.file)).toEqual(['./nested/depots/north.ttl']);
    expect(result.skippedFiles).toEqual(['./nested/.git/', './nested/depots/.backup/', './nested/depots/node_modules/']);
  });

  it('reports a folder that holds only skipped folders as holding no RDF files, and still lists them', async () => {
    const result = await loadSources(['only-hidden'], { cwd: root });
    expect(result.sources).toEqual([]);
    expect(result.errors.map((error) => error.file)).toEqual(['only-hidden']);
    expect(result.skippedFiles).toEqual(['only-hidden/.snapshots/']);
  });

  it('keeps the folder as the user wrote it, trailing slash or not', async () => {
    const result = await loadSources(['./demo/'], { cwd: root });
    expect(result.sources.map((source) => source.file)).toEqual([
      './demo/infrastructure/fleet.trig.gz',
      './demo/infrastructure/track.nt',
      './demo/rolling-stock.ttl',
    ]);
  });

  it('reports a folder without RDF files', async () => {
    const result = await loadSources(['empty-folder'], { cwd: root });
    expect(result.sources).toEqual([]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ file: 'empty-folder', line: 0, column: 0 });
    expect(result.errors[0].hint).toContain('.ttl, .trig, .nt, .nq');
  });
});

describe('loadSources on files', () => {
  it('reads sources in argument order, each file once', async () => {
    const result = await loadSources(['demo/rolling-stock.ttl', 'relative.ttl', 'demo/rolling-stock.ttl'], { cwd: root });
    expect(result.sources.map((source) => source.file)).toEqual(['demo/rolling-stock.ttl', 'relative.ttl']);
  });

  it('resolves relative IRIs against the file URL', async () => {
    const result = await loadSources(['relative.ttl'], { cwd: root });
    expect(result.sources[0].statements[0].subject).toBe(pathToFileURL(join(root, 'Car')).href);
  });

  it('recognises gzip by its magic bytes, not by its name', async () => {
    const result = await loadSources(['gzip-under-plain-name.ttl', 'plain-under-gz-name.nt.gz'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => [source.format, source.statements.length])).toEqual([
      ['turtle', 2],
      ['n-triples', 1],
    ]);
  });

  it('reports a truncated gzip file as an error rather than reading part of it', async () => {
    const result = await loadSources(['truncated.ttl.gz', 'demo/rolling-stock.ttl'], { cwd: root });
    expect(result.sources.map((source) => source.file)).toEqual(['demo/rolling-stock.ttl']);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0].file).toBe('truncated.ttl.gz');
    expect(result.errors[0].message).toContain('cannot be decompressed');
    expect(result.errors[0].hint).toContain('gzip');
  });

  it('still returns a good file in full beside a broken one', async () => {
    const result = await loadSources(['broken.ttl', 'demo/rolling-stock.ttl'], { cwd: root });
    expect(result.errors).toEqual([]);
    const [broken, good] = result.sources;
    expect(broken.statements).toHaveLength(1);
    expect(broken.errors).toHaveLength(1);
    expect(broken.errors[0]).toMatchObject({ file: 'broken.ttl', line: 4 });
    expect(good.errors).toEqual([]);
    expect(good.statements).toHaveLength(2);
  });

  it('reports a missing path with line 0, column 0 and a hint', async () => {
    const result = await loadSources(['no-such-file.ttl'], { cwd: root });
    expect(result.sources).toEqual([]);
    expect(result.errors).toEqual([
      expect.objectContaining({ file: 'no-such-file.ttl', line: 0, column: 0, hint: expect.stringContaining('folder') }),
    ]);
    expect(result.errors[0].message).toContain('does not exist');
  });

  it('sniffs a named file with an unknown extension, and reports one whose content is no RDF', async () => {
    const result = await loadSources(['export.data', 'notes.txt'], { cwd: root });
    expect(result.sources.map((source) => [source.file, source.format])).toEqual([['export.data', 'turtle']]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0].file).toBe('notes.txt');
    expect(result.errors[0].hint).toContain('.ttl, .trig, .nt, .nq');
  });

  it('drops a UTF-8 byte order mark, so the first subject is at column 1', async () => {
    const result = await loadSources(['with-bom.ttl'], { cwd: root });
    expect(result.sources[0].statements[0].position).toEqual({ file: 'with-bom.ttl', line: 1, column: 1 });
  });

  it('reports text that is not UTF-8 at the first bad byte', async () => {
    const result = await loadSources(['latin1.ttl'], { cwd: root });
    expect(result.errors).toEqual([]);
    expect(result.sources.map((source) => [source.file, source.statements.length])).toEqual([['latin1.ttl', 0]]);
    const errors = result.sources[0].errors;
    expect(errors).toHaveLength(1);
    // The line is '<NV>Car> <NV>label> "Wagen' then the byte e4: counted from the two IRIs' lengths.
    const column = `<${NV}Car> <${NV}label> "Wagen`.length + 1;
    expect(errors[0]).toMatchObject({ file: 'latin1.ttl', line: 1, column });
    expect(errors[0].message).toContain('it was not read');
    expect(errors[0].hint).toContain('UTF-8');
  });
});

describe('loadSources on stdin', () => {
  it('reads - from the given stream as <stdin>, sniffing its format', async () => {
    const stdin = Readable.from([Buffer.from(INFRASTRUCTURE.slice(0, 10)), Buffer.from(INFRASTRUCTURE.slice(10))]);
    const result = await loadSources(['-'], { cwd: root, stdin });
    expect(result.errors).toEqual([]);
    expect(result.sources).toHaveLength(1);
    expect(result.sources[0]).toMatchObject({ file: '<stdin>', format: 'n-triples' });
    expect(result.sources[0].statements[0].position).toEqual({ file: '<stdin>', line: 1, column: 1 });
  });

  it('gives stdin whose syntax cannot be told a hint about stdin, not about file names', async () => {
    const stdin = Readable.from([Buffer.from('Northvale Rail asset graph, see the wiki.\n')]);
    const result = await loadSources(['-'], { cwd: root, stdin });
    expect(result.sources).toEqual([]);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ file: '<stdin>', line: 0, column: 0 });
    expect(result.errors[0].message).toBe('The syntax of standard input could not be told from its content; it was not read.');
    expect(result.errors[0].hint).toMatch(/^standard input has no name to tell its syntax by/);
    expect(result.errors[0].hint).toContain('Turtle, TriG, N-Triples, N-Quads, RDF/XML or JSON-LD');
    expect(result.errors[0].hint).not.toContain('name the file');
  });

  it('decompresses gzip on stdin and resolves relative IRIs against file:///dev/stdin', async () => {
    const stdin = Readable.from([gzipSync('@prefix nv: <https://data.northvale-rail.example/def/> .\n<Car> a nv:Wagon .\n')]);
    const result = await loadSources(['-'], { stdin });
    expect(result.sources[0].format).toBe('turtle');
    expect(result.sources[0].statements[0].subject).toBe('file:///dev/Car');
  });
});

describe('blank node labels from loadSources', () => {
  const subjectsOf = async (paths: string[]) =>
    (await loadSources(paths, { cwd: root })).sources.map((source) => source.statements.map((statement) => statement.subject));

  it('are the same however the same file is written, and differ for another file', async () => {
    const [plain] = await subjectsOf(['blank.ttl']);
    expect(plain[0]).toMatch(/^_:b[0-9a-f]{8}_coupler$/);
    expect(await subjectsOf(['./blank.ttl'])).toEqual([plain]);
    expect(await subjectsOf(['sub/../blank.ttl'])).toEqual([plain]);
    expect(await subjectsOf([join(root, 'blank.ttl')])).toEqual([plain]);
    const [other] = await subjectsOf(['sub/blank.ttl']);
    expect(other[0]).not.toBe(plain[0]);
    expect(other[0].endsWith('_coupler')).toBe(true);
  });

  it('come from the given cwd, without reading the process working folder', async () => {
    const cwdSpy = vi.spyOn(process, 'cwd');
    try {
      const result = await loadSources(['./blank.ttl', 'demo'], { cwd: root });
      expect(result.sources).toHaveLength(4);
      expect(cwdSpy).not.toHaveBeenCalled();
    } finally {
      cwdSpy.mockRestore();
    }
  });
});
