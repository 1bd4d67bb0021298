// The walden extension starts `walden serve` and connects it to the
// documents where chemists write reaction steps: fenced ```reaction blocks
// in Markdown pages, .steps plan files, and the Markdown cells of Jupyter
// notebooks. All analysis happens in the server; this file only launches it.
import * as vscode from 'vscode';
import {
  DocumentSelector,
  LanguageClient,
  LanguageClientOptions,
  ServerOptions,
  TransportKind,
} from 'vscode-languageclient/node';

let client: LanguageClient | undefined;

// selector lists what the server reads. Text documents are limited to the
// file and untitled schemes so that notebook cells (scheme
// vscode-notebook-cell) reach the server only once, through the LSP 3.17
// notebook synchronisation that vscode-languageclient 8 and later provide.
const selector: DocumentSelector = [
  { scheme: 'file', language: 'markdown' },
  { scheme: 'untitled', language: 'markdown' },
  { scheme: 'file', language: 'walden-steps' },
  { scheme: 'untitled', language: 'walden-steps' },
  { notebook: '*', language: 'markdown' },
];

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  context.subscriptions.push(
    vscode.commands.registerCommand('walden.restartServer', restart),
    vscode.workspace.onDidChangeConfiguration(async (e) => {
      // The program and its arguments are read only at start-up; other
      // walden.* settings reach the running server as
      // workspace/didChangeConfiguration.
      if (e.affectsConfiguration('walden.path') || e.affectsConfiguration('walden.serverArguments')) {
        await restart();
      }
    }),
  );
  await start();
}

export async function deactivate(): Promise<void> {
  await stop();
}

async function start(): Promise<void> {
  const cfg = vscode.workspace.getConfiguration('walden');
  const command = cfg.get<string>('path') || 'walden';
  const args = ['serve', ...(cfg.get<string[]>('serverArguments') ?? [])];
  const serverOptions: ServerOptions = {
    run: { command, args, transport: TransportKind.stdio },
    debug: { command, args, transport: TransportKind.stdio },
  };
  const clientOptions: LanguageClientOptions = {
    documentSelector: selector,
    synchronize: { configurationSection: 'walden' },
    outputChannelName: 'walden',
  };
  client = new LanguageClient('walden', 'walden', serverOptions, clientOptions);
  try {
    await client.start();
  } catch (err) {
    const msg = err instanceof Error ? err.message : String(err);
    void vscode.window.showErrorMessage(
      `walden could not start "${command} serve": ${msg}. ` +
        'Install walden (see the extension README) or set "walden.path" to the program.',
    );
  }
}

async function stop(): Promise<void> {
  const c = client;
  client = undefined;
  if (c && c.isRunning()) {
    await c.stop();
  }
}

async function restart(): Promise<void> {
  await stop();
  await start();
}
