// Known SPARQL servers and the push-down queries they answer wrongly, recognised from the HTTP Server header.

/** A server version whose answers to some rules' push-down queries were measured to be wrong. */
export interface KnownServer {
  /** What the report calls the server. */
  name: string;
  /** Matches the Server header of the answers (e.g. `Virtuoso/07.20.3229 (Linux) x86_64-pc-linux-gnu`). */
  serverHeader: RegExp;
  /** Ids of the rules whose queries this server answers wrongly. */
  wrongRules: readonly string[];
  /** Why, in one clause, for the warning. */
  reason: string;
  /** Where the measurements are written down. */
  evidence: string;
}

/**
 * The table, one entry per server line. Virtuoso 7.x: measured on Debian's 7.2.5 (Server header
 * `Virtuoso/07.20.3229`), where the disjoint-overlap query misses and adds rows against oxigraph
 * and the in-memory engine on every run, and the kind-and-part query on the demo added a row
 * (fleet:cab-A101-1) in 2 of 6 runs of the system suite and not in the others (docs/push-down.md,
 * section "Seen on Virtuoso 7.2.5").
 */
export const KNOWN_SERVERS: readonly KnownServer[] = Object.freeze([
  {
    name: 'Virtuoso 7.x',
    serverHeader: /^Virtuoso\/07\./i,
    wrongRules: ['disjoint-overlap', 'kind-and-part'],
    reason: 'it answers the closures and filters of that query wrongly, or differently from one run to the next (rows missing and rows added, measured against oxigraph)',
    evidence: 'docs/push-down.md',
  },
]);

/** The known server whose Server header this is, or undefined for any other server (or no header). */
export function knownServer(serverHeader: string | undefined, table: readonly KnownServer[] = KNOWN_SERVERS): KnownServer | undefined {
  if (serverHeader === undefined) return undefined;
  return table.find((server) => server.serverHeader.test(serverHeader.trim()));
}

/** Whether any entry of the table names this rule, so the server must be known before its query is sent. */
export function ruleNamedByTable(ruleId: string, table: readonly KnownServer[] = KNOWN_SERVERS): boolean {
  return table.some((server) => server.wrongRules.includes(ruleId));
}
