import { mkdtempSync, mkdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const viewports = {
  phone: { width: 390, height: 844 },
  laptop: { width: 1366, height: 768 },
  projector: { width: 1920, height: 1080 },
} as const;

/** Debian's chromium with a fresh profile, headless, with no background traffic off the machine. */
export async function openBrowser(viewport: { width: number; height: number } = viewports.laptop) {
  const profile = mkdtempSync(path.join(tmpdir(), "outroll-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    viewport,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Saves a full-page screenshot under the git-ignored screenshots/ folder. */
export async function screenshot(page: Page, name: string) {
  const dir = process.env.SCREENSHOT_DIR ?? path.resolve("screenshots");
  mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}

export async function signInThroughUi(context: BrowserContext, appUrl: string, email: string, password: string) {
  const page = await context.newPage();
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${appUrl}/app`);
  // The URL changes before React Router commits the new screen; wait for the shell itself.
  await page.getByRole("navigation", { name: "Product areas" }).waitFor();
  return page;
}
