/**
 * Document text is data, never markup: hostile text must show as the characters it holds, in the
 * upload preview, the document list, the theme panel and the document dialog, and run nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, startServer, waitForJob, type TestServer } from '../helpers/server.js';
import { launchBrowser, type TestBrowser } from './browser.js';

const SCRIPT_DOC = '<script>window.__sheafRan = "script"</script> please refund my cracked teapot order';
const IMG_DOC = '<img src="x" onerror="window.__sheafRan = \'img\'"> the parcel with my teapot order never arrived';
// Invented filler so the clustering has two clear groups to find.
const FILLER = [
  'please refund my order, the teapot came cracked',
  'refund for the cracked teapot please, order was damaged',
  'my refund has not arrived for the cracked order',
  'the parcel never arrived and tracking shows nothing',
  'parcel tracking stuck, delivery never arrived',
  'where is my parcel, delivery is late and never arrived',
];

let server: TestServer;
let browser: TestBrowser;
let page: Page;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function ran(p: Page): Promise<unknown> {
  return p.evaluate(() => (window as unknown as { __sheafRan?: unknown }).__sheafRan);
}

describe('hostile document text', () => {
  it('shows as inert text in the preview of a dropped file, and the import reports skipped lines and refusals', async () => {
    await page.goto(server.url);
    const csv = `id,text\nx1,"${SCRIPT_DOC.replace(/"/g, '""')}"\nx2,"${IMG_DOC.replace(/"/g, '""')}"\nx3,"   "\n`;
    // Dropped onto the drop zone, as a person would drag it from their desktop.
    const dropped = await page.evaluateHandle((text) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], 'hostile.csv', { type: 'text/csv' }));
      return dt;
    }, csv);
    await page.locator('sheaf-upload .drop').dispatchEvent('drop', { dataTransfer: dropped });
    const table = page.locator('sheaf-upload .preview table');
    await table.waitFor();
    const cells = await table.locator('tbody td').allTextContents();
    expect(cells).toContain(SCRIPT_DOC);
    expect(cells).toContain(IMG_DOC);
    expect(await table.locator('img, script').count()).toBe(0);
    expect(await ran(page)).toBeUndefined();

    // Importing it reports the blank line the server skipped, with its line number.
    await page.locator('sheaf-upload button[type=submit]').click();
    const result = page.locator('sheaf-upload [role=status]');
    await result.waitFor();
    expect(await result.innerText()).toMatch(/2 documents imported, 1 lines? skipped/);
    expect(await result.locator('table[aria-label="Skipped lines"] tbody tr').count()).toBe(1);

    // A file with no text at all is refused; the server's reason is shown, not a status code.
    await page.locator('sheaf-upload input[type=file]').setInputFiles({ name: 'blank.csv', mimeType: 'text/csv', buffer: Buffer.from('id,text\ny1,\ny2,  \n') });
    await page.locator('sheaf-upload button[type=submit]').click();
    const alert = page.locator('sheaf-upload sheaf-error-note .note.bad');
    await alert.waitFor();
    const words = await alert.innerText();
    expect(words).toContain('Import failed');
    expect(words).not.toMatch(/\b422\b/);
    expect(words.length).toBeGreaterThan('Import failed: '.length + 10);
  });

  it('shows as inert text in the document list, theme panel and document dialog', async () => {
    const created = await api(server.url, '/corpora', {
      method: 'POST',
      json: { name: 'hostile', documents: [{ id: 'h1', text: SCRIPT_DOC }, { id: 'h2', text: IMG_DOC }, ...FILLER.map((text, i) => ({ id: `f${i}`, text }))] },
    });
    expect(created.status).toBe(201);
    const started = await api(server.url, `/corpora/${created.body.id}/analyses`, { method: 'POST', json: { k: 2 } });
    expect(started.status).toBe(202);
    const done = await waitForJob(server.url, `/analyses/${started.body.id}`);
    expect(done.status).toBe('done');

    const theme = done.clusters.find((c: { representativeIds: string[] }) => c.representativeIds.includes('h1')) ?? done.clusters[0];
    await page.goto(`${server.url}/?analysis=${encodeURIComponent(done.id)}&theme=${encodeURIComponent(theme.id)}`);
    const list = page.locator('sheaf-document-list');
    await list.locator('tr[data-doc="h1"] td.text button', { hasText: '<script>' }).waitFor();
    const texts = await list.locator('td.text button').allTextContents();
    expect(texts.some((t) => t.includes(SCRIPT_DOC))).toBe(true);

    const panel = page.locator('sheaf-theme-panel');
    await panel.locator('ol.docs').first().waitFor();
    expect(await panel.locator('img, script').count()).toBe(0);

    await page.goto(`${server.url}/?analysis=${encodeURIComponent(done.id)}`);
    await list.locator('tr[data-doc="h2"] td.text button').click();
    const body = page.locator('sheaf-document-dialog [data-role=document-text]');
    await body.waitFor();
    expect(await body.textContent()).toBe(IMG_DOC);
    expect(await page.locator('sheaf-document-dialog img').count()).toBe(0);
    expect(await page.locator('sheaf-document-list img, sheaf-document-list script').count()).toBe(0);
    expect(await ran(page)).toBeUndefined();
  });
});
