import { expect } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, pageContent, test } from './support';

// The navigation each role should see (product.md, People and roles; lib/auth/navigation.ts).
const EXPECTED_NAV: Record<string, string[]> = {
  admin: ['Shows', 'Reviews', 'Renders', 'Deliveries', 'Sky view', 'Library', 'Studio'],
  producer: ['Shows', 'Reviews', 'Renders', 'Deliveries', 'Sky view', 'Library'],
  advisor: ['Shows', 'Reviews', 'Renders', 'Deliveries', 'Sky view', 'Library'],
  operator: ['Shows', 'Deliveries'],
};

test.describe('sign-in', () => {
  for (const [role, sections] of Object.entries(EXPECTED_NAV)) {
    test(`should sign the demo ${role} in to the studio home with the ${role} navigation, and out again`, async ({ page }) => {
      const signIn = new SignInPage(page);
      await signIn.open();
      await signIn.signIn(demoEmail(role), DEMO_PASSWORD);
      await expect(page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}$`));
      await expect(page.getByTestId('studio-name')).toHaveText('Saltmarsh Dome');
      const nav = page.getByTestId('studio-nav');
      const labels = (await nav.locator('li').allInnerTexts()).map((t) => t.replace(/\s*soon$/i, '').trim());
      expect(labels).toEqual(['Home', ...sections]);
      await page.getByTestId('sign-out').click();
      await expect(page).toHaveURL(/\/sign-in/);
      await page.goto(`/studios/${DEMO_STUDIO_SLUG}`);
      await expect(page).toHaveURL(/\/sign-in/);
    });
  }

  test('should give the same generic error for a wrong password and an unknown e-mail', async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(demoEmail('advisor'), 'not-the-password');
    await signIn.expectError(/do not match an account/);
    await signIn.signIn('nobody@saltmarsh-dome.test', 'not-the-password');
    await signIn.expectError(/do not match an account/);
  });

  test('should send unsigned visitors to sign-in and answer the API with 401 problem+json', async ({ page, request }) => {
    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in/);
    const response = await request.get('/api/v1/me');
    expect(response.status()).toBe(401);
    expect(response.headers()['content-type']).toContain('application/problem+json');
  });

  test('should show non-admins that member management is admin-only', async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(demoEmail('producer'), DEMO_PASSWORD);
    await expect(page.getByTestId('studio-name')).toBeVisible();
    await page.goto(`/studios/${DEMO_STUDIO_SLUG}/studio`);
    await expect(pageContent(page).getByTestId('forbidden')).toBeVisible();
    await page.goto('/studios/not-my-studio');
    await expect(page.getByTestId('not-found')).toBeVisible();
  });
});
