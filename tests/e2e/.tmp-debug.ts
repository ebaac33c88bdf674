import { launchBrowser, startServer } from './harness';
(async () => {
  const server = await startServer();
  const browser = await launchBrowser();
  try {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(`${server.url}/sign-in`);
    await page.waitForTimeout(3000);
    const info = await page.evaluate(async () => {
      await document.fonts.ready;
      const out: string[] = [];
      document.fonts.forEach((f) => out.push(`${f.family} ${f.weight} ${f.status}`));
      return { out, css: [...document.querySelectorAll('style')].map((s) => s.textContent ?? '').filter((t) => t.includes('font-face')).join('\n').slice(0, 2000) };
    });
    console.log(JSON.stringify(info, null, 1));
  } finally {
    await browser.close();
    await server.stop();
  }
})();
