/**
 * The sky view (issue 7): WebGL path, agreement with lib/render, fallback after a lost context.
 * Run against a served app: SKYWELL_BASE_URL=... playwright test tests/e2e/sky-view.spec.ts
 */
import { expect, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, test } from './support';
import { parseFrameRequest, type FrameRequest } from '../../lib/render/schema';
import { prepareFrame } from '../../lib/render/frame';
import { renderBandEncoded } from '../../lib/render/renderRows';
import { loadMilkyWayMap, loadStarCatalogue } from '../../lib/render/node/assets';
import { renderSourceDirections } from '../../lib/webgl/sourceDirections';

test.setTimeout(400_000);
// the dev server compiles pages on first use; give navigation room on a loaded machine
test.use({ navigationTimeout: 120_000, actionTimeout: 60_000 });

/** Agreement tolerance for sky directions, radians (issue 7: 1e-3 rad or one pixel's footprint). */
const DIRECTION_TOLERANCE_RAD = 1e-3;

async function openSkyView(page: Page): Promise<void> {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(demoEmail('advisor'), DEMO_PASSWORD);
  await page.waitForURL(/\/studios\//);
  await page.goto(`/studios/${DEMO_STUDIO_SLUG}/sky-view`);
  await expect(page.getByRole('heading', { name: 'Sky view' })).toBeVisible();
}

interface CameraCase {
  name: string;
  radiusRs: string;
  observer: 'hover' | 'fall';
  projection: 'flat' | 'dome';
}

async function applyCase(page: Page, c: CameraCase): Promise<void> {
  await page.getByLabel('Frame size').selectOption('small');
  await page.getByLabel('Observer').selectOption(c.observer);
  if (c.observer === 'fall') await page.getByLabel(/Fall energy/).fill('1');
  await page.getByLabel('Radius (r_s)').fill(c.radiusRs);
  await page.getByLabel('Projection', { exact: true }).selectOption(c.projection);
  if (c.projection === 'dome') await page.getByLabel('Dome tilt (°)').fill('20');
}

/** Wait until the WebGL view shows the request whose camera radius is radiusM. */
async function webglRequest(page: Page, radiusM: number): Promise<FrameRequest> {
  await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'webgl');
  await expect(page.getByTestId('sky-view-webgl')).toHaveAttribute('data-ready', 'true', { timeout: 60_000 });
  await expect
    .poll(async () => page.evaluate(() => window.__skywellSkyView?.request?.camera.state.radiusM ?? null), { timeout: 30_000 })
    .toBeCloseTo(radiusM, 9);
  return parseFrameRequest(await page.evaluate(() => window.__skywellSkyView!.request));
}

function decodeFloats(base64: string): Float32Array {
  const bytes = Buffer.from(base64, 'base64');
  return new Float32Array(bytes.buffer, bytes.byteOffset, bytes.byteLength / 4);
}

/** Angle between two directions, robust for tiny angles: atan2(|a x b|, a . b). */
function angleBetween(a: ArrayLike<number>, ai: number, b: ArrayLike<number>, bi: number): number {
  const cx = a[ai + 1] * b[bi + 2] - a[ai + 2] * b[bi + 1];
  const cy = a[ai + 2] * b[bi] - a[ai] * b[bi + 2];
  const cz = a[ai] * b[bi + 1] - a[ai + 1] * b[bi];
  return Math.atan2(Math.hypot(cx, cy, cz), a[ai] * b[bi] + a[ai + 1] * b[bi + 1] + a[ai + 2] * b[bi + 2]);
}

