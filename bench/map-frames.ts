/**
 * How fast the web client's map draws 50,000 points, in a real headless chromium (software
 * rendering, no GPU), while panning and zooming every frame.
 *
 *   npm run bench map-frames [points=50000] [frames=150]
 *
 * Serves the built client (dist/client) from 127.0.0.1, mounts one <sheaf-scatter-map> with
 * synthetic clustered points, and drives it with a pan/zoom per animation frame. Prints frames
 * per second and draw time per frame (mean, 95th percentile), and, side by side in the same run,
 * the same measure for a plain peer drawing (one arc and fill per point, the way a first attempt
 * usually draws a scatter), with the ratio.
 */
import { createServer, type Server } from 'node:http';
import { readFile } from 'node:fs/promises';
import { extname, join, normalize } from 'node:path';
import { chromium } from 'playwright-core';

const points = Number(process.argv[2] ?? 50_000);
const frames = Number(process.argv[3] ?? 150);
if (!Number.isInteger(points) || points < 1 || !Number.isInteger(frames) || frames < 10) {
  console.error('usage: npm run bench map-frames [points ≥ 1] [frames ≥ 10]');
  process.exit(2);
}

const ROOT = 'dist/client';
const TYPES: Record<string, string> = { '.js': 'text/javascript', '.css': 'text/css', '.html': 'text/html', '.svg': 'image/svg+xml', '.map': 'application/json' };

async function harness(): Promise<string> {
  const index = await readFile(join(ROOT, 'index.html'), 'utf8');
  const script = /<script type="module"[^>]*src="([^"]+)"/.exec(index)?.[1];
  if (!script) throw new Error('dist/client/index.html has no module script; run npm run build');
  return `<!doctype html><html><head><meta charset="utf-8"><script type="module" src="${script}"></script>
<style>body{margin:0} sheaf-scatter-map{display:block;width:1200px;height:800px}</style></head><body><div id="host"></div></body></html>`;
}

function serve(page: string): Promise<{ server: Server; url: string }> {
  const server = createServer(async (req, res) => {
    const path = normalize(decodeURIComponent((req.url ?? '/').split('?')[0]));
    if (path === '/' || path === '/bench.html') {
      res.writeHead(200, { 'content-type': 'text/html' }).end(page);
      return;
    }
    if (path.includes('..')) return void res.writeHead(400).end();
    try {
      const body = await readFile(join(ROOT, path));
      res.writeHead(200, { 'content-type': TYPES[extname(path)] ?? 'application/octet-stream' }).end(body);
    } catch {
      res.writeHead(404).end();
    }
  });
  return new Promise((resolve) => server.listen(0, '127.0.0.1', () => {
    const a = server.address();
    resolve({ server, url: `http://127.0.0.1:${typeof a === 'object' && a ? a.port : 0}/` });
  }));
}

interface Run {
  fps: number;
  meanMs: number;
  p95Ms: number;
}

