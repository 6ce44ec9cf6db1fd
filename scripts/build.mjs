// Builds what `npm start` and the benches run: the server (and bench/, corpora/ scripts) with
// tsc into dist/, and the web client with vite into dist/client. Fast enough to run on every start.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

run(process.execPath, ['node_modules/typescript/bin/tsc', '-p', 'tsconfig.build.json']);
if (existsSync('client/index.html')) run(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn']);
