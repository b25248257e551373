import { test as base, type Page } from '@playwright/test';

/** The demo studio's accounts (README, Demo accounts); the password is the seeded default. */
export const DEMO_PASSWORD = process.env.SKYWELL_DEMO_PASSWORD ?? 'skywell-demo-2026';
export const DEMO_STUDIO_SLUG = 'saltmarsh-dome';
export const demoEmail = (role: string) => `${role}@saltmarsh-dome.test`;

/** Messages in the SMTP fake (maildev REST API) addressed to one person. */
export async function mailTo(address: string): Promise<{ subject: string; text: string }[]> {
  const base = process.env.SKYWELL_MAIL_FAKE_URL;
  if (!base) throw new Error('SKYWELL_MAIL_FAKE_URL is not set: run through npm test');
  const all = (await (await fetch(`${base}/api/email`)).json()) as { subject: string; text: string; to: { address: string }[] }[];
  return all.filter((m) => m.to.some((t) => t.address === address));
}

/** An API client signed in as a demo role through next-auth's own credentials endpoint. */
export async function apiSignedInAs(playwright: { request: { newContext(o: { baseURL: string }): Promise<import('@playwright/test').APIRequestContext> } }, baseURL: string, role: string) {
  const context = await playwright.request.newContext({ baseURL });
  const { csrfToken } = (await (await context.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const response = await context.post('/api/auth/callback/credentials', { form: { csrfToken, email: demoEmail(role), password: DEMO_PASSWORD, json: 'true' } });
  if (!response.ok()) throw new Error(`could not sign in as ${role}: ${response.status()}`);
  return context;
}

/**
 * The page's own content: the layout's <main>. Page-level test ids are looked up inside it because
 * React can leave a hidden copy of freshly streamed content at the end of <body> for a moment (a
 * `<div hidden id="S:n">` segment waiting to be revealed, seen in traces), which strict locators
 * would otherwise count twice.
 */
export function pageContent(page: import('@playwright/test').Page): import('@playwright/test').Locator {
  return page.getByRole('main');
}

/**
 * Makes a page's getByTestId skip elements inside a `hidden` container. React can leave a hidden copy of
 * freshly streamed content at the end of <body> (a `<div hidden id="S:n">` segment, seen in traces), and
 * strict locators would otherwise find every test id on the page twice. Elements hidden by CSS still match,
 * so `toBeHidden` keeps its meaning. Call it on pages a test opens itself; the `page` fixture has it.
 */
export function skipHiddenStreamCopies(page: Page): Page {
  const original = page.getByTestId.bind(page);
  page.getByTestId = (testId) => (typeof testId === 'string' ? page.locator(`[data-testid=${JSON.stringify(testId)}]:not([hidden] *)`) : original(testId));
  return page;
}

/** Playwright's test with a `page` whose getByTestId skips hidden streamed copies (skipHiddenStreamCopies). */
export const test = base.extend({
  page: async ({ page }, use) => {
    await use(skipHiddenStreamCopies(page));
  },
});
