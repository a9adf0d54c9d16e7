// The README's screenshot of the web page: node docs/make-screenshot.mjs (after npm run build; needs Debian's chromium).
// Starts the built `plumbline web --no-open`, pastes a paragraph of an invented demo manuscript, drops a demo PDF,
// opens a flagged result and saves docs/web-page.png.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const server = spawn(process.execPath, [join(root, 'dist', 'src', 'cli', 'main.js'), 'web', '--no-open'], { stdio: ['ignore', 'pipe', 'inherit'] });
const url = await new Promise((resolve) => {
  let out = '';
  server.stdout.on('data', (chunk) => {
    out += chunk;
    const found = /plumbline web: (\S+)/.exec(out);
    if (found) resolve(found[1]);
  });
});
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: ['--no-sandbox', '--headless'] });
try {
  const page = await browser.newPage({ viewport: { width: 1180, height: 760 } });
  await page.goto(url);
  await page.waitForSelector('body[data-ready="true"]', { state: 'attached' });
  const lines = readFileSync(join(root, 'corpus-demo', 'sleep-and-recall.md'), 'utf8').split('\n');
  await page.locator('#paste').fill(lines.slice(38, 52).join('\n'));
  await page.locator('#check-text').click();
  await page.locator('#files').setInputFiles(join(root, 'corpus-demo', 'lantern-reading-fluency.pdf'));
  await page.waitForFunction(() => document.querySelectorAll('.document-choice').length === 2);
  await page.locator('.document-choice').first().click();
  await page.locator('#manuscript button.result.v-fail').first().click();
  // The documents, the marked manuscript and the result opened, under the caution (which stays in view).
  await page.evaluate(() => window.scrollTo(0, document.getElementById('status').getBoundingClientRect().top + window.scrollY - 135));
  await page.screenshot({ path: join(root, 'docs', 'web-page.png') });
} finally {
  await browser.close();
  server.kill('SIGTERM');
}
