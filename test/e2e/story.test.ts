/**
 * One end-to-end story through the real server and a real browser: upload the demo CSV, find
 * themes with k chosen by silhouette, check the map, rename, merge, move, export, reload.
 */
import { mkdir, readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { splitCsv } from '../../client/lib/preview-parse.js';
import { api, startServer, type TestServer } from '../helpers/server.js';
import { launchBrowser, type TestBrowser } from './browser.js';

const DEMO = 'corpora/demo.csv';

let server: TestServer;
let browser: TestBrowser;
let page: Page;
const pageErrors: string[] = [];

beforeAll(async () => {
  await mkdir('test-output', { recursive: true });
  server = await startServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
  page.on('pageerror', (e) => pageErrors.push(e.message));
  // The server's Content-Security-Policy allows no inline or foreign script: any violation is a bug.
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) pageErrors.push(m.text());
  });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** Rows of the demo file, counted with an RFC 4180 reader (the file has line breaks inside quotes). */
async function demoRowCount(): Promise<number> {
  return splitCsv(await readFile(DEMO, 'utf8')).records.length - 1;
}

describe('a person sorting the demo inbox', () => {
  it('uploads, finds themes, edits them, exports, and finds the edits after a reload', async () => {
    const expected = await demoRowCount();
    await page.goto(server.url);
    await page.getByText('No corpora yet').waitFor();

    // Upload with a preview parsed in the browser and the text field picked.
    await page.locator('sheaf-upload input[type=file]').setInputFiles(DEMO);
    await page.locator('sheaf-upload .preview table').waitFor();
    expect(await page.locator('sheaf-upload select[name=textField]').inputValue()).toBe('text');
    expect(await page.locator('sheaf-upload select[name=idField]').inputValue()).toBe('id');
    await page.locator('sheaf-upload button[type=submit]').click();
    const note = page.locator('sheaf-upload [role=status]');
    await note.waitFor();
    expect(await note.innerText()).toContain(`${expected.toLocaleString('en-US')} documents imported`);

    // The new corpus is selected; run auto-k over a short range to keep the test quick.
    await page.locator('sheaf-analysis-form input[name=kMax]').fill('8');
    await page.locator('sheaf-analysis-form select[name=mapEpochs]').selectOption('fine');
    await page.locator('sheaf-analysis-form button[type=submit]').click();
    await page.locator('sheaf-job-progress [role=progressbar]').waitFor();

    // Finishing opens the analysis; the map holds one point per document.
    const canvas = page.locator('sheaf-scatter-map canvas');
    await canvas.waitFor({ timeout: 180_000 });
    expect(Number(await canvas.getAttribute('data-points'))).toBe(expected);
    const aid = new URL(page.url()).searchParams.get('analysis')!;
    expect(aid).toBeTruthy();
    expect((await api(server.url, `/analyses/${aid}`)).body.params).toMatchObject({ kMax: 8, mapEpochs: 'fine' });
    await page.locator('sheaf-analysis-header', { hasText: 'fine map' }).waitFor();
    const drawn = await page.locator('sheaf-scatter-map').evaluate((el) => (el as unknown as { framesDrawn: number }).framesDrawn);
    expect(drawn).toBeGreaterThan(0);

    // Hovering a point shows that document's text; a box over the whole map selects every point.
    const map = page.locator('sheaf-scatter-map');
    const at = await map.evaluate((el: any) => ({ x: el.view.sx(el.xs[0]), y: el.view.sy(el.ys[0]) }));
    const box = (await canvas.boundingBox())!;
    await page.mouse.move(box.x + at.x, box.y + at.y);
    const hovered = await map.evaluate((el: any) => el.hovered as number);
    expect(hovered).toBeGreaterThanOrEqual(0);
    const hoveredDoc = (await api(server.url, `/corpora/${new URL(page.url()).searchParams.get('corpus')}/documents?offset=${hovered}&limit=1`)).body.items[0];
    const start = hoveredDoc.text.replace(/\s+/g, ' ').trim().slice(0, 40);
    await page.locator('sheaf-scatter-map .tip', { hasText: start }).waitFor();
    await page.getByRole('button', { name: 'Box', exact: true }).click();
    await page.mouse.move(box.x + 2, box.y + 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width - 2, box.y + box.height - 2, { steps: 4 });
    await page.mouse.up();
    const moveBar = page.locator('sheaf-analysis-page .movebar');
    await moveBar.waitFor();
    expect(await moveBar.innerText()).toContain(`${expected.toLocaleString('en-US')} selected`);
    await moveBar.getByRole('button', { name: 'Clear selection' }).click();
    await moveBar.waitFor({ state: 'detached' });
    // A lasso drawn around the whole map selects every point too.
    await page.getByRole('button', { name: 'Lasso', exact: true }).click();
    await page.mouse.move(box.x + 2, box.y + 2);
    await page.mouse.down();
    for (const [fx, fy] of [[0.5, 0], [1, 0], [1, 0.5], [1, 1], [0.5, 1], [0, 1], [0, 0.5]]) {
      await page.mouse.move(box.x + 2 + fx * (box.width - 4), box.y + 2 + fy * (box.height - 4), { steps: 3 });
    }
    await page.mouse.up();
    await moveBar.waitFor();
    expect(await moveBar.innerText()).toContain(`${expected.toLocaleString('en-US')} selected`);
    await moveBar.getByRole('button', { name: 'Clear selection' }).click();
    await page.getByRole('button', { name: 'Pan', exact: true }).click();
    // The wheel zooms in around the pointer.
    const scale0 = await map.evaluate((el: any) => el.view.scale as number);
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.wheel(0, -400);
    await expect.poll(() => map.evaluate((el: any) => el.view.scale as number)).toBeGreaterThan(scale0);
    await page.getByRole('button', { name: 'Fit', exact: true }).click();

    // Text search outlines the matches and keeps the words in the URL.
    await page.getByRole('searchbox', { name: 'Search document text' }).fill('refund');
    await page.getByRole('button', { name: 'Search', exact: true }).click();
    await page.getByText('matching documents outlined on the map').waitFor();
    expect(new URL(page.url()).searchParams.get('q')).toBe('refund');
    await page.getByRole('button', { name: 'Clear search' }).click();

    const themes = page.locator('sheaf-theme-list li');
    const before = await themes.count();
    expect(before).toBeGreaterThanOrEqual(2);
    const firstId = (await themes.nth(0).getAttribute('data-theme'))!;

    // Rename the first theme in place.
    await themes.nth(0).locator('button.pick').click();
    const nameBox = page.locator('sheaf-theme-panel input.name');
    await nameBox.fill('Named by hand');
    await nameBox.press('Enter');
    await page.locator('sheaf-theme-list li', { hasText: 'Named by hand' }).waitFor();
    await page.locator('sheaf-scatter-map').screenshot({ path: 'test-output/map.png' });
    await page.locator('sheaf-theme-panel').screenshot({ path: 'test-output/theme-panel.png' });

    // Merge the second and third themes under a new name.
    const secondId = (await themes.nth(1).getAttribute('data-theme'))!;
    const thirdId = (await themes.nth(2).getAttribute('data-theme'))!;
    await themes.nth(1).locator('input[type=checkbox]').check();
    await themes.nth(2).locator('input[type=checkbox]').check();
    await page.locator('sheaf-theme-list .merge input').fill('Money matters');
    await page.locator('sheaf-theme-list .merge button').click();
    await page.locator('sheaf-theme-list li', { hasText: 'Money matters' }).waitFor();
    expect(await themes.count()).toBe(before - 1);
    const merged = await api(server.url, `/analyses/${aid}`);
    const mergedCluster = merged.body.clusters.find((c: { name: string }) => c.name === 'Money matters');
    expect(mergedCluster).toBeTruthy();
    expect(merged.body.clusters.some((c: { id: string }) => c.id === secondId) && merged.body.clusters.some((c: { id: string }) => c.id === thirdId)).toBe(false);

    // Move one document of the renamed theme into the merged one from the document dialog.
    await page.locator(`sheaf-theme-list li[data-theme="${firstId}"] button.pick`).click();
    const row = page.locator('sheaf-document-list tbody tr').first();
    await row.locator('td.text button').waitFor();
    const docId = (await row.getAttribute('data-doc'))!;
    await row.locator('td.text button').click();
    const dialog = page.locator('sheaf-document-dialog dialog[open]');
    await dialog.waitFor();
    await dialog.locator('select').selectOption(mergedCluster.id);
    await dialog.locator('button.primary').click();
    await page.locator('sheaf-document-dialog dialog[open]').waitFor({ state: 'detached' });

    // Export through the page's own link and read the file.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByText('Export CSV').click()]);
    const csv = await readFile((await download.path())!, 'utf8');
    const records = splitCsv(csv).records;
    expect(records.length - 1).toBe(expected);
    const header = records[0].fields;
    const idCol = header.findIndex((h) => /^(documentId|id)$/i.test(h));
    expect(idCol).toBeGreaterThanOrEqual(0);
    const names = new Set(records.slice(1).map((r) => r.fields.join('\u0001')));
    expect([...names].some((r) => r.includes('Named by hand'))).toBe(true);
    const movedRow = records.find((r) => r.fields[idCol] === docId)!;
    expect(movedRow.fields).toContain('Money matters');

    const ndHref = (await page.getByText('Export NDJSON').getAttribute('href'))!;
    const ndLines = (await (await fetch(server.url + ndHref)).text()).trim().split('\n').map((l) => JSON.parse(l));
    expect(ndLines.length).toBe(expected);
    expect(ndLines.find((l: { documentId: string }) => l.documentId === docId).clusterName).toBe('Money matters');

    // Reload: every edit is still there.
    await page.reload();
    await page.locator('sheaf-theme-list li', { hasText: 'Named by hand' }).waitFor();
    await page.locator('sheaf-theme-list li', { hasText: 'Money matters' }).waitFor();
    expect(await themes.count()).toBe(before - 1);
    const assignments = await api(server.url, `/analyses/${aid}/assignments`);
    expect(assignments.body.find((a: { documentId: string }) => a.documentId === docId).clusterId).toBe(mergedCluster.id);

    // Train a router from the two named themes, read its evaluation, and route a text with a key.
    await page.getByRole('button', { name: 'Train a router…' }).click();
    await page.locator('sheaf-train-form button[type=submit]').click();
    const perLabel = page.locator('sheaf-label-table tbody tr');
    await perLabel.first().waitFor({ timeout: 120_000 });
    expect(await perLabel.count()).toBe(2);
    expect(await page.locator('sheaf-confusion-heatmap tbody td').count()).toBe(4);
    expect(await page.locator('sheaf-roc-chart polyline').count()).toBe(2);
    expect(await page.getByRole('note').innerText()).toContain('safety, health or legal deadlines');
    await page.getByRole('button', { name: 'Create a key' }).click();
    await page.locator('[data-role=new-key]').waitFor();
    await page.locator('sheaf-route-try textarea').fill('I was charged twice and need the invoice corrected');
    await page.getByRole('button', { name: 'Route it' }).click();
    const verdict = page.locator('[data-role=route-result] .verdict b');
    await verdict.waitFor();
    expect(['Named by hand', 'Money matters']).toContain(await verdict.innerText());
    await page.screenshot({ path: 'test-output/router.png', fullPage: true });
    page.once('dialog', (d) => void d.accept());
    await page.locator('sheaf-key-manager').getByRole('button', { name: 'Revoke' }).click();
    await page.locator('sheaf-key-manager', { hasText: 'revoked' }).waitFor();
    expect(pageErrors, pageErrors.join("\n")).toEqual([]);
  }, 300_000);
});
