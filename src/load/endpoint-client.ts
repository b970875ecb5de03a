// A small SPARQL 1.1 Protocol client on Node's fetch: POST, timeouts, bounded retries, clear errors.
import type { EndpointSettings } from './endpoint-settings.js';
import type { InputError } from './statement.js';

/** The SPARQL 1.1 Query Results JSON media type (SPARQL 1.1 Query Results JSON Format, section 4). */
export const SPARQL_JSON = 'application/sparql-results+json';

/** What a request of the client returned: the media type (without parameters) and the body. */
export interface EndpointAnswer {
  contentType: string;
  body: string;
  headers: Headers;
}

/** What went wrong: an HTTP error status, no answer in time, no connection, or an answer that cannot be read. */
export type FailureKind = 'status' | 'timeout' | 'connection' | 'malformed';

/** A request that failed for good: its InputError names the endpoint (as file), what happened and a hint. */
export class EndpointFailure extends Error {
  constructor(
    readonly problem: InputError,
    readonly kind: FailureKind = 'malformed',
  ) {
    super(problem.message);
    this.name = 'EndpointFailure';
  }
}

/** How many characters of a server's error text an error message quotes. */
const SERVER_MESSAGE_LENGTH = 600;

/** Connection errors (undici's and the system's codes) after which a request is worth sending again. */
const RESET_CODES: ReadonlySet<string> = new Set(['ECONNRESET', 'EPIPE', 'UND_ERR_SOCKET', 'UND_ERR_CLOSED']);

/** What the client needs besides the settings; `sleep` is replaceable so tests need not wait. */
export interface ClientOptions {
  /** The endpoint URL, as given with --endpoint. */
  endpoint: string;
  /** Where errors are placed: the endpoint, with the graph when one is read. */
  location: string;
  settings: EndpointSettings;
  /** The Authorization header's value, read from the environment variable named in config. */
  authorization?: string;
  sleep?: (milliseconds: number) => Promise<void>;
}

/** A failed attempt: whether to try again, what went wrong, and the error to give if not. */
interface AttemptFailure {
  retry: boolean;
  kind: FailureKind;
  problem: InputError;
}

/** Sends SPARQL queries to one endpoint; every failure becomes an EndpointFailure, never a partial answer. */
export class SparqlClient {
  /** Requests sent, retries included (for the summary and the tests). */
  requests = 0;
  /** The Server header of the last successful answer, when the server sent one. */
  serverHeader?: string;
  private readonly sleep: (milliseconds: number) => Promise<void>;

  constructor(private readonly options: ClientOptions) {
    this.sleep = options.sleep ?? ((milliseconds) => new Promise((resolve) => setTimeout(resolve, milliseconds)));
  }

  /** Sends one query and returns the answer; retries 5xx answers and reset connections with exponential backoff. */
  async send(query: string, accept: string, purpose: string): Promise<EndpointAnswer> {
    const { retries, retryDelaySeconds } = this.options.settings;
    let failure: AttemptFailure | undefined;
    for (let attempt = 0; attempt <= retries; attempt++) {
      if (attempt > 0) await this.sleep(retryDelaySeconds * 1000 * 2 ** (attempt - 1));
      const outcome = await this.attempt(query, accept, purpose);
      if ('body' in outcome) return outcome;
      failure = outcome;
      if (!outcome.retry) break;
    }
    const tries = failure!.retry && retries > 0 ? ` (after ${retries + 1} attempts)` : '';
    throw new EndpointFailure({ ...failure!.problem, message: this.redact(failure!.problem.message + tries) }, failure!.kind);
  }

