// The `endpoint:` section of isapart.yaml: values, defaults, and errors with line and hint.
import { describe, expect, it } from 'vitest';
import { endpointSettings } from '../../src/check-endpoint.js';
import { parseConfig } from '../../src/config/load-config.js';
import { DEFAULT_ENDPOINT_SETTINGS } from '../../src/load/endpoint-settings.js';

describe('endpoint: in isapart.yaml', () => {
  it('reads every key over the defaults', () => {
    const { config, errors } = parseConfig(
      'endpoint:\n  page-size: 500\n  timeout: 30\n  retries: 0\n  retry-delay: 0.25\n  authorization-env: NV_SPARQL_AUTH\n  post: form\n  results: n-triples\n  trust-server: true\n',
      'isapart.yaml',
    );
    expect(errors).toEqual([]);
    expect(endpointSettings(config)).toEqual({ pageSize: 500, timeoutSeconds: 30, retries: 0, retryDelaySeconds: 0.25, authorizationEnv: 'NV_SPARQL_AUTH', post: 'form', results: 'n-triples', trustServer: true });
  });

  it('keeps the defaults without the section', () => {
    const { config } = parseConfig('scope: [https://data.northvale-rail.example/]\n', 'isapart.yaml');
    expect(endpointSettings(config)).toEqual(DEFAULT_ENDPOINT_SETTINGS);
  });

  it.each([
    ['endpoint:\n  page-size: 0\n', 2, '`endpoint: page-size` must be a whole number from 1 to 1000000, found the number 0'],
    ['endpoint:\n  page-size: 10.5\n', 2, 'must be a whole number'],
    ['endpoint:\n  timeout: soon\n', 2, '`endpoint: timeout` must be a number from 0.001 to 86400, found the text `soon`'],
    ['endpoint:\n  retries: 99\n', 2, '`endpoint: retries` must be a whole number from 0 to 10'],
    ['endpoint:\n  post: get\n', 2, '`endpoint: post` must be `query` or `form`, found the text `get`'],
    ['endpoint:\n  authorization-env: Bearer abc123\n', 2, '`endpoint: authorization-env` must name an environment variable'],
    ['endpoint:\n  page-sise: 100\n', 2, 'unknown key `page-sise` in `endpoint`'],
    ['endpoint:\n  results: xml\n', 2, '`endpoint: results` must be `json` or `n-triples`, found the text `xml`'],
    ['endpoint:\n  trust-server: yes please\n', 2, '`endpoint: trust-server` must be true or false, found the text `yes please`'],
    ['endpoint: fast\n', 1, '`endpoint` must be a mapping of settings, found the text `fast`'],
  ])('refuses %j at line %i', (text, line, message) => {
    const { errors } = parseConfig(text, 'isapart.yaml');
    expect(errors).toHaveLength(1);
    expect(errors[0].line).toBe(line);
    expect(errors[0].message).toContain(message);
    expect(errors[0].hint).toBeTruthy();
  });

  it('suggests the nearest key for a misspelt one', () => {
    const { errors } = parseConfig('endpoint:\n  page-sise: 100\n', 'isapart.yaml');
    expect(errors[0].hint).toContain('page-size');
  });
});
