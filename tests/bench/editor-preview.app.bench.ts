/**
 * Scene editor preview bench (issue 5): frames per second the live preview puts on
 * screen while a demo shot plays, in Debian Chromium with SwiftShader (software
 * WebGL) against the app `npm run bench` serves (SKYWELL_BASE_URL).
 *
 * Play advances the scrubber every animation frame, so each frame asks the preview
 * for a new camera state: the whole path a producer's scrub takes (React state,
 * lib/scenes frame request, ray table, draw). Frames are counted by the sky view
 * itself (window.__skywellFramesShown). Measured on the WebGL path (the default)
 * and on the CPU fallback in a Web Worker (WebGL disabled by a launch flag), where
 * the preview draws half-size light frames while the shot moves; each under two
 * compositor set-ups, since headless Chromium's default (compositing the window in
 * SwiftShader) caps every path at about 8 frames per second on its own.
 * Target: at least 20 frames per second at 640x360. Reported, not asserted.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import type {} from '../../components/sky-view/debug-handle'; // window.__skywellFramesShown

const BASE_URL = process.env.SKYWELL_BASE_URL;
const STUDIO = 'saltmarsh-dome';
const PASSWORD = process.env.SKYWELL_DEMO_PASSWORD ?? 'skywell-demo-2026';
const WINDOW_MS = 6000;
/** SKYWELL_BENCH_PROFILE=1 also prints where the page's main thread spent the played window; =trace, the busiest trace events of every thread. */
const PROFILE = process.env.SKYWELL_BENCH_PROFILE === '1';
const TRACE = process.env.SKYWELL_BENCH_PROFILE === 'trace';

/** Total duration per (thread, event name) of complete trace events, top 25. */
function printTrace(label: string, trace: { traceEvents: { name: string; ph: string; dur?: number; pid: number; tid: number; args?: { name?: string } }[] }): void {
  const threadNames = new Map<string, string>();
  for (const e of trace.traceEvents) if (e.ph === 'M' && e.name === 'thread_name') threadNames.set(`${e.pid}:${e.tid}`, e.args?.name ?? '?');
  const totals = new Map<string, number>();
  for (const e of trace.traceEvents) {
    if (e.ph !== 'X' || !e.dur) continue;
    const key = `${threadNames.get(`${e.pid}:${e.tid}`) ?? e.tid} / ${e.name}`;
    totals.set(key, (totals.get(key) ?? 0) + e.dur / 1000);
  }
  const top = [...totals].sort((a, b) => b[1] - a[1]).slice(0, 25).map(([k, v]) => `  ${v.toFixed(0).padStart(6)} ms  ${k}`).join('\n');
  console.log(`trace of "${label}" (total duration per thread and event, nested events counted in their parents too):\n${top}`);
}

interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; children?: number[] }[];
  samples: number[];
  timeDeltas: number[];
}

/** Self time per function (top 20) and per script of a V8 CPU profile. */
function printProfile(label: string, profile: CpuProfile): void {
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const self = new Map<string, number>();
  const perUrl = new Map<string, number>();
  profile.samples.forEach((id, i) => {
    const frame = byId.get(id)!.callFrame;
    const name = `${frame.functionName || '(anonymous)'} ${frame.url.split('/').pop()}:${frame.lineNumber}`;
    const dt = (profile.timeDeltas[i] ?? 0) / 1000;
    self.set(name, (self.get(name) ?? 0) + dt);
    const url = frame.url.split('/').pop() || frame.functionName;
    perUrl.set(url, (perUrl.get(url) ?? 0) + dt);
  });
  const top = (m: Map<string, number>, n: number) => [...m].sort((a, b) => b[1] - a[1]).slice(0, n).map(([k, v]) => `  ${v.toFixed(0).padStart(6)} ms  ${k}`).join('\n');
  console.log(`profile of "${label}" (main thread self time):\n${top(self, 20)}\nper script:\n${top(perUrl, 10)}`);
}
const ARGS = [
  '--no-sandbox', '--disable-background-networking', '--disable-component-update', '--disable-sync',
  '--no-first-run', '--disable-quic', '--use-angle=swiftshader', '--enable-unsafe-swiftshader',
];

async function signIn(page: Page): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.locator('[data-testid="sign-in-form"][data-hydrated="true"]').waitFor({ timeout: 120_000 });
  await page.getByLabel('E-mail').fill(`producer@${STUDIO}.test`);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByLabel('Password').press('Enter');
  await page.waitForURL(new RegExp(`/studios/${STUDIO}$`), { timeout: 120_000 });
}

interface PlayResult {
  fps: number;
  size: string;
  path: string;
  seconds: number;
  /** share of the polls during play that found half-size light frames on screen (the preview's data-detail) */
  lightShare: number;
}

