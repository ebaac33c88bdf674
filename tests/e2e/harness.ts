// What every browser test needs: a current web build, the real server as a child process on a free port with a
// fresh data folder, Debian's Chromium through playwright-core, and a few waits that fail with a clear message.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { freePort } from '../support/free-port';

export const root = path.resolve(__dirname, '..', '..');
export const screenshotDir = path.join(__dirname, 'screenshots');
const CHROMIUM = '/usr/bin/chromium';

export function log(line: string) {
  console.log(`[e2e] ${line}`);
}

/** Builds dist/ when it is missing or stale (the server's own check when it exists). */
export function ensureWebBuild() {
  const checker = path.join(root, 'server', 'web-build.ts');
  const env = { ...process.env, EXPO_OFFLINE: '1', CI: '1' };
  const result = existsSync(checker)
    ? spawnSync('npx', ['tsx', checker], { cwd: root, stdio: 'inherit', env })
    : existsSync(path.join(root, 'dist', 'index.html'))
      ? { status: 0 }
      : spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', 'dist'], { cwd: root, stdio: 'inherit', env });
  if (result.status !== 0) throw new Error(`The web build failed (exit code ${result.status})`);
}

export interface ServerProcess {
  url: string;
  output: string[];
  stop(): Promise<void>;
}

/** Starts `tsx server/main.ts` in its own process group and waits until /api/health answers. */
export async function startServer(extraEnv: Record<string, string> = {}): Promise<ServerProcess> {
  const port = await freePort();
  const dataDir = mkdtempSync(path.join(os.tmpdir(), 'pw-e2e-'));
  const url = `http://localhost:${port}`;
  const output: string[] = [];
  const child: ChildProcess = spawn('npx', ['tsx', 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), DATA_DIR: dataDir, ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  const collect = (chunk: Buffer) => output.push(...chunk.toString().split('\n').filter(Boolean));
  child.stdout?.on('data', collect);
  child.stderr?.on('data', collect);
  let exited: number | null = null;
  child.once('exit', (code) => (exited = code ?? -1));

  const stop = async () => {
    if (exited === null && child.pid) {
      const gone = new Promise<void>((resolve) => child.once('exit', () => resolve()));
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        /* already gone */
      }
      const timer = setTimeout(() => {
        try {
          process.kill(-child.pid!, 'SIGKILL');
        } catch {
          /* already gone */
        }
      }, 5_000);
      await gone;
      clearTimeout(timer);
    }
    rmSync(dataDir, { recursive: true, force: true });
  };

  const deadline = Date.now() + 90_000;
  while (Date.now() < deadline) {
    if (exited !== null) {
      await stop();
      throw new Error(`The server exited with code ${exited} before it was ready:\n${output.join('\n')}`);
    }
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return { url, output, stop };
    } catch {
      /* not listening yet */
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  await stop();
  throw new Error(`The server did not answer /api/health within 90 s:\n${output.join('\n')}`);
}

export async function launchBrowser(): Promise<Browser> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium`);
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

const TIMEOUT_MS = 15_000;

// A stack keeps the screens under the top one in the page, hidden; tests only ever mean the one on show.
/** The visible element with this testID. */
export function el(page: Page, testId: string): Locator {
  return page.getByTestId(testId).filter({ visible: true }).first();
}

/** The visible element with this text. */
export function txt(page: Page, text: string | RegExp, exact = true): Locator {
  return page.getByText(text, { exact }).filter({ visible: true }).first();
}

/** The visible elements whose testID starts with this prefix. */
export function byPrefix(page: Page, prefix: string): Locator {
  return page.locator(`[data-testid^="${prefix}"]`).filter({ visible: true });
}

/** Waits until the text is visible somewhere on the page; fails naming the text. */
export async function seeText(page: Page, text: string | RegExp, options: { exact?: boolean } = {}): Promise<Locator> {
  const locator = txt(page, text, options.exact ?? false);
  try {
    await locator.waitFor({ state: 'visible', timeout: TIMEOUT_MS });
  } catch {
    throw new Error(`Expected to see ${JSON.stringify(String(text))} on ${page.url()}`);
  }
  return locator;
}

export async function seeTestId(page: Page, testId: string): Promise<Locator> {
  const locator = el(page, testId);
  try {
    await locator.waitFor({ state: 'visible', timeout: TIMEOUT_MS });
  } catch {
    throw new Error(`Expected to see [data-testid=${testId}] on ${page.url()}`);
  }
  return locator;
}

export async function notSeeTestId(page: Page, testId: string) {
  if ((await page.getByTestId(testId).filter({ visible: true }).count()) > 0) {
    throw new Error(`Expected no [data-testid=${testId}] on ${page.url()}`);
  }
}

export async function notSeeText(page: Page, text: string | RegExp) {
  const locator = page.getByText(text).filter({ visible: true });
  try {
    await locator.first().waitFor({ state: 'hidden', timeout: TIMEOUT_MS });
  } catch {
    throw new Error(`Expected ${JSON.stringify(String(text))} to be gone from ${page.url()}`);
  }
}

/** Fails unless the element is at least `min` px in both directions (a finger-sized target). */
export async function assertTouchTarget(locator: Locator, what: string, min = 44) {
  const box = await locator.boundingBox();
  if (!box) throw new Error(`${what} has no size on the page`);
  if (box.width < min || box.height < min) {
    throw new Error(`${what} is ${box.width.toFixed(0)}x${box.height.toFixed(0)} px, under ${min} px`);
  }
}

export function assert(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(message);
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true });
  // Let fades and slides of modals finish before the picture.
  await page.waitForTimeout(400);
  const file = path.join(screenshotDir, `${name}.png`);
  await page.screenshot({ path: file });
  log(`screenshot ${path.relative(root, file)}`);
}

// ----- What the app's browser tests share: demo sign-in, fresh browser contexts, and one start-up and teardown.

export const DEMO_PASSWORD = 'larkspur-demo-2026';
export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1440, height: 900 };

// The page in use last, so that a failure can leave a picture of what the browser showed.
let lastPage: Page | null = null;

export interface OpenPage {
  context: BrowserContext;
  page: Page;
  /** Page errors, console errors and server faults seen so far; a test fails on any. */
  problems: string[];
}

export interface PageOptions {
  /** The dark colour scheme instead of the light one. */
  dark?: boolean;
  /** Touch input at any size (a phone-sized page always has it). */
  touch?: boolean;
  /** Count a 404 for anything outside /api/ (a missing font or script) as a problem too. */
  missingFiles?: boolean;
}

/** A fresh browser context (no cookies: a different person) at a phone's or a wide screen's size. */
export async function newBrowserPage(browser: Browser, viewport: { width: number; height: number }, options: PageOptions = {}): Promise<OpenPage> {
  const phone = viewport.width < 768;
  const context = await browser.newContext({
    viewport,
    colorScheme: options.dark ? 'dark' : 'light',
    locale: 'en-GB',
    timezoneId: 'UTC',
    ...(phone || options.touch ? { hasTouch: true } : {}),
    ...(phone ? { isMobile: true, deviceScaleFactor: 2 } : {}),
  });
  const page = await context.newPage();
  lastPage = page;
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    // Refused requests are judged by the tests themselves; other console errors are problems.
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(`console error: ${message.text()}`);
  });
  page.on('response', (response) => {
    const missingFile = options.missingFiles === true && response.status() === 404 && !new URL(response.url()).pathname.startsWith('/api/');
    if (response.status() >= 500 || missingFile) problems.push(`${response.status()} for ${response.url()}`);
  });
  return { context, page, problems };
}

/** Signs in through the sign-in form and waits for the projects list. */
export async function signInWithForm(page: Page, url: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${url}/sign-in`);
  await seeTestId(page, 'sign-in-screen');
  await el(page, 'email').fill(email);
  await el(page, 'password').fill(password);
  await el(page, 'sign-in-submit').click();
  await seeTestId(page, 'projects-panel');
}