test.describe('sky view, WebGL path', () => {
  const cases: CameraCase[] = [
    { name: 'hovering at 3.5 r_s, flat', radiusRs: '3.5', observer: 'hover', projection: 'flat' },
    { name: 'hovering at 3.5 r_s, dome', radiusRs: '3.5', observer: 'hover', projection: 'dome' },
    { name: 'falling at 1.2 r_s, flat', radiusRs: '1.2', observer: 'fall', projection: 'flat' },
    { name: 'falling at 1.2 r_s, dome', radiusRs: '1.2', observer: 'fall', projection: 'dome' },
    { name: 'falling at 0.5 r_s (inside the horizon), flat', radiusRs: '0.5', observer: 'fall', projection: 'flat' },
    { name: 'falling at 0.5 r_s (inside the horizon), dome', radiusRs: '0.5', observer: 'fall', projection: 'dome' },
  ];

  test('should report sky directions that agree with lib/render for every camera case', async ({ page }) => {
    await openSkyView(page);
    await page.getByLabel(/Where the light comes from/).check();
    for (const c of cases) {
      await applyCase(page, c);
      const req = await webglRequest(page, 2 * Number(c.radiusRs));
      const gpu = decodeFloats(await page.evaluate(() => window.__skywellSkyView!.readDirections!()));
      const cpu = renderSourceDirections(prepareFrame({ ...req, sky: { ...req.sky, stars: { ...req.sky.stars, enabled: false }, milkyWay: { ...req.sky.milkyWay, enabled: false } } }, {}));
      const { width, height } = req;
      expect(gpu.length).toBe(width * height * 4);
      let compared = 0;
      let failures = 0;
      let worst = 0;
      for (let y = 0; y < height; y++) {
        for (let x = 0; x < width; x++) {
          const i = y * width + x;
          const fate = cpu[5 * i + 3];
          // skip the one-pixel band around fate boundaries (shadow edge, horizon image)
          let edge = false;
          for (let dy = -1; dy <= 1 && !edge; dy++) {
            for (let dx = -1; dx <= 1; dx++) {
              const xx = x + dx;
              const yy = y + dy;
              if (xx >= 0 && yy >= 0 && xx < width && yy < height && cpu[5 * (yy * width + xx) + 3] !== fate) edge = true;
            }
          }
          if (edge) continue;
          compared++;
          if (gpu[4 * i + 3] !== fate) {
            failures++;
            continue;
          }
          if (fate < 0) continue;
          const angle = angleBetween(gpu, 4 * i, cpu, 5 * i);
          worst = Math.max(worst, angle);
          if (angle > Math.max(DIRECTION_TOLERANCE_RAD, cpu[5 * i + 4])) failures++;
        }
      }
      console.log(`${c.name}: ${compared} pixels compared, worst ${worst.toExponential(2)} rad, ${failures} over tolerance`);
      expect(compared, c.name).toBeGreaterThan(0.5 * width * height * (c.projection === 'dome' ? Math.PI / 4 : 1));
      expect(failures, c.name).toBe(0);
    }
  });

  test('should draw a frame that agrees with the CPU render of the same request', async ({ page }) => {
    await openSkyView(page);
    await applyCase(page, { name: 'hover', radiusRs: '3.5', observer: 'hover', projection: 'flat' });
    await page.getByLabel('Look: turn from the hole (°, right +)').fill('30');
    const req = await webglRequest(page, 7);
    await expect.poll(async () => page.evaluate(() => window.__skywellSkyView?.request?.camera.look[1] ?? 0)).toBeGreaterThan(0.4);
    const finalReq = parseFrameRequest(await page.evaluate(() => window.__skywellSkyView!.request));
    const gpu = Buffer.from(await page.evaluate(() => window.__skywellSkyView!.readFrame()), 'base64');
    const plan = prepareFrame(finalReq, { catalogue: loadStarCatalogue(), milkyWay: loadMilkyWayMap() });
    const cpu = renderBandEncoded(plan, { y0: 0, y1: req.height }, 8);
    const diffs: number[] = [];
    for (let i = 0, j = 0; j < cpu.length; i += 4, j += 3) for (let k = 0; k < 3; k++) diffs.push(Math.abs(gpu[i + k] - cpu[j + k]));
    diffs.sort((a, b) => a - b);
    const mean = diffs.reduce((s, d) => s + d, 0) / diffs.length;
    const p99 = diffs[Math.floor(0.99 * (diffs.length - 1))];
    console.log(`frame agreement: mean |diff| ${mean.toFixed(3)}/255, 99th percentile ${p99}/255`);
    expect(mean).toBeLessThan(2);
    expect(p99).toBeLessThan(10);
  });

  test('should switch to the CPU renderer without a reload when the WebGL context is lost', async ({ page }) => {
    await openSkyView(page);
    await page.getByLabel('Frame size').selectOption('small');
    await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'webgl');
    await expect(page.getByTestId('sky-view-webgl')).toHaveAttribute('data-ready', 'true', { timeout: 60_000 });
    await page.evaluate(() => {
      const canvas = document.querySelector('[data-testid="sky-view-webgl"] canvas') as HTMLCanvasElement;
      (canvas.getContext('webgl2') as WebGL2RenderingContext).getExtension('WEBGL_lose_context')!.loseContext();
    });
    await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'cpu');
    await expect(page.getByTestId('sky-view-path')).toContainText('context was lost');
    await expect(page.getByTestId('sky-view-cpu')).toHaveAttribute('data-ready', 'true', { timeout: 90_000 });
    const frame = Buffer.from(await page.evaluate(() => window.__skywellSkyView!.readFrame()), 'base64');
    expect(frame.some((v, i) => i % 4 !== 3 && v > 0)).toBe(true);
  });

  test('should explain a radius the observer cannot have', async ({ page }) => {
    await openSkyView(page);
    await page.getByLabel('Radius (r_s)').fill('0.8');
    await expect(page.getByTestId('sky-view-error')).toContainText('outside the event horizon');
  });
});
