// A private Virtuoso Open Source instance per test run: a temporary folder, loopback ports, stopped by its pid.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** The Debian package's programs and its configuration template (package virtuoso-opensource). */
export const VIRTUOSO_SERVER = '/usr/bin/virtuoso-t';
export const VIRTUOSO_ISQL = '/usr/bin/isql-vt';
export const VIRTUOSO_INI = '/etc/virtuoso-opensource-7/virtuoso.ini';

/** How long the server may take to say "Server online", and a load to finish. */
const START_TIMEOUT_MS = 120_000;
const POLL_MS = 200;

/** Settings beyond the Debian defaults; all are lines of the ini file. */
export interface VirtuosoOptions {
  /** NumberOfBuffers (8 kB pages in memory); the Debian default is 10000. */
  buffers?: number;
  /** [SPARQL] ResultSetMaxRows; the Debian default is 10000. */
  maxRows?: number;
  /** [Parameters] MaxSortedTopRows, the cap on ORDER BY with OFFSET; the built-in default is 10000. */
  maxSortedTopRows?: number;
}

/** A running instance. */
export interface VirtuosoInstance {
  folder: string;
  pid: number;
  sqlPort: number;
  httpPort: number;
  /** The SPARQL 1.1 endpoint: http://127.0.0.1:PORT/sparql. */
  sparqlUrl: string;
  /** Loads an N-Triples or Turtle file into a graph with TTLP_MT, then checkpoints. */
  load(file: string, graph: string): void;
  /** Loads a large file with Virtuoso's bulk loader (ld_dir, rdf_loader_run), then checkpoints. */
  bulkLoad(file: string, graph: string): void;
  /** Stops the server by its pid and removes the folder. */
  stop(): Promise<void>;
}

/** Why the package is missing, as an error that fails the suite: these tests must never be skipped. */
function missingPackageError(): Error {
  return new Error(
    `Virtuoso Open Source is not installed (${VIRTUOSO_SERVER}, ${VIRTUOSO_ISQL} or ${VIRTUOSO_INI} is missing). ` +
      'The system tests need it: sudo apt-get update && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y virtuoso-opensource',
  );
}

/** A free TCP port on the loopback interface. */
async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  if (address === null || typeof address === 'string') throw new Error('no free loopback port');
  return address.port;
}

/**
 * The Debian virtuoso.ini with every file in `folder`, both ServerPort lines on 127.0.0.1, the
 * folder allowed for file access, and the given limits.
 */
export function privateIni(template: string, folder: string, ports: { sql: number; http: number }, options: VirtuosoOptions): string {
  const file = (name: string) => path.join(folder, name);
  const replacements: Record<string, Record<string, string>> = {
    Database: {
      DatabaseFile: file('virtuoso.db'),
      ErrorLogFile: file('virtuoso.log'),
      LockFile: file('virtuoso.lck'),
      TransactionFile: file('virtuoso.trx'),
      xa_persistent_file: file('virtuoso.pxa'),
    },
    TempDatabase: { DatabaseFile: file('virtuoso-temp.db'), TransactionFile: file('virtuoso-temp.trx') },
    Parameters: {
      ServerPort: `127.0.0.1:${ports.sql}`,
      DirsAllowed: `., ${folder}, /usr/share/virtuoso-opensource-7/vad`,
      ...(options.buffers === undefined ? {} : { NumberOfBuffers: String(options.buffers), MaxDirtyBuffers: String(Math.floor(options.buffers * 0.75)) }),
    },
    HTTPServer: { ServerPort: `127.0.0.1:${ports.http}` },
    SPARQL: { ...(options.maxRows === undefined ? {} : { ResultSetMaxRows: String(options.maxRows) }), MaxQueryExecutionTime: '0' },
  };
  if (options.maxSortedTopRows !== undefined) replacements.Parameters.MaxSortedTopRows = String(options.maxSortedTopRows);
  // Keys the template lacks go right under their section's header: Virtuoso reads a section once.
  const present = new Set<string>();
  let section = '';
  for (const line of template.split('\n')) {
    const header = /^\[([^\]]+)\]/.exec(line);
    if (header !== null) section = header[1];
    const key = /^\s*([A-Za-z_]+)\s*=/.exec(line)?.[1];
    if (key !== undefined) present.add(`${section}.${key}`);
  }
  section = '';
  const lines = template.split('\n').flatMap((line) => {
    const header = /^\[([^\]]+)\]/.exec(line);
    if (header !== null) {
      section = header[1];
      const missing = Object.entries(replacements[section] ?? {}).filter(([key]) => !present.has(`${section}.${key}`));
      return [line, ...missing.map(([key, value]) => `${key} = ${value}`)];
    }
    const key = /^\s*([A-Za-z_]+)\s*=/.exec(line)?.[1];
    const value = key === undefined ? undefined : replacements[section]?.[key];
    return [key === undefined || value === undefined ? line : `${key} = ${value}`];
  });
  for (const port of [ports.sql, ports.http]) {
    if (!lines.some((line) => line === `ServerPort = 127.0.0.1:${port}`)) throw new Error(`the ini template has no ServerPort line for ${port}`);
  }
  return `${lines.join('\n')}\n`;
}

