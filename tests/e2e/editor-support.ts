// What the editor's browser tests share: signed-in browser contexts (the session cookie from an API sign-in),
// sheets made through the API, touch input through Chromium's DevTools protocol (taps, drags, pinches), and
// readings of the drawing from the page itself (the world layer's transform, symbols' boxes, value tags).
import type { Browser, CDPSession, Page } from 'playwright-core';
import { TestClient } from '../support/http-client';
import { assert, DEMO_PASSWORD, newBrowserPage, type OpenPage, type ServerProcess } from './harness';

export interface Point {
  x: number;
  y: number;
}

export interface Opened extends OpenPage {
  api: TestClient;
  touch: Touch;
}

export async function apiAs(server: ServerProcess, email: string): Promise<TestClient> {
  const api = new TestClient(server.url);
  const r = await api.signIn(email, DEMO_PASSWORD);
  assert(r.status === 200, `sign-in of ${email} failed: ${r.status}`);
  return api;
}

/** Touch input for a page through its own DevTools session. */
export async function touchOf(p: OpenPage): Promise<Touch> {
  return new Touch(await p.context.newCDPSession(p.page), p.page);
}

/** A browser context signed in as `email` (the API sign-in's session cookie), with touch, at the given size. */
export async function openAs(browser: Browser, server: ServerProcess, email: string, viewport: { width: number; height: number }): Promise<Opened> {
  const api = await apiAs(server, email);
  const opened = await newBrowserPage(browser, viewport, { touch: true });
  const cookies = api.cookieHeader().split('; ').filter(Boolean).map((pair) => {
    const eq = pair.indexOf('=');
    return { name: pair.slice(0, eq), value: pair.slice(eq + 1), url: server.url };
  });
  await opened.context.addCookies(cookies);
  return { ...opened, api, touch: await touchOf(opened) };
}

export async function demoProjectId(api: TestClient): Promise<string> {
  const r = await api.get('/api/projects');
  const p = (r.body.projects as { id: string; name: string }[]).find((x) => x.name === 'Larkspur Row');
  assert(p, 'the demo project Larkspur Row is missing');
  return p.id;
}

export async function newSheet(api: TestClient, projectId: string, name: string): Promise<string> {
  const r = await api.post(`/api/projects/${projectId}/sheets`, { name });
  assert(r.status === 201 || r.status === 200, `making sheet ${name} failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.sheet.id as string;
}

/** The sheet's JSON view through the API (what the server's room holds). */
export async function documentOf(api: TestClient, sheetId: string): Promise<any> {
  const r = await api.get(`/api/sheets/${sheetId}/document`);
  assert(r.status === 200, `reading the document failed: ${r.status}`);
  return r.body;
}

/** Touches through the DevTools protocol: what a finger does, as the browser sees it. */
export class Touch {
  constructor(
    private readonly cdp: CDPSession,
    private readonly page: Page,
  ) {}

  private send(type: 'touchStart' | 'touchMove' | 'touchEnd', points: Point[]) {
    return this.cdp.send('Input.dispatchTouchEvent', {
      type,
      touchPoints: points.map((p, id) => ({ x: Math.round(p.x), y: Math.round(p.y), id, radiusX: 4, radiusY: 4, force: 1 })),
    });
  }

  async tap(p: Point) {
    await this.send('touchStart', [p]);
    await this.page.waitForTimeout(40);
    await this.send('touchEnd', []);
    await this.page.waitForTimeout(120);
  }

  async drag(from: Point, to: Point, steps = 12) {
    await this.send('touchStart', [from]);
    await this.page.waitForTimeout(30);
    for (let i = 1; i <= steps; i++) {
      await this.send('touchMove', [{ x: from.x + ((to.x - from.x) * i) / steps, y: from.y + ((to.y - from.y) * i) / steps }]);
      await this.page.waitForTimeout(16);
    }
    await this.send('touchEnd', []);
    await this.page.waitForTimeout(150);
  }

  /** Two fingers about `centre`, from `startGap` apart to `endGap` apart, moving their centre by `shift`. */
  async pinch(centre: Point, startGap: number, endGap: number, shift: Point = { x: 0, y: 0 }, steps = 12) {
    const at = (gap: number, k: number) => {
      const c = { x: centre.x + shift.x * k, y: centre.y + shift.y * k };
      return [
        { x: c.x - gap / 2, y: c.y },
        { x: c.x + gap / 2, y: c.y },
      ];
    };
    await this.send('touchStart', at(startGap, 0));
    await this.page.waitForTimeout(30);
    for (let i = 1; i <= steps; i++) {
      await this.send('touchMove', at(startGap + ((endGap - startGap) * i) / steps, i / steps));
      await this.page.waitForTimeout(16);
    }
    await this.send('touchEnd', []);
    await this.page.waitForTimeout(150);
  }
}

export interface ViewTransform {
  x: number;
  y: number;
  zoom: number;
  /** The canvas's top-left corner on the page. */
  left: number;
  top: number;
}

/** The view as the page applies it: the world layer's transform and the canvas's place on the page. */
export async function viewTransform(page: Page): Promise<ViewTransform> {
  return page.evaluate(() => {
    const world = document.querySelector('[data-testid="sheet-world"]') as HTMLElement | null;
    const ground = document.querySelector('[data-testid="sheet-canvas"]') as HTMLElement | null;
    if (!world || !ground) throw new Error('no canvas on the page');
    const m = /translate\(([-\d.e]+)px, ([-\d.e]+)px\) scale\(([-\d.e]+)\)/.exec(world.style.transform);
    const rect = ground.getBoundingClientRect();
    return { x: m ? Number(m[1]) : 0, y: m ? Number(m[2]) : 0, zoom: m ? Number(m[3]) : 1, left: rect.left, top: rect.top };
  });
}

export function toScreen(v: ViewTransform, world: Point): Point {
  return { x: v.left + v.x + world.x * v.zoom, y: v.top + v.y + world.y * v.zoom };
}

export async function symbolBox(page: Page, elementId: string) {
  const box = await page.locator(`[data-testid="sym-${elementId}"]`).first().boundingBox();
  assert(box, `element ${elementId} is not drawn`);
  return box;
}

/** The number on a value tag, read from its text as drawn ("A–N 138.6 V" gives 138.6). */
export async function tagNumber(page: Page, key: string, timeoutMs = 5000): Promise<number> {
  const locator = page.locator(`[data-testid="tag-${key}"] text`).first();
  await locator.waitFor({ state: 'attached', timeout: timeoutMs }).catch(() => {
    throw new Error(`no value tag ${key} on the drawing`);
  });
  const text = (await locator.textContent()) ?? '';
  const m = /(-?\d+(?:\.\d+)?)\s*(V|A)$/.exec(text.trim());
  assert(m, `the tag ${key} reads "${text}"`);
  return Number(m[1]);
}

/** Waits until a tag's number satisfies `check` (the solve after an edit). */
export async function waitForTag(page: Page, key: string, check: (v: number) => boolean, what: string, timeoutMs = 8000): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  let last = NaN;
  while (Date.now() < deadline) {
    try {
      last = await tagNumber(page, key, 500);
      if (check(last)) return last;
    } catch {
      /* not drawn yet */
    }
    await page.waitForTimeout(100);
  }
  throw new Error(`tag ${key}: expected ${what}, last read ${last}`);
}