  private async attempt(query: string, accept: string, purpose: string): Promise<EndpointAnswer | AttemptFailure> {
    const { settings } = this.options;
    const headers: Record<string, string> = { Accept: accept };
    if (this.options.authorization !== undefined) headers.Authorization = this.options.authorization;
    let body: string;
    if (settings.post === 'form') {
      headers['Content-Type'] = 'application/x-www-form-urlencoded';
      body = new URLSearchParams({ query }).toString();
    } else {
      headers['Content-Type'] = 'application/sparql-query; charset=utf-8';
      body = query;
    }
    this.requests++;
    // One signal covers the whole exchange, the answer's body included: a server that stalls mid-answer times out too.
    const signal = AbortSignal.timeout(settings.timeoutSeconds * 1000);
    try {
      // Redirects are not followed: the credentials would go wherever they point.
      const response = await fetch(this.options.endpoint, { method: 'POST', headers, body, signal, redirect: 'manual' });
      const text = await response.text();
      const contentType = (response.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
      if (!response.ok) return this.statusFailure(response, serverMessage(text, contentType === 'text/html'), purpose);
      this.serverHeader = response.headers.get('server') ?? undefined;
      return { contentType, body: text, headers: response.headers };
    } catch (error) {
      return this.connectionFailure(error, purpose);
    }
  }

  private statusFailure(response: Response, said: string, purpose: string): AttemptFailure {
    const status = `HTTP ${response.status}${response.statusText ? ` ${response.statusText}` : ''}`;
    const message = `the SPARQL endpoint answered ${status} to the query for ${purpose}${said === '' ? '' : `: ${said}`}`;
    const location = response.headers.get('location');
    const hint =
      response.status >= 300 && response.status < 400
        ? `the endpoint redirects${location === null ? '' : ` to ${location}`}; give that URL with --endpoint (isapart does not follow redirects, so credentials go nowhere else)`
        : statusHint(response.status, said, this.options.settings);
    return { retry: response.status >= 500, kind: 'status', problem: this.problem(message, hint) };
  }

  private connectionFailure(error: unknown, purpose: string): AttemptFailure {
    const name = error instanceof Error ? error.name : '';
    if (name === 'TimeoutError' || name === 'AbortError') {
      const seconds = this.options.settings.timeoutSeconds;
      const hint =
        this.options.settings.post === 'query'
          ? 'raise `endpoint: { timeout: SECONDS }` in isapart.yaml, or lower `page-size`; a server that never answers a direct POST (Virtuoso 7.2 does not) needs `endpoint: { post: form }`'
          : 'raise `endpoint: { timeout: SECONDS }` in isapart.yaml, or lower `page-size` so each request asks for less';
      return { retry: false, kind: 'timeout', problem: this.problem(`the SPARQL endpoint did not answer the query for ${purpose} within ${seconds} s`, hint) };
    }
    const code = errorCode(error);
    const reason = code === undefined ? (error instanceof Error ? (causeMessage(error) ?? error.message) : String(error)) : code;
    const refused = code === 'ECONNREFUSED' || code === 'ENOTFOUND' || code === 'EAI_AGAIN';
    const hint = refused
      ? 'check the URL given with --endpoint and that the SPARQL server is running and reachable from here'
      : 'the connection broke off; check the server log, or try again later';
    return {
      retry: code !== undefined && RESET_CODES.has(code),
      kind: 'connection',
      problem: this.problem(`the SPARQL endpoint could not be reached for the query for ${purpose}: ${reason}`, hint),
    };
  }

  private problem(message: string, hint: string): InputError {
    return { file: this.options.location, line: 0, column: 0, message: this.redact(message), hint };
  }

  /** Removes the credentials from any text a server sent back, so they are never shown. */
  private redact(text: string): string {
    const secret = this.options.authorization;
    if (secret === undefined || secret === '') return text;
    let redacted = text.split(secret).join('[credentials removed]');
    // A scheme such as `Bearer x` may be echoed as the token alone.
    const token = secret.includes(' ') ? secret.slice(secret.indexOf(' ') + 1).trim() : '';
    if (token.length >= 4) redacted = redacted.split(token).join('[credentials removed]');
    return redacted;
  }
}

/** A server's error text as one short line: the tags of an HTML page removed, blank runs collapsed. */
function serverMessage(text: string, html: boolean): string {
  const plain = html ? text.replace(/<script[\s\S]*?<\/script>|<style[\s\S]*?<\/style>/gi, ' ').replace(/<[^>]+>/g, ' ') : text;
  const line = plain.replace(/\s+/g, ' ').trim();
  return line.length > SERVER_MESSAGE_LENGTH ? `${line.slice(0, SERVER_MESSAGE_LENGTH)}…` : line;
}

/** A hint for an HTTP status; Virtuoso's sort limit has its own (its error code SR353, as this server reports it). */
function statusHint(status: number, said: string, settings: EndpointSettings): string {
  if (/SR353|Sorted TOP clause/.test(said)) {
    return 'Virtuoso caps ORDER BY with OFFSET at MaxSortedTopRows rows (section [Parameters] of virtuoso.ini): raise it above the largest role count, or ask the store administrator to';
  }
  if (status === 401 || status === 403) {
    return settings.authorizationEnv === undefined
      ? 'the endpoint wants credentials: name the environment variable that holds the Authorization header value in isapart.yaml, `endpoint: { authorization-env: NAME }`'
      : `check the credentials in the environment variable ${settings.authorizationEnv} (named by endpoint: authorization-env)`;
  }
  if (status === 404) return 'check the URL given with --endpoint: it should be the SPARQL service itself, often ending in /sparql';
  if (status === 400) return 'the server refused the query; if it does not take a direct POST, set `endpoint: { post: form }` in isapart.yaml';
  if (status === 415) return 'the server does not take `application/sparql-query` bodies; set `endpoint: { post: form }` in isapart.yaml';
  if (status >= 500) return 'the server failed; its log may say more. Retried with growing delays (`endpoint: { retries: N }` in isapart.yaml)';
  return 'check the URL given with --endpoint and the server\'s documentation';
}

/** The system or undici error code of a failed fetch (`error.cause.code`), when there is one. */
function errorCode(error: unknown): string | undefined {
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current !== undefined && current !== null; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string') return code;
    current = (current as { cause?: unknown }).cause;
  }
  return undefined;
}

function causeMessage(error: Error): string | undefined {
  const cause = (error as { cause?: unknown }).cause;
  return cause instanceof Error ? cause.message : undefined;
}
