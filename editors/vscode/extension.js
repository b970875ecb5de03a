// The isapart VS Code extension: starts `isapart lsp --stdio` for RDF documents and does nothing else.
const { workspace } = require('vscode');
const { LanguageClient, TransportKind } = require('vscode-languageclient/node');

/** The language ids this extension declares in package.json, one per file extension isapart reads. */
const LANGUAGES = ['turtle', 'trig', 'ntriples', 'nquads', 'rdfxml', 'jsonld'];

let client;

/** Starts the language server when VS Code activates the extension. */
function activate(context) {
  const settings = workspace.getConfiguration('isapart');
  const command = settings.get('command', 'isapart');
  // A path to a .js file (such as a checkout's bin/isapart.js) is run with the node that runs VS Code's extension host.
  const server = command.endsWith('.js')
    ? { command: process.execPath, args: [command, 'lsp', '--stdio'], transport: TransportKind.stdio }
    : { command, args: ['lsp', '--stdio'], transport: TransportKind.stdio };
  client = new LanguageClient(
    'isapart',
    'isapart',
    { run: server, debug: server },
    {
      documentSelector: LANGUAGES.map((language) => ({ scheme: 'file', language })),
      // Files created, changed or deleted on disk, and config or rule files, reach the server without a restart.
      synchronize: { fileEvents: workspace.createFileSystemWatcher('**/*.{ttl,trig,nt,nq,rdf,owl,jsonld,gz,yaml,yml}') },
      initializationOptions: { lintDelayMs: settings.get('lintDelayMs', 60) },
    },
  );
  context.subscriptions.push({ dispose: () => client && client.stop() });
  return client.start();
}

/** Stops the language server when VS Code deactivates the extension. */
function deactivate() {
  return client ? client.stop() : undefined;
}

module.exports = { activate, deactivate };
