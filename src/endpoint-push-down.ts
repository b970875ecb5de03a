// Push-down: every rule sent to the endpoint as one SPARQL SELECT, its rows read back as findings.
import type { Finding, Level, RuleFailure } from './engine/finding.js';
import type { RuleDefinition } from './engine/rule.js';
import { compileRuleToSparql, PushDownError, pushDownVariables } from './engine/sparql-compile.js';
import { findingsFromRows, PushDownResultError, type SparqlBinding } from './engine/sparql-findings.js';
import { EndpointFailure, SPARQL_JSON, type SparqlClient } from './load/endpoint-client.js';
import { selectRows } from './load/endpoint.js';
import { endpointPosition } from './load/endpoint-location.js';
import type { EndpointSettings } from './load/endpoint-settings.js';
import type { InputError } from './load/statement.js';
import type { RoleMap } from './roles/role.js';
import { knownServer, ruleNamedByTable, type KnownServer } from './endpoint-known-servers.js';

/** What a push-down run needs: the client, the endpoint and graph, the run's roles, scope and roots. */
export interface PushDownRun {
  client: SparqlClient;
  endpoint: string;
  graph?: string;
  settings: EndpointSettings;
  roleMap: RoleMap;
  scope: string[];
  roots: string[];
  /** Evaluates rules in memory on a graph extracted from the same endpoint (for servers that answer their queries wrongly). */
  runLocally?: (rules: { rule: RuleDefinition; level: Level }[]) => Promise<PushDownResult>;
}

/** What a push-down run produced: findings, rules that could not be compiled or read, and endpoint errors. */
export interface PushDownResult {
  findings: Finding[];
  failures: RuleFailure[];
  errors: InputError[];
  /** Rules evaluated locally instead of on the endpoint, one warning each: which rule, which server, why. */
  warnings: InputError[];
}

/** The query of one page of a rule's rows: the rule's SELECT with a stable order and a window. */
export function pagedRuleQuery(sparql: string, rule: RuleDefinition, limit: number, offset: number): string {
  const variables = pushDownVariables(rule);
  const ordered = [...variables.nodes, ...variables.cycles.flatMap((cycle) => [cycle.members, cycle.next])];
  return `${sparql.trimEnd()}\nORDER BY ${ordered.join(' ')}\nLIMIT ${limit}\nOFFSET ${offset}\n`;
}

/**
 * Runs each rule on the endpoint. A rule is read page by page (ORDER BY its variables, LIMIT, and
 * OFFSET moved by the rows received) until a page comes back short (a server that caps answers
 * below the page size says so in a header, which is an error); a rule that cannot be compiled, or
 * whose rows are not what its query returns, becomes a RuleFailure; an endpoint failure stops the
 * run and is returned as an input error, so a report is never clean when a rule did not run.
 */
export async function runPushDown(run: PushDownRun, active: { rule: RuleDefinition; level: Level }[]): Promise<PushDownResult> {
  const result: PushDownResult = { findings: [], failures: [], errors: [], warnings: [] };
  // Rules a known server answers wrongly wait until an answer has told which server this is.
  const suspect = run.runLocally === undefined ? [] : active.filter(({ rule }) => ruleNamedByTable(rule.id));
  const ordinary = active.filter((entry) => !suspect.includes(entry));
  if (!(await pushRules(run, ordinary, result)) || suspect.length === 0) return result;
  if (run.client.requests === 0) {
    try {
      await run.client.send('ASK { }', SPARQL_JSON, 'the server check');
    } catch (error) {
      if (!(error instanceof EndpointFailure)) throw error;
      result.errors.push(error.problem);
      return result;
    }
  }
  const server = knownServer(run.client.serverHeader);
  const local = server === undefined ? [] : suspect.filter(({ rule }) => server.wrongRules.includes(rule.id));
  await pushRules(run, suspect.filter((entry) => !local.includes(entry)), result);
  if (local.length === 0 || result.errors.length > 0) return result;
  const file = endpointPosition(run.endpoint, run.graph).file;
  result.warnings.push(...local.map(({ rule }) => localRuleWarning(rule.id, server!, run.client.serverHeader!, file)));
  const evaluated = await run.runLocally!(local);
  result.findings.push(...evaluated.findings);
  result.failures.push(...evaluated.failures);
  result.errors.push(...evaluated.errors);
  return result;
}

/** The warning that a rule ran locally because this server answers its query wrongly. */
function localRuleWarning(ruleId: string, server: KnownServer, serverHeader: string, file: string): InputError {
  return {
    file,
    line: 0,
    column: 0,
    message: `rule ${ruleId} was not pushed down: the endpoint is ${server.name} (Server: ${serverHeader}), and ${server.reason}; it was evaluated here on the hierarchy statements extracted from the same endpoint`,
    hint: `the measurements and the table of known servers are in ${server.evidence}; \`endpoint: { trust-server: true }\` sends the query anyway`,
  };
}

/** Sends each rule's query and reads its findings into `result`; false when an endpoint failure stopped the run. */
async function pushRules(run: PushDownRun, active: { rule: RuleDefinition; level: Level }[], result: PushDownResult): Promise<boolean> {
  const location = { endpoint: run.endpoint, graph: run.graph };
  const file = endpointPosition(run.endpoint, run.graph).file;
  for (const { rule, level } of active) {
    let sparql: string;
    try {
      sparql = compileRuleToSparql(rule, { roleMap: run.roleMap, scope: run.scope, roots: run.roots, graph: run.graph }).sparql;
    } catch (error) {
      if (!(error instanceof PushDownError)) throw error;
      result.failures.push({ ruleId: rule.id, message: `it cannot be pushed down: ${error.message} (${error.hint})` });
      continue;
    }
    try {
      const rows: SparqlBinding[] = [];
      for (;;) {
        const page = await selectRows(run.client, pagedRuleQuery(sparql, rule, run.settings.pageSize, rows.length), `rule ${rule.id}`, file, run.settings.pageSize);
        rows.push(...(page as SparqlBinding[]));
        if (page.length < run.settings.pageSize) break;
      }
      result.findings.push(...findingsFromRows(rule, level, rows, location));
    } catch (error) {
      // The server refusing or not finishing one rule's query leaves the others worth running; a lost connection does not.
      if (error instanceof EndpointFailure && (error.kind === 'status' || error.kind === 'timeout')) {
        result.failures.push({ ruleId: rule.id, message: `the endpoint did not run its query: ${error.problem.message}; hint: ${error.problem.hint ?? ''}` });
        continue;
      }
      if (error instanceof EndpointFailure) {
        result.errors.push(error.problem);
        return false;
      }
      if (error instanceof PushDownResultError) {
        result.failures.push({ ruleId: rule.id, message: `the endpoint's rows for it cannot be read: ${error.message}` });
        continue;
      }
      throw error;
    }
  }
  return true;
}
