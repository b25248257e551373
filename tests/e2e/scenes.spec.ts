import { expect, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { SceneEditorPage, type PreviewFrame } from './pages/scene-editor-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, skipHiddenStreamCopies, test } from './support';
import { defaultSceneSpec } from '../../lib/scenes/defaults';
import { sceneSpecSchema } from '../../lib/scenes/schema';
import { readoutAt, sceneWorldline } from '../../lib/scenes/readout';
import { buildPacingCurve, properTimeAt } from '../../lib/scenes/pacing';
import { DEMO_SCENES } from '../../lib/demo/scenes';
import { parseFrameRequest } from '../../lib/render/schema';
import { prepareFrame } from '../../lib/render/frame';
import { renderBandEncoded } from '../../lib/render/renderRows';
import { loadSkyAssets } from '../../lib/render/node/assets';

test.describe.configure({ timeout: 300_000 });

async function signIn(page: Page, role: string) {
  const signInPage = new SignInPage(page);
  await signInPage.open();
  // On a cold dev server the form hydrates late; typing before that submits it as a plain GET.
  await page.waitForLoadState('networkidle');
  await signInPage.signIn(demoEmail(role), DEMO_PASSWORD);
  await expect(page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}$`), { timeout: 60_000 });
}

async function openDemoShow(page: Page) {
  await page.goto(`/studios/${DEMO_STUDIO_SLUG}/shows`);
  await page.getByRole('link', { name: 'The Long Fall' }).first().click();
  await expect(page.getByTestId('show-name')).toHaveText('The Long Fall', { timeout: 120_000 });
}

/** Signs a producer in and opens the demo's drop shot, waiting for its first full frame on the WebGL path. */
async function openDropSceneAsProducer(page: Page): Promise<{ editor: SceneEditorPage; first: PreviewFrame }> {
  await signIn(page, 'producer');
  await openDemoShow(page);
  await page.getByRole('link', { name: 'Drop through the horizon', exact: true }).click();
  await expect(page.getByTestId('scene-title')).toHaveText('Drop through the horizon', { timeout: 180_000 });
  const editor = new SceneEditorPage(page);
  const first = await editor.waitForFullFrame();
  expect(first.path).toBe('webgl');
  return { editor, first };
}

/**
 * Per-channel absolute differences (RGB, 0..255) between an RGBA frame and an RGB one:
 * the mean and the 99th percentile (from a 256-bin histogram, so nothing is sorted).
 */
function diffStats(rgba: Buffer, rgb: Uint8Array, pixels: number): { mean: number; p99: number } {
  const histogram = new Float64Array(256);
  let sum = 0;
  for (let p = 0; p < pixels; p++) {
    for (let c = 0; c < 3; c++) {
      const d = Math.abs(rgba[p * 4 + c] - rgb[p * 3 + c]);
      histogram[d]++;
      sum += d;
    }
  }
  const count = pixels * 3;
  let seen = 0;
  let p99 = 0;
  while (p99 < 255 && seen + histogram[p99] < 0.99 * count) seen += histogram[p99++];
  return { mean: sum / count, p99 };
}

/**
 * Agreement of the preview (WebGL under SwiftShader, or the CPU fallback) with lib/render, in 8-bit levels:
 * issue 7's targets for the WebGL view, mean |diff| below 2/255 and 99th percentile below 10/255. The sky-view
 * spec measures 0.015/255 and 1/255 under SwiftShader; the CPU fallback runs lib/render itself.
 */
const AGREEMENT_MEAN_LEVELS = 2;
const AGREEMENT_P99_LEVELS = 10;

/**
 * Checks the frame the preview shows against lib/render's render of the same request, here in Node, within the
 * agreement targets, and logs the figures under `label`.
 * @returns lib/render's frame (RGB), for further checks of the picture
 */
async function expectAgreesWithLibRender(editor: SceneEditorPage, frame: PreviewFrame, label: string): Promise<Uint8Array> {
  const shown = await editor.framePixels();
  const request = parseFrameRequest(frame.request);
  expect(shown.width).toBe(request.width);
  expect(shown.height).toBe(request.height);
  expect(shown.rgba.length).toBe(request.width * request.height * 4);
  const reference = renderBandEncoded(prepareFrame(request, await loadSkyAssets(request)), { y0: 0, y1: request.height }, 8) as Uint8Array;
  const diff = diffStats(shown.rgba, reference, request.width * request.height);
  console.log(`${label}: ${request.width}x${request.height} on the ${frame.path} path; mean |diff| ${diff.mean.toFixed(3)}/255, 99th percentile ${diff.p99}/255`);
  expect(diff.mean).toBeLessThan(AGREEMENT_MEAN_LEVELS);
  expect(diff.p99).toBeLessThan(AGREEMENT_P99_LEVELS);
  return reference;
}

const radiusOf = (request: Record<string, unknown>) => (request.camera as { state: { radiusM: number } }).state.radiusM;

test.describe('scene editor', () => {
  test('should let a producer build a drop from scratch, see the preview follow the radius, scrub, and read the engine values', async ({ page }) => {
    await signIn(page, 'producer');
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/shows`);
    const showName = `E2E show ${Date.now()}`;
    // Keyboard: name the show and press Enter.
    await page.getByLabel('New show').fill(showName);
    await page.getByLabel('New show').press('Enter');
    await page.getByRole('link', { name: showName }).click();
    await expect(page.getByTestId('show-name')).toHaveText(showName, { timeout: 120_000 });
    await page.getByLabel('New scene').fill('Drop from 10 r_s');
    await page.getByLabel('New scene').press('Enter');
    await expect(page.getByTestId('scene-editor')).toBeVisible({ timeout: 180_000 });

    const editor = new SceneEditorPage(page);
    const first = await editor.waitForFullFrame();
    // Issue 7: the editor shows the WebGL view by default (SwiftShader offers WebGL2 here).
    expect(first.path).toBe('webgl');
    await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'webgl');
    const before = await editor.framePixels();

    // Mouse and keyboard: make the first segment a drop from rest, start radius 10 r_s.
    await page.getByTestId('f-path-segments-0-kind').selectOption('drop');
    const radius = page.getByTestId('segment-0-r');
    await radius.click();
    await radius.press('Control+a');
    await radius.pressSequentially('10');
    await expect(page.getByTestId('segment-0-summary')).toContainText('ends at the singularity');
    const second = await editor.waitForFullFrame((request) => Math.abs(radiusOf(request) - 20) < 1e-9);
    expect(radiusOf(second.request)).not.toBeCloseTo(radiusOf(first.request), 3);
    const after = await editor.framePixels();
    expect(after.width * after.height).toBe(before.width * before.height);
    const changed = diffStats(before.rgba, rgbOf(after.rgba), before.width * before.height);
    console.log(`preview change from 40 r_s hover to 10 r_s drop: mean |diff| ${changed.mean.toFixed(2)} levels`);
    expect(changed.mean).toBeGreaterThan(1);

    // Scrub with the mouse to about 70 % of the shot.
    const scrubber = page.getByTestId('scrubber');
    // the mouse clicks at viewport coordinates: bring the scrubber (below the preview) into view first
    await scrubber.scrollIntoViewIfNeeded();
    await expect
      .poll(async () => {
        const box = (await scrubber.boundingBox())!;
        await page.mouse.click(box.x + box.width * 0.7, box.y + box.height / 2);
        return Number(await scrubber.inputValue());
      }, { timeout: 30_000 })
      .toBeGreaterThan(500);
    const position = Number(await scrubber.inputValue());

    // The expected values, computed here in Node from the same engine code and the spec the producer built.
    const spec = sceneSpecSchema.parse({ ...defaultSceneSpec(), path: { segments: [{ kind: 'drop', r: 20 }] } });
    const worldline = sceneWorldline(spec);
    const curve = buildPacingCurve(spec.pacing.points);
    const screenEnd = 10 * (worldline.duration / 100); // default pacing: 100 M over 10 s, straight beyond
    const expectedTau = properTimeAt(curve, (position / 1000) * screenEnd);
    const expected = readoutAt(spec, worldline, expectedTau);
    await expect.poll(async () => (await editor.readouts()).tau, { timeout: 30_000 }).toBeCloseTo(expectedTau, 6);
    const shown = await editor.readouts();
    console.log(`scrubbed to tau ${shown.tau} M; countdown shown ${shown.countdownSeconds} s, engine ${expected.countdownSeconds} s; band ${shown.orbitBand}`);
    expect(shown.countdownSeconds).not.toBeNull();
    expect(Math.abs(shown.countdownSeconds! - expected.countdownSeconds!) / expected.countdownSeconds!).toBeLessThan(1e-9);
    expect(shown.orbitBand).toBe(expected.orbitBand);
    await expect(page.getByTestId('readout-band')).toContainText(expected.orbitBand);
    // distant-observer time: null beyond the horizon, else the engine's value
    if (expected.distantTimeSeconds === null) expect(shown.distantSeconds).toBeNull();
    else expect(Math.abs(shown.distantSeconds! - expected.distantTimeSeconds) / expected.distantTimeSeconds).toBeLessThan(1e-9);

    // Save: a new revision based on revision 1.
    await page.getByTestId('revision-message').fill('drop from 10 r_s');
    await page.getByTestId('save-revision').click();
    await expect(page.getByTestId('save-outcome')).toContainText('Saved as revision 2', { timeout: 120_000 });
    await expect(page.getByTestId('revision-status')).toContainText('Revision 2');

    // "Until a radius" is kept as a radius: the drop still ends there after its start radius changes.
    await page.getByTestId('f-path-segments-0-duration-mode').selectOption('radius');
    const until = page.getByTestId('segment-0-until-r');
    await until.fill('4');
    await expect(page.getByTestId('segment-0-summary')).toContainText('ends at 4 r_s');
    await radius.fill('12');
    await expect(page.getByTestId('segment-0-summary')).toContainText('ends at 4 r_s');
    // a radius the fall cannot reach gets its reason at the field
    await until.fill('13');
    await expect(page.getByTestId('f-path-segments-0-untilR-error')).toContainText('a radial fall only moves inward');
  });

  test('should keep operators out of scenes and show advisors a read-only editor', async ({ page, browser }) => {
    await signIn(page, 'advisor');
    await openDemoShow(page);
    await page.getByRole('link', { name: 'Drop through the horizon', exact: true }).click();
    await expect(page.getByTestId('scene-editor')).toHaveAttribute('data-can-edit', 'false', { timeout: 180_000 });
    await expect(page.getByTestId('read-only-notice')).toBeVisible();
    await expect(page.getByTestId('save-revision')).toHaveCount(0);
    await expect(page.getByTestId('segment-0-r')).toBeDisabled();
    const editorUrl = page.url();

    const operatorContext = await browser.newContext();
    const operator = skipHiddenStreamCopies(await operatorContext.newPage());
    await signIn(operator, 'operator');
    await operator.goto(editorUrl);
    await expect(operator.getByTestId('scene-forbidden')).toBeVisible({ timeout: 120_000 });
    await expect(operator.getByTestId('scene-editor')).toHaveCount(0);
    await operatorContext.close();
  });

  test('should open every demo scene without error, with a first full frame matching a server-side render of the same request', async ({ page }) => {
    test.setTimeout(900_000);
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, 'producer');
    // exact names: other tests add scenes to the shared demo show whose names start with these
    for (const demo of DEMO_SCENES) {
      await openDemoShow(page);
      await page.getByRole('link', { name: demo.name, exact: true }).click();
      await expect(page.getByTestId('scene-title')).toHaveText(demo.name, { timeout: 180_000 });
      const editor = new SceneEditorPage(page);
      await expectAgreesWithLibRender(editor, await editor.waitForFullFrame(), demo.slug);
    }
    expect(errors).toEqual([]);
  });

  test('should play with half-size WebGL frames when full ones come slower than 20 per second, full detail at rest, unless asked for full frames', async ({ page }) => {
    const { editor, first: rested } = await openDropSceneAsProducer(page);
    const full = { width: rested.request.width as number, height: rested.request.height as number };
    const box = page.getByTestId('sky-view-webgl');
    const shownWidth = (await box.boundingBox())!.width;

    // SwiftShader draws this 640x360 shot well below 20 frames per second, so playing switches to light frames:
    // drawn at half size, shown in the same box.
    await page.getByTestId('scrubber').focus();
    await page.keyboard.press('Home');
    await page.getByTestId('play').click();
    const preview = page.getByTestId('preview');
    await expect(preview).toHaveAttribute('data-detail', 'interactive', { timeout: 60_000 });
    const light = JSON.parse((await preview.getAttribute('data-request'))!) as { width: number; height: number };
    expect(light).toMatchObject({ width: full.width / 2, height: full.height / 2 });
    await expect(page.getByTestId('preview-status')).toContainText('light frame while moving');
    expect(Math.abs((await box.boundingBox())!.width - shownWidth)).toBeLessThan(1);
    // the canvas draws the light frame's own pixels (its drawing buffer is not the box's size; r3f resizes it
    // just after the request changes)
    await expect.poll(() => box.locator('canvas').evaluate((c: HTMLCanvasElement) => [c.width, c.height])).toEqual([light.width, light.height]);

    // At rest: the full-detail frame again.
    await page.getByTestId('play').click();
    const settled = await editor.waitForFullFrame();
    expect(settled.request).toMatchObject(full);

    // A producer who prefers sharp frames while moving can ask for them.
    await page.getByTestId('preview-full-frames').check();
    await page.getByTestId('play').click();
    await page.waitForTimeout(2000);
    await expect(preview).toHaveAttribute('data-detail', 'full');
    await page.getByTestId('play').click();
  });

  test('should match lib/render with the horizon grid switched off, the shadow drawn black', async ({ page }) => {
    await signIn(page, 'producer');
    await openDemoShow(page);
    // Hovering at 3.2 M, the shadow's edge lies 84 degrees from the hole (sin psi = 3 sqrt(3) M / r sqrt(1 - 2M / r),
    // Synge 1966). At the shot's end the dome looks 90 degrees away from the hole, so about half of its circle
    // is shadow and half lensed sky.
    await page.getByRole('link', { name: 'Hover near the photon sphere', exact: true }).click();
    await expect(page.getByTestId('scene-title')).toHaveText('Hover near the photon sphere', { timeout: 180_000 });
    const editor = new SceneEditorPage(page);
    await editor.waitForFullFrame();
    await page.getByTestId('scrubber').focus();
    await page.keyboard.press('End');
    await editor.waitForFullFrame((r) => Math.abs(((r.camera as { look: number[] }).look[1] ?? 0)) > 0.9);
    await page.getByTestId('tab-sky').click();
    const grid = page.getByLabel('Horizon grid (thin teal lines)');
    await grid.uncheck();
    const frame = await editor.waitForFullFrame((r) => !(r.effects as { horizonGrid: { enabled: boolean } }).horizonGrid.enabled);
    expect(frame.path).toBe('webgl');
    const reference = await expectAgreesWithLibRender(editor, frame, 'horizon grid off');
    // black pixels of lib/render's frame: the shadow and the corners outside the dome's circle (21%), not the sky
    let black = 0;
    for (let j = 0; j < reference.length; j += 3) if (reference[j] + reference[j + 1] + reference[j + 2] === 0) black++;
    const blackShare = black / (reference.length / 3);
    console.log(`horizon grid off: ${(100 * blackShare).toFixed(0)}% of the frame black`);
    expect(blackShare).toBeGreaterThan(0.35);
    expect(blackShare).toBeLessThan(0.8);
    // leave the shared demo scene's draft as it was
    await grid.check();
  });

  test('should scale the preview down to a column narrower than the frame, keeping its full-size drawing', async ({ page }) => {
    const { first } = await openDropSceneAsProducer(page);
    await page.setViewportSize({ width: 560, height: 800 });
    const box = page.getByTestId('sky-view-webgl');
    const section = page.getByRole('region', { name: 'Preview' });
    await expect.poll(async () => (await box.boundingBox())!.width).toBeLessThan(first.request.width as number);
    const shown = (await box.boundingBox())!;
    const column = (await section.boundingBox())!;
    expect(shown.x + shown.width).toBeLessThanOrEqual(column.x + column.width);
    // same aspect, and the canvas still draws the request's own pixels
    expect(shown.height / shown.width).toBeCloseTo((first.request.height as number) / (first.request.width as number), 2);
    expect(await box.locator('canvas').evaluate((c: HTMLCanvasElement) => [c.width, c.height])).toEqual([first.request.width, first.request.height]);
  });

  test('should fall back to the CPU renderer when WebGL is lost, with light frames while scrubbing and full detail at rest', async ({ page }) => {
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    const { editor, first } = await openDropSceneAsProducer(page);

    // The same loss a driver reset causes: the view must switch to lib/render in a worker without a reload.
    await page.evaluate(() => {
      const canvas = document.querySelector('[data-testid="sky-view-webgl"] canvas') as HTMLCanvasElement;
      (canvas.getContext('webgl2') as WebGL2RenderingContext).getExtension('WEBGL_lose_context')!.loseContext();
    });
    await expect(page.getByTestId('sky-view-path')).toHaveAttribute('data-path', 'cpu');
    await expect(page.getByTestId('sky-view-path')).toContainText('context was lost');
    const rested = await editor.waitForFullFrame();
    expect(rested.path).toBe('cpu');
    const full = { width: rested.request.width as number, height: rested.request.height as number };

    // Drag the scrubber: while it moves the CPU path asks for half-size frames. The light phase lasts only
    // while the scrubber moves plus a short rest, so every size asked for is recorded as it happens.
    await page.evaluate(() => {
      const preview = document.querySelector('[data-testid=preview]')!;
      const sizes: string[] = [];
      (window as unknown as { __previewSizes: string[] }).__previewSizes = sizes;
      new MutationObserver(() => {
        const request = JSON.parse(preview.getAttribute('data-request') || '{}') as { width?: number; height?: number };
        sizes.push(`${preview.getAttribute('data-detail')} ${request.width}x${request.height}`);
      }).observe(preview, { attributes: true, attributeFilter: ['data-detail', 'data-request'] });
    });
    const scrubber = page.getByTestId('scrubber');
    await scrubber.scrollIntoViewIfNeeded();
    const box = (await scrubber.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.6, box.y + box.height / 2, { steps: 5 });
    await page.mouse.up();
    await expect
      .poll(async () => page.evaluate(() => (window as unknown as { __previewSizes: string[] }).__previewSizes))
      .toContain(`interactive ${full.width / 2}x${full.height / 2}`);

    // At rest it refines to the full-detail frame, which is lib/render's own picture.
    const settled = await editor.waitForFullFrame((request) => request.width === full.width && radiusOf(request) !== radiusOf(rested.request));
    expect(settled.path).toBe('cpu');
    await expectAgreesWithLibRender(editor, settled, 'CPU fallback');
    expect(errors).toEqual([]);
  });
});

/** RGBA -> RGB bytes. */
function rgbOf(rgba: Buffer): Uint8Array {
  const out = new Uint8Array((rgba.length / 4) * 3);
  for (let i = 0, j = 0; i < rgba.length; i += 4, j += 3) {
    out[j] = rgba[i];
    out[j + 1] = rgba[i + 1];
    out[j + 2] = rgba[i + 2];
  }
  return out;
}
