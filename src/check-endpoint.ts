// The endpoint side of a run: extraction settings from config, and push-down of the active rules.
import type { IsapartConfig } from './config/config.js';
import type { Finding, Level, RuleFailure } from './engine/finding.js';
import type { RuleDefinition } from './engine/rule.js';
import { endpointClient, endpointProblems, loadEndpoint, type EndpointRequest } from './load/endpoint.js';
import { DEFAULT_ENDPOINT_SETTINGS, type EndpointSettings } from './load/endpoint-settings.js';
import type { InputError } from './load/statement.js';
import type { LoadResultWithSkipped } from './load/sources.js';
import { runPushDown, type PushDownResult } from './endpoint-push-down.js';
import { runRules } from './engine/run.js';
import { buildHierarchyGraph } from './graph/build.js';
import type { RoleMap } from './roles/role.js';

/** The endpoint options of a run (a part of CheckOptions). */
export interface EndpointOptions {
  /** A SPARQL 1.1 endpoint to read instead of files. */
  endpoint?: string;
  /** The named graph to read at the endpoint. */
  graph?: string;
  /** Run the rules as SPARQL on the endpoint instead of extracting the hierarchy. */
  pushDown?: boolean;
  /** Where `endpoint: authorization-env` is looked up; default the process environment. */
  env?: Readonly<Record<string, string | undefined>>;
  /** Replaces the waits between retries (tests). */
  sleep?: (milliseconds: number) => Promise<void>;
}

/** The settings of `endpoint:` in config over the defaults. */
export function endpointSettings(config: IsapartConfig): EndpointSettings {
  return { ...DEFAULT_ENDPOINT_SETTINGS, ...config.endpoint };
}

/** The request a run sends to its endpoint. */
export function endpointRequest(options: EndpointOptions & { endpoint: string }, config: IsapartConfig, roleMap: RoleMap): EndpointRequest {
  return { endpoint: options.endpoint, graph: options.graph, roleMap, settings: endpointSettings(config), env: options.env ?? process.env, sleep: options.sleep };
}

/** Extraction: the endpoint's hierarchy statements as sources, or nothing when push-down runs the rules there. */
export async function loadFromEndpoint(request: EndpointRequest, pushDown: boolean): Promise<LoadResultWithSkipped> {
  if (pushDown) return { sources: [], errors: endpointProblems(request.endpoint, request.graph), skippedFiles: [] };
  const read = await loadEndpoint(request);
  return { sources: read.sources, errors: read.errors, skippedFiles: [] };
}

/** Push-down of the active rules; an endpoint that cannot be used is an input error, never a clean result. */
export async function pushDownRules(
  request: EndpointRequest,
  config: IsapartConfig,
  active: { rule: RuleDefinition; level: Level }[],
): Promise<{ findings: Finding[]; failures: RuleFailure[]; errors: InputError[]; warnings: InputError[] }> {
  if (endpointProblems(request.endpoint, request.graph).length > 0) return { findings: [], failures: [], errors: [], warnings: [] };
  const client = endpointClient(request);
  if (!('send' in client)) return { findings: [], failures: [], errors: [client], warnings: [] };
  // `endpoint: { trust-server: true }` sends every query, whatever the server.
  const runLocally = request.settings.trustServer === true ? undefined : (rules: { rule: RuleDefinition; level: Level }[]) => runOnExtractedGraph(request, config, rules);
  return runPushDown(
    { client, endpoint: request.endpoint, graph: request.graph, settings: request.settings, roleMap: request.roleMap, scope: config.scope, roots: config.roots, runLocally },
    active,
  );
}

/** Runs rules in memory on the hierarchy statements extracted from the endpoint (the predicates the graph reads). */
async function runOnExtractedGraph(request: EndpointRequest, config: IsapartConfig, rules: { rule: RuleDefinition; level: Level }[]): Promise<PushDownResult> {
  const read = await loadEndpoint(request);
  if (read.errors.length > 0) return { findings: [], failures: [], errors: read.errors, warnings: [] };
  const graph = buildHierarchyGraph(read.sources, request.roleMap, { prefixes: config.scope, roots: config.roots });
  return { ...runRules(graph, rules), errors: [], warnings: [] };
}
