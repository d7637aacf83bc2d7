import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chromium, expect, test, type Browser, type Page, type TestInfo } from '@playwright/test';
import QRCode from 'qrcode';
import { demo } from './support';

/** Frame of the fake camera, in pixels (a 4:3 webcam picture). */
const width = 640;
const height = 480;

/**
 * A fake camera recording of a printed QR label: YUV4MPEG2 (C420), black modules on a white
 * frame with a quiet zone, the same picture in every frame. Chromium plays it in a loop as the
 * camera (`--use-file-for-fake-video-capture`).
 */
function labelVideo(text: string, file: string): string {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const quiet = 4;
  const scale = Math.floor(Math.min(width, height) / (modules.size + 2 * quiet)) - 1;
  const side = (modules.size + 2 * quiet) * scale;
  const left = Math.floor((width - side) / 2);
  const top = Math.floor((height - side) / 2);
  const luma = Buffer.alloc(width * height, 255);
  for (let row = 0; row < modules.size; row++) {
    for (let col = 0; col < modules.size; col++) {
      if (!modules.get(row, col)) continue;
      for (let y = 0; y < scale; y++) {
        const offset = (top + (row + quiet) * scale + y) * width + left + (col + quiet) * scale;
        luma.fill(0, offset, offset + scale);
      }
    }
  }
  const chroma = Buffer.alloc((width / 2) * (height / 2), 128);
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma, chroma]);
  const header = Buffer.from(`YUV4MPEG2 W${width} H${height} F10:1 Ip A1:1 C420\n`);
  // Chromium reads the file from an absolute path; one it cannot open shows its own test pattern.
  const absolute = path.resolve(file);
  mkdirSync(path.dirname(absolute), { recursive: true });
  writeFileSync(absolute, Buffer.concat([header, ...Array<Buffer>(10).fill(frame)]));
  return absolute;
}

/** A Chromium of its own whose camera shows `video`, on a phone-sized screen. */
async function phoneWithCamera(video: string, baseURL: string) {
  const browser: Browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--use-fake-ui-for-media-stream',
      '--use-fake-device-for-media-stream',
      `--use-file-for-fake-video-capture=${video}`,
    ],
  });
  const context = await browser.newContext({
    baseURL,
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
  });
  // Keeps every camera stream the page opens, to check that closing the view stops it.
  await context.addInitScript(() => {
    const streams: MediaStream[] = [];
    (window as unknown as { cameraStreams: MediaStream[] }).cameraStreams = streams;
    const original = navigator.mediaDevices.getUserMedia.bind(navigator.mediaDevices);
    navigator.mediaDevices.getUserMedia = async (constraints) => {
      const stream = await original(constraints);
      streams.push(stream);
      return stream;
    };
  });
  const page = await context.newPage();
  return { browser, page };
}

// Two browsers of their own start per test: more time than a plain spec on a busy machine.
test.describe.configure({ timeout: 120_000 });

/** Signs in on the phone; the second browser starts cold, so it gets more time than `signIn`. */
async function signInOnPhone(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page.getByRole('button', { name: 'Scan a label' })).toBeVisible({ timeout: 30_000 });
}

function baseUrlOf(testInfo: TestInfo): string {
  const url = testInfo.project.use.baseURL;
  if (!url) throw new Error('The e2e config gives no baseURL');
  return url;
}

test('when a printed label is held up to the camera, then its container opens with the draw form ready', async ({
  request,
}, testInfo) => {
  const baseURL = baseUrlOf(testInfo);
  await request.post('/api/auth/login', { data: { email: demo.member, password: demo.password } });
  const list = (await (await request.get('/api/containers?pageSize=50')).json()) as {
    items: { id: number; labelCode: string; status: string }[];
  };
  const container = list.items.find((c) => c.status === 'sealed' || c.status === 'open')!;
  // What the printed label's QR holds: the container's address at the lab's PUBLIC_URL.
  const video = labelVideo(
    `${baseURL}/stock/c/${container.labelCode}`,
    testInfo.outputPath('label.y4m'),
  );

  const { browser, page } = await phoneWithCamera(video, baseURL);
  try {
    await signInOnPhone(page, demo.member);
    // Headless Chromium on Linux has no BarcodeDetector: the jsQR library reads the frames.
    expect(await page.evaluate(() => 'BarcodeDetector' in window)).toBe(false);
    await page.getByRole('button', { name: 'Scan a label' }).click();

    await expect(page).toHaveURL(new RegExp(`/stock/containers/${container.id}#draw$`), {
      timeout: 30_000,
    });
    await expect(page.getByText(container.labelCode, { exact: true }).first()).toBeVisible();
    const draw = page.getByRole('region', { name: 'Record a draw' });
    await expect(draw).toBeInViewport();
    await expect(draw.locator('input[inputmode="decimal"]')).toBeFocused();
    // The camera stopped when the view closed.
    expect(
      await page.evaluate(() =>
        (window as unknown as { cameraStreams: MediaStream[] }).cameraStreams.every((s) =>
          s.getTracks().every((t) => t.readyState === 'ended'),
        ),
      ),
    ).toBe(true);
    await page.screenshot({ path: testInfo.outputPath('container-after-scan-390.png') });
  } finally {
    await browser.close();
  }
});

test('when the code on the label is unknown here, then the camera view says so and keeps scanning; Escape closes it and the camera', async ({
  baseURL: configured,
}, testInfo) => {
  const baseURL = configured ?? baseUrlOf(testInfo);
  const video = labelVideo(`${baseURL}/stock/c/LW-99999`, testInfo.outputPath('unknown.y4m'));
  const { browser, page } = await phoneWithCamera(video, baseURL);
  try {
    await signInOnPhone(page, demo.member);
    await page.getByRole('button', { name: 'Scan a label' }).click();
    const dialog = page.getByRole('dialog', { name: 'Scan a label' });
    await expect(dialog.getByText(/No container in this lab has the label LW-99999/)).toBeVisible({
      timeout: 30_000,
    });
    await expect(dialog.getByText(/^Scanning\./)).toBeVisible();
    await expect(dialog.getByTestId('label-scanner')).toHaveAttribute('data-decoder', 'library');
    await page.screenshot({ path: testInfo.outputPath('scan-unknown-390.png') });

    await page.keyboard.press('Escape');
    await expect(dialog).toBeHidden();
    const stopped = await page.evaluate(() =>
      (window as unknown as { cameraStreams: MediaStream[] }).cameraStreams.every((s) =>
        s.getTracks().every((t) => t.readyState === 'ended'),
      ),
    );
    expect(stopped).toBe(true);
  } finally {
    await browser.close();
  }
});
