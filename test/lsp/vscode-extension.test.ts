// The VS Code extension under editors/vscode: it starts `isapart lsp --stdio` for every file extension the loader reads.
import { readFileSync } from 'node:fs';
import Module, { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { RDF_EXTENSIONS } from '../../src/load/format.js';

const extensionFolder = path.resolve(fileURLToPath(import.meta.url), '../../../editors/vscode');
const manifest = JSON.parse(readFileSync(path.join(extensionFolder, 'package.json'), 'utf8')) as {
  main: string;
  activationEvents: string[];
  contributes: { languages: { id: string; extensions: string[] }[] };
};

interface StartedClient {
  id: string;
  server: { run: { command: string; args: string[] } };
  client: { documentSelector: { scheme: string; language: string }[]; synchronize: { fileEvents: string }; initializationOptions: unknown };
  started: boolean;
}

/** Loads extension.js with stand-ins for the `vscode` and `vscode-languageclient/node` modules, and activates it. */
function activateWithStandIns(settings: Record<string, unknown>): StartedClient {
  const clients: StartedClient[] = [];
  const standIns: Record<string, unknown> = {
    vscode: {
      workspace: {
        getConfiguration: () => ({ get: (key: string, fallback: unknown) => settings[key] ?? fallback }),
        createFileSystemWatcher: (glob: string) => glob,
      },
    },
    'vscode-languageclient/node': {
      TransportKind: { stdio: 0 },
      LanguageClient: class {
        record: StartedClient;
        constructor(id: string, _name: string, server: StartedClient['server'], client: StartedClient['client']) {
          this.record = { id, server, client, started: false };
          clients.push(this.record);
        }
        start() {
          this.record.started = true;
          return Promise.resolve();
        }
        stop() {
          return Promise.resolve();
        }
      },
    },
  };
  const moduleInternals = Module as unknown as { _load: (request: string, parent: unknown, isMain: boolean) => unknown };
  const originalLoad = moduleInternals._load;
  moduleInternals._load = (request, parent, isMain) => (request in standIns ? standIns[request] : originalLoad(request, parent, isMain));
  try {
    const require = createRequire(path.join(extensionFolder, 'package.json'));
    const entry = require.resolve(path.join(extensionFolder, manifest.main));
    delete require.cache[entry];
    const extension = require(entry) as { activate(context: { subscriptions: unknown[] }): unknown };
    extension.activate({ subscriptions: [] });
  } finally {
    moduleInternals._load = originalLoad;
  }
  expect(clients).toHaveLength(1);
  return clients[0];
}

describe('the VS Code extension', () => {
  it('declares a language for every extension the loader reads, and activates on them', () => {
    const declared = manifest.contributes.languages.flatMap((language) => language.extensions);
    expect([...declared].sort()).toEqual([...RDF_EXTENSIONS].sort());
    for (const extension of RDF_EXTENSIONS) expect(manifest.activationEvents[0]).toContain(extension.slice(1));
  });

  it('starts isapart lsp --stdio for those languages, and watches RDF and YAML files', () => {
    const started = activateWithStandIns({});
    expect(started.started).toBe(true);
    expect(started.server.run).toMatchObject({ command: 'isapart', args: ['lsp', '--stdio'] });
    expect(started.client.documentSelector.map((selector) => selector.language).sort()).toEqual(
      manifest.contributes.languages.map((language) => language.id).sort(),
    );
    for (const extension of [...RDF_EXTENSIONS, '.yaml']) expect(started.client.synchronize.fileEvents).toContain(extension.slice(1));
    expect(started.client.initializationOptions).toEqual({ lintDelayMs: 60 });
  });

  it('runs a configured bin/isapart.js with node', () => {
    const started = activateWithStandIns({ command: '/opt/isapart/bin/isapart.js', lintDelayMs: 25 });
    expect(started.server.run).toMatchObject({ command: process.execPath, args: ['/opt/isapart/bin/isapart.js', 'lsp', '--stdio'] });
    expect(started.client.initializationOptions).toEqual({ lintDelayMs: 25 });
  });
});
