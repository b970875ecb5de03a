// The name an endpoint (and graph) goes by in positions, reports and errors.
import type { Position } from './statement.js';

/**
 * The location of everything read from an endpoint: its URL, with the graph as the
 * `default-graph-uri` parameter of the SPARQL 1.1 Protocol (section 2.1) when one graph is read,
 * so the location is itself a URI that names the same data. Line and column 0: no statement position.
 */
export function endpointPosition(endpoint: string, graph?: string): Position {
  if (graph === undefined) return { file: endpoint, line: 0, column: 0 };
  const separator = endpoint.includes('?') ? '&' : '?';
  return { file: `${endpoint}${separator}default-graph-uri=${encodeURIComponent(graph)}`, line: 0, column: 0 };
}

/** Whether a position's file is a URL (an endpoint) rather than a path. */
export function isUrlLocation(file: string): boolean {
  return /^https?:\/\//i.test(file);
}