/** Opens the demo project from the projects list; returns its path (/projects/:id). */
export async function openDemoProject(page: Page): Promise<string> {
  await txt(page, 'Larkspur Row').click();
  await seeTestId(page, 'project-detail');
  await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
  return new URL(page.url()).pathname;
}

/** The first link to `hrefPart` in the newest e-mail to `to` on the outbox page (the local SMTP sink's mail). */
export async function linkFromOutbox(page: Page, url: string, to: string, hrefPart: string, subject?: RegExp): Promise<string> {
  await page.goto(`${url}/outbox`);
  await seeTestId(page, 'outbox-screen');
  let mail = page.getByTestId('outbox-message').filter({ hasText: `To ${to}` });
  if (subject) mail = mail.filter({ hasText: subject });
  await mail.first().waitFor({ state: 'visible', timeout: TIMEOUT_MS });
  const href = await mail.first().locator(`a[href*="${hrefPart}"]`).first().getAttribute('href');
  assert(href, `the e-mail to ${to} has no link to ${hrefPart}`);
  return href;
}

/** Fails naming whose browser reported problems; closes every context. */
export async function closeAll(pages: [string, OpenPage][]) {
  for (const [who, p] of pages) {
    assert(p.problems.length === 0, `the ${who}'s browser reported problems:\n${p.problems.join('\n')}`);
    await p.context.close();
  }
}

/**
 * A browser test's whole life: a current web build, the server on a free port with a fresh data folder, Chromium;
 * on failure a picture of the last page and the server's last lines; everything stopped at the end, and the
 * process's exit code set.
 */
export function runBrowserTest(name: string, run: (browser: Browser, server: ServerProcess) => Promise<void>) {
  const main = async () => {
    ensureWebBuild();
    let server: ServerProcess | null = null;
    let browser: Browser | null = null;
    try {
      server = await startServer();
      log(`server at ${server.url}`);
      browser = await launchBrowser();
      await run(browser, server);
    } catch (error) {
      if (lastPage && !lastPage.isClosed()) await screenshot(lastPage, `${name}-FAILED`).catch(() => undefined);
      if (server) console.error(`[e2e] server output:\n${server.output.slice(-40).join('\n')}`);
      throw error;
    } finally {
      await browser?.close().catch(() => undefined);
      await server?.stop();
    }
  };
  main().then(
    () => {
      log(`${name}: all checks passed`);
      process.exit(0);
    },
    (error) => {
      console.error(`[e2e] ${name} FAILED: ${error instanceof Error ? (error.stack ?? error.message) : error}`);
      process.exit(1);
    },
  );
}
