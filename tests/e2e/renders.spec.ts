import { expect as baseExpect, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, pageContent, test } from './support';

// A render worker must be running against the same database (scripts/worker.ts).
// Frames are kept tiny (128 px dome masters, three-frame sequences) so renders finish in seconds even on a loaded machine.
const RENDER_DONE_TIMEOUT_MS = 120_000;
// Page loads may compile on first visit (next dev) on a shared two-core machine: wait up to 60 s for what a person would see.
const expect = baseExpect.configure({ timeout: 60_000 });
const DEMO_SHOW = 'The Long Fall';
const DEMO_SCENE = 'Hover near the photon sphere';
const TINY_SIDE_PX = '128';

/** The New render form, driven by keyboard-reachable labelled controls. */
class NewRenderPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto(`/studios/${DEMO_STUDIO_SLUG}/renders`);
    await this.page.getByTestId('new-render').click();
    await expect(this.page.getByTestId('new-render-form')).toBeVisible();
  }

  async pickScene(show: string, scene: string) {
    await this.page.getByLabel('Show', { exact: true }).selectOption({ label: show });
    await this.page.getByLabel('Scene', { exact: true }).selectOption({ label: scene });
    await expect(this.page.getByTestId('scene-frames')).toBeVisible({ timeout: 90_000 });
  }

  async tinyDomeMaster() {
    await this.page.getByLabel('Resolution', { exact: true }).selectOption('custom');
    await this.page.getByLabel('Width (px)').fill(TINY_SIDE_PX);
    await this.page.getByLabel('Height (px)').fill(TINY_SIDE_PX);
    await this.page.getByLabel('Format', { exact: true }).selectOption('png8');
  }

  async submit() {
    await this.page.getByTestId('request-render').click();
    await expect(this.page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}/renders/[0-9a-f-]{36}$`), { timeout: 30_000 });
    await expect(this.page.getByTestId('render-detail')).toBeVisible();
  }
}

async function signInAs(page: Page, role: string) {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(demoEmail(role), DEMO_PASSWORD);
  // Generous: the first visit compiles the studio pages under `next dev`.
  await expect(page.getByTestId('studio-name')).toBeVisible({ timeout: 30_000 });
}

async function waitUntilDone(page: Page) {
  await expect(page.getByTestId('render-status')).toHaveAttribute('data-status', 'done', { timeout: RENDER_DONE_TIMEOUT_MS });
}

test.use({ navigationTimeout: 60_000, actionTimeout: 30_000 });

test.describe('renders', () => {
  test.setTimeout(4 * RENDER_DONE_TIMEOUT_MS);

  test('should let a producer request a still and a short sequence, watch them finish and open the still', async ({ page }) => {
    await signInAs(page, 'producer');
    await page.getByTestId('nav-renders').getByRole('link').click();
    await expect(page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}/renders$`));

    // A still chosen by proper time: the form shows which frame that is, and the render asks for exactly that frame.
    const form = new NewRenderPage(page);
    await form.open();
    await form.pickScene(DEMO_SHOW, DEMO_SCENE);
    await page.getByRole('radio', { name: 'Still', exact: true }).check();
    await page.getByRole('radio', { name: 'Proper time', exact: true }).check();
    await page.getByLabel(/Proper time, seconds/).fill('0');
    await expect(page.getByTestId('proper-time-frame')).toHaveText('Frame 0');
    await form.tinyDomeMaster();
    await form.submit();
    await expect(page.getByTestId('draft-notice')).toContainText('Draft — revision not approved');
    await waitUntilDone(page);
    await expect(page.getByTestId('render-progress')).toHaveAttribute('aria-valuenow', '1');

    await page.getByTestId('frame-thumb-0').click();
    const viewer = page.getByTestId('frame-viewer');
    await expect(viewer).toBeVisible();
    const image = viewer.getByTestId('frame-viewer-image');
    await expect.poll(() => image.evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0)), { timeout: 30_000 }).toBe(Number(TINY_SIDE_PX));
    await page.keyboard.press('Escape');
    await expect(viewer).toBeHidden();

    // A three-frame sequence through a frame range; it ends with a photosensitivity result and a delivery.
    await form.open();
    await form.pickScene(DEMO_SHOW, DEMO_SCENE);
    await page.getByRole('radio', { name: 'Frame sequence', exact: true }).check();
    await page.getByRole('radio', { name: 'Frame range', exact: true }).check();
    await page.getByLabel('First frame', { exact: true }).fill('0');
    await page.getByLabel('Last frame', { exact: true }).fill('2');
    await form.tinyDomeMaster();
    await form.submit();
    await waitUntilDone(page);
    await expect(page.getByTestId('frame-grid').getByRole('button')).toHaveCount(3);
    await expect(page.getByTestId('photosensitivity-verdict')).toHaveAttribute('data-verdict', /^(pass|fail)$/, { timeout: RENDER_DONE_TIMEOUT_MS });
    await expect(page.getByTestId('venue-caution')).toContainText('venue policy and local rules');
    await expect(page.getByTestId('frame-readout-chart')).toBeVisible();
    await expect(page.getByTestId('delivery-link')).toBeVisible({ timeout: RENDER_DONE_TIMEOUT_MS });

    // The list shows both renders as done.
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/renders`);
    await expect(page.getByTestId('renders-table').getByTestId('render-row-status').first()).toHaveAttribute('data-status', 'done');
  });

  test('should show a frame-range error from the form before anything is sent', async ({ page }) => {
    await signInAs(page, 'producer');
    const form = new NewRenderPage(page);
    await form.open();
    await form.pickScene(DEMO_SHOW, DEMO_SCENE);
    await page.getByRole('radio', { name: 'Frame sequence', exact: true }).check();
    await page.getByRole('radio', { name: 'Frame range', exact: true }).check();
    await page.getByLabel('First frame', { exact: true }).fill('5');
    await page.getByLabel('Last frame', { exact: true }).fill('2');
    await page.getByTestId('request-render').click();
    await expect(page.getByText('The last frame must not come before the first.')).toBeVisible();
    await expect(page).toHaveURL(/\/renders\/new$/);
  });

  test('should not let an operator create renders, in the page or through the API', async ({ page }) => {
    await signInAs(page, 'operator');
    await expect(page.getByTestId('nav-renders')).toHaveCount(0);
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/renders`);
    await expect(pageContent(page).getByTestId('forbidden')).toBeVisible();
    await expect(page.getByTestId('new-render')).toHaveCount(0);
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/renders/new`);
    await expect(pageContent(page).getByTestId('forbidden')).toBeVisible();
    await expect(page.getByTestId('new-render-form')).toHaveCount(0);

    // A well-formed request, so the answer is about the role, not the body (route order: schema, session, role).
    const response = await page.request.post(`/api/v1/studios/${DEMO_STUDIO_SLUG}/renders`, {
      data: { sceneId: '00000000-0000-4000-8000-000000000000', revision: 1, kind: 'still', frames: { start: 0, end: 0 }, settings: { width: 128, height: 128, format: 'png8', supersampling: 1 } },
    });
    expect(response.status()).toBe(403);
    expect(response.headers()['content-type']).toContain('application/problem+json');
  });
});
