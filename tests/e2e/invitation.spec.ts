import { expect } from '@playwright/test';
import { SignInPage } from './pages/sign-in-page';
import { DEMO_PASSWORD, DEMO_STUDIO_SLUG, demoEmail, mailTo, test } from './support';

test.describe('inviting a member', () => {
  test('should e-mail a link that sets a password, after which the new member signs in with the invited role', async ({ page }) => {
    const invitee = `new-advisor-${Date.now()}@saltmarsh-dome.test`;
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(demoEmail('admin'), DEMO_PASSWORD);
    await expect(page.getByTestId('studio-name')).toBeVisible();

    await page.getByTestId('nav-studio').getByRole('link').click();
    await expect(page.getByTestId('members-table')).toBeVisible();
    const form = page.getByTestId('invite-form');
    await form.getByLabel('E-mail').fill(invitee);
    await form.getByLabel('Role').selectOption('advisor');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByTestId('invite-outcome')).toContainText(`Invitation sent to ${invitee}`);
    await expect(page.getByTestId('sent-emails')).toContainText(invitee);

    await expect.poll(async () => (await mailTo(invitee)).length, { timeout: 10_000 }).toBe(1);
    const [message] = await mailTo(invitee);
    const link = message.text.match(/https?:\/\/\S+\/invitations\/[A-Za-z0-9_-]+/)![0];

    await page.getByTestId('sign-out').click();
    await expect(page).toHaveURL(/\/sign-in/);
    await page.goto(new URL(link).pathname);
    await expect(page.getByText('Invited as Scientific advisor')).toBeVisible();
    await page.getByLabel('Your name').fill('Noor Vasquez');
    await page.getByLabel(/New password/).fill('dark-sky-password-9');
    await page.getByLabel('Repeat the password').fill('dark-sky-password-9');
    await page.getByRole('button', { name: 'Set password and join' }).click();
    await expect(page).toHaveURL(/\/sign-in\?joined=1/);

    await signIn.signIn(invitee, 'dark-sky-password-9');
    await expect(page).toHaveURL(new RegExp(`/studios/${DEMO_STUDIO_SLUG}$`));
    await expect(page.getByTestId('current-role')).toHaveText('Scientific advisor');
    await expect(page.getByTestId('person-name')).toHaveText('Noor Vasquez');

    // The link works once.
    await page.goto(new URL(link).pathname);
    await expect(page.getByTestId('invitation-used')).toBeVisible();
  });
});