/** Runs inside the page: mounts the map, then pans/zooms once per frame and times each draw. */
const PAGE_RUN = async ({ n, frames, peer }: { n: number; frames: number; peer: boolean }): Promise<Run> => {
  await customElements.whenDefined('sheaf-scatter-map');
  // Deterministic clustered points: 12 Gaussian blobs (Park–Miller generator, Box–Muller).
  let s = 12345;
  const rnd = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const gauss = () => Math.sqrt(-2 * Math.log(rnd() + 1e-12)) * Math.cos(2 * Math.PI * rnd());
  const k = 12;
  const xs = new Float32Array(n), ys = new Float32Array(n), styleOf = new Int32Array(n);
  const cx = Array.from({ length: k }, () => rnd() * 40 - 20), cy = Array.from({ length: k }, () => rnd() * 40 - 20);
  for (let i = 0; i < n; i++) {
    const c = Math.floor(rnd() * k);
    styleOf[i] = c;
    xs[i] = cx[c] + gauss() * 2.5;
    ys[i] = cy[c] + gauss() * 2.5;
  }
  const hues = ['#0072B2', '#E69F00', '#009E73', '#D55E00', '#56B4E9', '#CC79A7', '#F0E442', '#000000'];
  const styles = Array.from({ length: k + 1 }, (_, i) => ({ color: hues[i % 8], rgb: [0, 0, 0], marker: i < 8 ? 'dot' : 'ring' }));
  const times: number[] = [];
  if (!peer) {
    const el = document.createElement('sheaf-scatter-map') as HTMLElement & Record<string, any>;
    Object.assign(el, { xs, ys, styleOf, styles });
    document.getElementById('host')!.append(el);
    await el.updateComplete;
    await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    const start = performance.now();
    const drawn0 = el.framesDrawn as number;
    for (let f = 0; f < frames; f++) {
      if (f % 2) el.view.panBy(6, -3);
      else el.view.zoomAt(600, 400, f % 4 === 0 ? 1.02 : 0.985);
      el.schedule();
      await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
      times.push(el.lastFrameMs as number);
    }
    const elapsed = performance.now() - start;
    const drawn = (el.framesDrawn as number) - drawn0;
    times.sort((a, b) => a - b);
    return { fps: (drawn / elapsed) * 1000, meanMs: times.reduce((a, b) => a + b, 0) / times.length, p95Ms: times[Math.floor(times.length * 0.95)] };
  }
  // Peer: a straightforward canvas scatter, one path + fill per point.
  const canvas = document.createElement('canvas');
  canvas.width = 1200;
  canvas.height = 800;
  document.getElementById('host')!.append(canvas);
  const ctx = canvas.getContext('2d')!;
  let scale = 18, ox = 600, oy = 400;
  const start = performance.now();
  for (let f = 0; f < frames; f++) {
    if (f % 2) (ox += 6), (oy += 3);
    else scale *= f % 4 === 0 ? 1.02 : 0.985;
    await new Promise((r) => requestAnimationFrame(r));
    const t0 = performance.now();
    ctx.clearRect(0, 0, 1200, 800);
    for (let i = 0; i < n; i++) {
      ctx.beginPath();
      ctx.arc(ox + xs[i] * scale, oy - ys[i] * scale, 1.6, 0, Math.PI * 2);
      ctx.fillStyle = hues[styleOf[i] % 8];
      ctx.fill();
    }
    times.push(performance.now() - t0);
  }
  const elapsed = performance.now() - start;
  times.sort((a, b) => a - b);
  return { fps: (frames / elapsed) * 1000, meanMs: times.reduce((a, b) => a + b, 0) / times.length, p95Ms: times[Math.floor(times.length * 0.95)] };
};

async function main(): Promise<void> {
  const { server, url } = await serve(await harness());
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const results: Record<string, Run & { heapMB: number }> = {};
    for (const peer of [false, true]) {
      const page = await browser.newPage({ viewport: { width: 1240, height: 840 } });
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      await page.goto(url);
      const run = (await page.evaluate(PAGE_RUN as any, { n: points, frames, peer })) as Run;
      if (errors.length) throw new Error(errors.join('\n'));
      const cdp = await page.context().newCDPSession(page);
      await cdp.send('Performance.enable');
      const metrics = (await cdp.send('Performance.getMetrics')).metrics as { name: string; value: number }[];
      const heap = metrics.find((m) => m.name === 'JSHeapUsedSize')?.value ?? NaN;
      results[peer ? 'peer' : 'sheaf'] = { ...run, heapMB: heap / 2 ** 20 };
      await page.close();
    }
    const a = results.sheaf, b = results.peer;
    const row = (name: string, r: Run & { heapMB: number }) =>
      `${name.padEnd(34)} ${r.fps.toFixed(1).padStart(7)} ${r.meanMs.toFixed(2).padStart(9)} ${r.p95Ms.toFixed(2).padStart(9)} ${r.heapMB.toFixed(1).padStart(9)}`;
    console.log(`map-frames: ${points.toLocaleString('en-US')} points, ${frames} pan/zoom frames, headless chromium without GPU, 1200×800 canvas`);
    console.log(`${'drawer'.padEnd(34)} ${'fps'.padStart(7)} ${'mean ms'.padStart(9)} ${'p95 ms'.padStart(9)} ${'heap MB'.padStart(9)}`);
    console.log(row('sheaf-scatter-map (pixel buffer)', a));
    console.log(row('peer: one arc+fill per point', b));
    console.log(`ratio (peer / sheaf): draw time mean ${(b.meanMs / a.meanMs).toFixed(1)}×, p95 ${(b.p95Ms / a.p95Ms).toFixed(1)}×; fps sheaf/peer ${(a.fps / b.fps).toFixed(1)}×`);
    console.log(`target ≥ 30 fps: ${a.fps >= 30 ? 'met' : 'NOT met'} (frame rate is capped by the display clock, ~60 fps)`);
    console.log(`bench process peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB (the browser runs in its own processes)`);
  } finally {
    await browser.close();
    server.close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
