import { test as base, expect, type Browser, type BrowserContext } from "@playwright/test";

export { expect };
export type { APIResponse, Browser, Page } from "@playwright/test";

/**
 * Playwright's `test` with one automatic check: no Content-Security-Policy violation in any page of the test
 * (its own page, and pages or contexts it opens from `browser`). Each page reports `securitypolicyviolation`
 * events to its console, and Chromium's own "violates the following Content Security Policy" messages count too.
 */
export const test = base.extend<{ cspViolations: string[] }>({
  cspViolations: [
    async ({ browser, context }, provide) => {
      const seen: string[] = [];
      const watch = async (ctx: BrowserContext) => {
        await ctx.addInitScript(() => {
          document.addEventListener("securitypolicyviolation", (e) =>
            console.error(`CSP violation: ${e.violatedDirective} blocked ${e.blockedURI || "inline code"} (${e.sourceFile}:${e.lineNumber})`),
          );
        });
        ctx.on("console", (msg) => {
          const text = msg.text();
          if (/CSP violation|Content Security Policy/i.test(text)) seen.push(`${msg.page()?.url() ?? "?"}: ${text}`);
        });
      };
      await watch(context);
      const original = { newContext: browser.newContext, newPage: browser.newPage };
      const patched = browser as Browser & typeof original;
      patched.newContext = async (...args: Parameters<Browser["newContext"]>) => {
        const ctx = await original.newContext.apply(browser, args);
        await watch(ctx);
        return ctx;
      };
      patched.newPage = async (...args: Parameters<Browser["newPage"]>) => {
        const page = await original.newPage.apply(browser, args);
        await watch(page.context());
        return page;
      };
      try {
        await provide(seen);
      } finally {
        patched.newContext = original.newContext;
        patched.newPage = original.newPage;
      }
      expect(seen, "Content-Security-Policy violations on this test's pages").toEqual([]);
    },
    { auto: true },
  ],
});
