import { expect, type Browser, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, mailTo, pageContent, skipHiddenStreamCopies, test } from './support';

// A cold dev server compiles each route on first use: the whole flow can take 15 minutes there.
test.describe.configure({ timeout: 1_200_000 });

const API = `/api/v1/studios/${DEMO_STUDIO_SLUG}`;
const SHOTS = process.env.SKYWELL_SCREENSHOT_DIR ?? '.data/test/playwright-results/reviews';

/** A small, cheap shot: a 12 solar-mass hole, dropped from rest at 10 M; the horizon comes at 33.7 M of proper time (MTW cycloid). */
const DROP_SPEC = {
  massSolar: 12,
  path: { segments: [{ kind: 'drop', r: 10, duration: 34 }] },
  look: { keyframes: [{ tau: 0, look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 100, rollDeg: 0 }] },
  projection: { kind: 'flat', fovDeg: 100 },
  pacing: { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 34, screenTime: 10 }] },
  notes: 'E2E review scene',
};

async function signedInPage(browser: Browser, role: string): Promise<Page> {
  const context = await browser.newContext();
  const page = skipHiddenStreamCopies(await context.newPage());
  const signInPage = new SignInPage(page);
  await signInPage.open();
  // On a cold dev server the form hydrates late; typing before that submits it as a plain GET.
  await page.waitForLoadState('networkidle');
  await signInPage.signIn(demoEmail(role), DEMO_PASSWORD);
  await expect(page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}$`), { timeout: 120_000 });
  return page;
}

async function postJson<T>(page: Page, url: string, data: unknown, status = 201): Promise<T> {
  const response = await page.request.post(url, { data });
  expect(response.status(), `${url}: ${await response.text()}`).toBe(status);
  return (await response.json()) as T;
}

/** Submit a revision through the Reviews page's form; returns the new review's id. */
async function submitThroughForm(page: Page, showName: string, sceneId: string, revision: number): Promise<string> {
  await page.goto(`/studios/${DEMO_STUDIO_SLUG}/reviews`);
  const form = pageContent(page).getByTestId('submit-review-form');
  await expect(form).toBeVisible({ timeout: 120_000 });
  await form.getByTestId('submit-show').selectOption({ label: showName });
  await expect(form.getByTestId('submit-scene').locator(`option[value="${sceneId}"]`)).toHaveCount(1, { timeout: 120_000 });
  await form.getByTestId('submit-scene').selectOption(sceneId);
  await expect(form.getByTestId('submit-revision').locator(`option[value="${revision}"]`)).toHaveCount(1, { timeout: 120_000 });
  await form.getByTestId('submit-revision').selectOption(String(revision));
  await form.getByTestId('submit-message').fill(`Please check revision ${revision}.`);
  await form.getByTestId('submit-review').click();
  await expect(page).toHaveURL(/\/reviews\/[0-9a-f-]{36}$/, { timeout: 120_000 });
  return page.url().split('/').pop()!;
}

async function openReview(page: Page, reviewId: string) {
  await page.goto(`/studios/${DEMO_STUDIO_SLUG}/reviews/${reviewId}`);
  await expect(pageContent(page).getByTestId('review-page')).toBeVisible({ timeout: 180_000 });
}

/** Advisor: scrub with the keyboard to about `fraction` of the shot, mark a point on the frame and pin a note there. */
async function pinNote(page: Page, body: string, fraction: number) {
  const scrubber = pageContent(page).getByTestId('scrubber');
  await scrubber.focus();
  await scrubber.press('Home');
  for (let i = 0; i < Math.round(fraction * 10); i++) await scrubber.press('PageUp');
  await expect(pageContent(page).getByTestId('frame-image')).toHaveAttribute('data-loaded', 'true', { timeout: 180_000 });
  await pageContent(page).getByTestId('frame-image-box').click({ position: { x: 60, y: 40 } });
  await expect(pageContent(page).getByTestId('frame-image-point')).toBeVisible();
  await pageContent(page).getByTestId('pin-note-body').fill(body);
  await pageContent(page).getByTestId('pin-note').click();
  await expect(pageContent(page).getByTestId('note-thread').filter({ hasText: body })).toBeVisible({ timeout: 60_000 });
}

test.describe('reviews', () => {
  test('should take a revision from submission through notes, changes and approval to a final render', async ({ browser }) => {
    const producer = await signedInPage(browser, 'producer');
    const advisor = await signedInPage(browser, 'advisor');

    // A fresh show and scene keep this test independent of the demo data.
    const showName = `E2E reviews ${Date.now()}`;
    const { show } = await postJson<{ show: { id: string } }>(producer, `${API}/shows`, { name: showName });
    const created = await postJson<{ scene: { id: string } }>(producer, `${API}/shows/${show.id}/scenes`, { name: 'Review drop', spec: DROP_SPEC });
    const sceneId = created.scene.id;

    // 1. The producer submits revision 1 from the Reviews page; advisors are e-mailed a link.
    const firstReviewId = await submitThroughForm(producer, showName, sceneId, 1);
    await expect(pageContent(producer).getByTestId('review-state')).toHaveText('In review');
    await expect(pageContent(producer).getByTestId('pin-note-body')).toHaveCount(0); // producers reply only
    if (process.env.SKYWELL_MAIL_FAKE_URL) {
      await expect.poll(async () => (await mailTo(demoEmail('advisor'))).some((m) => m.text.includes(firstReviewId)), { timeout: 30_000 }).toBe(true);
    }

    // 2. The advisor finds it in the list and opens the accuracy report.
    await advisor.goto(`/studios/${DEMO_STUDIO_SLUG}/reviews`);
    await advisor.locator(`[data-review-id="${firstReviewId}"] a`).click();
    await expect(pageContent(advisor).getByTestId('review-page')).toBeVisible({ timeout: 180_000 });
    await pageContent(advisor).getByTestId('report-link').click();
    const report = pageContent(advisor).getByTestId('accuracy-report');
    await expect(report).toBeVisible({ timeout: 300_000 });
    await expect(pageContent(advisor).getByTestId('checks-summary')).toContainText('passes all');
    await expect(advisor.locator('[data-testid="check-row"][data-passed="false"]')).toHaveCount(0);
    expect(await pageContent(advisor).getByTestId('check-row').count()).toBeGreaterThanOrEqual(8);
    await expect(advisor.locator('[data-testid="key-moment"][data-kind="horizon"]')).toHaveCount(1);
    await expect(pageContent(advisor).getByTestId('non-physical-list')).toContainText('exposure');
    await expect(pageContent(advisor).getByTestId('report-idealisations')).toContainText('eternal');
    for (const frame of await advisor.locator('[data-testid^="moment-frame-"]').all()) {
      await expect.poll(() => frame.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), { timeout: 240_000 }).toBeGreaterThan(0);
    }
    await advisor.screenshot({ path: `${SHOTS}/report-screen.png`, fullPage: true });
    await advisor.emulateMedia({ media: 'print' });
    await advisor.screenshot({ path: `${SHOTS}/report-print.png`, fullPage: true });
    await advisor.emulateMedia({ media: 'screen' });

    // 3. Back on the review, the advisor pins a note at a moment, cannot approve while it is open, and asks for changes.
    await pageContent(advisor).getByTestId('back-to-review').click();
    await expect(pageContent(advisor).getByTestId('review-page')).toBeVisible({ timeout: 180_000 });
    await pinNote(advisor, 'The look should follow the hole more slowly here.', 0.5);
    await advisor.screenshot({ path: `${SHOTS}/review-advisor.png`, fullPage: true });
    await pageContent(advisor).getByTestId('approve').click();
    await expect(pageContent(advisor).getByTestId('decision-error')).toContainText('still open', { timeout: 120_000 });
    await pageContent(advisor).getByTestId('changes-message').fill('Slow the look down at mid-fall; see the note.');
    await pageContent(advisor).getByTestId('request-changes').click();
    await expect(pageContent(advisor).getByTestId('review-state')).toHaveText('Changes requested', { timeout: 60_000 });

    // 4. The producer reads the request (the closed review takes no more notes) and saves revision 2 based on revision 1.
    await openReview(producer, firstReviewId);
    await expect(pageContent(producer).getByTestId('changes-note')).toContainText('Slow the look down');
    const edited = { ...DROP_SPEC, look: { keyframes: [{ tau: 0, look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 100, rollDeg: 0 }, { tau: 34, look: [-1, 0, 0], up: [0, 0, 1], fovDeg: 120, rollDeg: 0 }] } };
    const saved = await postJson<{ revision: { number: number } }>(producer, `${API}/scenes/${sceneId}/revisions`, { basedOn: 1, spec: edited, message: 'Slower look change' });
    expect(saved.revision.number).toBe(2);
    const secondReviewId = await submitThroughForm(producer, showName, sceneId, 2);

    // 5. The advisor pins a note on revision 2; the producer replies; the advisor resolves it and approves.
    await openReview(advisor, secondReviewId);
    await expect(pageContent(advisor).getByTestId('diff-none')).toBeVisible();
    await pinNote(advisor, 'Check the countdown here.', 0.8);
    await openReview(producer, secondReviewId);
    const thread = pageContent(producer).getByTestId('note-thread').first();
    await thread.getByTestId('reply-body').fill('Checked: it matches the readout.');
    await thread.getByTestId('reply-send').click();
    await expect(thread.getByTestId('note-reply')).toContainText('Checked', { timeout: 60_000 });
    await expect(pageContent(producer).getByTestId('approve')).toHaveCount(0);
    await advisor.reload();
    await expect(pageContent(advisor).getByTestId('note-reply')).toContainText('Checked', { timeout: 180_000 });
    await pageContent(advisor).getByTestId('note-thread').first().getByTestId('note-resolve').click();
    await expect(pageContent(advisor).getByTestId('note-status').first()).toHaveText('resolved', { timeout: 60_000 });
    await pageContent(advisor).getByTestId('approve').click();
    await expect(pageContent(advisor).getByTestId('review-state')).toHaveText('Approved', { timeout: 60_000 });
    await expect(pageContent(advisor).getByTestId('approved-note')).toContainText('content hash');

    // 6. A render of the approved revision is final, not a draft; one of revision 1 stays a draft.
    const settings = { width: 32, height: 20 };
    const final = await postJson<{ render: { id: string; draft: boolean; revision: number } }>(producer, `${API}/renders`, { sceneId, revision: 2, kind: 'still', settings });
    expect(final.render.revision).toBe(2);
    expect(final.render.draft).toBe(false);
    const draft = await postJson<{ render: { id: string; draft: boolean } }>(producer, `${API}/renders`, { sceneId, revision: 1, kind: 'still', settings });
    expect(draft.render.draft).toBe(true);
    for (const id of [final.render.id, draft.render.id]) await producer.request.post(`${API}/renders/${id}/cancel`);

    // The list shows both reviews with their outcomes.
    await producer.goto(`/studios/${DEMO_STUDIO_SLUG}/reviews`);
    await expect(producer.locator(`[data-review-id="${secondReviewId}"]`)).toContainText('Approved', { timeout: 120_000 });
    await expect(producer.locator(`[data-review-id="${firstReviewId}"]`)).toContainText('Changes requested');
  });
});
