// A SPARQL 1.1 Protocol server for tests on 127.0.0.1: oxigraph answers the queries, faults are injected on demand.
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import oxigraph from 'oxigraph';

/** What the server does with one request instead of answering it, or undefined to answer it. */
export type Fault =
  | { kind: 'status'; status: number; body: string }
  | { kind: 'reset' }
  | { kind: 'stall'; milliseconds: number }
  | { kind: 'body'; contentType: string; body: string; headers?: Record<string, string> };

/** One request as the server saw it. */
export interface SeenRequest {
  contentType: string;
  authorization?: string;
  query: string;
}

/** A running test server. */
export interface TestSparqlServer {
  url: string;
  store: oxigraph.Store;
  requests: SeenRequest[];
  /** Decides a fault for the n-th request (0-based); return undefined to answer normally. */
  fault: (index: number, request: SeenRequest) => Fault | undefined;
  /** Caps every answer at this many rows, as some servers do silently (sending X-SPARQL-MaxRows). */
  maxRows?: number;
  /** A Server header sent with every answer, to stand for a particular server product. */
  serverHeader?: string;
  close(): Promise<void>;
}

async function bodyOf(request: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of request) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

/** The query of a SPARQL 1.1 Protocol POST: the body itself, or its `query` form field. */
function queryOf(contentType: string, body: string): string {
  if (contentType.startsWith('application/x-www-form-urlencoded')) return new URLSearchParams(body).get('query') ?? '';
  return body;
}

/** Starts a server on a free loopback port, answering from the store. */
export async function startSparqlServer(store: oxigraph.Store = new oxigraph.Store()): Promise<TestSparqlServer> {
  const sockets = new Set<import('node:net').Socket>();
  const handle = async (request: IncomingMessage, response: ServerResponse, index: number): Promise<void> => {
    const contentType = request.headers['content-type'] ?? '';
    const seen: SeenRequest = { contentType, authorization: request.headers.authorization, query: queryOf(contentType, await bodyOf(request)) };
    server.requests.push(seen);
    const fault = server.fault(index, seen);
    if (fault?.kind === 'reset') {
      request.socket.destroy();
      return;
    }
    if (fault?.kind === 'stall') {
      await new Promise((resolve) => setTimeout(resolve, fault.milliseconds));
      if (response.destroyed) return;
    }
    if (fault?.kind === 'status') {
      response.writeHead(fault.status, { 'Content-Type': 'text/plain' }).end(fault.body);
      return;
    }
    if (fault?.kind === 'body') {
      response.writeHead(200, { 'Content-Type': fault.contentType, ...fault.headers }).end(fault.body);
      return;
    }
    if (/^(\s*#[^\n]*\n)*\s*CONSTRUCT\b/i.test(seen.query)) {
      try {
        const triples = store.query(seen.query, { results_format: 'application/n-triples' }) as string;
        response.writeHead(200, { 'Content-Type': 'application/n-triples', ...(server.serverHeader === undefined ? {} : { Server: server.serverHeader }) }).end(triples);
      } catch (error) {
        response.writeHead(400, { 'Content-Type': 'text/plain' }).end(`query refused: ${String(error)}`);
      }
      return;
    }
    let json: string;
    try {
      json = store.query(seen.query, { results_format: 'application/sparql-results+json' }) as string;
    } catch (error) {
      response.writeHead(400, { 'Content-Type': 'text/plain' }).end(`query refused: ${String(error)}`);
      return;
    }
    const headers: Record<string, string> = { 'Content-Type': 'application/sparql-results+json' };
    if (server.serverHeader !== undefined) headers.Server = server.serverHeader;
    if (server.maxRows !== undefined) {
      const parsed = JSON.parse(json) as { results: { bindings: unknown[] } };
      if (parsed.results.bindings.length > server.maxRows) {
        parsed.results.bindings = parsed.results.bindings.slice(0, server.maxRows);
        headers['X-SPARQL-MaxRows'] = String(server.maxRows);
        json = JSON.stringify(parsed);
      }
    }
    response.writeHead(200, headers).end(json);
  };
  let count = 0;
  const http: Server = createServer((request, response) => {
    void handle(request, response, count++);
  });
  http.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
  const { port } = http.address() as AddressInfo;
  const server: TestSparqlServer = {
    url: `http://127.0.0.1:${port}/sparql`,
    store,
    requests: [],
    fault: () => undefined,
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of sockets) socket.destroy();
        http.close(() => resolve());
      }),
  };
  return server;
}

/** A loopback port that nothing listens on: bound once, then closed. */
export async function closedPort(): Promise<number> {
  const http = createServer();
  await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
  const { port } = http.address() as AddressInfo;
  await new Promise<void>((resolve) => http.close(() => resolve()));
  return port;
}
