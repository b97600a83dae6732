// The demo sheet of the browser tests: a grey one-row sheet drawn by Skia
// (@napi-rs/canvas) at 300 dpi — "o" (a ring), "l" (a bar) and a "v"-like chevron —
// as PNG bytes, and the steps a user takes to fit its letters in the page.
import { expect, type Page } from '@playwright/test';
import { createCanvas } from '@napi-rs/canvas';
import sharp from 'sharp';

/** The characters drawn on the demo sheet, in reading order. */
export const DEMO_CHARACTERS = 'olv';

export async function demoSheetPng(): Promise<Buffer> {
  const width = 420;
  const height = 200;
  const canvas = createCanvas(width, height);
  const g = canvas.getContext('2d');
  g.fillStyle = '#f2f0ea';
  g.fillRect(0, 0, width, height);
  g.fillStyle = '#1a1a1a';
  g.beginPath();
  g.ellipse(80, 110, 44, 50, 0, 0, 2 * Math.PI);
  g.ellipse(80, 110, 24, 32, 0, 0, 2 * Math.PI, true);
  g.fill();
  g.fillRect(170, 40, 22, 120);
  g.beginPath();
  g.moveTo(240, 160);
  g.lineTo(300, 60);
  g.lineTo(360, 160);
  g.lineTo(338, 160);
  g.lineTo(300, 96);
  g.lineTo(262, 160);
  g.closePath();
  g.fill();
  const rgba = g.getImageData(0, 0, width, height).data;
  const grey = Buffer.alloc(width * height);
  for (let i = 0; i < grey.length; i++) grey[i] = rgba[i * 4] ?? 255;
  return sharp(grey, { raw: { width, height, channels: 1 } }).png().withMetadata({ density: 300 }).toBuffer();
}

/** Opens the demo sheet in the page, assigns its characters and fits them, ending at the letters at a glance. */
export async function openFittedDemoSheet(page: Page): Promise<void> {
  await page.goto('/');
  await page.getByTestId('scan-file').setInputFiles({ name: 'sheet.png', mimeType: 'image/png', buffer: await demoSheetPng() });
  await expect(page.getByTestId('letter-count')).toHaveText('3 letters in 1 row');
  await page.getByLabel('Characters on the sheet, in reading order').fill(DEMO_CHARACTERS);
  await page.getByRole('button', { name: 'Assign' }).click();
  await expect(page.getByTestId('assigned-count')).toHaveText('3 of 3 letters assigned');
  await page.getByRole('button', { name: 'Fit the assigned letters' }).click();
  await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
}
