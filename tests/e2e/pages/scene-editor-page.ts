import { expect, type Page } from '@playwright/test';

/** What the preview shows once a full-detail frame is on screen. */
export interface PreviewFrame {
  /** the frame request the sky view drew (window.__skywellSkyView.request) */
  request: Record<string, unknown>;
  /** which renderer drew it */
  path: 'webgl' | 'cpu';
}

/** The scene editor, read the way a test needs it: preview pixels, the request behind them, and the readouts. */
export class SceneEditorPage {
  constructor(private readonly page: Page) {}

  /**
   * Waits until the preview's sky view has drawn the full-detail request the editor asked for
   * (and, when `accept` is given, one it accepts), and returns that request.
   */
  async waitForFullFrame(accept: (request: Record<string, unknown>) => boolean = () => true, timeout = 180_000): Promise<PreviewFrame> {
    let shown: PreviewFrame | null = null;
    let failure: string | null = null;
    await expect
      .poll(async () => {
        const state = await this.page.evaluate(() => {
          const preview = document.querySelector('[data-testid=preview]');
          const handle = window.__skywellSkyView;
          const path = document.querySelector('[data-testid=sky-view-path]')?.getAttribute('data-path');
          const box = path ? document.querySelector(`[data-testid=sky-view-${path}]`) : null;
          // a failed CPU render shows an alert: report it instead of waiting out the timeout
          const failure = document.querySelector('[data-testid=sky-view-cpu] [role=alert]')?.textContent ?? null;
          return {
            detail: preview?.getAttribute('data-detail') ?? null,
            wanted: preview?.getAttribute('data-request') ?? '',
            path: handle?.path ?? null,
            drawn: handle?.request ? JSON.stringify(handle.request) : '',
            ready: box?.getAttribute('data-ready') === 'true',
            failure,
          };
        });
        failure = state.failure;
        if (failure) return `failed: ${failure}`;
        if (state.detail !== 'full' || !state.ready || !state.path || !state.wanted || state.drawn !== state.wanted) return 'waiting';
        const request = JSON.parse(state.drawn) as Record<string, unknown>;
        if (!accept(request)) return 'waiting';
        shown = { request, path: state.path };
        return 'drawn';
      }, { timeout, intervals: [250, 500, 1000] })
      .toMatch(/^(drawn|failed)/);
    // fail fast on a render error rather than waiting out the timeout
    if (!shown) throw new Error(`the preview could not draw its frame: ${failure}`);
    return shown;
  }

  /** RGBA bytes of the frame the sky view drew (rows from the top), with its size. */
  async framePixels(): Promise<{ width: number; height: number; rgba: Buffer }> {
    const { width, height, base64 } = await this.page.evaluate(async () => {
      const handle = window.__skywellSkyView!;
      const request = handle.request!;
      return { width: request.width, height: request.height, base64: await handle.readFrame() };
    });
    return { width, height, rgba: Buffer.from(base64, 'base64') };
  }

  async readouts(): Promise<{ tau: number; countdownSeconds: number | null; distantSeconds: number | null; orbitBand: string; radiusRs: number }> {
    const el = this.page.getByTestId('readouts');
    const countdown = await el.getAttribute('data-countdown-seconds');
    const distant = await el.getAttribute('data-distant-seconds');
    return {
      tau: Number(await el.getAttribute('data-tau')),
      countdownSeconds: countdown ? Number(countdown) : null,
      distantSeconds: distant ? Number(distant) : null,
      orbitBand: (await el.getAttribute('data-orbit-band')) ?? '',
      radiusRs: Number(await el.getAttribute('data-radius-rs')),
    };
  }
}
