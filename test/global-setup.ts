// Builds the server and client once before the suite, so integration and browser tests run
// the same files `npm start` runs. SHEAF_TEST_NO_BUILD=1 skips it when only engine tests run.
import { spawnSync } from 'node:child_process';

export default function setup(): void {
  if (process.env.SHEAF_TEST_NO_BUILD === '1') return;
  const r = spawnSync(process.execPath, ['scripts/build.mjs'], { stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm run build failed; the integration tests need dist/');
}