/** Opens a demo scene, waits for its first full frame, plays the shot and counts the frames shown. */
async function playScene(page: Page, sceneName: string, expectedPath: 'webgl' | 'cpu'): Promise<PlayResult> {
  await page.goto(`${BASE_URL}/studios/${STUDIO}/shows`);
  await page.getByRole('link', { name: 'The Long Fall' }).first().click();
  await page.getByRole('link', { name: sceneName, exact: true }).click();
  await page.getByTestId('scene-title').filter({ hasText: sceneName }).waitFor({ timeout: 180_000 });
  const preview = page.getByTestId('preview');
  await page.waitForFunction(
    (path) => {
      const el = document.querySelector('[data-testid="preview"]');
      return el?.getAttribute('data-path') === path && el.getAttribute('data-detail') === 'full' && (window.__skywellFramesShown ?? 0) > 0;
    },
    expectedPath,
    { timeout: 180_000 },
  );
  const size = `${JSON.parse((await preview.getAttribute('data-request')) ?? '{}').width}x${JSON.parse((await preview.getAttribute('data-request')) ?? '{}').height}`;
  // from the start of the shot, and let the page settle
  await page.getByTestId('scrubber').focus();
  await page.keyboard.press('Home');
  await page.waitForTimeout(1500);
  const before = await page.evaluate(() => ({ frames: window.__skywellFramesShown ?? 0, at: performance.now() }));
  const profiler = PROFILE ? await page.context().newCDPSession(page) : null;
  if (profiler) {
    await profiler.send('Profiler.enable');
    await profiler.send('Profiler.start');
  }
  if (TRACE) await page.context().browser()!.startTracing(page, { categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'gpu', 'cc', 'viz'] });
  await page.getByTestId('play').click();
  // until the window closes or the shot ends (Play shows again)
  const deadline = Date.now() + WINDOW_MS;
  let polls = 0;
  let lightPolls = 0;
  while (Date.now() < deadline && (await page.getByTestId('play').getAttribute('aria-label')) === 'Pause') {
    polls++;
    if ((await preview.getAttribute('data-detail')) === 'interactive') lightPolls++;
    await page.waitForTimeout(200);
  }
  const after = await page.evaluate(() => ({ frames: window.__skywellFramesShown ?? 0, at: performance.now() }));
  if ((await page.getByTestId('play').getAttribute('aria-label')) === 'Pause') await page.getByTestId('play').click();
  if (profiler) printProfile(sceneName, (await profiler.send('Profiler.stop')).profile);
  if (TRACE) {
    const raw = (await page.context().browser()!.stopTracing()).toString();
    // the whole trace too, for chrome://tracing or Perfetto
    const file = path.join('.data', 'bench', 'traces', `${sceneName.replace(/\W+/g, '-').toLowerCase()}-${Date.now()}.json`);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, raw);
    console.log(`trace written to ${file}`);
    printTrace(sceneName, JSON.parse(raw));
  }
  const seconds = (after.at - before.at) / 1000;
  const shownPath = (await preview.getAttribute('data-path')) ?? '?';
  return { fps: (after.frames - before.frames) / seconds, size, path: shownPath, seconds, lightShare: polls ? lightPolls / polls : 0 };
}

/**
 * Plays the scenes in a fresh browser context. `fullFrames` sets the editor's "full-size frames while moving"
 * choice (kept in localStorage): on, WebGL draws every frame at full size; off, the editor switches to
 * half-size light frames once WebGL draws slower than 20 frames per second in motion.
 */
async function measure(browser: Browser, scenes: string[], path: 'webgl' | 'cpu', fullFrames = true): Promise<PlayResult[]> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  await context.addInitScript((on) => window.localStorage.setItem('skywell:preview-full-frames-while-moving', on ? '1' : '0'), fullFrames);
  const page = await context.newPage();
  page.on('pageerror', (e) => console.error(`page error: ${e.message}`));
  await signIn(page);
  const results: PlayResult[] = [];
  for (const scene of scenes) results.push(await playScene(page, scene, path));
  await context.close();
  return results;
}

async function main(): Promise<void> {
  if (!BASE_URL) throw new Error('SKYWELL_BASE_URL is not set: run through `npm run bench`');
  const scenes = ['Drop through the horizon', 'Approach from 40 r_s'];
  console.log('Skywell scene editor preview bench: Debian Chromium, SwiftShader (software WebGL); frames shown while the shot plays');
  // Two compositor set-ups: headless Chromium's default composites the whole window through SwiftShader on
  // every frame; desktop Chromium on a machine without a usable GPU composites in software instead, redrawing
  // only what changed, while WebGL still runs in SwiftShader.
  const headless = { label: 'compositing in SwiftShader (headless default)', args: ARGS };
  const software = { label: 'software compositing (--disable-gpu-compositing, as desktop Chromium without a GPU)', args: [...ARGS, '--disable-gpu-compositing'] };
  const withBrowser = async <T>(args: string[], use: (browser: Browser) => Promise<T>): Promise<T> => {
    const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args });
    try {
      return await use(browser);
    } finally {
      await browser.close();
    }
  };
  for (const compositor of [headless, software]) {
    for (const fullFrames of [true, false]) {
      const results = await withBrowser(compositor.args, (browser) => measure(browser, scenes, 'webgl', fullFrames));
      const frames = fullFrames ? 'full frames' : 'light frames when slow (the editor default)';
      results.forEach((r, i) =>
        console.log(
          `preview, ${r.path} path, ${compositor.label}, ${frames}, "${scenes[i]}" ${r.size}: ${r.fps.toFixed(1)} frames/s over ${r.seconds.toFixed(1)} s` +
            ` (target >= 20 at 640x360); half-size light frames on screen ${(100 * r.lightShare).toFixed(0)}% of the play`,
        ),
      );
    }
  }
  // the CPU fallback under both set-ups: headless compositing in SwiftShader bounds it too
  for (const compositor of [headless, software]) {
    const [r] = await withBrowser([...compositor.args, '--disable-webgl', '--disable-3d-apis'], (browser) => measure(browser, scenes.slice(0, 1), 'cpu'));
    console.log(
      `preview, ${r.path} fallback (WebGL disabled), ${compositor.label}, "${scenes[0]}" full size ${r.size}, half-size frames while playing: ` +
        `${r.fps.toFixed(1)} frames/s over ${r.seconds.toFixed(1)} s (target >= 20 at 640x360)`,
    );
  }
}

main().catch((error: unknown) => {
  console.error(`editor preview bench failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
