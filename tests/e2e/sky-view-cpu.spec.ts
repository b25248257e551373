/**
 * The sky view with WebGL switched off by browser flags: the CPU worker draws the frame and the page says so.
 */
import { expect } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, test } from './support';

test.use({
  launchOptions: {
    executablePath: '/usr/bin/chromium',
    args: [
      '--no-sandbox', '--disable-background-networking', '--disable-component-update', '--disable-sync',
      '--no-first-run', '--disable-quic', '--disable-webgl', '--disable-3d-apis',
    ],
  },
});
test.setTimeout(400_000);
// the dev server compiles pages on first use; give navigation room on a loaded machine
test.use({ navigationTimeout: 120_000, actionTimeout: 60_000 });

test.describe('sky view without WebGL', () => {
  test('should show the frame from the CPU renderer and say which path is in use', async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(demoEmail('producer'), DEMO_PASSWORD);
    await page.waitForURL(/\/studios\//);
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/sky-view`);
    await page.getByLabel('Frame size').selectOption('small');
    await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'cpu');
    await expect(page.getByTestId('sky-view-path')).toContainText('WebGL2 is not available');
    await expect(page.getByTestId('sky-view-cpu')).toHaveAttribute('data-ready', 'true', { timeout: 120_000 });
    // The first frame may still be the default size: wait for the small one that was asked for.
    const readFrame = async () => Buffer.from(await page.evaluate(() => window.__skywellSkyView!.readFrame()), 'base64');
    await expect.poll(async () => (await readFrame()).length, { timeout: 120_000 }).toBe(320 * 180 * 4);
    const frame = await readFrame();
    // the frame has light in it (stars, Milky Way, horizon grid), not an empty canvas
    let lit = 0;
    for (let i = 0; i < frame.length; i += 4) if (frame[i] + frame[i + 1] + frame[i + 2] > 30) lit++;
    expect(lit).toBeGreaterThan(100);
  });
});
