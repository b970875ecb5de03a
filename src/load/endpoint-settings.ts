// How isapart talks to a SPARQL 1.1 endpoint: paging, timeouts, retries, the request form, credentials.

/** How a query travels (SPARQL 1.1 Protocol, section 2.1): the query as the POST body, or as a form field. */
export type QueryPost = 'query' | 'form';

/** How pages of statements come back: SELECT rows as SPARQL JSON results, or CONSTRUCT triples as N-Triples (or Turtle). */
export type PageResults = 'json' | 'n-triples';

/** The `endpoint:` settings of isapart.yaml, with defaults filled in. */
export interface EndpointSettings {
  /** Rows asked for per request (LIMIT of each page). */
  pageSize: number;
  /** Seconds one request may take, from sending it to the last byte of the answer. */
  timeoutSeconds: number;
  /** How many times a request is sent again after a 5xx answer or a reset connection. */
  retries: number;
  /** Seconds before the first retry; each further retry waits twice as long. */
  retryDelaySeconds: number;
  /** The name of the environment variable that holds the Authorization header's value; never the value itself. */
  authorizationEnv?: string;
  /** `query`: POST with `Content-Type: application/sparql-query`; `form`: POST `application/x-www-form-urlencoded`. */
  post: QueryPost;
  /** `json`: SELECT pages read as SPARQL 1.1 Query Results JSON; `n-triples`: CONSTRUCT pages read with n3. */
  results: PageResults;
  /** With `--push-down`, send every rule's query even to a server known to answer some wrongly (src/endpoint-known-servers.ts). */
  trustServer?: boolean;
}

/** The settings when isapart.yaml has no `endpoint:` section. */
export const DEFAULT_ENDPOINT_SETTINGS: Readonly<EndpointSettings> = Object.freeze({
  pageSize: 10_000,
  timeoutSeconds: 120,
  retries: 3,
  retryDelaySeconds: 1,
  post: 'query',
  results: 'json',
});
