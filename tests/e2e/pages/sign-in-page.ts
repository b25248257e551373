import { expect, type Page } from '@playwright/test';

/** The sign-in page, driven by keyboard where a person would type. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/sign-in');
    await this.waitUntilInteractive();
  }

  /** Typing before React hydrates the form would submit it as a plain request. */
  async waitUntilInteractive() {
    await expect(this.page.locator('[data-testid="sign-in-form"][data-hydrated="true"]')).toBeVisible();
  }

  async signIn(email: string, password: string) {
    await this.waitUntilInteractive();
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password').fill(password);
    await this.page.getByLabel('Password').press('Enter');
  }

  async expectError(text: RegExp) {
    await expect(this.page.getByTestId('sign-in-error')).toHaveText(text);
  }
}
