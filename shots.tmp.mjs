import { chromium } from '@playwright/test';
const base = 'http://127.0.0.1:4390';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu'] });
async function as(email, shots) {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(base + '/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('lotwise-demo-2026');
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.getByRole('navigation', { name: /main/i }).waitFor();
  for (const [path, file, full] of shots) {
    await page.goto(base + path);
    await page.waitForTimeout(2500);
    await page.screenshot({ path: `/work/wt-int/docs/screenshots/${file}`, fullPage: !!full });
  }
  await page.close();
}
await as('technician@example.test', [
  ['/orders/2', 'order-coordinator.png', true],
  ['/orders/restock', 'restock.png'],
  ['/purchasing/suppliers/1', 'supplier.png'],
  ['/orders/1/money', 'order-money.png'],
  ['/orders/1/receive', 'order-received.png'],
]);
await as('member.one@example.test', [
  ['/purchases', 'my-purchases.png'],
  ['/orders/1/receipt', 'receipt.png', true],
]);
await browser.close();
