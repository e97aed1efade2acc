// /catalogue in Chromium against the production build (issue 5): the grid renders the team's
// catalogue, search and column filters narrow it, an admin's cell edit persists after a reload,
// an import shows the bad row and commits nothing until the file is right, and the write
// endpoints refuse non-admins with 403. Issue 23: the count says how many of how many are shown,
// an admin adds an item through a form checked like an import row, a changed value asks for its
// source (and is not saved without it), and each item shows its history from the audit log.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { closeDb, getDb } from '@/db/client';
import { catalogueCoverings } from '@/db/schema';
import { listCoverings } from '@/db/queries/catalogue';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue/columns';
import { appUrl, launchBrowser, screenshot } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { signInOverHttp } from './auth-http';

/** The grid refetches after a write; give it the time a loaded CI machine needs. */
const POLL = { timeout: 20_000, interval: 250 };

let browser: Browser;
let page: Page;
let teamId: string;
let viewerEmail: string;
let designerEmail: string;
let adminEmail: string;

async function signIn(target: Page, email: string, path: string) {
  await target.goto(appUrl(path));
  await target.waitForURL(/\/sign-in/);
  await target.getByLabel('E-mail').fill(email);
  await target.getByLabel('Password').fill(TEST_PASSWORD);
  await target.getByRole('button', { name: 'Sign in' }).click();
  await target.waitForURL(/\/catalogue/);
}

async function coveringId(key: string): Promise<string> {
  const row = (await listCoverings(teamId)).find((c) => c.key === key);
  if (!row) throw new Error(`no covering ${key}`);
  return row.id;
}

/** A body cell: the grid's row id is the catalogue row's id. */
function cellOf(target: Page, rowId: string, field: string) {
  return target.locator(`.ag-row[row-id="${rowId}"] .ag-cell[col-id="${field}"]`).first();
}

async function editCell(target: Page, rowId: string, field: string, text: string) {
  await cellOf(target, rowId, field).dblclick();
  await target.keyboard.press('ControlOrMeta+A');
  await target.keyboard.type(text);
  await target.keyboard.press('Enter');
}

/** The keys of the rows the grid shows (the key column is pinned on the left). */
async function shownKeys(target: Page): Promise<string[]> {
  return target.locator('.ag-cell[col-id="key"]').allInnerTexts();
}

