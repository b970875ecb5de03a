// The `endpoint:` section of isapart.yaml: how to talk to a SPARQL endpoint given with --endpoint.
import { isMap, isScalar, type Node } from 'yaml';
import type { EndpointSettings } from '../load/endpoint-settings.js';
import type { IsapartConfig } from './config.js';
import { suggestionHint } from './nearest.js';
import { blameNode, describeNode, mappingEntries, reportAt, stringValue, type MappingEntry, type YamlReadContext } from './yaml-nodes.js';

/** The keys of `endpoint:`, as users write them. */
export const ENDPOINT_KEYS = ['page-size', 'timeout', 'retries', 'retry-delay', 'authorization-env', 'post', 'results', 'trust-server'] as const;

/** An environment variable name as POSIX shells accept it (common practice). */
const VARIABLE_NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** A number node within bounds, or undefined (reported). */
function readNumber(context: YamlReadContext, entry: MappingEntry, bounds: { min: number; max: number; integer: boolean; example: string }): number | undefined {
  const node: Node | undefined = entry.value;
  const value = isScalar(node) ? node.value : undefined;
  const ok = typeof value === 'number' && Number.isFinite(value) && value >= bounds.min && value <= bounds.max && (!bounds.integer || Number.isInteger(value));
  if (ok) return value;
  const kind = bounds.integer ? 'a whole number' : 'a number';
  reportAt(context, blameNode(entry), `\`endpoint: ${entry.key}\` must be ${kind} from ${bounds.min} to ${bounds.max}, found ${describeNode(node)}`, `write, for example, \`${entry.key}: ${bounds.example}\``);
  return undefined;
}

/**
 * `endpoint: { page-size, timeout, retries, retry-delay, authorization-env, post, results, trust-server }`. The
 * credentials are never in the file: `authorization-env` names the environment variable that
 * holds the Authorization header's value.
 */
export function readEndpoint(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  if (!isMap(entry.value)) {
    reportAt(context, blameNode(entry), `\`endpoint\` must be a mapping of settings, found ${describeNode(entry.value)}`, 'write `endpoint: { page-size: 10000, timeout: 120 }`');
    return;
  }
  const settings: Partial<EndpointSettings> = {};
  for (const field of mappingEntries(context, entry.value)) {
    switch (field.key) {
      case 'page-size':
        settings.pageSize = readNumber(context, field, { min: 1, max: 1_000_000, integer: true, example: '10000' });
        break;
      case 'timeout':
        settings.timeoutSeconds = readNumber(context, field, { min: 0.001, max: 86_400, integer: false, example: '120' });
        break;
      case 'retries':
        settings.retries = readNumber(context, field, { min: 0, max: 10, integer: true, example: '3' });
        break;
      case 'retry-delay':
        settings.retryDelaySeconds = readNumber(context, field, { min: 0, max: 600, integer: false, example: '1' });
        break;
      case 'authorization-env': {
        const name = stringValue(field.value);
        if (name === undefined || !VARIABLE_NAME.test(name)) {
          reportAt(
            context,
            blameNode(field),
            `\`endpoint: authorization-env\` must name an environment variable (letters, digits and _), found ${describeNode(field.value)}`,
            'write the variable\'s name, never the credentials: `authorization-env: NORTHVALE_SPARQL_AUTH`',
          );
        } else {
          settings.authorizationEnv = name;
        }
        break;
      }
      case 'post': {
        const form = stringValue(field.value);
        if (form !== 'query' && form !== 'form') {
          reportAt(context, blameNode(field), `\`endpoint: post\` must be \`query\` or \`form\`, found ${describeNode(field.value)}`, 'query: the query as the POST body (application/sparql-query); form: as a form field (what Virtuoso 7.2 needs)');
        } else {
          settings.post = form;
        }
        break;
      }
      case 'results': {
        const form = stringValue(field.value);
        if (form !== 'json' && form !== 'n-triples') {
          reportAt(context, blameNode(field), `\`endpoint: results\` must be \`json\` or \`n-triples\`, found ${describeNode(field.value)}`, 'json: SELECT pages as SPARQL JSON results; n-triples: CONSTRUCT pages as N-Triples or Turtle');
        } else {
          settings.results = form;
        }
        break;
      }
      case 'trust-server': {
        const value = isScalar(field.value) ? field.value.value : undefined;
        if (typeof value !== 'boolean') {
          reportAt(context, blameNode(field), `\`endpoint: trust-server\` must be true or false, found ${describeNode(field.value)}`, 'true: with --push-down, send every rule\'s query even to a server known to answer some of them wrongly (docs/push-down.md)');
        } else {
          settings.trustServer = value;
        }
        break;
      }
      default:
        reportAt(context, field.keyNode, `unknown key \`${field.key}\` in \`endpoint\``, suggestionHint(field.key, ENDPOINT_KEYS, 'keys'));
    }
  }
  const defined = Object.fromEntries(Object.entries(settings).filter(([, value]) => value !== undefined));
  // An empty section changes nothing, so it leaves the config as it was.
  if (Object.keys(defined).length > 0) config.endpoint = defined as Partial<EndpointSettings>;
}
