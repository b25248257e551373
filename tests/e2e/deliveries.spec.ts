import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import JSZip from 'jszip';
import { expect as baseExpect, type APIRequestContext, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { apiSignedInAs, DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, test } from './support';

// A render worker must be running against the same database (scripts/worker.ts).
const RENDER_DONE_TIMEOUT_MS = 120_000;
// Page loads may compile on first visit (next dev) on a shared two-core machine: wait up to 60 s for what a person would see.
const expect = baseExpect.configure({ timeout: 60_000 });
const DEMO_SHOW = 'The Long Fall';
const DEMO_SCENE = 'Hover near the photon sphere';
const api = `/api/v1/studios/${DEMO_STUDIO_SLUG}`;

type Manifest = { scene: { slug: string }; frames: { index: number; file: string; sha256: string; bytes: number }[]; photosensitivity: { verdict: string } };

async function signInAs(page: Page, role: string) {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(demoEmail(role), DEMO_PASSWORD);
  // Generous: the first visit compiles the studio pages under `next dev`.
  await expect(page.getByTestId('studio-name')).toBeVisible({ timeout: 30_000 });
}

/**
 * As the signed-in producer: a fresh scene in the demo show (a copy of a demo
 * scene's revision), submitted and approved by the demo advisor — operators
 * only receive approved revisions — then a tiny two-frame sequence rendered
 * and packaged. Returns the delivery id.
 */
async function tinyDelivery(request: APIRequestContext, advisor: APIRequestContext): Promise<string> {
  const shows = (await (await request.get(`${api}/shows`)).json()) as { shows: { id: string; name: string }[] };
  const show = shows.shows.find((s) => s.name === DEMO_SHOW)!;
  const scenes = (await (await request.get(`${api}/shows/${show.id}/scenes`)).json()) as { scenes: { id: string; name: string; latestRevision: number }[] };
  const demo = scenes.scenes.find((s) => s.name === DEMO_SCENE)!;
  const demoRevision = (await (await request.get(`${api}/scenes/${demo.id}/revisions/${demo.latestRevision}`)).json()) as { revision: { spec: unknown } };
  const copy = await request.post(`${api}/shows/${show.id}/scenes`, { data: { name: `Delivery check ${Date.now()}`, spec: demoRevision.revision.spec } });
  expect(copy.status()).toBe(201);
  const scene = { id: ((await copy.json()) as { scene: { id: string } }).scene.id, latestRevision: 1 };
  const submitted = await request.post(`${api}/reviews`, { data: { sceneId: scene.id, revision: 1 } });
  expect(submitted.status()).toBe(201);
  const reviewId = ((await submitted.json()) as { review: { id: string } }).review.id;
  expect((await advisor.post(`${api}/reviews/${reviewId}/approve`)).status()).toBe(201);
  const created = await request.post(`${api}/renders`, {
    data: { sceneId: scene.id, revision: scene.latestRevision, kind: 'sequence', frames: { start: 0, end: 1 }, settings: { width: 96, height: 96, format: 'png8', supersampling: 1 } },
  });
  expect(created.status()).toBe(201);
  const { render } = (await created.json()) as { render: { id: string } };
  let deliveryId: string | null = null;
  await expect
    .poll(async () => {
      const detail = (await (await request.get(`${api}/renders/${render.id}`)).json()) as { delivery: { id: string } | null };
      deliveryId = detail.delivery?.id ?? null;
      return deliveryId;
    }, { timeout: RENDER_DONE_TIMEOUT_MS, intervals: [1000, 2000] })
    .not.toBeNull();
  return deliveryId!;
}

test.use({ navigationTimeout: 60_000, actionTimeout: 30_000 });

test.describe('deliveries', () => {
  test.setTimeout(3 * RENDER_DONE_TIMEOUT_MS);

  test('should let an operator download a delivery whose zip matches its manifest checksums, then mark it loaded', async ({ page, playwright, baseURL }) => {
    await signInAs(page, 'producer');
    const advisor = await apiSignedInAs(playwright, baseURL!, 'advisor');
    const deliveryId = await tinyDelivery(page.request, advisor);
    await advisor.dispose();
    await page.getByTestId('sign-out').click();
    await expect(page).toHaveURL(/\/sign-in/);

    await signInAs(page, 'operator');
    await page.getByTestId('nav-deliveries').getByRole('link').click();
    await page.getByTestId(`delivery-row-${deliveryId}`).getByTestId('delivery-link').click();
    await expect(page.getByTestId('delivery-detail')).toBeVisible();
    await expect(page.getByTestId('manifest-frames').getByTestId('frame-sha256')).toHaveCount(2);
    await expect(page.getByTestId('venue-caution')).toContainText('venue policy and local rules');

    const downloading = page.waitForEvent('download');
    await page.getByTestId('download-delivery').click();
    const download = await downloading;
    expect(download.suggestedFilename()).toMatch(/\.zip$/);
    const zip = await JSZip.loadAsync(await readFile((await download.path())!));

    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string')) as Manifest;
    expect(manifest.frames.map((f) => f.index)).toEqual([0, 1]);
    for (const frame of manifest.frames) {
      // Delivery formats (product.md): <scene-slug>_<frame 0000>.png, SHA-256 per frame in the manifest.
      expect(frame.file).toBe(`${manifest.scene.slug}_${String(frame.index).padStart(4, '0')}.png`);
      const entry = zip.file(`frames/${frame.file}`);
      expect(entry, `zip entry for ${frame.file}`).toBeTruthy();
      const bytes = await entry!.async('uint8array');
      expect(bytes.byteLength).toBe(frame.bytes);
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(frame.sha256);
      await expect(page.getByTestId(`manifest-frame-${frame.index}`)).toContainText(frame.sha256);
    }
    expect(['pass', 'fail']).toContain(manifest.photosensitivity.verdict);

    await page.getByTestId('mark-loaded').click();
    await expect(page.getByTestId('delivery-status')).toHaveAttribute('data-status', 'loaded');
    await expect(page.getByTestId('mark-loaded')).toHaveCount(0);
  });

  // Reads the delivery the test above made (tests in a file run in order, one worker).
  test('should not offer "Mark as loaded" to an advisor', async ({ page }) => {
    await signInAs(page, 'advisor');
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/deliveries`);
    const first = page.getByTestId('deliveries-table').getByTestId('delivery-link').first();
    await expect(first).toBeVisible();
    await first.click();
    await expect(page.getByTestId('download-delivery')).toBeVisible();
    await expect(page.getByTestId('mark-loaded')).toHaveCount(0);
  });
});
