import { expect, type Page } from '@playwright/test';

/** The scene editor, read the way a test needs it: preview pixels, the request behind them, and the readouts. */
export class SceneEditorPage {
  constructor(private readonly page: Page) {}

  /** Waits for a full-detail preview frame newer than `afterFrames`, and returns its request and frame count. */
  async waitForFullFrame(afterFrames = 0, timeout = 120_000): Promise<{ request: Record<string, unknown>; frames: number; skyMissing: boolean }> {
    const preview = this.page.getByTestId('preview');
    await expect
      .poll(async () => {
        const detail = await preview.getAttribute('data-detail');
        const frames = Number(await preview.getAttribute('data-frames'));
        return detail === 'full' && frames > afterFrames;
      }, { timeout })
      .toBe(true);
    return {
      request: JSON.parse((await preview.getAttribute('data-request')) ?? '{}'),
      frames: Number(await preview.getAttribute('data-frames')),
      skyMissing: (await preview.getAttribute('data-sky-missing')) === 'true',
    };
  }

  /** RGBA bytes of the drawn frame on the preview canvas. */
  async framePixels(): Promise<{ width: number; height: number; rgba: Buffer }> {
    const { width, height, base64 } = await this.page.evaluate(() => {
      const canvas = document.querySelector('[data-testid=preview-canvas]') as HTMLCanvasElement;
      const d = canvas.dataset;
      const [x, y, w, h] = [d.frameX, d.frameY, d.frameWidth, d.frameHeight].map(Number);
      const bytes = canvas.getContext('2d')!.getImageData(x, y, w, h).data;
      let text = '';
      for (let i = 0; i < bytes.length; i += 0x8000) text += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
      return { width: w, height: h, base64: btoa(text) };
    });
    return { width, height, rgba: Buffer.from(base64, 'base64') };
  }

  async readouts(): Promise<{ tau: number; countdownSeconds: number | null; orbitBand: string; radiusRs: number }> {
    const el = this.page.getByTestId('readouts');
    const countdown = await el.getAttribute('data-countdown-seconds');
    return {
      tau: Number(await el.getAttribute('data-tau')),
      countdownSeconds: countdown ? Number(countdown) : null,
      orbitBand: (await el.getAttribute('data-orbit-band')) ?? '',
      radiusRs: Number(await el.getAttribute('data-radius-rs')),
    };
  }
}
