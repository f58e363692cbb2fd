// The firn extension: starts `firn lsp` for .firn files and lets VS Code's language client
// show its messages, hovers, definitions, outline, formatting and completions. Highlighting
// comes from the grammar in syntaxes/ and works without the server.
'use strict';

const vscode = require('vscode');

let client;

function activate(context) {
  const settings = vscode.workspace.getConfiguration('firn.languageServer');
  if (!settings.get('enabled', true)) {
    return;
  }
  let languageClient;
  try {
    // Installed with the extension (`npm install` in this folder, or a packaged .vsix).
    languageClient = require('vscode-languageclient/node');
  } catch (error) {
    vscode.window.showWarningMessage(
      'firn: the language client module is not installed in the extension folder ' +
        '(run `npm install` there); highlighting works, firn\'s messages do not.');
    return;
  }
  const command = settings.get('path', 'firn');
  const server = { command, args: ['lsp'], transport: languageClient.TransportKind.stdio };
  client = new languageClient.LanguageClient(
    'firn', 'firn language server', { run: server, debug: server },
    { documentSelector: [{ scheme: 'file', language: 'firn' }] });
  context.subscriptions.push(vscode.workspace.onDidChangeConfiguration((event) => {
    if (event.affectsConfiguration('firn.languageServer')) {
      vscode.window.showInformationMessage(
        'firn: reload the window to start the language server with the new setting.');
    }
  }));
  client.start();
}

function deactivate() {
  return client ? client.stop() : undefined;
}

module.exports = { activate, deactivate };
