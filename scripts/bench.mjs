// `npm run bench NAME [args…]` builds, then runs dist/bench/NAME.js; with no NAME it lists them.
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';

const [name, ...rest] = process.argv.slice(2);
const build = spawnSync(process.execPath, ['scripts/build.mjs'], { stdio: 'inherit' });
if (build.status !== 0) process.exit(build.status ?? 1);
const names = readdirSync('dist/bench').filter((f) => f.endsWith('.js')).map((f) => f.slice(0, -3));
if (!name || !names.includes(name)) {
  console.log(`usage: npm run bench <name> [args]\nbenches: ${names.join(', ')}`);
  process.exit(name ? 2 : 0);
}
const r = spawnSync(process.execPath, ['--expose-gc', `dist/bench/${name}.js`, ...rest], { stdio: 'inherit' });
process.exit(r.status ?? 1);
