// Hears what the browser says about the page's policies: Content-Security-Policy violations (the
// console line Chromium writes for each, and the page's securitypolicyviolation events) and
// Permissions-Policy header complaints, on every page of a browser context.
import { expect, type BrowserContext, type Page } from '@playwright/test';

const POLICY_MESSAGE = /Content Security Policy|Refused to (load|execute|apply|connect|frame|evaluate|create)|Permissions-Policy/i;

export async function watchPolicy(context: BrowserContext) {
  const lines: string[] = [];
  context.on('console', (message) => {
    if (POLICY_MESSAGE.test(message.text())) lines.push(`${message.location().url}: ${message.text()}`);
  });
  await context.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { __policyViolations: string[] }).__policyViolations = seen;
    document.addEventListener('securitypolicyviolation', (event) => {
      seen.push(`${event.violatedDirective} blocked ${event.blockedURI || 'inline'} at ${event.sourceFile}:${event.lineNumber}`);
    });
  });

  async function pageEvents(page: Page): Promise<string[]> {
    return page.evaluate(() => (window as unknown as { __policyViolations?: string[] }).__policyViolations ?? []);
  }

  return {
    /** Everything heard so far, on every page; plus the open pages' own events. */
    async violations(): Promise<string[]> {
      const events = (await Promise.all(context.pages().map((p) => pageEvents(p).catch(() => [])))).flat();
      return [...lines, ...events];
    },
    /** A script added to the page must be refused, and heard: otherwise silence proves nothing. */
    async expectInjectedScriptBlocked(page: Page) {
      const heard = lines.length + (await pageEvents(page)).length;
      await page.evaluate(() => {
        const script = document.createElement('script');
        script.textContent = 'window.__injected = 1;';
        document.head.append(script);
      });
      await expect.poll(async () => lines.length + (await pageEvents(page)).length).toBeGreaterThan(heard);
      expect(await page.evaluate(() => (window as unknown as { __injected?: number }).__injected)).toBeUndefined();
    },
  };
}
