import { expect, type Page } from '@playwright/test';

/** Demo accounts seeded on an empty database (see the server's demo seed). */
export const demo = {
  password: 'lotwise-demo-2026',
  admin: 'instructor@example.test',
  manager: 'technician@example.test',
  member: 'member.one@example.test',
  viewer: 'visitor@example.test',
} as const;

/** Signs in through the real sign-in page and waits for the app shell. */
export async function signIn(page: Page, email: string, password: string = demo.password) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page.getByRole('navigation', { name: /main/i })).toBeVisible();
}