async function waitFor(what: string, test: () => boolean, process: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + START_TIMEOUT_MS;
  while (!test()) {
    if (process.exitCode !== null) throw new Error(`virtuoso-t exited (code ${process.exitCode}) before ${what}; its log:\n${log()}`);
    if (Date.now() > deadline) throw new Error(`virtuoso-t did not reach ${what} within ${START_TIMEOUT_MS / 1000} s; its log:\n${log()}`);
    await new Promise((resolve) => setTimeout(resolve, POLL_MS));
  }
}

/** Starts a private instance and waits until it is online; throws (never skips) when the package is missing. */
export async function startVirtuoso(options: VirtuosoOptions = {}): Promise<VirtuosoInstance> {
  if (![VIRTUOSO_SERVER, VIRTUOSO_ISQL, VIRTUOSO_INI].every((file) => existsSync(file))) throw missingPackageError();
  const folder = mkdtempSync(path.join(tmpdir(), 'isapart-virtuoso-'));
  const ports = { sql: await freePort(), http: await freePort() };
  const iniFile = path.join(folder, 'virtuoso.ini');
  writeFileSync(iniFile, privateIni(readFileSync(VIRTUOSO_INI, 'utf8'), folder, ports, options));
  const logFile = path.join(folder, 'virtuoso.log');
  const log = () => (existsSync(logFile) ? readFileSync(logFile, 'utf8') : '(no log written)');
  const child = spawn(VIRTUOSO_SERVER, ['+foreground', '+configfile', iniFile], { cwd: folder, stdio: 'ignore' });
  if (child.pid === undefined) throw new Error(`${VIRTUOSO_SERVER} could not be started`);
  const pid = child.pid;
  try {
    await waitFor('"Server online"', () => /Server online at/.test(log()), child, log);
  } catch (error) {
    process.kill(pid, 'SIGKILL');
    throw error;
  }
  const quoted = (text: string) => `'${text.replace(/'/g, "''")}'`;
  // The server reads only files under DirsAllowed, so a file elsewhere is copied into the folder first.
  const insideFolder = (file: string): string => {
    const absolute = path.resolve(file);
    if (absolute.startsWith(folder + path.sep)) return absolute;
    const copy = path.join(folder, `load-${path.basename(file)}`);
    copyFileSync(absolute, copy);
    return copy;
  };
  const isql = (statement: string, file: string): void => {
    const result = spawnSync(VIRTUOSO_ISQL, [`127.0.0.1:${ports.sql}`, 'dba', 'dba', `exec=${statement}`], { encoding: 'utf8', timeout: START_TIMEOUT_MS * 10 });
    if (result.status !== 0 || /\*\*\* Error/.test(result.stdout + result.stderr)) {
      throw new Error(`loading ${file} into Virtuoso failed (exit ${result.status}):\n${result.stdout}\n${result.stderr}`);
    }
  };
  const instance: VirtuosoInstance = {
    folder,
    pid,
    sqlPort: ports.sql,
    httpPort: ports.http,
    sparqlUrl: `http://127.0.0.1:${ports.http}/sparql`,
    load(file: string, graph: string) {
      isql(`DB.DBA.TTLP_MT(file_to_string_output(${quoted(insideFolder(file))}), '', ${quoted(graph)}); checkpoint;`, file);
    },
    bulkLoad(file: string, graph: string) {
      const inside = insideFolder(file);
      isql(`ld_dir(${quoted(path.dirname(inside))}, ${quoted(path.basename(inside))}, ${quoted(graph)}); rdf_loader_run(); checkpoint;`, file);
    },
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
        process.kill(pid, 'SIGTERM');
        const timer = setTimeout(() => {
          if (child.exitCode === null) process.kill(pid, 'SIGKILL');
        }, 20_000);
        await exited;
        clearTimeout(timer);
      }
      rmSync(folder, { recursive: true, force: true });
    },
  };
  return instance;
}