beforeAll(async () => {
  const team = await createTestTeam('catalogue-e2e');
  teamId = team.id;
  await copyStandardCatalogueToTeam(teamId);
  const admin = await createTestUser(teamId, 'admin');
  adminEmail = admin.email;
  viewerEmail = (await createTestUser(teamId, 'viewer')).email;
  designerEmail = (await createTestUser(teamId, 'designer')).email;
  browser = await launchBrowser();
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  page = await context.newPage();
  await signIn(page, admin.email, '/catalogue?part=coverings');
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe('/catalogue', () => {
  it('renders the team’s coverings in the grid, and search and column filters narrow it', async () => {
    await page.waitForSelector('.ag-cell[col-id="key"]');
    const all = await shownKeys(page);
    expect(all.sort()).toEqual((await listCoverings(teamId)).map((c) => c.key).sort());
    await page.getByLabel('Search insulation and finishes').fill('XLPE');
    await expect.poll(() => shownKeys(page), POLL).toEqual(['xlpe-insulation']);
    await page.getByLabel('Search insulation and finishes').fill('');
    // The floating filter of the "Used as" column.
    await page.getByRole('textbox', { name: 'Used as Filter Input' }).fill('sheath');
    await expect.poll(async () => (await shownKeys(page)).sort(), POLL).toEqual(['pe-sheath', 'pvc-sheath']);
    await screenshot(page, 'catalogue-filtered');
  });

  it('the count label says how many items of how many the filters show', async () => {
    await page.goto(appUrl('/catalogue?part=coverings'));
    await page.waitForSelector('.ag-cell[col-id="key"]');
    const total = (await listCoverings(teamId)).length;
    const count = page.getByTestId('catalogue-count');
    await expect.poll(() => count.innerText(), POLL).toBe(`${total} items`);
    await page.getByRole('textbox', { name: 'Used as Filter Input' }).fill('sheath');
    await expect.poll(() => count.innerText(), POLL).toBe(`2 of ${total} items`);
    await page.getByLabel('Search insulation and finishes').fill('XLPE');
    await expect.poll(() => count.innerText(), POLL).toBe(`0 of ${total} items`);
    await page.getByRole('textbox', { name: 'Used as Filter Input' }).fill('');
    await expect.poll(() => count.innerText(), POLL).toBe(`1 of ${total} items`);
    await page.getByLabel('Search insulation and finishes').fill('');
    await expect.poll(() => count.innerText(), POLL).toBe(`${total} items`);
  });

  it('an admin edit persists after a reload', async () => {
    const rowId = await coveringId('pe-sheath');
    await page.goto(appUrl('/catalogue?part=coverings'));
    await page.waitForSelector('.ag-cell[col-id="key"]');
    await editCell(page, rowId, 'thermalResistivityKmPerW', '3.6');
    const prompt = page.getByRole('dialog', { name: 'Source of the new value' });
    await prompt.getByLabel('Source of resistivity for the new value').fill('Supplier datasheet PE-36 (e2e)');
    await prompt.getByRole('button', { name: 'Save with this source' }).click();
    await page.getByRole('status').filter({ hasText: 'Saved Thermal resistivity' }).waitFor();
    await page.reload();
    await page.waitForSelector('.ag-cell[col-id="key"]');
    await expect.poll(() => cellOf(page, rowId, 'thermalResistivityKmPerW').innerText(), POLL).toBe('3.6');
    const [stored] = await getDb().select().from(catalogueCoverings).where(eq(catalogueCoverings.id, rowId));
    expect([stored.thermalResistivityKmPerW, stored.resistivitySource]).toEqual(['3.6', 'Supplier datasheet PE-36 (e2e)']);
  });

  it('a changed value asks for its source: cancelled or left blank it is not saved', async () => {
    const rowId = await coveringId('pvc-insulation');
    const [before] = await getDb().select().from(catalogueCoverings).where(eq(catalogueCoverings.id, rowId));
    await editCell(page, rowId, 'thermalResistivityKmPerW', '5.5');
    const prompt = page.getByRole('dialog', { name: 'Source of the new value' });
    await prompt.waitFor();
    expect(await prompt.innerText()).toContain(`now cites “${before.resistivitySource}”`);
    await prompt.getByRole('button', { name: 'Save with this source' }).click();
    await prompt.getByRole('alert').filter({ hasText: 'Say where the new value comes from' }).waitFor();
    await prompt.getByRole('button', { name: 'Cancel the change' }).click();
    await page.getByRole('alert').filter({ hasText: 'a changed value needs its source' }).waitFor();
    const [after] = await getDb().select().from(catalogueCoverings).where(eq(catalogueCoverings.id, rowId));
    expect([after.thermalResistivityKmPerW, after.resistivitySource]).toEqual([before.thermalResistivityKmPerW, before.resistivitySource]);
    expect(await cellOf(page, rowId, 'thermalResistivityKmPerW').innerText()).toBe(before.thermalResistivityKmPerW);
    // The server refuses it too, whatever the browser does.
    const { client } = await signInOverHttp(adminEmail, TEST_PASSWORD);
    const response = await client.request(`/api/catalogue/coverings/${rowId}`, { method: 'PATCH', body: { changes: { thermalResistivityKmPerW: '5.5' } } });
    expect(response.status).toBe(400);
    expect(JSON.stringify(await response.json())).toContain('is required when Thermal resistivity changes');
  });

  it('shows an item’s history from the audit log: who changed which value from what to what', async () => {
    const rowId = await coveringId('pe-sheath');
    await page.goto(appUrl('/catalogue?part=coverings'));
    await page.waitForSelector('.ag-cell[col-id="key"]');
    await page.getByRole('button', { name: 'History of pe-sheath' }).click();
    const history = page.getByRole('region', { name: 'History of pe-sheath' });
    await history.getByText(/^Edited by admin /).waitFor();
    const text = await history.innerText();
    expect(text).toMatch(/Thermal resistivity \(K·m\/W\)\s+3\.5\s+→ 3\.6/);
    expect(text).toMatch(/Source of resistivity\s+.+\s+→ Supplier datasheet PE-36 \(e2e\)/);
    expect(rowId).toBeTruthy();
  });

  it('an admin adds an item with the form: refused like an import row, then added and shown', async () => {
    await page.getByRole('button', { name: 'Add a covering' }).click();
    const form = page.getByRole('form', { name: 'New covering' });
    await form.getByLabel('Key').fill('aramid-e2e');
    await form.getByLabel('Name').fill('Aramid tape (e2e)');
    await form.getByLabel('Used as').selectOption('insulation');
    await form.getByLabel(/^Thermal resistivity/).fill('abc');
    await form.getByLabel('Source of resistivity').fill('Supplier datasheet');
    await form.getByLabel('Source of limits').fill('Supplier datasheet');
    await form.getByRole('button', { name: 'Add the covering' }).click();
    await form.getByRole('alert').filter({ hasText: 'correct the fields marked below' }).waitFor();
    // The one number rule's message (lib/units/parse, as the grid and the files read numbers), under the field.
    await form.getByText('Thermal resistivity: abc is not a number').waitFor();
    expect(await form.getByText('Source of emissivity is required').count()).toBe(1);
    expect((await listCoverings(teamId)).some((c) => c.key === 'aramid-e2e')).toBe(false);
    await form.getByLabel(/^Thermal resistivity/).fill('5.5');
    await form.getByLabel('Source of emissivity').fill('Supplier datasheet');
    await form.getByRole('button', { name: 'Add the covering' }).click();
    await page.getByRole('status').filter({ hasText: 'Added aramid-e2e.' }).waitFor();
    await expect.poll(() => shownKeys(page), POLL).toEqual(['aramid-e2e']);
    const added = (await listCoverings(teamId)).find((c) => c.key === 'aramid-e2e');
    expect(added).toMatchObject({ name: 'Aramid tape (e2e)', role: 'insulation', thermalResistivityKmPerW: '5.5', emissivitySource: 'Supplier datasheet' });
    await screenshot(page, 'catalogue-added');
    // The form filters the grid to the new key; the tests after this one start from the whole part.
    await page.getByLabel('Search insulation and finishes').fill('');
  });

  it('a value the schema refuses is not saved and the message names the column', async () => {
    const rowId = await coveringId('pvc-sheath');
    await editCell(page, rowId, 'emissivity', '1.4');
    const alert = page.getByRole('alert').filter({ hasText: 'pvc-sheath · Emissivity' });
    await alert.waitFor();
    expect(await alert.innerText()).toContain('must be greater than 0 and at most 1');
    const [stored] = await getDb().select().from(catalogueCoverings).where(eq(catalogueCoverings.id, rowId));
    expect(stored.emissivity).toBe('0.9');
  });

  it('an import with a bad row shows that row and imports nothing; the fixed file imports every row', async () => {
    const header = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
    const good = 'silicone-e2e,Silicone rubber (e2e),insulation,4.5,Supplier datasheet,180,350,Supplier datasheet,0.9,Supplier datasheet';
    const bad = 'mica-e2e,Mica tape (e2e),insulation,abc,Supplier datasheet,,,Supplier datasheet,,Supplier datasheet';
    await page.getByRole('button', { name: 'Import a file' }).click();
    const input = page.getByLabel(/^File \(CSV or XLSX/);
    await input.setInputFiles({ name: 'coverings.csv', mimeType: 'text/csv', buffer: Buffer.from([header, good, bad].join('\n')) });
    await page.getByRole('button', { name: 'Check the file' }).click();
    const problems = page.getByRole('alert').filter({ hasText: 'nothing will be imported' });
    await problems.waitFor();
    const cells = await problems.locator('tbody tr').first().locator('td').allInnerTexts();
    expect(cells).toEqual(['3', 'thermal_resistivity_km_per_w', 'must be a number (got "abc")']);
    expect((await listCoverings(teamId)).some((c) => c.key === 'silicone-e2e')).toBe(false);
    await input.setInputFiles({ name: 'coverings.csv', mimeType: 'text/csv', buffer: Buffer.from([header, good, bad.replace('abc', '6.0')].join('\n')) });
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByRole('button', { name: 'Import 2 rows' }).click();
    await page.getByRole('status').filter({ hasText: 'Imported: 2 new rows, 0 replaced.' }).waitFor();
    await expect.poll(async () => (await shownKeys(page)).includes('silicone-e2e'), POLL).toBe(true);
    const keys = (await listCoverings(teamId)).map((c) => c.key);
    expect(keys).toEqual(expect.arrayContaining(['silicone-e2e', 'mica-e2e']));
    await screenshot(page, 'catalogue-imported');
  });

  it('the import endpoint refuses oversize, empty, binary and wrong-column files with a clear message', async () => {
    const { client } = await signInOverHttp(adminEmail, TEST_PASSWORD);
    const upload = async (name: string, bytes: Uint8Array) => {
      const form = new FormData();
      form.set('kind', 'coverings');
      form.set('file', new Blob([new Uint8Array(bytes)]), name);
      const response = await fetch(appUrl('/api/catalogue/imports'), {
        method: 'POST',
        body: form,
        headers: { cookie: client.jar.header(), origin: new URL(appUrl()).origin },
      });
      return { status: response.status, body: (await response.json()) as { error: { code: string; message: string } } };
    };
    const oversize = await upload('big.csv', new Uint8Array(2 * 1024 * 1024 + 1).fill(65));
    expect(oversize.status).toBe(413);
    expect(oversize.body.error.message).toMatch(/larger than the 2\.0 MB limit/);
    const empty = await upload('empty.csv', new Uint8Array());
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toBe('"empty.csv" is empty.');
    const binary = await upload('photo.csv', new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46]));
    expect(binary.status).toBe(415);
    expect(binary.body.error.message).toMatch(/binary data, not text/);
    const wrong = await upload('metals.csv', new TextEncoder().encode('key,name,colour\ncopper,Copper,red\n'));
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('wrong_columns');
    expect(wrong.body.error.message).toMatch(/missing columns: role, thermal_resistivity_km_per_w/);
  });

  it('refuses writes from non-admins with 403, and lets them read', async () => {
    const rowId = (await listCoverings(teamId))[0].id;
    for (const email of [viewerEmail, designerEmail]) {
      const { client, signedIn } = await signInOverHttp(email, TEST_PASSWORD);
      expect(signedIn).toBe(true);
      expect((await client.request('/api/catalogue/coverings')).status).toBe(200);
      expect((await client.request('/api/catalogue/imports', { method: 'POST', body: {} })).status).toBe(403);
      expect((await client.request(`/api/catalogue/coverings/${rowId}`, { method: 'PATCH', body: { changes: { name: 'x' } } })).status).toBe(403);
    }
  });

  it('the viewer sees the grid read only, without the import button', async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const viewerPage = await context.newPage();
    await signIn(viewerPage, viewerEmail, '/catalogue?part=materials');
    await viewerPage.waitForSelector('.ag-cell[col-id="key"]');
    await viewerPage.getByText('read only: admins edit the catalogue').waitFor();
    expect(await viewerPage.getByRole('button', { name: 'Import a file' }).count()).toBe(0);
    await context.close();
  });
});
